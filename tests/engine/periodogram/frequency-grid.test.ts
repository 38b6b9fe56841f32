import { describe, expect, it } from 'vitest';
import { gridFrequenciesPerDay, periodogramGrid } from '../../../worker/timing/periodogram/frequency-grid';

describe('periodogramGrid', () => {
  it('runs from 1/maxPeriod to at most 1/minPeriod in steps of 1/(oversampling·span)', () => {
    const grid = periodogramGrid(1000, { minPeriodDays: 2, maxPeriodDays: 500, oversampling: 8 });
    expect(grid.minFreqPerDay).toBeCloseTo(1 / 500, 15);
    expect(grid.stepPerDay).toBeCloseTo(1 / 8000, 15);
    const f = gridFrequenciesPerDay(grid);
    expect(f[f.length - 1]).toBeLessThanOrEqual(0.5 + 1e-12);
    expect(f[f.length - 1] + grid.stepPerDay).toBeGreaterThan(0.5);
    expect(f.length).toBe(grid.count);
  });

  it('defaults to 5 points per natural resolution 1/T', () => {
    const grid = periodogramGrid(365.25, { minPeriodDays: 1, maxPeriodDays: 365.25 });
    expect(grid.stepPerDay * 5 * 365.25).toBeCloseTo(1, 12);
  });

  it('rejects oversampling below 5 and invalid spans or periods with RangeError', () => {
    expect(() => periodogramGrid(100, { minPeriodDays: 1, maxPeriodDays: 100, oversampling: 4 })).toThrow(RangeError);
    expect(() => periodogramGrid(0, { minPeriodDays: 1, maxPeriodDays: 100 })).toThrow(RangeError);
    expect(() => periodogramGrid(100, { minPeriodDays: 0, maxPeriodDays: 100 })).toThrow(RangeError);
    expect(() => periodogramGrid(100, { minPeriodDays: 10, maxPeriodDays: 5 })).toThrow(RangeError);
  });
});
