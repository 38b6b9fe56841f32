/**
 * The engine call of a fit run, as plain data in and out (so it can run in a
 * worker thread): the same steps as fitTimingModel (check the request, arrival
 * geometry once, Gauss–Newton fit), with a stage report between them, and the
 * result shaped as the fit run stores it.
 */
import type { FitParameterResult, FitResult } from '../../api/contracts/fit-runs';
import type { Observatory } from '../timing/earth/observatory';
import type { TimingModel } from '../timing/model/timing-model';
import type { ArrivalGeometry } from '../timing/pipeline/arrival-geometry';
import { formatMjd } from '../timing/time/mjd-string';
import { parameterHandle } from '../timing/model/parameter-paths';
import { readModelFile } from '../timing/model/read-model-file';
import { writeModelFile } from '../timing/model/write-model-file';
import { computeArrivalGeometry } from '../timing/pipeline/compute-arrival-geometry';
import { checkFitRequest, fitPreparedArrivals } from '../timing/pipeline/fit-prepared-arrivals';
import { TimingInputError } from '../timing/engine-error';
import { explorerColumns, explorerPartialPaths, type ExplorerEngineColumns, type ExplorerPartialInfo } from './fit-run-explorer';
import type { DoubleDouble } from '../timing/time/epoch';
import type { Toa } from '../timing/toas/toa';

export interface FitEngineInput {
  modelJson: Record<string, unknown>; // the revision's model file JSON
  toas: Toa[];
  observatories: Observatory[]; // the sites of `toas` and `excludedToas`
  maxIterations?: number;
  /** TOAs excluded at fit time: evaluated (not fitted) for the explorer. */
  excludedToas?: Toa[];
}

/** The explorer arrays (fit-run-explorer.ts) of the fitted and of the excluded TOAs. */
export interface FitEngineExplorer {
  partialPaths: ExplorerPartialInfo[];
  fitted: ExplorerEngineColumns; // order of FitEngineInput.toas
  excluded: ExplorerEngineColumns; // order of FitEngineInput.excludedToas; NaN rows where the engine cannot evaluate a TOA
  referenceMjd: string; // the fitted model's epoch (TDB)
  spinFrequencyHz: string;
}

/** The stored fit result (api/contracts/fit-runs.ts) plus the per-TOA arrays the run keeps apart. */
export interface FitEngineOutput extends FitResult {
  residualUs: Float64Array; // same order as the input TOAs
  uncertaintyUs: Float64Array; // effective uncertainty used by the fit
  explorer: FitEngineExplorer;
}

export interface FitEngineHooks {
  onStage(stage: 'barycentring' | 'fitting'): void;
  onIteration(iteration: number, chi2: number): void;
}

const ddMinus = (a: DoubleDouble, b: DoubleDouble): number => a[1] - b[1] + (a[0] - b[0]); // hi parts first: same-size values

/**
 * Runs the fit. Throws the engine's TimingInputError for input without an answer
 * (bad model, unknown observatory, TOAs outside the ephemeris, degenerate parameters).
 */
export function runFitEngine(input: FitEngineInput, hooks: FitEngineHooks): FitEngineOutput {
  const model = readModelFile(input.modelJson);
  const observatories = new Map(input.observatories.map((o) => [o.code, o]));
  checkFitRequest(model, input.toas);
  hooks.onStage('barycentring');
  const geometry = computeArrivalGeometry(input.toas, observatories, {});
  hooks.onStage('fitting');
  const fit = fitPreparedArrivals(model, input.toas, geometry, {
    maxIterations: input.maxIterations,
    onIteration: ({ iteration, chi2 }) => hooks.onIteration(iteration, chi2),
  });
  const parameters: Record<string, FitParameterResult> = {};
  for (const [path, p] of Object.entries(fit.parameters)) {
    const handle = parameterHandle(model, path);
    const start = handle.get(model);
    parameters[path] = {
      value: p.value,
      uncertainty: p.uncertainty,
      unit: p.fileUnit,
      startValue: handle.formatValue(start),
      changeSigma: p.internalUncertainty > 0 ? ddMinus(p.internalValue, start) / p.internalUncertainty : 0,
    };
  }
  return {
    parameters,
    chi2: fit.chi2,
    dof: fit.dof,
    reducedChi2: fit.reducedChi2,
    weightedRmsUs: fit.weightedRmsUs,
    iterations: fit.iterations,
    converged: fit.converged,
    warnings: fit.warnings,
    phaseOffsetTurns: fit.phaseOffsetTurns,
    conditionNumber: fit.conditionNumber,
    engineSettings: fit.settings,
    fittedModel: writeModelFile(fit.model),
    residualUs: Float64Array.from(fit.residuals, (r) => r.residualUs),
    uncertaintyUs: Float64Array.from(fit.residuals, (r) => r.uncertaintyUs),
    explorer: explorerOutput(fit.model, input, geometry, fit.phaseOffsetTurns, observatories),
  };
}

function explorerOutput(
  model: TimingModel,
  input: FitEngineInput,
  geometry: ArrivalGeometry,
  phaseOffsetTurns: number,
  observatories: ReadonlyMap<string, Observatory>,
): FitEngineExplorer {
  const partialPaths = explorerPartialPaths(model);
  const spinHandle = parameterHandle(model, 'spin.frequency_hz');
  return {
    partialPaths,
    fitted: explorerColumns(model, input.toas, geometry, phaseOffsetTurns, partialPaths),
    excluded: excludedColumns(model, input.excludedToas ?? [], phaseOffsetTurns, partialPaths, observatories),
    referenceMjd: formatMjd(model.epochMjd, 20),
    spinFrequencyHz: spinHandle.formatValue(spinHandle.get(model)),
  };
}

/**
 * Excluded TOAs are evaluated as one set; when the engine refuses the set (a TOA outside the
 * ephemeris, an unknown site: often why it was excluded), each TOA alone, NaN for those it refuses.
 */
function excludedColumns(
  model: TimingModel,
  toas: readonly Toa[],
  phaseOffsetTurns: number,
  paths: readonly ExplorerPartialInfo[],
  observatories: ReadonlyMap<string, Observatory>,
): ExplorerEngineColumns {
  const evaluate = (set: readonly Toa[]) => explorerColumns(model, set, computeArrivalGeometry(set, observatories, {}), phaseOffsetTurns, paths);
  try {
    return evaluate(toas);
  } catch (error) {
    if (!(error instanceof TimingInputError)) throw error;
  }
  const columns = Object.fromEntries(
    EXPLORER_ARRAY_KEYS.map((key) => [key, new Float64Array(toas.length).fill(Number.NaN)]),
  ) as Record<(typeof EXPLORER_ARRAY_KEYS)[number], Float64Array>;
  const partials = paths.map(() => new Float64Array(toas.length).fill(Number.NaN));
  const nearestPulse = new Uint8Array(toas.length).fill(1);
  toas.forEach((toa, i) => {
    let one: ExplorerEngineColumns;
    try {
      one = evaluate([toa]);
    } catch (error) {
      if (error instanceof TimingInputError) return;
      throw error;
    }
    for (const key of EXPLORER_ARRAY_KEYS) columns[key][i] = one[key][0];
    one.partials.forEach((column, j) => { partials[j][i] = column[0]; });
    nearestPulse[i] = one.nearestPulse[0];
  });
  return { count: toas.length, ...columns, nearestPulse, partials };
}

const EXPLORER_ARRAY_KEYS = [
  'residualUs', 'uncertaintyUs', 'barycentricDaysHi', 'barycentricDaysLo', 'clockS', 'ttMinusUtcS', 'tdbMinusTtS',
  'roemerS', 'shapiroS', 'dispersionS', 'backendOffsetS', 'companionsS',
] as const;
