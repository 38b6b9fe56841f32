/**
 * Fitting one candidate companion: the circular orbit seeded from the
 * periodogram, then the eccentric orbit kept only when an F-test asks for it.
 */
import type { KeplerianCompanion, TimingModel } from '../model/timing-model';
import type { Toa } from '../toas/toa';
import type { ArrivalGeometry } from '../pipeline/arrival-geometry';
import { fitPreparedArrivals, type TimingFitOptions, type TimingFitResult } from '../pipeline/fit-prepared-arrivals';
import { nestedFTest } from '../fit/model-selection';
import { TimingInputError } from '../engine-error';
import { mjdAddDays } from '../time/mjd-arithmetic';
import type { EccentricityTest } from './companion-search-report';
import { eccentricSeed } from './sinusoid-seed';
import { residualSeries } from './residual-periodogram';

/** The circular orbit's fitted elements, as file keys. */
export const CIRCULAR_KEYS = ['period_days', 'projected_semimajor_axis_lt_s', 'periastron_epoch_mjd'] as const;
/** The two added by the eccentric orbit. */
export const ECCENTRIC_KEYS = ['eccentricity', 'periastron_longitude_deg'] as const;

export function companionPath(name: string, key: string): string {
  return `companions[${name}].${key}`;
}

export interface CandidateFitOutcome {
  /** the chosen fit (eccentric if kept, else circular); undefined when the circular fit failed */
  fit?: TimingFitResult;
  /** the fitted (or, after a failure, the seeded) companion */
  companion: KeplerianCompanion;
  /** keys of the companion that were fitted */
  fittedKeys: string[];
  eccentricityTest: EccentricityTest;
  /** set when a fit threw: the engine's one-line reason and the status it implies */
  failure?: { status: 'unstable' | 'degenerate'; reason: string };
  /** soft problems met on the way (an eccentric fit that failed, …) */
  notes: string[];
}

/**
 * Adds `seed` to the fitted model of `base` and fits it with everything else in solve_for.
 *
 * @param base                   the fit without the new companion (its model is the start)
 * @param seed                   circular starting elements (circularSeed)
 * @param toas                   the TOAs of `geometry`
 * @param geometry               computeArrivalGeometry(toas, …)
 * @param fitOptions             iterations, Jupiter Shapiro delay
 * @param eccentricityThreshold  F-test probability below which e and ω are kept
 * @returns                      the chosen fit, the companion, the F-test (Notes 1–3)
 *
 * Notes: 1. Circular first: period, projected semimajor axis and periastron epoch (e = ω = 0), a
 *           well-posed problem near the periodogram's seed.
 *        2. Then e and ω from the second harmonic of the circular fit's residuals (eccentricSeed),
 *           fitted with everything else; kept when the nested-model F-test (Bevington & Robinson
 *           2003, §11.4) gives a probability below `eccentricityThreshold` for the 2 added parameters.
 *        3. A fit ending with x < 0 or e < 0 is the same orbit with ω + 180° and T₀ + Pb/2 (for x < 0,
 *           also ω + 180°): it is folded back and refitted so the reported fit and the model agree.
 *        Engine errors (degenerate parameters: TimingInputError; an orbit driven out of its valid
 *        range, e.g. e ≥ 1: RangeError) make the outcome `failure`, never an exception.
 */
export function fitCandidate(
  base: TimingFitResult,
  seed: KeplerianCompanion,
  toas: readonly Toa[],
  geometry: ArrivalGeometry,
  fitOptions: TimingFitOptions,
  eccentricityThreshold: number,
): CandidateFitOutcome {
  const name = seed.name;
  const notes: string[] = [];
  const notAttempted: EccentricityTest = { attempted: false, statistic: 0, probability: 1, kept: false };
  const circularStart = withCompanion(base.model, seed, CIRCULAR_KEYS);
  const circular = tryFit(circularStart, toas, geometry, fitOptions, name, false);
  if ('failure' in circular) {
    return { companion: seed, fittedKeys: [...CIRCULAR_KEYS], eccentricityTest: notAttempted, failure: circular.failure, notes };
  }
  const eccentric = tryEccentricOrbit(circular.fit, name, toas, geometry, fitOptions, eccentricityThreshold);
  notes.push(...eccentric.notes);
  const chosen = eccentric.fit ?? circular.fit;
  return {
    fit: chosen,
    companion: companionOf(chosen.model, name),
    fittedKeys: eccentric.fit !== undefined ? [...CIRCULAR_KEYS, ...ECCENTRIC_KEYS] : [...CIRCULAR_KEYS],
    eccentricityTest: eccentric.test,
    notes,
  };
}

export interface EccentricAttempt {
  /** the eccentric fit when the F-test kept it, else undefined */
  fit?: TimingFitResult;
  test: EccentricityTest;
  notes: string[];
}

/**
 * Tries eccentricity and periastron longitude for the circular companion `name` of `circularFit`.
 *
 * @param circularFit            a fit in which `name` is circular (e = ω = 0, not in solve_for)
 * @param name                   the companion
 * @param toas                   the TOAs of `geometry`
 * @param geometry               computeArrivalGeometry(toas, …)
 * @param fitOptions             iterations, Jupiter Shapiro delay
 * @param eccentricityThreshold  F-test probability below which e and ω are kept
 * @returns                      the eccentric fit when kept, the F-test, notes (see fitCandidate, Note 2)
 */
export function tryEccentricOrbit(
  circularFit: TimingFitResult,
  name: string,
  toas: readonly Toa[],
  geometry: ArrivalGeometry,
  fitOptions: TimingFitOptions,
  eccentricityThreshold: number,
): EccentricAttempt {
  const notAttempted: EccentricityTest = { attempted: false, statistic: 0, probability: 1, kept: false };
  const circularCompanion = companionOf(circularFit.model, name);
  const start = withCompanion(circularFit.model, eccentricSeed(circularCompanion, residualSeries(circularFit, geometry)), ECCENTRIC_KEYS);
  const eccentric = tryFit(start, toas, geometry, fitOptions, name, true);
  if ('failure' in eccentric) {
    return { test: notAttempted, notes: [`companion ${name}: the eccentric orbit fit failed (${eccentric.failure.reason}); kept circular`] };
  }
  const test = nestedFTest(fitSummary(circularFit), fitSummary(eccentric.fit)); // Bevington & Robinson 2003, §11.4
  const kept = eccentric.fit.converged && eccentric.fit.chi2 < circularFit.chi2 && test.probability < eccentricityThreshold;
  const notes = eccentric.fit.converged ? [] : [`companion ${name}: the eccentric orbit fit did not converge; kept circular`];
  return { ...(kept ? { fit: eccentric.fit } : {}), test: { attempted: true, statistic: test.statistic, probability: test.probability, kept }, notes };
}

function fitSummary(fit: TimingFitResult): { chi2: number; count: number; freeParameters: number } {
  return { chi2: fit.chi2, count: fit.residuals.length, freeParameters: fit.parameterNames.length };
}

/** The model with `companion` put in (replacing one of the same name) and `keys` added to solve_for. */
function withCompanion(model: TimingModel, companion: KeplerianCompanion, keys: readonly string[]): TimingModel {
  const next = structuredClone(model);
  const index = next.companions.findIndex((c) => c.name === companion.name);
  if (index >= 0) next.companions[index] = { ...companion };
  else next.companions.push({ ...companion });
  for (const key of keys) {
    const path = companionPath(companion.name, key);
    if (!next.solveFor.includes(path)) next.solveFor.push(path);
  }
  return next;
}

export function companionOf(model: TimingModel, name: string): KeplerianCompanion {
  const c = model.companions.find((k) => k.name === name);
  if (c === undefined || c.kind !== 'keplerian') throw new RangeError(`companionOf: no keplerian companion named ${name}`);
  return c;
}

type FitAttempt = { fit: TimingFitResult } | { failure: { status: 'unstable' | 'degenerate'; reason: string } };

/** One fit; engine errors become a failure; a fit ending at x < 0 or e < 0 is folded back and refitted (Note 3). */
function tryFit(model: TimingModel, toas: readonly Toa[], geometry: ArrivalGeometry, options: TimingFitOptions, name: string, eccentric: boolean): FitAttempt {
  try {
    let fit = fitPreparedArrivals(model, toas, geometry, options);
    const folded = foldedOrbit(companionOf(fit.model, name), eccentric);
    if (folded !== undefined) {
      const next = structuredClone(fit.model);
      next.companions[next.companions.findIndex((c) => c.name === name)] = folded;
      fit = fitPreparedArrivals(next, toas, geometry, options);
    }
    return { fit };
  } catch (error) {
    if (error instanceof TimingInputError) return { failure: { status: 'degenerate', reason: error.message.split('\n')[0] } };
    if (error instanceof RangeError) return { failure: { status: 'unstable', reason: `the orbit left its valid range (${error.message.split('\n')[0]})` } };
    throw error;
  }
}

/** The same orbit with x ≥ 0, e ≥ 0 and ω in [0°, 360°), or undefined when nothing needs folding. */
function foldedOrbit(c: KeplerianCompanion, eccentric: boolean): KeplerianCompanion | undefined {
  let { projectedSemimajorAxisLtS: x, eccentricity: e, periastronLongitudeDeg: omega, periastronEpochMjd: epoch } = c;
  let changed = false;
  if (x < 0) {
    // −x·sin(M + ω) = x·sin(M + ω + 180°): B&T 1976 delay with α, β negated
    x = -x;
    omega += 180;
    changed = true;
  }
  if (eccentric && e < 0) {
    // (−e, ω) ≡ (e, ω + 180°) with the periastron half an orbit later (E → E + π, M → M + π)
    e = -e;
    omega += 180;
    epoch = mjdAddDays(epoch, c.periodDays / 2);
    changed = true;
  }
  if (!eccentric && changed) {
    // a circular orbit keeps ω = 0: move the epoch by half a period instead
    omega = 0;
    epoch = mjdAddDays(epoch, c.periodDays / 2);
  }
  const wrapped = ((omega % 360) + 360) % 360;
  if (wrapped !== omega) changed = true;
  return changed ? { ...c, projectedSemimajorAxisLtS: x, eccentricity: e, periastronLongitudeDeg: wrapped, periastronEpochMjd: epoch } : undefined;
}
