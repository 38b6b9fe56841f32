/**
 * The parameter table of a comparison: the union of the runs' free parameters,
 * each run's value ± uncertainty, and each run's difference from the reference
 * run (runs[0]) in the file unit and in units of the combined uncertainty.
 * Values are read from the fitted models with the engine's parameter handles,
 * so differences keep the double-double digits of epochs and frequencies.
 */
import type { ComparedParameter, ComparedValue } from '../../contracts/comparisons';
import type { FitResult } from '../../contracts/fit-runs';
import { allParameterPaths, parameterHandle, parameterPathProblem } from '../../../worker/timing/model/parameter-paths';
import { readModelFile } from '../../../worker/timing/model/read-model-file';
import type { TimingModel } from '../../../worker/timing/model/timing-model';
import type { DoubleDouble } from '../../../worker/timing/time/epoch';

const RA_PATH = 'astrometry.ra_hms';

/** a − b for two values of similar size: high parts first, then the low parts. */
const ddMinus = (a: DoubleDouble, b: DoubleDouble): number => a[1] - b[1] + (a[0] - b[0]);

/** An angle difference folded into (−π, π], so RA 23h59m vs 0h01m differs by 2 min, not 23h58m. */
function foldAngleRad(x: number): number {
  const twoPi = 2 * Math.PI;
  const folded = x - twoPi * Math.round(x / twoPi);
  return folded === -Math.PI ? Math.PI : folded;
}

/** The fitted model of each run (the engine's reader; a stored fitted model always reads back). */
export function fittedModels(results: readonly FitResult[]): TimingModel[] {
  return results.map((r) => readModelFile(r.fittedModel));
}

/** The union of the runs' free parameter paths: each run's in model file order, new ones appended. */
export function unionOfFreePaths(results: readonly FitResult[], models: readonly TimingModel[]): string[] {
  const union: string[] = [];
  results.forEach((result, i) => {
    for (const path of allParameterPaths(models[i])) if (path in result.parameters && !union.includes(path)) union.push(path);
    for (const path of Object.keys(result.parameters)) if (!union.includes(path)) union.push(path); // paths the model lister does not know
  });
  return union;
}

interface RunValue {
  value: string;
  uncertainty: number | null;
  free: boolean;
  /** the value in the handle's internal unit, and the handle's converter to the file unit */
  internal: DoubleDouble;
  toFileUnit: (internal: number) => number;
}

function runValue(result: FitResult, model: TimingModel, path: string): RunValue | null {
  if (parameterPathProblem(model, path) !== null) return null;
  const handle = parameterHandle(model, path);
  const fitted = result.parameters[path];
  return {
    value: fitted ? fitted.value : handle.formatValue(handle.get(model)),
    uncertainty: fitted ? fitted.uncertainty : null,
    free: fitted !== undefined,
    internal: handle.get(model),
    toFileUnit: (x) => handle.toFileUncertainty(x), // a linear scale, so it converts differences too
  };
}

function unitOf(results: readonly FitResult[], models: readonly TimingModel[], path: string): string {
  for (const r of results) if (r.parameters[path]) return r.parameters[path].unit;
  for (const m of models) if (parameterPathProblem(m, path) === null) return parameterHandle(m, path).fileUnit;
  return '';
}

/**
 * @param results  the runs' stored fit results, reference first
 * @returns        one row per free parameter of any run; `values[i] === null` when run i's model lacks it
 */
export function compareParameters(results: readonly FitResult[], models: readonly TimingModel[] = fittedModels(results)): ComparedParameter[] {
  return unionOfFreePaths(results, models).map((path) => {
    const values = results.map((r, i) => runValue(r, models[i], path));
    const reference = values[0];
    return {
      path,
      unit: unitOf(results, models, path),
      values: values.map((v, i): ComparedValue | null => {
        if (v === null) return null;
        const base = { value: v.value, uncertainty: v.uncertainty, free: v.free };
        if (i === 0 || reference === null) return { ...base, difference: null, differenceSigma: null };
        let internal = ddMinus(v.internal, reference.internal);
        if (path === RA_PATH) internal = foldAngleRad(internal);
        const difference = v.toFileUnit(internal);
        // Significance of a difference of two independent estimates: Δ/√(σ1² + σ2²) (common practice); a fixed value has σ = 0.
        const combined = Math.hypot(v.uncertainty ?? 0, reference.uncertainty ?? 0);
        return { ...base, difference, differenceSigma: combined > 0 ? difference / combined : null };
      }),
    };
  });
}
