import { describe, expect, it } from 'vitest';
import {
  akaikeInformationCriterion,
  bayesianInformationCriterion,
  chiSquareUpperTail,
  fUpperTail,
  nestedFTest,
} from '../../../worker/timing/fit/model-selection';

describe('fUpperTail', () => {
  // Upper 5 % and 1 % points of the F distribution: NIST/SEMATECH e-Handbook of Statistical
  // Methods §1.3.6.7.3 (also Bevington & Robinson 3rd ed., Table C.5); values from memory.
  it.each([
    [4.965, 1, 10, 0.05],
    [3.493, 2, 20, 0.05],
    [2.922, 3, 30, 0.05],
    [10.044, 1, 10, 0.01],
    [4.51, 3, 30, 0.01],
  ])('F = %f with (%i, %i) dof has upper tail %f', (f, d1, d2, p) => {
    expect(fUpperTail(f, d1, d2)).toBeCloseTo(p, 3);
  });

  it('keeps tiny probabilities (no 1 − cdf cancellation)', () => {
    const p = fUpperTail(400, 2, 1000);
    expect(p).toBeGreaterThan(0);
    expect(p).toBeLessThan(1e-100);
  });

  it('is 1 at F = 0', () => {
    expect(fUpperTail(0, 2, 10)).toBe(1);
  });
});

describe('chiSquareUpperTail', () => {
  // 5 % points of χ²: 3.841 (1 dof), 18.307 (10 dof); NIST/SEMATECH e-Handbook §1.3.6.7.4, from memory.
  it('matches the tabulated 5 % points', () => {
    expect(chiSquareUpperTail(3.841, 1)).toBeCloseTo(0.05, 3);
    expect(chiSquareUpperTail(18.307, 10)).toBeCloseTo(0.05, 3);
  });
});

describe('nestedFTest', () => {
  it('computes F = (Δχ²/Δk)/(χ²/ν) for an added term (Bevington & Robinson 3rd ed. §11.4)', () => {
    const smaller = { chi2: 150, count: 100, freeParameters: 3 };
    const larger = { chi2: 100, count: 100, freeParameters: 5 };
    const result = nestedFTest(smaller, larger);
    expect(result.statistic).toBeCloseTo((50 / 2) / (100 / 95), 12);
    expect(result.addedParameters).toBe(2);
    expect(result.dof).toBe(95);
    expect(result.probability).toBeCloseTo(fUpperTail(result.statistic, 2, 95), 15);
    expect(result.probability).toBeLessThan(1e-6);
  });

  it('refuses models that are not nested by parameter count', () => {
    expect(() => nestedFTest({ chi2: 1, count: 10, freeParameters: 3 }, { chi2: 1, count: 10, freeParameters: 3 })).toThrow(RangeError);
  });
});

describe('information criteria', () => {
  it('AIC = χ² + 2k and BIC = χ² + k ln N', () => {
    const fit = { chi2: 120, count: 100, freeParameters: 4 };
    expect(akaikeInformationCriterion(fit)).toBe(128);
    expect(bayesianInformationCriterion(fit)).toBeCloseTo(120 + 4 * Math.log(100), 12);
  });
});
