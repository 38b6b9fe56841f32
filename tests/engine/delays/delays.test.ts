import { describe, expect, it } from 'vitest';
import { dispersionDelayS, barycentricFrequencyMhz } from '../../../worker/timing/delays/dispersion-delay';
import { dispersionMeasureAt, dispersionTaylorCoefficient } from '../../../worker/timing/delays/dispersion-measure-at';
import { shapiroDelayS } from '../../../worker/timing/delays/shapiro-delay';
import { roemerDelayS } from '../../../worker/timing/delays/roemer-delay';
import { pulsarDirection, newSkyDirection } from '../../../worker/timing/delays/pulsar-direction';
import { AU_LIGHT_SECONDS, SUN_MASS_SECONDS, RAD_PER_MAS } from '../../../worker/timing/delays/physical-constants';

function expectWithin(got: number, want: number, tol: number, label: string): void {
  const err = Math.abs(got - want);
  if (!(err <= tol)) throw new Error(`${label}: want ${want}, got ${got}, |error| ${err} > tol ${tol}`);
}

describe('dispersion delay', () => {
  it('matches DM / (2.41e-4 f²) s within 1e-3 relative (Lorimer & Kramer 2005, Handbook of Pulsar Astronomy)', () => {
    for (const [dm, f] of [[10, 1400], [300, 150], [2.5, 4000]]) {
      const rounded = dm / (2.41e-4 * f * f);
      expectWithin(dispersionDelayS(dm, f) / rounded, 1, 1e-3, `DM ${dm} at ${f} MHz`);
    }
  });
  it('agrees with e²/(2π m_e c) from CODATA 2018 constants (cgs) to 1e-6 relative', () => {
    // CODATA 2018: e = 4.803204712570263e-10 esu, m_e = 9.1093837015e-28 g, c = 2.99792458e10 cm/s; 1 pc = 3.0856775814913673e18 cm (IAU 2015 B2).
    const k = (4.803204712570263e-10 ** 2 / (2 * Math.PI * 9.1093837015e-28 * 2.99792458e10)) * 3.0856775814913673e18; // s Hz² per pc cm⁻³
    expectWithin(dispersionDelayS(1, 1) / (k / 1e12), 1, 1e-6, 'dispersion constant');
  });
  it('is zero at infinite frequency and NaN for f ≤ 0', () => {
    expect(dispersionDelayS(50, Infinity)).toBe(0);
    expect(Number.isNaN(dispersionDelayS(50, 0))).toBe(true);
    expect(Number.isNaN(dispersionDelayS(50, -10))).toBe(true);
  });
  it('Doppler-corrects to a lower barycentric frequency when moving toward the pulsar', () => {
    expect(barycentricFrequencyMhz(1400, 1e-4)).toBeCloseTo(1400 * (1 - 1e-4), 9);
    expect(barycentricFrequencyMhz(Infinity, 1e-4)).toBe(Infinity);
  });
  it('DM Taylor series uses factorials of years', () => {
    expectWithin(dispersionMeasureAt(10, [1e-3, 2e-4], 2), 10 + 1e-3 * 2 + (2e-4 * 4) / 2, 1e-15, 'DM(2 yr)');
    expectWithin(dispersionTaylorCoefficient(2, 3), 27 / 6, 1e-15, 't³/3!');
    expect(dispersionMeasureAt(10, [], 5)).toBe(10);
  });
});

describe('Shapiro delay', () => {
  it('is about 120 µs for a line of sight grazing the Sun (common practice, within 10 %)', () => {
    const solarRadiusLs = 6.957e8 / 299_792_458; // IAU 2015 B3 nominal radius
    // observatory 1 au from the Sun on +x; pulsar direction passing one solar radius from the centre
    const bLs = solarRadiusLs;
    const rx = AU_LIGHT_SECONDS;
    const nx = -Math.sqrt(AU_LIGHT_SECONDS ** 2 - bLs ** 2) / AU_LIGHT_SECONDS;
    const ny = bLs / AU_LIGHT_SECONDS;
    const delay = shapiroDelayS(rx, 0, 0, nx, ny, 0, SUN_MASS_SECONDS);
    expectWithin(delay, 120e-6, 12e-6, 'grazing solar Shapiro delay (s)');
  });
  it('is small and negative-going (ln 2 term) for a pulsar opposite the Sun', () => {
    const delay = shapiroDelayS(AU_LIGHT_SECONDS, 0, 0, 1, 0, 0, SUN_MASS_SECONDS);
    expectWithin(delay, -2 * SUN_MASS_SECONDS * Math.log(2), 1e-15, 'anti-solar delay');
  });
  it('T☉ = GM☉/c³ ≈ 4.925490947 µs (IAU 2015 Resolution B3 nominal value, from memory)', () => {
    expectWithin(SUN_MASS_SECONDS, 4.925490947e-6, 1e-14, 'T☉');
  });
});

describe('Roemer delay', () => {
  it('is r·n̂ without parallax and positive on the pulsar side', () => {
    expect(roemerDelayS(400, 100, -50, 1, 0, 0, 0)).toBe(400);
    expect(roemerDelayS(-400, 0, 0, 1, 0, 0, 0)).toBe(-400);
  });
  it('curvature term equals the exact path difference for a pulsar at 1 kpc (1 mas)', () => {
    const dLs = AU_LIGHT_SECONDS / RAD_PER_MAS;
    const [rx, ry] = [0, AU_LIGHT_SECONDS]; // perpendicular to n̂ = x
    // d − |d n̂ − r| with r ⟂ n̂, in a cancellation-free form: −|r|²/(d + √(d² + |r|²))
    const stable = (ry * ry) / (dLs + Math.hypot(dLs - rx, ry));
    expectWithin(roemerDelayS(rx, ry, 0, 1, 0, 0, 1), -stable, 1e-15, 'curvature');
    expectWithin(-stable, -1.2e-6, 0.05e-6, '≈ 1.2 µs per mas at 1 au (common practice)');
  });
});

describe('pulsar direction', () => {
  it('returns a unit vector and moves by μ·t on the sky', () => {
    const out = newSkyDirection();
    const astrometry = { raRad: 1.2, decRad: -0.6, pmRaCosDecMasPerYr: 30, pmDecMasPerYr: -20 };
    pulsarDirection(astrometry, 0, out);
    const n0 = [out.x, out.y, out.z];
    expectWithin(Math.hypot(out.x, out.y, out.z), 1, 1e-15, '|n|');
    pulsarDirection(astrometry, 10, out);
    const angle = Math.hypot(out.x - n0[0], out.y - n0[1], out.z - n0[2]); // chord ≈ angle for small motions
    expectWithin(angle / RAD_PER_MAS, 10 * Math.hypot(30, 20), 1e-3, 'angular motion (mas)');
  });
});
