/**
 * The iterative companion search (docs/formats.md §4 `search`; docs/timing.md
 * "Companion search"): fit, periodogram of the residuals, strongest peak and
 * its false-alarm probability; while that is below the threshold, a new
 * Keplerian companion seeded from the peak, a full refit, and again.
 */
import type { TimingModel } from '../model/timing-model';
import type { Toa } from '../toas/toa';
import type { ArrivalGeometry } from '../pipeline/arrival-geometry';
import { fitPreparedArrivals, type TimingFitOptions, type TimingFitResult } from '../pipeline/fit-prepared-arrivals';
import { periodogramGrid } from '../periodogram/frequency-grid';
import { aliasFlags } from '../periodogram/alias-flags';
import { LOMB_SCARGLE_FAST_SETTINGS } from '../periodogram/lomb-scargle-fast';
import { powerAtFalseAlarm } from '../periodogram/false-alarm-power-level';
import { DEFAULT_PULSAR_MASS_SOLAR } from '../physics/physics-constants';
import {
  CompanionSearchCancelled,
  type CompanionSearchOptions,
  type CompanionSearchReport,
  type CompanionSearchSettings,
  type SearchCandidate,
  type SearchPeak,
  type SearchPeriodogram,
  type SearchStopReason,
} from './companion-search-report';
import { defaultSearchPeriodRange } from './search-period-range';
import { residualSeries, roundPeriodogram } from './residual-periodogram';
import { windowPeakFrequencies } from './sampling-alias-context';
import { circularSeed } from './sinusoid-seed';
import { CIRCULAR_KEYS, ECCENTRIC_KEYS, companionOf, companionPath, fitCandidate, tryEccentricOrbit } from './candidate-fit';
import { classifyCandidate } from './candidate-checks';
import { candidateDerivedQuantities } from './candidate-derived';

export const DEFAULT_MAX_COMPANIONS = 3;
export const DEFAULT_FALSE_ALARM_THRESHOLD = 1e-3;
export const DEFAULT_ECCENTRICITY_THRESHOLD = 1e-3;
export const DEFAULT_OVERSAMPLING = 5;
/** A final reduced χ² above this gets a warning (the uncertainties are formal, not rescaled). */
const HIGH_REDUCED_CHI2 = 1.5;
/** Names given to new companions, in order, skipping names the model already uses. */
const COMPANION_NAMES = 'bcdefghijklmnopqrstuvwxyz'.split('');

/**
 * Searches the residuals of `model` for periodic light-travel-time signals and fits a companion to each.
 *
 * @param model     starting model (not modified); its solve_for is fitted in every round
 * @param toas      arrival times, same order as `geometry`
 * @param geometry  computeArrivalGeometry(toas, …), computed once
 * @param options   period range, max companions, thresholds, pulsar mass, fit options, progress, cancel
 * @returns         CompanionSearchReport: one peak per round (the last one stopped the search), the
 *                  periodograms, every candidate (accepted, unstable or degenerate) with elements ±1σ,
 *                  χ² before and after, F-test and derived masses, and the final model and fit
 *
 * Notes: 1. Round k: periodogram of the current fit's residuals (generalized Lomb–Scargle with the TOA
 *           weights, Zechmeister & Kürster 2009) on 1/maxPeriod … 1/minPeriod with oversampling ≥ 5
 *           (periodogramGrid); highest peak; its Baluev 2008 false-alarm probability.
 *        2. Stop when that probability is ≥ the threshold, or when maxCompanions companions are already
 *           accepted (the peak is still computed and reported), or when the candidate is rejected.
 *        3. Otherwise a circular Keplerian companion is seeded from a linear sinusoid fit at the refined
 *           peak (circularSeed: period from the peak, x from the amplitude, T₀ from the phase), fitted
 *           with everything in solve_for, then tried eccentric (candidate-fit.ts).
 *        4. A candidate that is unstable (no convergence, e → 1, period beyond the span) or degenerate
 *           (x not significant, period unconstrained, degenerate parameters) is reported, not added.
 *        5. Defaults: min period max(1 d, 2 × median TOA spacing), max period the span, 3 companions,
 *           false alarm 0.001, F-test 0.001, pulsar mass 1.4 M☉, oversampling 5 (docs/timing.md).
 * Throws TimingInputError / RangeError for a bad request (as fitPreparedArrivals and periodogramGrid:
 * bad paths, min period ≥ max period, …) and CompanionSearchCancelled when options.isCancelled() is true.
 */
export function searchCompanions(model: TimingModel, toas: readonly Toa[], geometry: ArrivalGeometry, options: CompanionSearchOptions = {}): CompanionSearchReport {
  const maxCompanions = options.maxCompanions ?? DEFAULT_MAX_COMPANIONS;
  const falseAlarmThreshold = options.falseAlarmThreshold ?? DEFAULT_FALSE_ALARM_THRESHOLD;
  const eccentricityThreshold = options.eccentricityThreshold ?? DEFAULT_ECCENTRICITY_THRESHOLD;
  const pulsarMassSolar = options.pulsarMassSolar ?? DEFAULT_PULSAR_MASS_SOLAR;
  const oversampling = options.oversampling ?? DEFAULT_OVERSAMPLING;
  checkOptions(maxCompanions, falseAlarmThreshold, eccentricityThreshold, pulsarMassSolar);
  const fitOptions: TimingFitOptions = { ...options.fitOptions };
  const totalRounds = maxCompanions + 1;
  const progress = (round: number, stage: string, withinRound: number): void => {
    if (options.isCancelled?.() === true) throw new CompanionSearchCancelled();
    const fraction = stage === 'done' ? 1 : Math.min(1, (round - 1 + withinRound) / totalRounds);
    options.onProgress?.({ round, stage, fraction });
  };

  progress(1, 'fit', 0);
  let current = fitPreparedArrivals(model, toas, geometry, fitOptions);
  const warnings: string[] = [];
  if (!current.converged) warnings.push(`the starting fit did not converge (χ² = ${current.chi2}); the search went on from where it stopped`);
  const firstSeries = residualSeries(current, geometry);
  const range = defaultSearchPeriodRange(firstSeries.tDays);
  const minPeriodDays = options.minPeriodDays ?? range.minPeriodDays;
  const maxPeriodDays = options.maxPeriodDays ?? range.maxPeriodDays;
  const grid = periodogramGrid(range.spanDays, { minPeriodDays, maxPeriodDays, oversampling });
  const windowPeaksPerDay = windowPeakFrequencies(firstSeries.tDays, firstSeries.weights, grid, oversampling);
  const usedNames = new Set(model.companions.map((c) => c.name));
  const names = COMPANION_NAMES.filter((n) => !usedNames.has(n));

  const peaks: SearchPeak[] = [];
  const periodograms: SearchPeriodogram[] = [];
  const candidates: SearchCandidate[] = [];
  let stopReason: SearchStopReason;
  for (let round = 1; ; round++) {
    progress(round, 'periodogram', 0.05);
    const series = round === 1 ? firstSeries : residualSeries(current, geometry);
    const pg = roundPeriodogram(series, grid);
    const periodDays = 1 / pg.peakFrequencyPerDay;
    const aliasWarnings = aliasFlags(periodDays, {
      cadenceDays: range.cadenceDays > 0 ? range.cadenceDays : undefined, // NaN (one session) → no cadence flags
      windowPeaksPerDay,
      strongerPeaksPerDay: peaks.map((p) => p.frequencyPerDay),
      resolutionPerDay: grid.stepPerDay * oversampling,
    });
    peaks.push({ round, periodDays, frequencyPerDay: pg.peakFrequencyPerDay, power: pg.peakPower, falseAlarmProbability: pg.falseAlarmProbability, aliasWarnings });
    const fMaxPerDay = pg.frequencyPerDay[grid.count - 1];
    const thresholdPower = powerAtFalseAlarm(falseAlarmThreshold, series.tDays.length, fMaxPerDay, series.tDays, series.weights); // inverse of the peak's Baluev 2008 FAP
    periodograms.push({ round, grid, frequencyPerDay: pg.frequencyPerDay, power: pg.power, thresholdPower });
    if (!(pg.falseAlarmProbability < falseAlarmThreshold)) {
      stopReason = 'false-alarm-above-threshold';
      break;
    }
    const accepted = candidates.filter((c) => c.status === 'accepted').length;
    if (accepted >= maxCompanions) {
      stopReason = 'max-companions';
      warnings.push(`stopped at ${maxCompanions} companions while the next peak (${periodDays.toPrecision(6)} d) has false-alarm probability ${pg.falseAlarmProbability.toExponential(2)} < ${falseAlarmThreshold}: more signal may remain`);
      break;
    }
    const name = names[accepted] ?? `companion-${round}`;
    progress(round, 'companion-fit', 0.2);
    const seed = circularSeed(name, periodDays, series);
    const outcome = fitCandidate(current, seed, toas, geometry, fitOptions, eccentricityThreshold);
    progress(round, 'eccentricity-test', 0.9);
    warnings.push(...outcome.notes);
    const uncertainties: Record<string, number> = {};
    for (const key of outcome.fittedKeys) uncertainties[key] = outcome.fit?.parameters[companionPath(name, key)]?.uncertainty ?? NaN;
    const verdict = outcome.failure ?? classifyCandidate({
      companion: outcome.companion,
      uncertainties,
      converged: outcome.fit?.converged ?? false,
      spanDays: range.spanDays,
    });
    candidates.push({
      round,
      name,
      status: verdict.status,
      ...(verdict.reason !== undefined ? { reason: verdict.reason } : {}),
      companion: outcome.companion,
      uncertainties,
      falseAlarmProbability: pg.falseAlarmProbability,
      seedPeriodDays: periodDays,
      chi2Before: current.chi2,
      chi2After: outcome.fit?.chi2 ?? NaN,
      eccentricityTest: outcome.eccentricityTest,
      derived: candidateDerivedQuantities(outcome.companion, pulsarMassSolar),
      converged: outcome.fit?.converged ?? false,
    });
    for (const w of aliasWarnings) warnings.push(`companion ${name}: ${w}`);
    if (verdict.status !== 'accepted' || outcome.fit === undefined) {
      stopReason = 'candidate-rejected';
      warnings.push(`candidate ${name} at ${periodDays.toPrecision(6)} d is ${verdict.status}: ${verdict.reason ?? ''}; it is not in the model and the search stopped`);
      break;
    }
    current = outcome.fit;
    progress(round, 'eccentricity-retest', 0.95);
    current = retestCircularCompanions(current, candidates, toas, geometry, fitOptions, eccentricityThreshold);
  }
  progress(peaks.length, 'done', 1);
  refreshAcceptedCandidates(candidates, current, pulsarMassSolar);
  if (!current.converged) warnings.push(`the final fit did not converge; last χ² = ${current.chi2}`);
  if (current.reducedChi2 > HIGH_REDUCED_CHI2) {
    warnings.push(`the final reduced χ² is ${current.reducedChi2.toFixed(2)}: the residuals hold more than the stated white noise (an unfitted offset, red noise, or a signal below the threshold), so the formal uncertainties are likely too small`);
  }
  const settings: CompanionSearchSettings = {
    minPeriodDays,
    maxPeriodDays,
    maxCompanions,
    falseAlarmThreshold,
    eccentricityThreshold,
    pulsarMassSolar,
    oversampling,
    frequencyCount: grid.count,
    spanDays: range.spanDays,
    periodogram: `generalized Lomb–Scargle (floating mean, weights 1/σ²), extirpolation order ${LOMB_SCARGLE_FAST_SETTINGS.extirpolationOrder}, FFT oversampling ${LOMB_SCARGLE_FAST_SETTINGS.fftOversampling}; false alarm: Baluev 2008`,
    fit: current.settings,
  };
  return { peaks, periodograms, candidates, model: current.model, finalFit: current, stopReason, warnings: dedupe([...current.warnings, ...warnings]), settings };
}

/**
 * Re-tries the eccentric orbit for every accepted companion still circular, now that one more signal
 * is modelled: an F-test made while other companions were unmodelled has their signals in its
 * denominator and can miss a real eccentricity, whose second harmonic would then be the next peak.
 * Returns the fit with every eccentric orbit the test now keeps.
 */
function retestCircularCompanions(
  fit: TimingFitResult,
  candidates: SearchCandidate[],
  toas: readonly Toa[],
  geometry: ArrivalGeometry,
  fitOptions: TimingFitOptions,
  eccentricityThreshold: number,
): TimingFitResult {
  let current = fit;
  for (const candidate of candidates) {
    if (candidate.status !== 'accepted' || candidate.eccentricityTest.kept) continue;
    const attempt = tryEccentricOrbit(current, candidate.name, toas, geometry, fitOptions, eccentricityThreshold);
    if (!attempt.test.attempted) continue;
    candidate.eccentricityTest = attempt.test;
    if (attempt.fit !== undefined) current = attempt.fit;
  }
  return current;
}

/** Accepted candidates carry the elements, 1σ and derived quantities of the final fit (χ² figures stay as at discovery). */
function refreshAcceptedCandidates(candidates: SearchCandidate[], finalFit: TimingFitResult, pulsarMassSolar: number): void {
  for (const candidate of candidates) {
    if (candidate.status !== 'accepted') continue;
    const companion = companionOf(finalFit.model, candidate.name);
    const uncertainties: Record<string, number> = {};
    for (const key of [...CIRCULAR_KEYS, ...ECCENTRIC_KEYS]) {
      const p = finalFit.parameters[companionPath(candidate.name, key)];
      if (p !== undefined) uncertainties[key] = p.uncertainty;
    }
    candidate.companion = companion;
    candidate.uncertainties = uncertainties;
    candidate.derived = candidateDerivedQuantities(companion, pulsarMassSolar);
  }
}

function checkOptions(maxCompanions: number, falseAlarm: number, eccentricity: number, pulsarMass: number): void {
  if (!Number.isInteger(maxCompanions) || maxCompanions < 0 || maxCompanions > COMPANION_NAMES.length) {
    throw new RangeError(`maxCompanions: must be a whole number from 0 to ${COMPANION_NAMES.length}, got ${maxCompanions}`);
  }
  if (!(falseAlarm > 0 && falseAlarm < 1)) throw new RangeError(`falseAlarmThreshold: must be in (0, 1), got ${falseAlarm}`);
  if (!(eccentricity > 0 && eccentricity < 1)) throw new RangeError(`eccentricityThreshold: must be in (0, 1), got ${eccentricity}`);
  if (!(pulsarMass > 0 && Number.isFinite(pulsarMass))) throw new RangeError(`pulsarMassSolar: must be > 0, got ${pulsarMass}`);
}

function dedupe(list: string[]): string[] {
  return [...new Set(list)];
}

