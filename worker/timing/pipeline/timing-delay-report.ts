/**
 * Per-TOA delay components for the `delays` command (docs/formats.md §4).
 */
import type { TimingModel } from '../model/timing-model';
import type { Toa } from '../toas/toa';
import type { ArrivalGeometry } from './arrival-geometry';
import { prepareArrivals } from './prepared-arrivals';
import { computeTimingResiduals } from './timing-residuals';
import { formatMjd } from '../time/mjd-string';
import { mjdAddSeconds } from '../time/mjd-arithmetic';
import { ddAddNumber, ddFromSum } from '../time/double-double-typed';

export interface DelayReportRow {
  row: number;
  ssb_tdb_mjd: string;
  clock_s: number;
  tt_minus_utc_s: number;
  tdb_minus_tt_s: number;
  roemer_s: number;
  shapiro_s: number;
  dispersion_s: number;
  companions_s: number;
  /** extra keys (docs/formats.md allows them) */
  backend_offset_s: number;
  residual_us: number;
}

/**
 * The delay chain of every TOA.
 *
 * @param model     the timing model
 * @param toas      arrivals, same order as `geometry`
 * @param geometry  computeArrivalGeometry(toas, …)
 * @returns         one row per TOA: ssb_tdb_mjd = mjd + (clock + TT−UTC + TDB−TT + Roemer − Shapiro −
 *                  dispersion)/86400 (docs/formats.md §4; summed in double-double, printed to 20
 *                  decimals ≈ 1 ps), the components in seconds, the backend offset and the residual (µs)
 */
export function timingDelayReport(model: TimingModel, toas: readonly Toa[], geometry: ArrivalGeometry, options: { includeJupiterShapiro?: boolean } = {}): DelayReportRow[] {
  const prepared = prepareArrivals(toas, geometry, model.epochMjd);
  const ev = computeTimingResiduals(model, prepared, options);
  return toas.map((toa, i) => {
    const solarSystemS = ddAddNumber(ddFromSum(ev.roemerS[i], -ev.shapiroS[i]), -ev.dispersionS[i]);
    return {
      row: toa.row,
      ssb_tdb_mjd: formatMjd(mjdAddSeconds(geometry.tdb[i], solarSystemS), 20), // docs/formats.md §4 sum
      clock_s: geometry.clockS[i],
      tt_minus_utc_s: geometry.ttMinusUtcS[i],
      tdb_minus_tt_s: geometry.tdbMinusTtS[i],
      roemer_s: ev.roemerS[i],
      shapiro_s: ev.shapiroS[i],
      dispersion_s: ev.dispersionS[i],
      companions_s: ev.companionS[i],
      backend_offset_s: ev.offsetS[i],
      residual_us: ev.residualS[i] * 1e6,
    };
  });
}
