/**
 * Invented pulsars and simulated TOAs for the companion-search tests: an
 * isolated millisecond pulsar whose true model gets the companions under test,
 * and a starting model without them (spin frequency and its derivative fitted).
 */
import { readModelFile } from '../../../worker/timing/model/read-model-file';
import type { TimingModel } from '../../../worker/timing/model/timing-model';
import type { Toa } from '../../../worker/timing/toas/toa';
import type { ArrivalGeometry } from '../../../worker/timing/pipeline/arrival-geometry';
import { simulateToas } from '../../../worker/timing/simulate/simulate-toas';
import { builtinObservatories } from '../../../worker/timing/earth/builtin-observatories';
import { computeArrivalGeometry } from '../../../worker/timing/pipeline/compute-arrival-geometry';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { mjdToApproxNumber } from '../../../worker/timing/time/mjd-arithmetic';
import type { SearchCandidate } from '../../../worker/timing/search/companion-search-report';

export const observatories = new Map(builtinObservatories().map((o) => [o.code, o]));

/** An invented isolated millisecond pulsar (every value made up). */
const BASE_MODEL = {
  format: 'pulsekeeper-model/1',
  pulsar: 'FPG-J0533+1907 (search test)',
  epoch_mjd: '59000',
  spin: { frequency_hz: '243.1715229812', frequency_derivatives: ['-5.1e-16'] },
  astrometry: { ra_hms: '05:33:12.4410', dec_dms: '+19:07:44.210', pm_ra_cosdec_mas_per_yr: 0, pm_dec_mas_per_yr: 0, parallax_mas: 0 },
  dispersion: { dm_pc_per_cm3: 20, dm_derivatives: [] },
  offsets: [],
  noise: [],
  glitches: [],
};

export const START_SOLVE_FOR = ['spin.frequency_hz', 'spin.frequency_derivatives[0]'];

export interface SimulatedSearchData {
  truth: TimingModel;
  start: TimingModel;
  toas: Toa[];
  geometry: ArrivalGeometry;
}

/**
 * TOAs of the invented pulsar with `companions` (model-file objects), MJD 58000–60000 at harrow-ridge,
 * infinite frequency, σ = `uncertaintyUs`; and the starting model without companions.
 */
export function simulatedSearchData(companions: Record<string, unknown>[], options: { count: number; seed: number; uncertaintyUs?: number }): SimulatedSearchData {
  const truth = readModelFile({ ...BASE_MODEL, companions, solve_for: [] });
  const start = readModelFile({ ...BASE_MODEL, companions: [], solve_for: START_SOLVE_FOR });
  const sim = simulateToas(truth, {
    startMjd: parseMjd('58000'),
    endMjd: parseMjd('60000'),
    count: options.count,
    observatory: 'harrow-ridge',
    uncertaintyUs: options.uncertaintyUs ?? 1,
    frequencyMhz: Infinity,
    seed: options.seed,
  }, observatories);
  return { truth, start, toas: sim.toas, geometry: computeArrivalGeometry(sim.toas, observatories) };
}

/** |fitted − true| in units of the fitted 1σ, for one element of a candidate (epochs in days). */
export function sigmasOff(candidate: SearchCandidate, key: string, trueValue: number): number {
  const c = candidate.companion;
  const values: Record<string, number> = {
    period_days: c.periodDays,
    projected_semimajor_axis_lt_s: c.projectedSemimajorAxisLtS,
    eccentricity: c.eccentricity,
    periastron_longitude_deg: c.periastronLongitudeDeg,
    periastron_epoch_mjd: mjdToApproxNumber(c.periastronEpochMjd),
  };
  let diff = values[key] - trueValue;
  if (key === 'periastron_longitude_deg') diff = ((diff + 540) % 360) - 180; // angles compare modulo 360°
  if (key === 'periastron_epoch_mjd') diff -= Math.round(diff / c.periodDays) * c.periodDays; // epochs modulo the period
  return Math.abs(diff) / candidate.uncertainties[key];
}
