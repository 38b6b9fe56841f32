import { describe, expect, it } from 'vitest';
import { createSeededNormal, createSeededUniform } from '../../../worker/timing/fit/seeded-normal';

describe('createSeededNormal (mulberry32 + Marsaglia polar method)', () => {
  it('the same seed gives the same sequence and another seed a different one', () => {
    const a = createSeededNormal(123);
    const b = createSeededNormal(123);
    const c = createSeededNormal(124);
    const xa = Array.from({ length: 20 }, a);
    expect(Array.from({ length: 20 }, b)).toEqual(xa);
    expect(Array.from({ length: 20 }, c)).not.toEqual(xa);
  });

  it('100 000 draws have mean 0, variance 1, skewness 0 and kurtosis 3 within sampling error', () => {
    const draw = createSeededNormal(2026);
    const m = 100_000;
    let s1 = 0, s2 = 0, s3 = 0, s4 = 0, beyond3 = 0;
    for (let i = 0; i < m; i++) {
      const z = draw();
      s1 += z; s2 += z * z; s3 += z ** 3; s4 += z ** 4;
      if (Math.abs(z) > 3) beyond3++;
    }
    // Sampling standard errors for N(0,1): mean 1/√m, variance √(2/m), skewness √(6/m), kurtosis √(24/m); allow 5σ.
    expect(Math.abs(s1 / m)).toBeLessThan(5 / Math.sqrt(m));
    expect(Math.abs(s2 / m - 1)).toBeLessThan(5 * Math.sqrt(2 / m));
    expect(Math.abs(s3 / m)).toBeLessThan(5 * Math.sqrt(15 / m)); // Var(z³) = 15
    expect(Math.abs(s4 / m - 3)).toBeLessThan(5 * Math.sqrt(96 / m)); // Var(z⁴) = 105 − 9 = 96
    // P(|z| > 3) = 0.0026998 for a normal (common practice table value).
    expect(Math.abs(beyond3 / m - 0.0026998)).toBeLessThan(5 * Math.sqrt(0.0027 / m));
  });
});

describe('createSeededUniform', () => {
  it('stays inside (0, 1) and has mean ½ and variance 1/12', () => {
    const u = createSeededUniform(9);
    const m = 50_000;
    let s = 0, s2 = 0, min = 1, max = 0;
    for (let i = 0; i < m; i++) {
      const x = u();
      s += x; s2 += x * x; min = Math.min(min, x); max = Math.max(max, x);
    }
    expect(min).toBeGreaterThan(0);
    expect(max).toBeLessThan(1);
    expect(Math.abs(s / m - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / m));
    expect(Math.abs(s2 / m - (s / m) ** 2 - 1 / 12)).toBeLessThan(0.002);
  });

  it('rejects a non-finite seed', () => {
    expect(() => createSeededNormal(Number.NaN)).toThrowError(RangeError);
  });
});
