import { describe, expect, it } from 'vitest';
import { companionDelaysS } from '../../../worker/timing/orbits/companion-delays';
import { solveKepler } from '../../../worker/timing/orbits/kepler-equation';
import type { Companion, DamourDeruelleCompanion, KeplerianCompanion, TimingModel } from '../../../worker/timing/model/timing-model';
import { mjdAddDays, mjdDiffDays, mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import type { Mjd } from '../../../worker/timing/time/epoch';
import { SUN_MASS_SECONDS } from '../../../worker/timing/delays/physical-constants';

function expectWithin(got: number, want: number, tol: number, label: string): void {
  const err = Math.abs(got - want);
  if (!(err <= tol)) throw new Error(`${label}: want ${want}, got ${got}, |error| ${err} > tol ${tol}`);
}

const DEG = Math.PI / 180;
const epoch = mjdFromParts(58000, 0);

function dd(overrides: Partial<DamourDeruelleCompanion> = {}): DamourDeruelleCompanion {
  return {
    kind: 'damour-deruelle', name: 'b', enabled: true, periodDays: 0.4, projectedSemimajorAxisLtS: 2.2, eccentricity: 0.3,
    periastronLongitudeDeg: 40, periastronEpochMjd: mjdFromParts(58000, 0.25), periodDerivative: 0,
    periastronAdvanceDegPerYr: 0, einsteinDelayS: 0, shapiroRangeS: 0, shapiroShape: 0, ...overrides,
  };
}
function asKeplerian(c: DamourDeruelleCompanion): KeplerianCompanion {
  const { shapiroRangeS: _r, shapiroShape: _s, ...rest } = c;
  return { ...rest, kind: 'keplerian' };
}
function model(companions: Companion[]): Pick<TimingModel, 'companions' | 'epochMjd'> {
  return { companions, epochMjd: epoch };
}
function times(count: number, spanDays: number, start = 58000.1): Mjd[] {
  return Array.from({ length: count }, (_, i) => mjdFromParts(Math.floor(start), start - Math.floor(start) + (i * spanDays) / count));
}
function delays(c: Companion, ts: Mjd[]): Float64Array {
  return companionDelaysS(model([c]), ts);
}
function daysSincePeriastron(t: Mjd, c: DamourDeruelleCompanion): number {
  const d = mjdDiffDays(t, c.periastronEpochMjd);
  return d[1] + d[0];
}
/** Roemer + Einstein delay at an emission time (Damour & Deruelle 1986, written out here from the paper's form). */
function roemerEinsteinAtS(c: DamourDeruelleCompanion, tDays: number): number {
  const u = solveKepler((2 * Math.PI * tDays) / c.periodDays, c.eccentricity);
  const w = c.periastronLongitudeDeg * DEG;
  const x = c.projectedSemimajorAxisLtS;
  const e = c.eccentricity;
  return x * Math.sin(w) * (Math.cos(u) - e) + (x * Math.sqrt(1 - e * e) * Math.cos(w) + c.einsteinDelayS) * Math.sin(u);
}

describe('Damour–Deruelle delay', () => {
  it('with r = s = 0, ω̇ = 0, γ = 0 agrees with Blandford–Teukolsky to second order in n·x', () => {
    // Both share D·(1 − D'), D the Roemer delay, D' = nD_u/(1 − e cos u) (Blandford & Teukolsky 1976,
    // ApJ 205, 580; Damour & Deruelle 1986). DD adds D·(D'² + ½DD''). With |D| ≤ x(1 − e cos u),
    // |D_u|, |D_uu| ≤ x and 1 − e cos u ≥ 1 − e: |D·D'²| ≤ n²x³/(1−e) and |½D²D''| ≤ ½n²x³(1 + e/(1−e)),
    // so |DD − BT| ≤ 1.5·x·(nx)²/(1 − e).
    const c = dd();
    const ts = times(400, 2);
    const a = delays(c, ts);
    const b = delays(asKeplerian(c), ts);
    const x = c.projectedSemimajorAxisLtS;
    const n = (2 * Math.PI) / (c.periodDays * 86_400);
    const bound = (1.5 * x * (n * x) ** 2) / (1 - c.eccentricity);
    const worst = Math.max(...Array.from(a, (v, i) => Math.abs(v - b[i])));
    expect(worst).toBeLessThanOrEqual(bound);
    // the second-order terms are really there (a bound of 0.1 × would fail): the formulas differ
    expect(worst).toBeGreaterThan(0.1 * bound);
  });

  it('solves t_arrival = t_emission + D(t_emission) to third order in n·x (iterated solution)', () => {
    // A compact orbit where the second-order terms are ~20 µs: x = 3 lt-s, Pb = 0.1 d, e = 0.2.
    const c = dd({ projectedSemimajorAxisLtS: 3, periodDays: 0.1, eccentricity: 0.2, einsteinDelayS: 2e-3 });
    const ts = times(120, 0.3, 58000.26);
    const got = delays(c, ts);
    const bt = delays(asKeplerian({ ...c, einsteinDelayS: 0 }), ts);
    const x = c.projectedSemimajorAxisLtS;
    const n = (2 * Math.PI) / (c.periodDays * 86_400);
    // next term of the series (1/4!)·d³(D⁴)/dt³: each time derivative brings n/(1 − e), so
    // ≲ x(nx)³/(1 − e)⁴ with a factor 4 for the terms of the product rule
    const tol = (4 * x * (n * x) ** 3) / (1 - c.eccentricity) ** 4;
    let worstBt = 0;
    ts.forEach((t, i) => {
      const arrival = daysSincePeriastron(t, c);
      let emission = arrival;
      for (let k = 0; k < 40; k += 1) emission = arrival - roemerEinsteinAtS(c, emission) / 86_400;
      const exact = (arrival - emission) * 86_400;
      expectWithin(got[i], exact, tol, `sample ${i}`);
      const einstein = c.einsteinDelayS * Math.sin(solveKepler((2 * Math.PI * arrival) / c.periodDays, c.eccentricity));
      worstBt = Math.max(worstBt, Math.abs(bt[i] + einstein - exact));
    });
    expect(worstBt).toBeGreaterThan(10 * tol); // first order alone (Blandford–Teukolsky) would fail this check
  });

  it('Shapiro term of a circular orbit is −2r ln(1 − s sin Φ), −2r ln(1 − s) at conjunction', () => {
    // Closed form for e = 0 (Blandford & Teukolsky 1976, ApJ 205, 580; Damour & Deruelle 1986): Φ = ω + u is
    // the phase from the ascending node; conjunction (pulsar behind the companion) is Φ = π/2.
    const r = 1.3 * SUN_MASS_SECONDS; // r = T☉·m_c (Damour & Deruelle 1986), m_c = 1.3 solar masses
    const s = 0.9995;
    const base = dd({ eccentricity: 0, periastronLongitudeDeg: 20, shapiroShape: s });
    const withShapiro = { ...base, shapiroRangeS: r };
    // times around the orbit, and one exactly at conjunction: u = π/2 − ω
    const conjunction = mjdAddDays(base.periastronEpochMjd, ((Math.PI / 2 - 20 * DEG) / (2 * Math.PI)) * base.periodDays);
    const ts = [...times(60, 0.4), conjunction];
    const a = delays(withShapiro, ts);
    const b = delays(base, ts);
    ts.forEach((t, i) => {
      const phi = 20 * DEG + (2 * Math.PI * daysSincePeriastron(t, base)) / base.periodDays;
      const want = -2 * r * Math.log(1 - s * Math.sin(phi));
      expectWithin(a[i] - b[i], want, 1e-9 * Math.abs(want) + 1e-15, `sample ${i}`);
    });
    // at conjunction: −2·1.3·4.925490947 µs·ln(5e-4) ≈ 97.3 µs (hand computation; T☉ from IERS 2010 GM☉)
    expectWithin(a[ts.length - 1] - b[ts.length - 1], 97.33e-6, 0.01e-6, 'conjunction');
  });

  it('Einstein term adds γ sin u, u the eccentric anomaly (Damour & Deruelle 1986)', () => {
    const gamma = 4.3e-3;
    const c = dd({ eccentricity: 0.6 });
    const ts = times(200, 0.8);
    const a = delays({ ...c, einsteinDelayS: gamma }, ts);
    const b = delays(c, ts);
    const x = c.projectedSemimajorAxisLtS;
    const n = (2 * Math.PI) / (c.periodDays * 86_400);
    // γ also enters D' in the inverse formula: |change − γ sin u| ≤ γn(2x + γ)/(1 − e), 10 % margin for D'²
    const tol = (1.1 * gamma * n * (2 * x + gamma)) / (1 - c.eccentricity);
    ts.forEach((t, i) => {
      const u = solveKepler((2 * Math.PI * daysSincePeriastron(t, c)) / c.periodDays, c.eccentricity);
      expectWithin(a[i] - b[i], gamma * Math.sin(u), tol, `sample ${i}`);
    });
    // γ sin M instead would differ by up to ~e·γ, far outside the tolerance
    expect(0.6 * gamma).toBeGreaterThan(20 * tol);
  });

  it('periastron advances with the true anomaly: ω = ω₀ + k·A_e(u), k = ω̇Pb/2π (Damour & Deruelle 1986)', () => {
    const c = dd({ periastronAdvanceDegPerYr: 4.2, eccentricity: 0.6 });
    for (const elapsed of [0.13, 0.31, 365.25 * 3 + 0.05, 365.25 * 3 + 0.27]) {
      const t = mjdAddDays(c.periastronEpochMjd, elapsed);
      const orbits = elapsed / c.periodDays;
      const whole = Math.round(orbits);
      const u = solveKepler(2 * Math.PI * (orbits - whole), c.eccentricity);
      // A_e(u) = 2 atan[√((1+e)/(1−e)) tan(u/2)] (Damour & Deruelle 1986), plus 2π per whole orbit
      const trueAnomaly = 2 * Math.PI * whole + 2 * Math.atan(Math.sqrt((1 + c.eccentricity) / (1 - c.eccentricity)) * Math.tan(u / 2));
      const k = (4.2 * DEG * c.periodDays) / (365.25 * 2 * Math.PI);
      const shifted = dd({ ...c, periastronAdvanceDegPerYr: 0, periastronLongitudeDeg: 40 + (k * trueAnomaly) / DEG });
      expectWithin(delays(c, [t])[0], delays(shifted, [t])[0], 2e-11, `after ${elapsed} d`);
    }
  });

  it('disabled companions contribute nothing; the delay adds to other companions', () => {
    const ts = times(30, 1);
    const strong = dd({ shapiroRangeS: 5e-6, shapiroShape: 0.99, einsteinDelayS: 1e-3, periastronAdvanceDegPerYr: 3 });
    const off = delays({ ...strong, enabled: false }, ts);
    expect(Array.from(off).every((v) => v === 0)).toBe(true);
    const one = delays(strong, ts);
    const two = companionDelaysS(model([strong, { ...strong, name: 'c', enabled: false }, { ...strong, name: 'd' }]), ts);
    ts.forEach((_, i) => expectWithin(two[i], 2 * one[i], 1e-15, `sum ${i}`));
  });
});
