/**
 * The engine call of a search run, as plain data in and out (so it can run in
 * a worker thread): read the model, arrival geometry once, the iterative
 * companion search (worker/timing/search/companion-search.ts), and the report
 * shaped as the search run stores it (SearchResult of api/contracts/search-runs.ts
 * plus the periodograms, kept apart as typed arrays).
 */
import type { SearchCandidate, SearchOptions, SearchResult, SearchValue } from '../../api/contracts/search-runs';
import type { Observatory } from '../timing/earth/observatory';
import type { Companion } from '../timing/model/timing-model';
import { COMPANION_PARAMETER_FIELDS } from '../timing/model/parameter-paths';
import { readModelFile } from '../timing/model/read-model-file';
import { writeModelFile } from '../timing/model/write-model-file';
import { computeArrivalGeometry } from '../timing/pipeline/compute-arrival-geometry';
import { checkFitRequest } from '../timing/pipeline/fit-prepared-arrivals';
import { searchCompanions } from '../timing/search/companion-search';
import type { CompanionSearchProgress, CompanionSearchReport, SearchCandidate as EngineCandidate } from '../timing/search/companion-search-report';
import type { TimingModel } from '../timing/model/timing-model';
import type { Toa } from '../timing/toas/toa';

export interface SearchEngineInput {
  modelJson: Record<string, unknown>; // the revision's model file JSON
  toas: Toa[];
  observatories: Observatory[];
  options: SearchOptions;
}

export interface SearchEnginePeriodogram {
  round: number;
  grid: { minFrequencyPerDay: number; stepPerDay: number; count: number };
  power: Float64Array;
}

export interface SearchEngineOutput {
  result: SearchResult;
  periodograms: SearchEnginePeriodogram[];
}

export interface SearchEngineHooks {
  onStage(stage: 'barycentring' | 'searching'): void;
  onProgress(progress: CompanionSearchProgress): void;
}

/** Elements whose uncertainty is shown even when held fixed (null), in file order. */
const CORE_ELEMENTS = new Set(['period_days', 'projected_semimajor_axis_lt_s', 'eccentricity', 'periastron_longitude_deg', 'periastron_epoch_mjd', 'ascending_node_epoch_mjd', 'e_sin_omega', 'e_cos_omega']);

/** A companion's file fields (writeModelFile's notation: MJD text for epochs, numbers otherwise). */
function companionFileFields(model: TimingModel, companion: Companion): Record<string, unknown> {
  const file = writeModelFile({ ...model, companions: [companion], solveFor: [] });
  return (file.companions as Record<string, unknown>[])[0];
}

/** The candidate's elements in file notation with their 1σ (null when the element was held fixed). */
export function candidateElements(model: TimingModel, candidate: EngineCandidate): Record<string, SearchValue> {
  const fields = companionFileFields(model, candidate.companion);
  const elements: Record<string, SearchValue> = {};
  for (const field of COMPANION_PARAMETER_FIELDS) {
    if (!(field.fileKey in fields)) continue;
    const sigma = candidate.uncertainties[field.fileKey];
    if (sigma === undefined && !CORE_ELEMENTS.has(field.fileKey)) continue;
    elements[field.fileKey] = { value: String(fields[field.fileKey]), uncertainty: sigma ?? null, unit: field.unit };
  }
  return elements;
}

/** Not-finite figures (a failed orbit fit) are stored as null, never as a number JSON cannot hold. */
const finiteOrNull = (x: number): number | null => (Number.isFinite(x) ? x : null);

function presentCandidate(model: TimingModel, c: EngineCandidate): SearchCandidate {
  return {
    round: c.round,
    name: c.name,
    kind: c.companion.kind,
    status: c.status,
    reason: c.reason ?? null,
    falseAlarmProbability: c.falseAlarmProbability,
    seedPeriodDays: c.seedPeriodDays,
    elements: candidateElements(model, c),
    chi2Before: c.chi2Before,
    chi2After: finiteOrNull(c.chi2After),
    chi2Change: finiteOrNull(c.chi2After - c.chi2Before),
    eccentricityTest: { ...c.eccentricityTest },
    converged: c.converged,
    derived: {
      massFunctionSolar: finiteOrNull(c.derived.massFunctionSolar),
      assumedPulsarMassSolar: c.derived.pulsarMassSolar,
      minimumCompanionMass: {
        solarMasses: finiteOrNull(c.derived.minimumCompanionMass.solarMasses),
        jupiterMasses: finiteOrNull(c.derived.minimumCompanionMass.jupiterMasses),
        earthMasses: finiteOrNull(c.derived.minimumCompanionMass.earthMasses),
      },
      separationAu: finiteOrNull(c.derived.separationAu),
    },
  };
}

const optionalThreshold = (power: number | undefined): { thresholdPower?: number } => (power !== undefined && Number.isFinite(power) ? { thresholdPower: power } : {});

/** The engine's report as the run stores it. */
export function presentSearchReport(report: CompanionSearchReport, options: SearchOptions): SearchEngineOutput {
  const { finalFit, settings } = report;
  const thresholdPowers = new Map(report.periodograms.map((p) => [p.round, p.thresholdPower]));
  const parameters: Record<string, SearchValue> = {};
  for (const [path, p] of Object.entries(finalFit.parameters)) parameters[path] = { value: p.value, uncertainty: p.uncertainty, unit: p.fileUnit };
  const candidates = report.candidates.map((c) => presentCandidate(report.model, c));
  const result: SearchResult = {
    peaks: report.peaks.map((p) => ({
      round: p.round,
      periodDays: p.periodDays,
      frequencyPerDay: p.frequencyPerDay,
      power: p.power,
      falseAlarmProbability: p.falseAlarmProbability,
      significant: p.falseAlarmProbability < options.falseAlarmThreshold,
      aliasWarnings: [...p.aliasWarnings],
      ...optionalThreshold(thresholdPowers.get(p.round)), // the threshold line, kept in the result JSON
    })),
    candidates,
    companionsFound: candidates.filter((c) => c.status === 'accepted').length,
    stopReason: report.stopReason,
    finalFit: {
      chi2: finalFit.chi2,
      dof: finalFit.dof,
      reducedChi2: finalFit.reducedChi2,
      weightedRmsUs: finalFit.weightedRmsUs,
      converged: finalFit.converged,
      iterations: finalFit.iterations,
      parameters,
    },
    warnings: [...new Set([...report.warnings, ...finalFit.warnings])],
    searchSettings: {
      minPeriodDays: settings.minPeriodDays,
      maxPeriodDays: settings.maxPeriodDays,
      maxCompanions: settings.maxCompanions,
      falseAlarmThreshold: settings.falseAlarmThreshold,
      eccentricityThreshold: settings.eccentricityThreshold,
      pulsarMassSolar: settings.pulsarMassSolar,
      oversampling: settings.oversampling,
      frequencyCount: settings.frequencyCount,
      spanDays: settings.spanDays,
    },
    engineSettings: { periodogram: settings.periodogram, ...settings.fit },
    resultingModel: writeModelFile(report.model),
  };
  const periodograms = report.periodograms.map((p) => ({
    round: p.round,
    grid: { minFrequencyPerDay: p.grid.minFreqPerDay, stepPerDay: p.grid.stepPerDay, count: p.grid.count },
    power: Float64Array.from(p.power),
  }));
  return { result, periodograms };
}

/**
 * Runs the search. Throws the engine's TimingInputError (or RangeError) for
 * input without an answer (bad model, unknown observatory, TOAs outside the
 * ephemeris, a period range the data cannot support).
 */
export function runSearchEngine(input: SearchEngineInput, hooks: SearchEngineHooks): SearchEngineOutput {
  const model = readModelFile(input.modelJson);
  const observatories = new Map(input.observatories.map((o) => [o.code, o]));
  checkFitRequest(model, input.toas);
  hooks.onStage('barycentring');
  const geometry = computeArrivalGeometry(input.toas, observatories, {});
  hooks.onStage('searching');
  const { options } = input;
  const report = searchCompanions(model, input.toas, geometry, {
    ...(options.minPeriodDays !== null ? { minPeriodDays: options.minPeriodDays } : {}),
    ...(options.maxPeriodDays !== null ? { maxPeriodDays: options.maxPeriodDays } : {}),
    maxCompanions: options.maxCompanions,
    falseAlarmThreshold: options.falseAlarmThreshold,
    pulsarMassSolar: options.assumedPulsarMassSolar,
    onProgress: (progress) => hooks.onProgress(progress),
  });
  return presentSearchReport(report, options);
}
