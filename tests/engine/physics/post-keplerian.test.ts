import { describe, expect, it } from 'vitest';
import { postKeplerianPredictions } from '../../../worker/timing/physics/post-keplerian-predictions';
import {
  massesFromPeriastronAdvanceAndEinsteinDelay,
  massesFromPeriastronAdvanceAndPeriodDerivative,
  totalMassFromPeriastronAdvance,
} from '../../../worker/timing/physics/masses-from-post-keplerian';
import { SUN_MASS_SECONDS } from '../../../worker/timing/delays/physical-constants';
import { expectWithin } from '../time/expect-within';

const PB_SECONDS = 0.322997448918 * 86_400; // Hulse–Taylor binary, Weisberg, Nice & Taylor 2010 (from memory)
const ECCENTRICITY = 0.617134; // Weisberg & Huang 2016 (from memory)
const X_LIGHT_SECONDS = 2.341782; // Weisberg, Nice & Taylor 2010 (from memory)
const MP = 1.438; // Weisberg & Huang 2016 (from memory)
const MC = 1.39; // Weisberg & Huang 2016 (from memory)
const orbit = { eccentricity: ECCENTRICITY, orbitalPeriodSeconds: PB_SECONDS };
const hulseTaylor = postKeplerianPredictions({
  pulsarMassSolar: MP, companionMassSolar: MC, ...orbit, projectedSemiMajorAxisLightSeconds: X_LIGHT_SECONDS,
});

describe('postKeplerianPredictions for the Hulse–Taylor binary', () => {
  it('predicts a periastron advance of 4.2266 °/yr', () => {
    expectWithin(hulseTaylor.periastronAdvanceDegPerYear, 4.2266, 4.2266 * 5e-3, 'ω̇ (°/yr), Weisberg & Huang 2016 (from memory)');
  });
  it('predicts an orbital period derivative of −2.40e−12', () => {
    expectWithin(hulseTaylor.orbitalPeriodDerivative, -2.4e-12, 2.4e-12 * 5e-3, 'Ṗb, Weisberg & Huang 2016 (from memory)');
  });
  it('predicts an Einstein delay of 4.3 ms', () => {
    expectWithin(hulseTaylor.einsteinDelaySeconds, 4.3e-3, 4.3e-3 * 2e-2, 'γ (s), from memory');
  });
  it('gives r = T☉ m_c and a physical Shapiro shape', () => {
    expectWithin(hulseTaylor.shapiroRangeSeconds, SUN_MASS_SECONDS * MC, 1e-20, 'r (s)');
    expect(hulseTaylor.shapiroShape).toBeGreaterThan(0);
    expect(hulseTaylor.shapiroShape).toBeLessThan(1);
    expect(hulseTaylor.warnings).toEqual([]);
  });
  it('warns when x is too large for the masses (sin i > 1)', () => {
    const p = postKeplerianPredictions({ pulsarMassSolar: MP, companionMassSolar: MC, ...orbit, projectedSemiMajorAxisLightSeconds: 10 });
    expect(p.shapiroShape).toBeGreaterThan(1);
    expect(p.warnings).toEqual(['shapiro-shape-exceeds-one']);
  });
  it('leaves the Shapiro shape NaN without x, and γ = 0 for a circular orbit', () => {
    const p = postKeplerianPredictions({ pulsarMassSolar: MP, companionMassSolar: MC, eccentricity: 0, orbitalPeriodSeconds: PB_SECONDS });
    expect(Number.isNaN(p.shapiroShape)).toBe(true);
    expect(p.einsteinDelaySeconds).toBe(0);
  });
  it('rejects an unbound eccentricity and non-positive masses by name', () => {
    expect(() => postKeplerianPredictions({ pulsarMassSolar: MP, companionMassSolar: MC, eccentricity: 1, orbitalPeriodSeconds: PB_SECONDS })).toThrow(/eccentricity/);
    expect(() => postKeplerianPredictions({ pulsarMassSolar: 0, companionMassSolar: MC, ...orbit })).toThrow(/pulsarMassSolar/);
  });
});

describe('masses from two post-Keplerian parameters (identity checks on the GR predictions)', () => {
  it('recovers the total mass from ω̇ alone', () => {
    expectWithin(totalMassFromPeriastronAdvance(hulseTaylor.periastronAdvanceDegPerYear, orbit) / (MP + MC) - 1, 0, 1e-12, 'relative M error');
  });

  it('recovers both masses from (ω̇, γ) to 1e-6 relative', () => {
    const got = massesFromPeriastronAdvanceAndEinsteinDelay(hulseTaylor.periastronAdvanceDegPerYear, hulseTaylor.einsteinDelaySeconds, orbit);
    expect(got.warnings).toEqual([]);
    expectWithin(got.masses!.pulsarMassSolar / MP - 1, 0, 1e-6, 'relative m_p error');
    expectWithin(got.masses!.companionMassSolar / MC - 1, 0, 1e-6, 'relative m_c error');
  });

  it('recovers both masses from (ω̇, Ṗb), the larger as the pulsar, with the swap reported', () => {
    const got = massesFromPeriastronAdvanceAndPeriodDerivative(hulseTaylor.periastronAdvanceDegPerYear, hulseTaylor.orbitalPeriodDerivative, orbit);
    expect(got.warnings).toEqual([]);
    expectWithin(got.masses!.pulsarMassSolar / MP - 1, 0, 1e-6, 'relative m_p error');
    expectWithin(got.masses!.companionMassSolar / MC - 1, 0, 1e-6, 'relative m_c error');
    expect(got.swappedMasses!.pulsarMassSolar).toBe(got.masses!.companionMassSolar);
  });

  it.each([
    [1.25, 0.25, 0.09, 0.1],
    [1.4, 1.4, 0.3, 8],
    [2.0, 0.6, 0.8, 2],
  ])('round-trips m_p = %f, m_c = %f (e = %f, Pb = %f d) through (ω̇, γ)', (mp, mc, e, pbDays) => {
    const o = { eccentricity: e, orbitalPeriodSeconds: pbDays * 86_400 };
    const p = postKeplerianPredictions({ pulsarMassSolar: mp, companionMassSolar: mc, ...o });
    const got = massesFromPeriastronAdvanceAndEinsteinDelay(p.periastronAdvanceDegPerYear, p.einsteinDelaySeconds, o);
    expectWithin(got.masses!.pulsarMassSolar / mp - 1, 0, 1e-10, 'relative m_p error');
    expectWithin(got.masses!.companionMassSolar / mc - 1, 0, 1e-10, 'relative m_c error');
  });

  it('reports no solution when γ is too large for the total mass', () => {
    const got = massesFromPeriastronAdvanceAndEinsteinDelay(hulseTaylor.periastronAdvanceDegPerYear, 10 * hulseTaylor.einsteinDelaySeconds, orbit);
    expect(got.masses).toBeNull();
    expect(got.warnings).toEqual(['no-positive-mass-solution']);
  });

  it('reports no solution when |Ṗb| exceeds what equal masses can radiate', () => {
    const got = massesFromPeriastronAdvanceAndPeriodDerivative(hulseTaylor.periastronAdvanceDegPerYear, 2 * hulseTaylor.orbitalPeriodDerivative, orbit);
    expect(got.masses).toBeNull();
    expect(got.warnings).toEqual(['no-positive-mass-solution']);
  });

  it('rejects a positive Ṗb and a circular orbit for γ by name', () => {
    expect(() => massesFromPeriastronAdvanceAndPeriodDerivative(4.2, 1e-12, orbit)).toThrow(/orbitalPeriodDerivative/);
    expect(() => massesFromPeriastronAdvanceAndEinsteinDelay(4.2, 1e-3, { ...orbit, eccentricity: 0 })).toThrow(/eccentricity/);
  });
});
