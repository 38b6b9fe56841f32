/**
 * A smooth curve of one companion's orbit delay across the data, to lay over the residuals
 * and compare with the signature that shows when the companion is switched off.
 */
import type { ExplorerTable } from '../../../../api/contracts/explorer';
import type { Companion } from '../../../../worker/timing/model/timing-model';
import type { BarycentricDays } from '../../../../worker/timing/orbits/barycentric-days';
import { addCompanionDelayS } from '../../../../worker/timing/orbits/companion-delays';
import { parseMjd } from '../../../../worker/timing/time/mjd-string';
import { calendarYearFromMjd, orbitalPhaseTurns, type XQuantity } from './x-quantities';

/** x quantities along which a delay curve makes sense (time or the companion's own phase). */
export const CURVE_X_QUANTITIES: ReadonlySet<XQuantity> = new Set(['mjd', 'year', 'orbital-phase']);

/** The explorer table's barycentric days (double-double, hi + lo) as the engine's type. */
export function barycentricDaysOf(table: ExplorerTable): BarycentricDays {
  return { reference: parseMjd(table.referenceMjd), hi: Float64Array.from(table.barycentricDaysHi), lo: Float64Array.from(table.barycentricDaysLo) };
}

export interface Curve {
  x: Float64Array;
  yUs: Float64Array;
}

/**
 * The companion's delay (µs, as if the companion were enabled) on `samples` evenly spaced
 * barycentric times across the data, with its mean over the samples removed (the residuals
 * carry a fitted phase offset, so only the shape can be compared).
 *
 * @param companion  the companion (its `enabled` flag is ignored)
 * @param days       the table's barycentric days (sets the span and the reference)
 * @param quantity   'mjd', 'year' or 'orbital-phase' (others give null)
 * @param samples    number of points, ≥ 2
 * @returns          the curve sorted by x, or null when the quantity has no curve or there are no TOAs
 *
 * Notes: 1. x for time axes uses reference + days as an MJD; the barycentric correction (≤ 500 s)
 *           is far below a pixel on a span of years.
 */
export function companionDelayCurve(companion: Companion, days: BarycentricDays, quantity: XQuantity, samples = 2000): Curve | null {
  if (!CURVE_X_QUANTITIES.has(quantity) || days.hi.length === 0) return null;
  let first = Infinity;
  let last = -Infinity;
  for (const d of days.hi) {
    if (d < first) first = d;
    if (d > last) last = d;
  }
  const grid: BarycentricDays = { reference: days.reference, hi: new Float64Array(samples), lo: new Float64Array(samples) };
  for (let k = 0; k < samples; k++) grid.hi[k] = first + ((last - first) * k) / (samples - 1);
  const delayS = new Float64Array(samples);
  addCompanionDelayS({ ...companion, enabled: true }, grid, delayS);
  let mean = 0;
  for (const d of delayS) mean += d / samples;
  const yUs = delayS.map((d) => (d - mean) * 1e6);
  const referenceMjd = days.reference.day + days.reference.frac[1] + days.reference.frac[0]; // Note 1
  let x: Float64Array;
  if (quantity === 'orbital-phase') x = orbitalPhaseTurns(companion, grid);
  else if (quantity === 'year') x = grid.hi.map((d) => calendarYearFromMjd(referenceMjd + d));
  else x = grid.hi.map((d) => referenceMjd + d);
  const order = Array.from({ length: samples }, (_, k) => k).sort((a, b) => x[a] - x[b]);
  return { x: Float64Array.from(order, (k) => x[k]), yUs: Float64Array.from(order, (k) => yUs[k]) };
}
