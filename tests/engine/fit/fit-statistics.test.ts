import { describe, expect, it } from 'vitest';
import { NeumaierSum, neumaierSum } from '../../../worker/timing/fit/neumaier-sum';
import {
  chiSquare,
  correlationFromCovariance,
  reducedChiSquare,
  weightedMean,
  weightedRms,
} from '../../../worker/timing/fit/fit-statistics';
import { expectWithin } from '../time/expect-within';

describe('neumaierSum (Neumaier 1974)', () => {
  it('sums [1, 1e100, 1, −1e100] to 2, where plain and Kahan summation give 0', () => {
    // The classic example for Neumaier's variant (common practice; Higham 2002, §4.3).
    expect(neumaierSum([1, 1e100, 1, -1e100])).toBe(2);
    expect([1, 1e100, 1, -1e100].reduce((s, v) => s + v, 0)).toBe(0);
  });

  it('sums one million copies of 0.1 to the correctly rounded value, where a plain loop drifts', () => {
    const acc = new NeumaierSum();
    let plain = 0;
    for (let i = 0; i < 1_000_000; i++) {
      acc.add(0.1);
      plain += 0.1;
    }
    // Exact: 10⁶ × 0.1000000000000000055511151231257827… = 100000.0000000000055511…, which is
    // within half an ulp (7.3e-12) of 100000, so the correctly rounded sum is exactly 100000.
    expect(acc.value).toBe(100000);
    expect(Math.abs(plain - 100000)).toBeGreaterThan(1e-7);
  });

  it('is 0 for no terms', () => {
    expect(neumaierSum([])).toBe(0);
  });
});

describe('fit statistics', () => {
  it('hand-checked χ², weighted mean and weighted RMS', () => {
    const r = [1, -2, 3];
    const s = [1, 2, 1];
    expect(chiSquare(r, s)).toBe(1 + 1 + 9); // (1/1)² + (−2/2)² + (3/1)²
    expect(weightedMean(r, s)).toBeCloseTo((1 - 2 / 4 + 3) / (1 + 0.25 + 1), 15); // Σ(x/σ²)/Σ(1/σ²)
    expectWithin(weightedRms(r, s), Math.sqrt(11 / 2.25), 1e-15, 'weighted RMS');
    expect(reducedChiSquare(11, 2)).toBe(5.5);
    expect(reducedChiSquare(11, 0)).toBeNaN();
  });

  it('correlation has unit diagonal and ρ = C₀₁/√(C₀₀C₁₁)', () => {
    const rho = correlationFromCovariance([4, -3, -3, 9], 2);
    expect(rho).toEqual([
      [1, -0.5],
      [-0.5, 1],
    ]);
  });

  it('rejects mismatched lengths', () => {
    expect(() => chiSquare([1, 2], [1])).toThrowError(RangeError);
    expect(() => correlationFromCovariance([1, 2, 3], 2)).toThrowError(RangeError);
  });
});
