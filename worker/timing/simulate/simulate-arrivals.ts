/**
 * Simulated arrival times that follow a timing model: the inverse problem
 * (find observatory times at which the model phase is an integer), solved by
 * fixed-point iteration, then Gaussian measurement noise.
 */
import type { TimingModel } from '../model/timing-model';
import type { Toa } from '../toas/toa';
import type { ArrivalGeometry } from '../pipeline/arrival-geometry';
import type { Mjd } from '../time/epoch';
import { TimingInputError } from '../engine-error';
import { createSeededNormal, createSeededUniform } from '../fit/seeded-normal';
import { mjdAddDays, mjdAddSeconds, mjdDiffDays } from '../time/mjd-arithmetic';
import { prepareArrivals } from '../pipeline/prepared-arrivals';
import { computeTimingResiduals } from '../pipeline/timing-residuals';

export interface SimulationRequest {
  startMjd: Mjd;
  endMjd: Mjd;
  count: number;
  observatory: string;
  uncertaintyUs: number;
  /** MHz at the observatory; default 1400. Infinity: no dispersion. */
  frequencyMhz?: number;
  /** default 1 */
  seed?: number;
  /** write the model's pulse numbers into the TOAs (default false) */
  withPulseNumbers?: boolean;
  backend?: string;
  includeJupiterShapiro?: boolean;
  /** add the Gaussian noise (default true); false gives the noise-free times */
  addNoise?: boolean;
}

export interface SimulationResult {
  toas: Toa[];
  /** largest |residual| of the noise-free times when the iteration stopped, seconds */
  maxNoiseFreeResidualS: number;
  iterations: number;
  warnings: string[];
}

/** Residual at which the noise-free times count as on the model (1e-11 s). */
const TARGET_RESIDUAL_S = 1e-11;
const MAX_ITERATIONS = 12;
/** Start times are shifted by up to ± this fraction of the spacing, uniformly (Note 1). */
const START_JITTER_SPACINGS = 0.3;
/** Mixed into the seed for the jitter stream, so jitter and noise come from different sequences. */
const JITTER_SEED_MIX = 0x9e3779b9; // 2^32/φ, the usual odd constant for decorrelating seeds (Knuth, TAOCP vol. 3, §6.4)

/**
 * TOAs whose noise-free times lie on the model, plus N(0, σ²) noise.
 *
 * @param model            the timing model the TOAs follow (phase offset 0)
 * @param request          span, count, observatory code, σ (µs), frequency, seed
 * @param geometryOf       computes the arrival geometry of a TOA set (computeArrivalGeometry)
 * @returns                TOAs (rows 1…count, time-ordered), the final noise-free residual, warnings
 *
 * Notes: 1. Start: evenly spaced times over [start, end], each moved by a seeded uniform jitter of
 *           up to ±0.3 of the spacing, so the sampling has no exact period.
 *        2. Iteration: evaluate the residual r (observed − model) and move each time by −r, keeping
 *           the pulse numbers of the first pass; since d(t_bary)/d(t_obs) = 1 + O(1e-4), each pass
 *           shrinks r by ~1e4, and the loop stops when max |r| < 1e-11 s (two or three passes).
 *        3. Noise: σ·z with z from createSeededNormal(seed), added after the iteration, so the same
 *           seed gives the same noise-free times and the same noise.
 * Throws TimingInputError for count < 1, end ≤ start, σ ≤ 0, frequency ≤ 0 (named in the message).
 */
export function simulateArrivals(
  model: TimingModel,
  request: SimulationRequest,
  geometryOf: (toas: Toa[]) => ArrivalGeometry,
): SimulationResult {
  checkRequest(request);
  const draw = createSeededNormal(request.seed ?? 1);
  const jitterDraw = createSeededUniform(((request.seed ?? 1) ^ JITTER_SEED_MIX) >>> 0);
  const spanDays = mjdDiffDays(request.endMjd, request.startMjd);
  const span = spanDays[1] + spanDays[0];
  const toas: Toa[] = [];
  for (let i = 0; i < request.count; i += 1) {
    const jitter = request.count > 1 ? START_JITTER_SPACINGS * (2 * jitterDraw() - 1) : 0;
    const position = request.count > 1 ? (i + 0.5 + jitter) / request.count : 0.5; // Note 1
    toas.push({
      row: i + 1,
      line: i + 2,
      mjd: mjdAddDays(request.startMjd, span * position),
      uncertaintyUs: request.uncertaintyUs,
      frequencyMhz: request.frequencyMhz ?? 1400,
      observatory: request.observatory,
      backend: request.backend ?? 'default',
      pulseNumber: null,
      labels: {},
    });
  }
  let fixedPulseNumbers: Float64Array | undefined;
  let maxResidual = Infinity;
  let iterations = 0;
  while (iterations < MAX_ITERATIONS) {
    iterations += 1;
    const prepared = prepareArrivals(toas, geometryOf(toas), model.epochMjd);
    const evaluation = computeTimingResiduals(model, prepared, { fixedPulseNumbers, includeJupiterShapiro: request.includeJupiterShapiro });
    fixedPulseNumbers ??= Float64Array.from(evaluation.pulseNumber);
    maxResidual = 0;
    for (let i = 0; i < toas.length; i += 1) maxResidual = Math.max(maxResidual, Math.abs(evaluation.residualS[i]));
    if (maxResidual < TARGET_RESIDUAL_S) break;
    toas.forEach((toa, i) => { toa.mjd = mjdAddSeconds(toa.mjd, -evaluation.residualS[i]); }); // Note 2
  }
  const warnings: string[] = [];
  if (!(maxResidual < TARGET_RESIDUAL_S)) {
    warnings.push(`simulation: noise-free times reached only ${maxResidual.toExponential(2)} s of the model after ${iterations} passes`);
  }
  const sigmaS = request.uncertaintyUs * 1e-6;
  toas.forEach((toa, i) => {
    if (request.addNoise !== false) toa.mjd = mjdAddSeconds(toa.mjd, sigmaS * draw()); // Note 3
    if (request.withPulseNumbers) toa.pulseNumber = fixedPulseNumbers![i];
  });
  return { toas, maxNoiseFreeResidualS: maxResidual, iterations, warnings };
}

function checkRequest(r: SimulationRequest): void {
  if (!Number.isInteger(r.count) || r.count < 1) throw new TimingInputError(`count: must be a whole number ≥ 1, got ${r.count}`);
  const span = mjdDiffDays(r.endMjd, r.startMjd);
  if (!(span[1] + span[0] > 0)) throw new TimingInputError('end-mjd: must be after start-mjd');
  if (!(r.uncertaintyUs > 0) || !Number.isFinite(r.uncertaintyUs)) throw new TimingInputError(`uncertainty-us: must be > 0, got ${r.uncertaintyUs}`);
  const f = r.frequencyMhz ?? 1400;
  if (!(f > 0) || Number.isNaN(f)) throw new TimingInputError(`frequency-mhz: must be > 0, got ${f}`);
}
