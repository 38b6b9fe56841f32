/**
 * The inverse of the Baluev 2008 false-alarm probability in its power argument:
 * the normalised periodogram power a highest peak must reach for its
 * false-alarm probability to fall to a given level (the threshold line drawn
 * over a periodogram).
 */
import { falseAlarmBaluev } from './false-alarm-probability';

const BISECTION_STEPS = 60; // halves [0, 1] to 2⁻⁶⁰ ≈ 1e-18, below a double's spacing near 1

/**
 * The periodogram power at which the Baluev false-alarm probability equals `targetFap`: the
 * inverse of `falseAlarmBaluev` in its first argument, found by bisection.
 *
 * @param targetFap   false-alarm probability to reach, in (0, 1)
 * @param n           number of samples (≥ 5), as for falseAlarmBaluev
 * @param fMaxPerDay  highest searched frequency, cycles per day (> 0)
 * @param tDays       sample times, days (any origin)
 * @param weights     optional weights 1/σ², as for falseAlarmBaluev
 * @returns           normalised power p ∈ [0, 1] with falseAlarmBaluev(p) ≈ targetFap (Note 1);
 *                    1 when even p = 1 stays above the target (too few samples to reach it)
 *
 * Notes: 1. falseAlarmBaluev stays near 1 at small p and falls towards 0 as p → 1; it may wiggle
 *    only where it is close to 1, so for the small targets of interest (1e-2, 1e-3) the powers
 *    above the target form one interval [0, p*). Bisection keeps the bracket [lo, hi] with
 *    FAP(lo) > target ≥ FAP(hi) and returns `hi`.
 * Throws RangeError for targetFap outside (0, 1); the other arguments are checked by
 * falseAlarmBaluev itself.
 * Accuracy: |p − p_true| ≤ 2⁻⁶⁰; round trip FAP(p) = target to ~1e-9 relative
 * (tests/engine/periodogram/false-alarm-power-level.test.ts).
 * References: Baluev 2008, MNRAS 385, 1279 (the FAP being inverted).
 */
export function powerAtFalseAlarm(
  targetFap: number,
  n: number,
  fMaxPerDay: number,
  tDays: Float64Array,
  weights?: Float64Array,
): number {
  if (!(targetFap > 0 && targetFap < 1)) throw new RangeError(`powerAtFalseAlarm: targetFap must be in (0, 1), got ${targetFap}`);
  const fap = (p: number) => falseAlarmBaluev(p, n, fMaxPerDay, tDays, weights);
  if (fap(1) > targetFap) return 1;
  let lo = 0;
  let hi = 1;
  for (let step = 0; step < BISECTION_STEPS; step++) {
    const mid = 0.5 * (lo + hi);
    if (fap(mid) > targetFap) lo = mid;
    else hi = mid;
  }
  return hi;
}
