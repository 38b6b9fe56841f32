/** A regular frequency grid: f_k = minFreqPerDay + k·stepPerDay, k = 0 … count−1. */
export interface FrequencyGrid {
  readonly minFreqPerDay: number;
  readonly stepPerDay: number;
  readonly count: number;
}

/**
 * Trial-frequency grid for a residual periodogram.
 *
 * Rule: from 1/maxPeriodDays to 1/minPeriodDays in steps of
 * 1/(oversampling · spanDays), oversampling ≥ 5 — at least 5 points per
 * natural resolution 1/T of a data set spanning T days (Note 1).
 *
 * @param spanDays  time span of the data (last − first sample), days; > 0
 * @param opts.minPeriodDays  shortest trial period, days; > 0
 * @param opts.maxPeriodDays  longest trial period, days; > minPeriodDays
 * @param opts.oversampling   points per natural resolution 1/T; ≥ 5 (default 5)
 * @returns  the grid; its last frequency is ≤ 1/minPeriodDays
 *
 * Notes: 1. A peak is about 1/T wide; 5 samples across it keep the sampled
 *    peak height within a few per cent of the true one (common practice).
 * Throws RangeError for non-positive span or periods, or oversampling < 5.
 * References: VanderPlas 2018, ApJS 236, 16, §7.1.
 */
export function periodogramGrid(
  spanDays: number,
  opts: { minPeriodDays: number; maxPeriodDays: number; oversampling?: number },
): FrequencyGrid {
  const { minPeriodDays, maxPeriodDays, oversampling = 5 } = opts;
  if (!(spanDays > 0) || !Number.isFinite(spanDays)) throw new RangeError(`spanDays: must be finite and > 0, got ${spanDays}`);
  if (!(minPeriodDays > 0)) throw new RangeError(`minPeriodDays: must be > 0, got ${minPeriodDays}`);
  if (!(maxPeriodDays > minPeriodDays) || !Number.isFinite(maxPeriodDays)) {
    throw new RangeError(`maxPeriodDays: must be finite and > minPeriodDays (${minPeriodDays}), got ${maxPeriodDays}`);
  }
  if (!(oversampling >= 5) || !Number.isFinite(oversampling)) throw new RangeError(`oversampling: must be ≥ 5, got ${oversampling}`);
  const minFreqPerDay = 1 / maxPeriodDays;
  const maxFreqPerDay = 1 / minPeriodDays;
  const stepPerDay = 1 / (oversampling * spanDays); // step = 1/(oversampling·T)
  const count = Math.floor((maxFreqPerDay - minFreqPerDay) / stepPerDay * (1 + 1e-12)) + 1;
  return { minFreqPerDay, stepPerDay, count };
}

/** The grid's frequencies as an array, cycles per day. */
export function gridFrequenciesPerDay(grid: FrequencyGrid): Float64Array {
  const out = new Float64Array(grid.count);
  for (let k = 0; k < grid.count; k++) out[k] = grid.minFreqPerDay + k * grid.stepPerDay;
  return out;
}
