import { describe, expect, it } from 'vitest';
import { numericDerivative, numericDerivativeColumn } from '../../../worker/timing/fit/numeric-derivative';
import { expectWithin } from '../time/expect-within';

/** Eccentric anomaly E from mean anomaly M by Newton's method on E − e sin E = M (Kepler's equation). */
function eccentricAnomaly(meanAnomalyRad: number, e: number): number {
  let E = meanAnomalyRad + e * Math.sin(meanAnomalyRad);
  for (let k = 0; k < 50; k++) {
    const dE = (E - e * Math.sin(E) - meanAnomalyRad) / (1 - e * Math.cos(E));
    E -= dE;
    if (Math.abs(dE) < 1e-16) break;
  }
  return E;
}

// Analytic derivatives (calculus; dE/dM = 1/(1 − e cos E) from differentiating Kepler's equation).
const cases = [
  { name: 'sin at 0.7', f: (o: number) => Math.sin(0.7 + o), exact: Math.cos(0.7), scale: 1 },
  { name: 'exp at 3', f: (o: number) => Math.exp(3 + o), exact: Math.exp(3), scale: 1 },
  { name: 'exp(−x/τ) at x = 40, τ = 12', f: (o: number) => Math.exp(-(40 + o) / 12), exact: -Math.exp(-40 / 12) / 12, scale: 12 },
  {
    name: 'quintic 2x⁵ − 3x³ + x − 7 at 1.3',
    f: (o: number) => { const x = 1.3 + o; return 2 * x ** 5 - 3 * x ** 3 + x - 7; },
    exact: 10 * 1.3 ** 4 - 9 * 1.3 ** 2 + 1,
    scale: 1.3,
  },
  {
    name: 'Kepler E(M) at M = 2.1 rad, e = 0.6',
    f: (o: number) => eccentricAnomaly(2.1 + o, 0.6),
    exact: 1 / (1 - 0.6 * Math.cos(eccentricAnomaly(2.1, 0.6))),
    scale: 1,
  },
  {
    name: 'phase-like sin(2π·f·t) at t = 1.234 s, f = 3.7 Hz',
    f: (o: number) => Math.sin(2 * Math.PI * 3.7 * (1.234 + o)),
    exact: 2 * Math.PI * 3.7 * Math.cos(2 * Math.PI * 3.7 * 1.234),
    scale: 1 / (2 * Math.PI * 3.7),
  },
];

describe('numericDerivative (Richardson-extrapolated central differences)', () => {
  it.each(cases)('$name: ≤ 1e-10 relative to the analytic derivative', ({ f, exact, scale }) => {
    const got = numericDerivative(f, scale);
    expectWithin(Math.abs(got - exact) / Math.abs(exact), 0, 1e-10, 'relative error');
  });

  it.each(cases)('$name: a step scale 10× off either way stays ≤ 1e-7 relative (within the 1e-6 promise)', ({ f, exact, scale }) => {
    for (const factor of [0.1, 10]) {
      const got = numericDerivative(f, scale * factor);
      expectWithin(Math.abs(got - exact) / Math.abs(exact), 0, 1e-7, `relative error, scale × ${factor}`);
    }
  });

  it('is exact to rounding for a cubic (Richardson removes the h² term; the h⁴ term vanishes)', () => {
    const got = numericDerivative((o) => (2 + o) ** 3, 1);
    expectWithin(got, 12, 1e-12, 'd(x³)/dx at 2');
  });

  it('rejects a step scale that is not positive and finite', () => {
    expect(() => numericDerivative(Math.sin, 0)).toThrowError(RangeError);
    expect(() => numericDerivative(Math.sin, Number.NaN)).toThrowError(RangeError);
  });
});

describe('numericDerivativeColumn', () => {
  it('differentiates every component of a vector function, even when f reuses its output array', () => {
    const t = Float64Array.from({ length: 50 }, (_, i) => i * 0.37);
    const out = new Float64Array(t.length);
    const tau = 4.2;
    const f = (o: number) => {
      for (let i = 0; i < t.length; i++) out[i] = 3 * Math.exp(-t[i] / (tau + o));
      return out;
    };
    const column = numericDerivativeColumn(f, tau);
    for (let i = 1; i < t.length; i++) {
      const exact = (3 * Math.exp(-t[i] / tau) * t[i]) / (tau * tau); // ∂/∂τ of 3·exp(−t/τ)
      expectWithin(Math.abs(column[i] - exact), 0, 1e-9 * Math.abs(exact) + 1e-300, `component ${i}`);
    }
    expect(column[0]).toBe(0);
  });

  it('throws when f changes its length between evaluations', () => {
    let k = 0;
    expect(() => numericDerivativeColumn(() => new Float64Array(2 + (k++ % 2)), 1)).toThrowError(RangeError);
  });
});
