import { describe, expect, it } from 'vitest';
import { solveKepler } from '../../../worker/timing/orbits/kepler-equation';
import { companionDelaysS } from '../../../worker/timing/orbits/companion-delays';
import { keplerianFromLowEccentricity, lowEccentricityFromKeplerian } from '../../../worker/timing/orbits/low-eccentricity-delay';
import type { KeplerianCompanion, TimingModel, Companion } from '../../../worker/timing/model/timing-model';
import { mjdFromParts, mjdAddDays, mjdDiffDays } from '../../../worker/timing/time/mjd-arithmetic';
import type { Mjd } from '../../../worker/timing/time/epoch';

function expectWithin(got: number, want: number, tol: number, label: string): void {
  const err = Math.abs(got - want);
  if (!(err <= tol)) throw new Error(`${label}: want ${want}, got ${got}, |error| ${err} > tol ${tol}`);
}
const DEG = Math.PI / 180;

describe("Kepler's equation", () => {
  it('e = 0.1, M = 5° gives E = 5.554589° (Meeus 1998, Astronomical Algorithms, example 30.a, from memory)', () => {
    expectWithin(solveKepler(5 * DEG, 0.1) / DEG, 5.554589, 1e-6, 'E (deg)');
  });
  it('converges to 1e-15 rad for e up to 0.99 across all mean anomalies', () => {
    for (const e of [0, 0.3, 0.9, 0.97, 0.99]) {
      for (let m = -7; m <= 7; m += 0.013) {
        const E = solveKepler(m, e);
        expectWithin(E - e * Math.sin(E), m, 1.5e-15 * Math.max(1, Math.abs(m)), `e ${e}, M ${m}`);
      }
    }
  });
  it('keeps the revolution of M and rejects e ≥ 1', () => {
    expectWithin(solveKepler(20 * Math.PI + 0.3, 0.5) - 20 * Math.PI, solveKepler(0.3, 0.5), 1e-13, 'revolution');
    expect(() => solveKepler(1, 1)).toThrow(RangeError);
    expect(() => solveKepler(1, -1)).toThrow(RangeError);
    // slightly negative e (numeric derivatives straddling e = 0) still solves the equation
    const E = solveKepler(0.7, -1e-4);
    expectWithin(E + 1e-4 * Math.sin(E), 0.7, 1e-15, 'e = −1e-4');
    expect(() => solveKepler(Number.NaN, 0.1)).toThrow(RangeError);
  });
});

const epoch = mjdFromParts(58000, 0);
function keplerian(overrides: Partial<KeplerianCompanion> = {}): KeplerianCompanion {
  return {
    kind: 'keplerian', name: 'b', enabled: true, periodDays: 1.5, projectedSemimajorAxisLtS: 3.2, eccentricity: 0.2,
    periastronLongitudeDeg: 40, periastronEpochMjd: mjdFromParts(58000, 0.25), periodDerivative: 0,
    periastronAdvanceDegPerYr: 0, einsteinDelayS: 0, ...overrides,
  };
}
function model(companions: Companion[]): Pick<TimingModel, 'companions' | 'epochMjd'> {
  return { companions, epochMjd: epoch };
}
function times(count: number, spanDays: number, start = 58000.1): Mjd[] {
  return Array.from({ length: count }, (_, i) => mjdFromParts(Math.floor(start), start - Math.floor(start) + (i * spanDays) / count));
}

describe('Blandford–Teukolsky delay', () => {
  it('for a circular orbit is x·sin(ω + M)(1 − n x cos(ω + M)) (hand-derivable case)', () => {
    const c = keplerian({ eccentricity: 0, periastronLongitudeDeg: 0 });
    const ts = times(50, 3);
    const delays = companionDelaysS(model([c]), ts);
    ts.forEach((t, i) => {
      const dtDays = Number(mjdDiffDays(t, c.periastronEpochMjd)[1]);
      const phi = (2 * Math.PI * dtDays) / c.periodDays;
      const n = (2 * Math.PI) / (c.periodDays * 86400);
      const want = c.projectedSemimajorAxisLtS * Math.sin(phi) * (1 - n * c.projectedSemimajorAxisLtS * Math.cos(phi));
      expectWithin(delays[i], want, 1e-12, `sample ${i}`);
    });
  });
  it('the first-order correction matches solving t_arrival = t_emission + Δ(t_emission) iteratively', () => {
    const c = keplerian({ eccentricity: 0.5, einsteinDelayS: 0 });
    const noCorrectionDelay = (tDays: number): number => {
      // Roemer delay evaluated at the emission time (B&T 1976 without the correction), from first principles
      const mean = (2 * Math.PI * tDays) / c.periodDays;
      const E = solveKepler(mean, c.eccentricity);
      const w = c.periastronLongitudeDeg * DEG;
      const x = c.projectedSemimajorAxisLtS;
      return x * Math.sin(w) * (Math.cos(E) - c.eccentricity) + x * Math.sqrt(1 - c.eccentricity ** 2) * Math.cos(w) * Math.sin(E);
    };
    const ts = times(40, 1.5, 58001);
    const delays = companionDelaysS(model([c]), ts);
    ts.forEach((t, i) => {
      const tArrival = mjdDiffDays(t, c.periastronEpochMjd)[1];
      let emission = tArrival;
      for (let k = 0; k < 30; k += 1) emission = tArrival - noCorrectionDelay(emission) / 86400;
      const exact = (tArrival - emission) * 86400;
      // dropped second-order term ~ x (n x)² / (1 − e)³ ≈ 3.2·(1.55e-4)²·8 ≈ 6e-7 s
      expectWithin(delays[i], exact, 1e-6, `sample ${i}`);
    });
  });
  it('adds γ sin E as the Einstein delay', () => {
    const ts = times(30, 2);
    const a = companionDelaysS(model([keplerian()]), ts);
    const b = companionDelaysS(model([keplerian({ einsteinDelayS: 1e-3 })]), ts);
    const maxDiff = Math.max(...Array.from(a, (v, i) => Math.abs(b[i] - v)));
    expectWithin(maxDiff, 1e-3, 1e-4, 'max |γ sin E|');
  });
  it('disabled companions contribute nothing; several companions add', () => {
    const ts = times(20, 2);
    const one = companionDelaysS(model([keplerian()]), ts);
    const off = companionDelaysS(model([keplerian({ enabled: false })]), ts);
    expect(Array.from(off).every((v) => v === 0)).toBe(true);
    const two = companionDelaysS(model([keplerian(), keplerian({ name: 'c', enabled: false }), keplerian({ name: 'd' })]), ts);
    ts.forEach((_, i) => expectWithin(two[i], 2 * one[i], 1e-15, `sum ${i}`));
  });
  it('periastron advance equals a shifted ω after the elapsed time', () => {
    const c = keplerian({ periastronAdvanceDegPerYr: 4 });
    const elapsedDays = 365.25 * 2 + 0.3;
    const t = [mjdAddDays(c.periastronEpochMjd, elapsedDays)];
    const advanced = companionDelaysS(model([c]), t)[0];
    const shifted = companionDelaysS(model([keplerian({ periastronLongitudeDeg: 40 + (4 * elapsedDays) / 365.25 })]), t)[0];
    expectWithin(advanced, shifted, 1e-12, 'ω̇ after 2 years');
  });
});

describe('low-eccentricity model', () => {
  it('agrees with the Keplerian delay to O(x e²) at e = 1e-5 (Lange et al. 2001, MNRAS 326, 274)', () => {
    const e = 1e-5;
    const k = keplerian({ eccentricity: e, projectedSemimajorAxisLtS: 12, periodDays: 0.8 });
    const l = lowEccentricityFromKeplerian(k);
    const ts = times(200, 4);
    const dk = companionDelaysS(model([k]), ts);
    const dl = companionDelaysS(model([l]), ts);
    // the published model omits the constant −(3/2)xη; it enters the Keplerian delay times the same
    // first-order arrival-time factor (1 − n x cos Φ) as everything else
    const x = k.projectedSemimajorAxisLtS;
    const n = (2 * Math.PI) / (k.periodDays * 86400);
    const tolS = 5 * x * e * e;
    ts.forEach((t, i) => {
      const phi = (2 * Math.PI * mjdDiffDays(t, l.ascendingNodeEpochMjd)[1]) / k.periodDays;
      const constantTerm = -1.5 * x * l.eSinOmega * (1 - n * x * Math.cos(phi));
      expectWithin(dl[i] + constantTerm, dk[i], tolS, `sample ${i}`);
    });
    // and the O(x e) terms matter: without η, κ the difference would exceed the tolerance
    const circular = companionDelaysS(model([{ ...l, eSinOmega: 0, eCosOmega: 0 }]), ts);
    expect(Math.max(...Array.from(circular, (v, i) => Math.abs(v - dk[i])))).toBeGreaterThan(100 * tolS);
  });
  it('element conversion round-trips', () => {
    const k = keplerian({ eccentricity: 3e-4, periastronLongitudeDeg: 250 });
    const back = keplerianFromLowEccentricity(lowEccentricityFromKeplerian(k));
    expectWithin(back.eccentricity, k.eccentricity, 1e-18, 'e');
    expectWithin(back.periastronLongitudeDeg, 250, 1e-9, 'ω');
    expectWithin(mjdDiffDays(back.periastronEpochMjd, k.periastronEpochMjd)[1] * 86400, 0, 1e-9, 'T₀ (s)');
  });
});
