import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { lombScargleDirect } from '../../../worker/timing/periodogram/lomb-scargle-direct';
import { lombScargleFast } from '../../../worker/timing/periodogram/lomb-scargle-fast';
import { gridFrequenciesPerDay, periodogramGrid } from '../../../worker/timing/periodogram/frequency-grid';
import { irregularSinusoid, worstRelativeDifference } from './lomb-scargle-data';

describe('lombScargleFast', () => {
  it.each([
    [50, 400, 17.1, 3],
    [300, 2000, 91, 0.2],
    [1000, 3650, 365.25, 0.5],
    [5000, 3000, 5.3, 0.05],
  ])('agrees with the direct sum to 1e-6 relative at every frequency (N = %i)', (n, spanDays, periodDays, amplitude) => {
    const data = irregularSinusoid(n, spanDays, periodDays, amplitude, 1000 + n);
    const grid = periodogramGrid(spanDays, { minPeriodDays: 1, maxPeriodDays: spanDays });
    const direct = lombScargleDirect(data.tDays, data.y, data.sigma, gridFrequenciesPerDay(grid));
    const fast = lombScargleFast(data.tDays, data.y, data.sigma, grid);
    expect(fast.length).toBe(grid.count);
    expect(worstRelativeDifference(fast, direct)).toBeLessThan(1e-6);
  });

  it('keeps 1e-6 relative at the coarsest FFT grid (length just above 5 × count)', () => {
    // 5 × 13 100 = 65 500 → FFT length 65 536: the least oversampled case the method allows.
    const data = irregularSinusoid(800, 3000, 12.9, 0.3, 77);
    const grid = { minFreqPerDay: 1 / 3000, stepPerDay: 1 / 15000, count: 13_100 };
    const direct = lombScargleDirect(data.tDays, data.y, data.sigma, gridFrequenciesPerDay(grid));
    const fast = lombScargleFast(data.tDays, data.y, data.sigma, grid);
    expect(worstRelativeDifference(fast, direct)).toBeLessThan(1e-6);
  });

  it('equals astropy LombScargle on the fixture grid to 1e-6 relative', () => {
    // Source: astropy 5.2.1 via tests/fixtures/scripts/lomb_scargle_reference.py (a regular grid)
    const fx = JSON.parse(
      readFileSync(new URL('../../fixtures/periodogram/lomb-scargle-astropy.json', import.meta.url), 'utf8'),
    ) as { timesDays: number[]; values: number[]; uncertainties: number[]; frequenciesPerDay: number[]; power: number[] };
    const f = fx.frequenciesPerDay;
    const grid = { minFreqPerDay: f[0], stepPerDay: (f[f.length - 1] - f[0]) / (f.length - 1), count: f.length };
    const fast = lombScargleFast(Float64Array.from(fx.timesDays), Float64Array.from(fx.values), Float64Array.from(fx.uncertainties), grid);
    expect(worstRelativeDifference(fast, fx.power)).toBeLessThan(1e-6);
  });

  it('gives power 0 for constant data and rejects bad inputs with RangeError', () => {
    const tDays = Float64Array.from([0, 1.3, 2.9, 4.1, 7.7]);
    const ones = new Float64Array(5).fill(1);
    const grid = { minFreqPerDay: 0.05, stepPerDay: 0.01, count: 10 };
    expect(Array.from(lombScargleFast(tDays, new Float64Array(5).fill(-3), ones, grid))).toEqual(new Array(10).fill(0));
    expect(() => lombScargleFast(tDays.subarray(0, 2), ones.subarray(0, 2), ones.subarray(0, 2), grid)).toThrow(RangeError);
    expect(() => lombScargleFast(tDays, ones, Float64Array.from([1, 1, 0, 1, 1]), grid)).toThrow(RangeError);
    expect(() => lombScargleFast(tDays, ones, ones, { ...grid, stepPerDay: 0 })).toThrow(RangeError);
    expect(() => lombScargleFast(tDays, ones, ones, { ...grid, count: 0 })).toThrow(RangeError);
  });
});
