/**
 * An observatory's clock correction at an arrival time (FORMATS.md §3).
 */
import type { ClockCorrectionPoint } from '../earth/observatory';
import type { Mjd } from './epoch';
import { mjdDiffDays, mjdToApproxNumber } from './mjd-arithmetic';

export interface ClockCorrection {
  /** Seconds to add to the observatory's time stamp to reach UTC. */
  seconds: number;
  /** True when the instant lies before the first or after the last point (end value held). */
  outsideTable: boolean;
}

/**
 * Linear interpolation in the observatory's clock-correction points.
 *
 * @param points  sorted by `mjd`, `correctionUs` in microseconds; empty = no correction
 * @param mjd     the arrival time stamp (observatory clock)
 * @returns       correction in seconds, and whether the table had to be extended (Note 1)
 *
 * Notes: 1. Outside the table the nearest end value is held; the caller reports it as a warning.
 * Accuracy: linear interpolation with weights from day-first differences (~1e-16 relative);
 *           the interval is chosen with float64 MJDs (a point closer than ~1 µs to the
 *           instant may pick the neighbouring interval, which gives the same value there).
 */
export function clockCorrection(points: ReadonlyArray<ClockCorrectionPoint>, mjd: Mjd): ClockCorrection {
  if (points.length === 0) return { seconds: 0, outsideTable: false };
  const first = points[0];
  const last = points[points.length - 1];
  if (ddValue(mjdDiffDays(mjd, first.mjd)) < 0) return { seconds: first.correctionUs * 1e-6, outsideTable: true };
  if (ddValue(mjdDiffDays(mjd, last.mjd)) > 0) return { seconds: last.correctionUs * 1e-6, outsideTable: true };
  // Bracket with float64 MJDs (µs resolution suffices to pick the interval), then weigh exactly.
  const approxMjd = approximateMjds(points);
  const target = mjdToApproxNumber(mjd);
  let lo = 0;
  let hi = points.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (approxMjd[mid] > target) hi = mid;
    else lo = mid;
  }
  const a = points[lo];
  const b = points[hi];
  const spanDays = ddValue(mjdDiffDays(b.mjd, a.mjd));
  if (spanDays <= 0) return { seconds: a.correctionUs * 1e-6, outsideTable: false };
  const weight = Math.min(1, Math.max(0, ddValue(mjdDiffDays(mjd, a.mjd)) / spanDays));
  return { seconds: (a.correctionUs + weight * (b.correctionUs - a.correctionUs)) * 1e-6, outsideTable: false }; // linear interpolation (FORMATS.md §3)
}

const approximateMjdCache = new WeakMap<ReadonlyArray<ClockCorrectionPoint>, Float64Array>();

/** The points' MJDs as float64, computed once per table (tables are not mutated once registered). */
function approximateMjds(points: ReadonlyArray<ClockCorrectionPoint>): Float64Array {
  let cached = approximateMjdCache.get(points);
  if (cached === undefined || cached.length !== points.length) {
    cached = Float64Array.from(points, (p) => mjdToApproxNumber(p.mjd));
    approximateMjdCache.set(points, cached);
  }
  return cached;
}

function ddValue(x: [number, number]): number {
  return x[1] + x[0];
}
