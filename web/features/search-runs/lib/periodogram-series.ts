import type { SearchPeriodogram } from '../api/get-search-periodograms';

/** Above this many grid points the curve is thinned for drawing (Note 1 of periodogramSeries). */
export const MAX_PLOTTED_POINTS = 6000;

export interface PeriodogramSeries {
  /** trial periods, days (1 / frequency), in the grid's order (longest first) */
  periodDays: number[];
  power: number[];
  /** true when buckets of the grid were reduced to their extremes */
  thinned: boolean;
}

/**
 * Power against period for one round, from its regular frequency grid f_k = f_min + k·Δf.
 *
 * @param periodogram  one round as GET /api/search-runs/:id/periodograms sends it
 * @param maxPoints    most points to return (≥ 4)
 * @returns            periods and powers; frequencies ≤ 0 (no period) are left out
 *
 * Notes: 1. Above `maxPoints` the grid is cut into equal buckets and each keeps its lowest and
 *    its highest power, in grid order, so no peak is lost from the drawing (the numbers shown
 *    beside the plot come from the server, never from the thinned curve).
 */
export function periodogramSeries(periodogram: SearchPeriodogram, maxPoints = MAX_PLOTTED_POINTS): PeriodogramSeries {
  const { minFrequencyPerDay, stepPerDay } = periodogram.grid;
  const count = Math.min(periodogram.grid.count, periodogram.power.length);
  const periodDays: number[] = [];
  const power: number[] = [];
  const push = (k: number) => {
    const f = minFrequencyPerDay + k * stepPerDay;
    if (f > 0 && Number.isFinite(periodogram.power[k])) {
      periodDays.push(1 / f);
      power.push(periodogram.power[k]);
    }
  };
  if (count <= maxPoints) {
    for (let k = 0; k < count; k++) push(k);
    return { periodDays, power, thinned: false };
  }
  const buckets = Math.floor(maxPoints / 2);
  for (let b = 0; b < buckets; b++) {
    const start = Math.floor((b * count) / buckets);
    const end = Math.floor(((b + 1) * count) / buckets);
    let lo = start;
    let hi = start;
    for (let k = start + 1; k < end; k++) {
      if (periodogram.power[k] < periodogram.power[lo]) lo = k;
      if (periodogram.power[k] > periodogram.power[hi]) hi = k;
    }
    push(Math.min(lo, hi));
    if (lo !== hi) push(Math.max(lo, hi));
  }
  return { periodDays, power, thinned: true };
}
