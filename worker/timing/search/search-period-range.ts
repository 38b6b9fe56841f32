/**
 * The default trial-period range of the companion search, from the sampling alone.
 */
import { dominantCadenceDays } from '../periodogram/alias-flags';

/** The shortest default trial period, days: below this the search is mostly sampling aliases. */
export const SHORTEST_DEFAULT_PERIOD_DAYS = 1;

export interface SearchPeriodRange {
  minPeriodDays: number;
  maxPeriodDays: number;
  spanDays: number;
  /** median spacing of consecutive (sorted) times, days */
  medianSpacingDays: number;
  /** session cadence (dominantCadenceDays; NaN with a single session), for the alias screen */
  cadenceDays: number;
}

/**
 * Default period range of the search.
 *
 * @param tDays  arrival times, days (any origin, any order); at least 2 distinct
 * @returns      min = max(1 d, 2 × median spacing), max = the span (last − first), the span, the
 *               median spacing and the session cadence (Note 1)
 *
 * Notes: 1. Median spacing = the median gap between consecutive sorted times. Two samples per trial
 *           period is the Nyquist condition of even sampling (common practice); irregular sampling
 *           reaches beyond it, and the shorter periods then compete with sampling aliases, which the
 *           alias screen flags (the session cadence, sessions being times within 0.5 d of each other,
 *           is returned for it). A period longer than the span cannot be told apart from the spin-down
 *           polynomial.
 * Throws RangeError for fewer than two distinct times.
 */
export function defaultSearchPeriodRange(tDays: Float64Array): SearchPeriodRange {
  const sorted = Float64Array.from(tDays).sort();
  const spanDays = sorted.length > 0 ? sorted[sorted.length - 1] - sorted[0] : 0;
  if (!(spanDays > 0)) throw new RangeError(`the TOAs span ${spanDays} days: a period search needs at least two distinct times`);
  const spacingDays = medianSpacingDays(sorted);
  const minPeriodDays = Math.max(SHORTEST_DEFAULT_PERIOD_DAYS, 2 * spacingDays);
  return { minPeriodDays, maxPeriodDays: spanDays, spanDays, medianSpacingDays: spacingDays, cadenceDays: dominantCadenceDays(sorted) };
}

function medianSpacingDays(sorted: Float64Array): number {
  const gaps = new Float64Array(sorted.length - 1);
  for (let i = 1; i < sorted.length; i++) gaps[i - 1] = sorted[i] - sorted[i - 1];
  gaps.sort();
  const mid = gaps.length >> 1;
  return gaps.length % 2 === 1 ? gaps[mid] : 0.5 * (gaps[mid - 1] + gaps[mid]);
}
