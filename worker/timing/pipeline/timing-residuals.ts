/**
 * Timing residuals: from the arrival geometry and a timing model to the
 * difference between observed and predicted arrival times, per TOA, with
 * every delay component kept for reporting.
 */
import type { TimingModel } from '../model/timing-model';
import type { PreparedArrivals } from './prepared-arrivals';
import { pulsarDirection, newSkyDirection } from '../delays/pulsar-direction';
import { roemerDelayS } from '../delays/roemer-delay';
import { shapiroDelayS } from '../delays/shapiro-delay';
import { barycentricFrequencyMhz, dispersionDelayS } from '../delays/dispersion-delay';
import { dispersionMeasureAt } from '../delays/dispersion-measure-at';
import { backendOffsetsS } from '../delays/backend-offset';
import { DAYS_PER_JULIAN_YEAR, JUPITER_MASS_SECONDS, SUN_MASS_SECONDS } from '../delays/physical-constants';
import type { BarycentricDays } from '../orbits/barycentric-days';
import { companionDelaysFromDaysS } from '../orbits/companion-delays';
import { prepareSpin, spinPhase, type PreparedSpin, type SpinPhaseValue } from './spin-phase';
import { ddAddNumber, ddTimesNumber } from '../time/double-double-typed';
import type { DoubleDouble } from '../time/epoch';

const SECONDS_PER_DAY = 86_400;

export interface ResidualOptions {
  /** Add Jupiter's Shapiro delay to the solar one (default false: the Sun alone, docs/formats.md §4). */
  includeJupiterShapiro?: boolean;
  /** Pulse numbers to use instead of the nearest integer (for numeric derivatives across a step). */
  fixedPulseNumbers?: Float64Array;
  /** The fit's overall phase offset, turns (default 0). */
  phaseOffsetTurns?: number;
}

/** All per-TOA results of one model evaluation (seconds unless named otherwise). */
export interface TimingEvaluation {
  count: number;
  /** observed − model, seconds and turns */
  residualS: Float64Array;
  residualTurns: Float64Array;
  /** pulse number assigned to each TOA (given, or nearest integer) */
  pulseNumber: Float64Array;
  /** instantaneous spin frequency at emission, Hz */
  frequencyHz: Float64Array;
  roemerS: Float64Array;
  shapiroS: Float64Array; // solar (+ Jupiter when asked) Shapiro delay, subtracted
  dispersionS: Float64Array; // subtracted
  offsetS: Float64Array; // backend offset, subtracted
  companionS: Float64Array; // sum of companion delays, subtracted
  barycentricFrequencyMhz: Float64Array;
  /** Barycentric arrival at infinite frequency minus the model epoch, days (double-double), before companions and offsets. */
  barycentricDays: BarycentricDays;
  /** Emission time − epoch, seconds, double-double: hi (usable alone for design columns) + lo. */
  emissionSinceEpochS: Float64Array;
  emissionSinceEpochLoS: Float64Array;
  /** TDB years since the epoch (observatory arrival), used for proper motion and DM derivatives. */
  yearsSinceEpoch: Float64Array;
  /** Unit vector toward the pulsar at each TOA (3·count). */
  directionXyz: Float64Array;
}

/**
 * Residuals of `model` for the prepared arrivals.
 *
 * @param model     timing model (its epoch must equal prepared.epochMjd)
 * @param prepared  prepareArrivals(toas, computeArrivalGeometry(toas, …), model.epochMjd)
 * @param options   Jupiter Shapiro delay, fixed pulse numbers, phase offset
 * @returns         TimingEvaluation (Note 4)
 *
 * Notes: 1. Barycentric arrival at infinite frequency: t_b = t_TDB + Roemer − Shapiro − dispersion
 *           (the DOMAIN convention; docs/formats.md §4); the backend offset is subtracted as well
 *           (docs/formats.md §2). Emission time = t_b − companion delays.
 *        2. Dispersion uses the Doppler-corrected frequency f·(1 − v·n̂/c) and DM(t) from its Taylor
 *           series in Julian years since the epoch (delays/).
 *        3. Phase φ at emission (spin-phase.ts); residual in turns = φ − N − phase offset, with N the
 *           TOA's pulse number, or the integer nearest to φ − phase offset when the rows have none;
 *           seconds = turns / instantaneous frequency (observed − model, positive when late).
 *        4. The barycentric days held in the result let companion delays be re-evaluated
 *           without re-barycentring (orbits/companion-delays.ts).
 * Accuracy: set by the geometry and the delay routines; the arithmetic keeps arrival times in
 *           double-double (≪ 1 ps).
 * References: Edwards, Hobbs & Manchester 2006, MNRAS 372, 1549; Lorimer & Kramer 2005, ch. 8.
 */
export function computeTimingResiduals(model: TimingModel, prepared: PreparedArrivals, options: ResidualOptions = {}): TimingEvaluation {
  const n = prepared.count;
  const g = prepared.geometry;
  const evaluation = allocateEvaluation(n, prepared);
  const offsets = backendOffsetsS(model.offsets);
  const offsetByIndex = Float64Array.from(prepared.backends, (b) => offsets.get(b) ?? 0);
  const direction = newSkyDirection();
  const astrometry = model.astrometry;
  const includeJupiter = options.includeJupiterShapiro === true;
  const days = evaluation.barycentricDays;
  for (let i = 0; i < n; i += 1) {
    const years = (prepared.tdbDaysHi[i] + prepared.tdbDaysLo[i]) / DAYS_PER_JULIAN_YEAR;
    evaluation.yearsSinceEpoch[i] = years;
    pulsarDirection(astrometry, years, direction);
    const { x: nx, y: ny, z: nz } = direction;
    evaluation.directionXyz[3 * i] = nx;
    evaluation.directionXyz[3 * i + 1] = ny;
    evaluation.directionXyz[3 * i + 2] = nz;
    const k = 3 * i;
    const p = g.observatoryPositionLs;
    const roemer = roemerDelayS(p[k], p[k + 1], p[k + 2], nx, ny, nz, astrometry.parallaxMas);
    let shapiro = 0;
    if (prepared.atBarycentre[i] === 0) {
      const s = g.sunToObservatoryLs;
      shapiro = shapiroDelayS(s[k], s[k + 1], s[k + 2], nx, ny, nz, SUN_MASS_SECONDS); // Shapiro 1964
      if (includeJupiter) {
        const j = g.jupiterToObservatoryLs;
        shapiro += shapiroDelayS(j[k], j[k + 1], j[k + 2], nx, ny, nz, JUPITER_MASS_SECONDS);
      }
    }
    const v = g.observatoryVelocityC;
    const fBary = barycentricFrequencyMhz(prepared.frequencyMhz[i], v[k] * nx + v[k + 1] * ny + v[k + 2] * nz);
    const dm = dispersionMeasureAt(model.dispersion.dmPcPerCm3, model.dispersion.dmDerivatives, years);
    const dispersion = dispersionDelayS(dm, fBary);
    evaluation.roemerS[i] = roemer;
    evaluation.shapiroS[i] = shapiro;
    evaluation.dispersionS[i] = dispersion;
    evaluation.barycentricFrequencyMhz[i] = fBary;
    evaluation.offsetS[i] = offsetByIndex[prepared.backendIndex[i]];
    // Note 1: t_b − epoch in days, double-double (the offset is kept out: it is applied with the companions)
    addDoubleInto(prepared.tdbDaysHi[i], prepared.tdbDaysLo[i], (roemer - shapiro - dispersion) / SECONDS_PER_DAY, days, i);
  }
  evaluation.companionS.set(companionDelaysFromDaysS(model.companions, days));
  phaseResiduals(prepareSpin(model), evaluation, prepared, options);
  return evaluation;
}

/**
 * Spin phase and residuals from the delays already in `evaluation` (Note 3 of computeTimingResiduals).
 * Exposed so that a caller who changed only companion or spin parameters can redo this step alone.
 */
export function phaseResiduals(spin: PreparedSpin, evaluation: TimingEvaluation, prepared: PreparedArrivals, options: ResidualOptions = {}): void {
  const phaseOffset = options.phaseOffsetTurns ?? 0;
  const fixed = options.fixedPulseNumbers;
  const useGiven = prepared.everyRowHasPulseNumber;
  const value: SpinPhaseValue = { turnsHi: 0, turnsLo: 0, frequencyHz: 0 };
  const days = evaluation.barycentricDays;
  for (let i = 0; i < evaluation.count; i += 1) {
    const laterDelaysS = evaluation.offsetS[i] + evaluation.companionS[i];
    const baryDays: DoubleDouble = [days.lo[i], days.hi[i]];
    const emissionS = ddAddNumber(ddTimesNumber(baryDays, SECONDS_PER_DAY), -laterDelaysS); // Note 1: emission − epoch, s
    evaluation.emissionSinceEpochS[i] = emissionS[1];
    evaluation.emissionSinceEpochLoS[i] = emissionS[0];
    spinPhase(spin, emissionS, value);
    // φ − phase offset, then the pulse number: hi part first (exact for |φ| < 2^52 turns)
    const shiftedHi = value.turnsHi - phaseOffset;
    let pulse: number;
    if (fixed !== undefined) pulse = fixed[i];
    else if (useGiven) pulse = prepared.pulseNumber[i];
    else pulse = Math.round(shiftedHi + value.turnsLo);
    const turns = value.turnsHi - pulse - phaseOffset + value.turnsLo;
    evaluation.pulseNumber[i] = pulse;
    evaluation.residualTurns[i] = turns;
    evaluation.frequencyHz[i] = value.frequencyHz;
    evaluation.residualS[i] = turns / value.frequencyHz; // Note 3
  }
}

/**
 * (hi + lo) + x as a normalised double-double written to days.hi[i], days.lo[i], without allocating:
 * Knuth's two-sum of the large parts, then the small part and a fast renormalisation
 * (Knuth 1969, TAOCP vol. 2, §4.2.2; Dekker 1971, Numer. Math. 18, 224).
 */
function addDoubleInto(hi: number, lo: number, x: number, days: BarycentricDays, i: number): void {
  const sum = hi + x;
  const xVirtual = sum - hi;
  const error = (hi - (sum - xVirtual)) + (x - xVirtual) + lo;
  const outHi = sum + error;
  days.hi[i] = outHi;
  days.lo[i] = error - (outHi - sum);
}

function allocateEvaluation(n: number, prepared: PreparedArrivals): TimingEvaluation {
  return {
    count: n,
    residualS: new Float64Array(n),
    residualTurns: new Float64Array(n),
    pulseNumber: new Float64Array(n),
    frequencyHz: new Float64Array(n),
    roemerS: new Float64Array(n),
    shapiroS: new Float64Array(n),
    dispersionS: new Float64Array(n),
    offsetS: new Float64Array(n),
    companionS: new Float64Array(n),
    barycentricFrequencyMhz: new Float64Array(n),
    barycentricDays: { reference: prepared.epochMjd, hi: new Float64Array(n), lo: new Float64Array(n) },
    emissionSinceEpochS: new Float64Array(n),
    emissionSinceEpochLoS: new Float64Array(n),
    yearsSinceEpoch: new Float64Array(n),
    directionXyz: new Float64Array(3 * n),
  };
}
