/**
 * Simulated TOAs at a registered observatory (or `ssb`/`geocenter`), with the
 * full arrival geometry (clock, time scales, DE405).
 */
import type { TimingModel } from '../model/timing-model';
import type { Observatory } from '../earth/observatory';
import { computeArrivalGeometry, type ArrivalGeometryOptions } from '../pipeline/compute-arrival-geometry';
import { loadDe405 } from '../ephemeris/de405-ephemeris';
import { simulateArrivals, type SimulationRequest, type SimulationResult } from './simulate-arrivals';

/**
 * TOAs whose times follow `model` to better than 1 ns before noise (simulate-arrivals.ts).
 *
 * @param model          the timing model
 * @param request        span (observatory-clock MJD), count, observatory, σ (µs), frequency (MHz), seed
 * @param observatories  registered observatories by code
 * @param options        ephemeris and Earth orientation for the geometry (DE405 by default, loaded once)
 * Throws TimingInputError for a bad request, an unknown observatory or a span outside the ephemeris.
 */
export function simulateToas(
  model: TimingModel,
  request: SimulationRequest,
  observatories: ReadonlyMap<string, Observatory>,
  options: ArrivalGeometryOptions = {},
): SimulationResult {
  const geometryOptions = { ...options, ephemeris: options.ephemeris ?? loadDe405() };
  return simulateArrivals(model, request, (toas) => computeArrivalGeometry(toas, observatories, geometryOptions));
}
