/**
 * The engine call of a fit run, as plain data in and out (so it can run in a
 * worker thread): the same steps as fitTimingModel (check the request, arrival
 * geometry once, Gauss–Newton fit), with a stage report between them, and the
 * result shaped as the fit run stores it.
 */
import type { FitParameterResult, FitResult } from '../../api/contracts/fit-runs';
import type { Observatory } from '../timing/earth/observatory';
import { parameterHandle } from '../timing/model/parameter-paths';
import { readModelFile } from '../timing/model/read-model-file';
import { writeModelFile } from '../timing/model/write-model-file';
import { computeArrivalGeometry } from '../timing/pipeline/compute-arrival-geometry';
import { checkFitRequest, fitPreparedArrivals } from '../timing/pipeline/fit-prepared-arrivals';
import type { DoubleDouble } from '../timing/time/epoch';
import type { Toa } from '../timing/toas/toa';

export interface FitEngineInput {
  modelJson: Record<string, unknown>; // the revision's model file JSON
  toas: Toa[];
  observatories: Observatory[];
  maxIterations?: number;
}

/** The stored fit result (api/contracts/fit-runs.ts) plus the per-TOA arrays the run keeps apart. */
export interface FitEngineOutput extends FitResult {
  residualUs: Float64Array; // same order as the input TOAs
  uncertaintyUs: Float64Array; // effective uncertainty used by the fit
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
  };
}
