/**
 * The timing fit from TOAs and observatories: arrival geometry once, then the
 * Gauss–Newton fit of fit-prepared-arrivals.ts.
 */
import type { TimingModel } from '../model/timing-model';
import type { Toa } from '../toas/toa';
import type { Observatory } from '../earth/observatory';
import { computeArrivalGeometry, type ArrivalGeometryOptions } from './compute-arrival-geometry';
import { checkFitRequest, fitPreparedArrivals, type TimingFitOptions, type TimingFitResult } from './fit-prepared-arrivals';

export type FitTimingModelOptions = TimingFitOptions & ArrivalGeometryOptions;

/**
 * Fits `model.solveFor` plus a phase offset to the TOAs.
 *
 * @param model          starting model (not modified)
 * @param toas           arrival times as read from the arrival-time file
 * @param observatories  registered observatories by code
 * @param options        ephemeris / Earth orientation (geometry), iterations, Jupiter Shapiro delay
 * @returns              TimingFitResult (fit-prepared-arrivals.ts): fitted model, parameters with
 *                       1σ in file units, χ², dof, reduced χ², weighted RMS (µs), residuals, warnings
 * Notes: the request is checked (paths, offsets' backends) before the geometry is computed, so a
 *        bad request fails fast. The geometry is computed once; iterations reuse it.
 * Throws TimingInputError (bad request, unknown observatory, TOAs outside the ephemeris, degenerate
 * parameters), each with a one-line message naming rows or parameters.
 */
export function fitTimingModel(
  model: TimingModel,
  toas: readonly Toa[],
  observatories: ReadonlyMap<string, Observatory>,
  options: FitTimingModelOptions = {},
): TimingFitResult {
  checkFitRequest(model, toas);
  const geometry = computeArrivalGeometry(toas, observatories, { ephemeris: options.ephemeris, earthOrientation: options.earthOrientation });
  return fitPreparedArrivals(model, toas, geometry, options);
}
