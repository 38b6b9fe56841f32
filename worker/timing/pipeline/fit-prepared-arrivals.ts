/**
 * The timing fit on arrivals whose geometry is already computed: Gauss–Newton
 * over `solve_for` plus the implicit phase offset.
 */
import type { TimingModel } from '../model/timing-model';
import type { Toa } from '../toas/toa';
import type { ArrivalGeometry, EphemerisInfo } from './arrival-geometry';
import type { DoubleDouble } from '../time/epoch';
import { parameterHandle, type ParameterHandle } from '../model/parameter-paths';
import { TimingInputError } from '../engine-error';
import { fitGaussNewton } from '../fit/gauss-newton-fit';
import { effectiveUncertaintiesS, prepareArrivals, type PreparedArrivals } from './prepared-arrivals';
import { computeTimingResiduals, type ResidualOptions, type TimingEvaluation } from './timing-residuals';
import { PHASE_OFFSET_PARAMETER, timingDesignMatrix } from './timing-design-matrix';

export interface TimingFitOptions {
  /** default 20 (fitGaussNewton) */
  maxIterations?: number;
  includeJupiterShapiro?: boolean;
  onIteration?(info: { iteration: number; chi2: number }): void;
}

export interface FittedParameter {
  /** decimal string in the file's notation (sexagesimal for ra/dec) */
  value: string;
  /** 1σ in the unit of the file key (formal, not scaled by √χ²_red) */
  uncertainty: number;
  internalValue: DoubleDouble;
  internalUncertainty: number;
  internalUnit: string;
  fileUnit: string;
}

export interface TimingFitResult {
  model: TimingModel;
  parameters: Record<string, FittedParameter>;
  phaseOffsetTurns: number;
  phaseOffsetUncertaintyTurns: number;
  chi2: number;
  dof: number;
  reducedChi2: number;
  weightedRmsUs: number;
  residuals: { row: number; residualUs: number; uncertaintyUs: number }[];
  iterations: number;
  converged: boolean;
  chi2History: number[];
  correlation: number[][];
  parameterNames: string[];
  conditionNumber: number;
  warnings: string[];
  settings: Record<string, string>;
  ephemeris: EphemerisInfo;
}

/**
 * Checks a fit request before any arithmetic: paths exist, no path twice, every fitted
 * backend offset has TOAs. Throws TimingInputError naming the parameters at fault.
 */
export function checkFitRequest(model: TimingModel, toas: readonly Toa[]): ParameterHandle[] {
  if (toas.length === 0) throw new TimingInputError('no TOAs to fit');
  const seen = new Set<string>();
  const duplicates = model.solveFor.filter((path) => (seen.has(path) ? true : (seen.add(path), false)));
  if (duplicates.length > 0) {
    throw new TimingInputError(`solve_for lists ${duplicates.join(', ')} more than once`, duplicates.map((path) => ({ path, message: 'listed twice' })));
  }
  const handles = model.solveFor.map((path) => parameterHandle(model, path));
  const backendsWithToas = new Set(toas.map((t) => t.backend));
  const idle = model.solveFor.filter((path) => {
    const match = /^offsets\[([^\]]+)\]\.seconds$/.exec(path);
    return match !== null && !backendsWithToas.has(match[1]);
  });
  if (idle.length > 0) {
    throw new TimingInputError(
      `${idle.join(', ')}: no TOAs from ${idle.length === 1 ? 'this backend' : 'these backends'}, so the offset cannot be fitted`,
      idle.map((path) => ({ path, message: 'no TOAs from this backend' })),
    );
  }
  return handles;
}

/**
 * Fits `model.solveFor` and a phase offset to TOAs with a precomputed arrival geometry.
 *
 * @param model     starting model (not modified)
 * @param toas      arrivals, same order as `geometry`
 * @param geometry  computeArrivalGeometry(toas, …), computed once and reused by every iteration
 * @param options   iterations, Jupiter Shapiro delay, progress callback
 * @returns         TimingFitResult: fitted model (a new object), parameters with formal 1σ in file
 *                  units, χ² statistics, residuals (µs) per row, convergence record, warnings
 *
 * Notes: 1. Residual = observed − model, design = ∂residual/∂parameter (timing-design-matrix.ts),
 *           weights 1/σ² with σ the effective uncertainty (prepared-arrivals.ts).
 *        2. The phase offset (turns) is always fitted and reported separately (not a model key).
 *        3. Non-convergence is reported, not thrown: converged = false and a warning with the
 *           last χ² (the command line turns it into an error exit).
 * Throws TimingInputError for unknown or repeated paths, offsets of backends without TOAs, and
 * (from the solver) parameters with no effect or degenerate combinations, naming them.
 */
export function fitPreparedArrivals(model: TimingModel, toas: readonly Toa[], geometry: ArrivalGeometry, options: TimingFitOptions = {}): TimingFitResult {
  const handles = checkFitRequest(model, toas);
  const prepared = prepareArrivals(toas, geometry, model.epochMjd);
  const working = structuredClone(model);
  const sigmasS = effectiveUncertaintiesS(prepared, model.noise);
  const residualOptions: ResidualOptions = { includeJupiterShapiro: options.includeJupiterShapiro };
  const names = [...model.solveFor, PHASE_OFFSET_PARAMETER];
  const outcome = fitGaussNewton({
    parameterNames: names,
    initialValues: [...handles.map((h) => h.get(model)), [0, 0] as DoubleDouble],
    sigmasS,
    maxIterations: options.maxIterations,
    onIteration: options.onIteration,
    evaluate(values, wantDesign) {
      const evaluation = evaluateAt(working, handles, values, prepared, residualOptions);
      if (!wantDesign) return { residualsS: evaluation.residualS };
      return { residualsS: evaluation.residualS, design: timingDesignMatrix(working, prepared, evaluation, model.solveFor, true) };
    },
  });
  const fitted = structuredClone(model);
  handles.forEach((h, j) => h.set(fitted, outcome.values[j]));
  const parameters: Record<string, FittedParameter> = {};
  handles.forEach((h, j) => {
    parameters[h.path] = {
      value: h.formatValue(outcome.values[j]),
      uncertainty: h.toFileUncertainty(outcome.uncertainties[j]),
      internalValue: outcome.values[j],
      internalUncertainty: outcome.uncertainties[j],
      internalUnit: h.internalUnit,
      fileUnit: h.fileUnit,
    };
  });
  const p = handles.length;
  return {
    model: fitted,
    parameters,
    phaseOffsetTurns: outcome.values[p][1] + outcome.values[p][0],
    phaseOffsetUncertaintyTurns: outcome.uncertainties[p],
    chi2: outcome.chi2,
    dof: outcome.dof,
    reducedChi2: outcome.reducedChi2,
    weightedRmsUs: outcome.weightedRmsS * 1e6,
    residuals: toas.map((toa, i) => ({ row: toa.row, residualUs: outcome.residualsS[i] * 1e6, uncertaintyUs: sigmasS[i] * 1e6 })),
    iterations: outcome.iterations,
    converged: outcome.converged,
    chi2History: outcome.chi2History,
    correlation: outcome.correlation,
    parameterNames: names,
    conditionNumber: outcome.conditionNumber,
    warnings: [...geometry.warnings, ...outcome.warnings],
    settings: { ...geometry.settings, jupiter_shapiro: options.includeJupiterShapiro ? 'included' : 'not included', dispersion_constant: '4.148808e3 s MHz^2 per pc cm^-3' },
    ephemeris: geometry.ephemeris,
  };
}

/** Sets the fit values into `working` and evaluates the residuals (phase offset = last value). */
function evaluateAt(
  working: TimingModel,
  handles: readonly ParameterHandle[],
  values: readonly DoubleDouble[],
  prepared: PreparedArrivals,
  options: ResidualOptions,
): TimingEvaluation {
  handles.forEach((h, j) => h.set(working, values[j]));
  const offset = values[handles.length];
  return computeTimingResiduals(working, prepared, { ...options, phaseOffsetTurns: offset[1] + offset[0] });
}
