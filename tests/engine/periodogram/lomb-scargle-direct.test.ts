import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { lombScargleDirect } from '../../../worker/timing/periodogram/lomb-scargle-direct';
import { gridFrequenciesPerDay, periodogramGrid } from '../../../worker/timing/periodogram/frequency-grid';
import { irregularSinusoid, worstRelativeDifference } from './lomb-scargle-data';

interface AstropyFixture {
  timesDays: number[]; values: number[]; uncertainties: number[]; frequenciesPerDay: number[]; power: number[];
}
const fixture = JSON.parse(
  readFileSync(new URL('../../fixtures/periodogram/lomb-scargle-astropy.json', import.meta.url), 'utf8'),
) as AstropyFixture;

describe('lombScargleDirect', () => {
  it('equals astropy LombScargle (standard, fit_mean, center_data) to 1e-6 relative', () => {
    // Source: astropy 5.2.1 via tests/fixtures/scripts/lomb_scargle_reference.py
    const power = lombScargleDirect(
      Float64Array.from(fixture.timesDays), Float64Array.from(fixture.values),
      Float64Array.from(fixture.uncertainties), Float64Array.from(fixture.frequenciesPerDay),
    );
    expect(power.length).toBe(fixture.power.length);
    expect(worstRelativeDifference(power, fixture.power)).toBeLessThan(1e-6);
  });

  it('peaks at the true frequency of an irregularly sampled sinusoid within one grid step', () => {
    // Common practice: a pure sinusoid's periodogram peaks at its frequency.
    const periodDays = 23.7;
    const data = irregularSinusoid(300, 1500, periodDays, 5, 11);
    const grid = periodogramGrid(1500, { minPeriodDays: 2, maxPeriodDays: 1500 });
    const f = gridFrequenciesPerDay(grid);
    const power = lombScargleDirect(data.tDays, data.y, data.sigma, f);
    let best = 0;
    for (let k = 1; k < power.length; k++) if (power[k] > power[best]) best = k;
    expect(Math.abs(f[best] - 1 / periodDays)).toBeLessThanOrEqual(grid.stepPerDay);
    expect(power[best]).toBeGreaterThan(0.9);
  });

  it('is unchanged by a shift of the time origin', () => {
    const data = irregularSinusoid(100, 800, 40, 1, 5);
    const f = Float64Array.from([0.01, 0.025, 0.1, 0.33]);
    const shifted = data.tDays.map((t) => t - 53000);
    const a = lombScargleDirect(data.tDays, data.y, data.sigma, f);
    const b = lombScargleDirect(shifted, data.y, data.sigma, f);
    expect(worstRelativeDifference(a, b)).toBeLessThan(1e-9);
  });

  it('gives power 0 for constant data', () => {
    const tDays = Float64Array.from([0, 1.3, 2.9, 4.1, 7.7]);
    const power = lombScargleDirect(tDays, new Float64Array(5).fill(4.2), new Float64Array(5).fill(1), Float64Array.from([0.1, 0.2]));
    expect(Array.from(power)).toEqual([0, 0]);
    const third = lombScargleDirect(tDays, new Float64Array(5).fill(1 / 3), Float64Array.from([1, 2, 3, 4, 5]), Float64Array.from([0.1, 0.2]));
    expect(Array.from(third)).toEqual([0, 0]);
  });

  it('rejects fewer than 3 samples and non-positive uncertainties with RangeError', () => {
    const f = Float64Array.from([0.1]);
    expect(() => lombScargleDirect(Float64Array.from([0, 1]), Float64Array.from([1, 2]), Float64Array.from([1, 1]), f)).toThrow(RangeError);
    const t3 = Float64Array.from([0, 1, 2.5]);
    const y3 = Float64Array.from([1, 2, 0]);
    expect(() => lombScargleDirect(t3, y3, Float64Array.from([1, 0, 1]), f)).toThrow(RangeError);
    expect(() => lombScargleDirect(t3, y3, Float64Array.from([1, -2, 1]), f)).toThrow(RangeError);
    expect(() => lombScargleDirect(t3, y3, Float64Array.from([1, 1]), f)).toThrow(RangeError);
  });
});
