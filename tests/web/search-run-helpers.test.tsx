import { describe, expect, it } from 'vitest';
import { isOneYearWarning, parseAliasWarning } from '../../web/features/search-runs/lib/alias-warnings';
import { formatFap } from '../../web/features/search-runs/lib/format-search';
import { periodogramSeries } from '../../web/features/search-runs/lib/periodogram-series';

// An invented periodogram on a regular grid f_k = f_min + k·Δf with one narrow spike.
function grid(count: number, spikeAt: number) {
  const minFrequencyPerDay = 1 / 2000;
  const stepPerDay = 1e-4;
  const power = Array.from({ length: count }, (_, k) => (k === spikeAt ? 0.9 : 0.01 + 0.02 * Math.abs(Math.sin(k))));
  return { round: 1, grid: { minFrequencyPerDay, stepPerDay, count }, pointsPerBin: 1, power };
}

describe('periodogram series', () => {
  it('turns each grid frequency into its period and keeps every point of a small grid', () => {
    const p = grid(50, 7);
    const s = periodogramSeries(p);
    expect(s.thinned).toBe(false);
    expect(s.periodDays).toHaveLength(50);
    expect(s.periodDays[7]).toBeCloseTo(1 / (p.grid.minFrequencyPerDay + 7 * p.grid.stepPerDay), 9);
    expect(s.power[7]).toBe(0.9);
  });

  it('thins a large grid to at most the point budget without losing the highest peak', () => {
    const p = grid(100_001, 61_234);
    const s = periodogramSeries(p, 1000);
    expect(s.thinned).toBe(true);
    expect(s.periodDays.length).toBeLessThanOrEqual(1000);
    expect(Math.max(...s.power)).toBe(0.9);
    const i = s.power.indexOf(0.9);
    expect(s.periodDays[i]).toBeCloseTo(1 / (p.grid.minFrequencyPerDay + 61_234 * p.grid.stepPerDay), 9);
    // Grid order is kept: frequencies rise, so periods fall.
    expect(s.periodDays.every((d, k) => k === 0 || d < s.periodDays[k - 1])).toBe(true);
  });

  it('leaves out a zero frequency (no period) and a power array shorter than the grid', () => {
    const short = { round: 1, grid: { minFrequencyPerDay: 0, stepPerDay: 0.01, count: 5 }, pointsPerBin: 1, power: [0.1, 0.2, 0.3] };
    const s = periodogramSeries(short);
    expect(s.power).toEqual([0.2, 0.3]);
    expect(s.periodDays).toEqual([100, 50]);
  });
});

describe('alias warnings and FAP text', () => {
  it('splits the engine’s stable code from its text', () => {
    const w = parseAliasWarning('one-year: peak at 366.1 d is near 1 year (365.25 d): likely a position or proper-motion error — fit astrometry first');
    expect(w.code).toBe('one-year');
    expect(w.text.startsWith('peak at 366.1 d')).toBe(true);
    expect(isOneYearWarning(w)).toBe(true);
    expect(isOneYearWarning(parseAliasWarning('half-year: peak at 182.6 d is near half a year'))).toBe(false);
    expect(parseAliasWarning('Something without a code')).toEqual({ code: '', text: 'Something without a code' });
  });

  it('writes small probabilities in powers of ten and never shows 0', () => {
    expect(formatFap(0.4)).toBe('0.40');
    expect(formatFap(3e-4)).toBe('3.0e-4');
    expect(formatFap(0)).toBe('< 1e-300');
    expect(formatFap(Number.NaN)).toBe('—');
  });
});
