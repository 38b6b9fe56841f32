import { describe, expect, it } from 'vitest';
import { massFunctionSolarMasses } from '../../../worker/timing/physics/mass-function';
import { minimumCompanionMass } from '../../../worker/timing/physics/minimum-companion-mass';
import { orbitalSeparationAu } from '../../../worker/timing/physics/orbital-separation';
import { bracketedRoot } from '../../../worker/timing/physics/bracketed-root';
import { AU_LIGHT_SECONDS, SUN_TO_JUPITER_MASS_RATIO } from '../../../worker/timing/delays/physical-constants';
import { postKeplerianPredictions } from '../../../worker/timing/physics/post-keplerian-predictions';
import { SUN_TO_EARTH_MASS_RATIO } from '../../../worker/timing/physics/physics-constants';
import { expectWithin } from '../time/expect-within';

const SECONDS_PER_DAY = 86_400;
const HULSE_TAYLOR_PB_SECONDS = 0.322997448918 * SECONDS_PER_DAY; // Weisberg, Nice & Taylor 2010 (from memory)
const HULSE_TAYLOR_X_LIGHT_SECONDS = 2.341782; // Weisberg, Nice & Taylor 2010 (from memory)

/** Left side of the mass-function equation at i = 90°. */
const massFunctionOf = (mc: number, mp: number) => mc ** 3 / (mp + mc) ** 2;

describe('massFunctionSolarMasses', () => {
  it('gives 0.1322 solar masses for the Hulse–Taylor binary', () => {
    const f = massFunctionSolarMasses(HULSE_TAYLOR_X_LIGHT_SECONDS, HULSE_TAYLOR_PB_SECONDS);
    expectWithin(f, 0.1322, 0.1322 * 1e-3, 'mass function (M☉), Weisberg, Nice & Taylor 2010 (from memory)');
  });

  it('scales as x³ / Pb² (hand check of the formula)', () => {
    const f1 = massFunctionSolarMasses(1, SECONDS_PER_DAY);
    expectWithin(massFunctionSolarMasses(2, 3 * SECONDS_PER_DAY) / f1, 8 / 9, 1e-14, 'f ratio');
  });

  it('rejects non-positive inputs by name', () => {
    expect(() => massFunctionSolarMasses(0, 1)).toThrow(/projectedSemiMajorAxisLightSeconds/);
    expect(() => massFunctionSolarMasses(1, Number.NaN)).toThrow(/orbitalPeriodSeconds/);
  });
});

describe('minimumCompanionMass', () => {
  it('gives Earth-scale masses for a planet-mass orbit, consistent with f ≈ m_c³/m_p²', () => {
    const f = massFunctionSolarMasses(1e-3, 100 * SECONDS_PER_DAY);
    const got = minimumCompanionMass(f, 1.4);
    // Hand check: for m_c ≪ m_p, m_c ≈ (f m_p²)^(1/3), with a relative correction ≈ (2/3) m_c/m_p ≈ 3e-6.
    const approximate = Math.cbrt(f * 1.4 * 1.4);
    expectWithin(got.solarMasses / approximate - 1, 0, 1e-5, 'relative difference from the small-mass limit');
    expect(got.earthMasses).toBeGreaterThan(1);
    expect(got.earthMasses).toBeLessThan(3);
    expectWithin(got.earthMasses, got.solarMasses * SUN_TO_EARTH_MASS_RATIO, 1e-12, 'Earth masses');
    expectWithin(got.jupiterMasses, got.solarMasses * SUN_TO_JUPITER_MASS_RATIO, 1e-12, 'Jupiter masses');
  });

  it.each([
    ['planet', 1e-3, 100],
    ['white dwarf', 2, 1.5],
    ['Hulse–Taylor', HULSE_TAYLOR_X_LIGHT_SECONDS, 0.322997448918],
    ['massive companion', 100, 10],
  ])('the root reproduces f to 1e-12 relative (%s case)', (_label, x, pbDays) => {
    const f = massFunctionSolarMasses(x, pbDays * SECONDS_PER_DAY);
    const mc = minimumCompanionMass(f, 1.4).solarMasses;
    expectWithin(massFunctionOf(mc, 1.4) / f - 1, 0, 1e-12, 'relative mass-function residual');
  });

  it('uses 1.4 solar masses by default and returns f itself for a massless pulsar', () => {
    expect(minimumCompanionMass(0.01).solarMasses).toBe(minimumCompanionMass(0.01, 1.4).solarMasses);
    expectWithin(minimumCompanionMass(0.3, 0).solarMasses, 0.3, 1e-15, 'm_c for m_p = 0');
    expect(minimumCompanionMass(0, 1.4).solarMasses).toBe(0);
  });

  it('rejects a negative or NaN mass function', () => {
    expect(() => minimumCompanionMass(-1)).toThrow(/massFunctionSolar/);
    expect(() => minimumCompanionMass(Number.NaN)).toThrow(/massFunctionSolar/);
    expect(() => minimumCompanionMass(0.1, -1)).toThrow(/pulsarMassSolar/);
  });
});

describe('bracketedRoot', () => {
  it('finds √2 to adjacent doubles', () => {
    expectWithin(bracketedRoot((x) => x * x - 2, 0, 2), Math.SQRT2, 4e-16, '√2');
  });
  it('rejects a bracket without a sign change', () => {
    expect(() => bracketedRoot((x) => x * x + 1, -1, 1)).toThrow(/change sign/);
  });
});

describe('orbitalSeparationAu', () => {
  it('gives 1 au for a massless body on the Gaussian year around one solar mass', () => {
    // Gaussian gravitational constant k = 0.01720209895 au^(3/2) d⁻¹ M☉^(−1/2) (IAU 1976 System of
    // Astronomical Constants; from memory): period 2π/k days at a = 1 au. The IAU 2012 au keeps
    // GM☉ = k² au³/d² to ~1e-10 (common practice), so the check holds to well under 1e-8.
    const gaussianYearSeconds = ((2 * Math.PI) / 0.01720209895) * SECONDS_PER_DAY;
    expectWithin(orbitalSeparationAu(1, gaussianYearSeconds), 1, 1e-8, 'semi-major axis (au)');
  });

  it('agrees with x = a sin i · m_c / M for the GR-predicted inclination (identity)', () => {
    const mp = 1.438;
    const mc = 1.39;
    const { shapiroShape } = postKeplerianPredictions({
      pulsarMassSolar: mp, companionMassSolar: mc, eccentricity: 0.617134,
      orbitalPeriodSeconds: HULSE_TAYLOR_PB_SECONDS, projectedSemiMajorAxisLightSeconds: HULSE_TAYLOR_X_LIGHT_SECONDS,
    });
    const aLightSeconds = orbitalSeparationAu(mp + mc, HULSE_TAYLOR_PB_SECONDS) * AU_LIGHT_SECONDS;
    expectWithin((aLightSeconds * shapiroShape * mc) / (mp + mc), HULSE_TAYLOR_X_LIGHT_SECONDS, 1e-12, 'x (lt-s)');
  });

  it('scales as M^(1/3) Pb^(2/3)', () => {
    expectWithin(orbitalSeparationAu(8, 8 * SECONDS_PER_DAY) / orbitalSeparationAu(1, SECONDS_PER_DAY), 8, 1e-13, 'ratio');
    expect(() => orbitalSeparationAu(0, 1)).toThrow(/totalMassSolar/);
  });
});
