/**
 * Damped Gauss–Newton fit of model parameters to residuals.
 *
 * Sign convention (used throughout the engine): residual = observed − model,
 * and the design matrix holds ∂residual_i/∂value_j (so a model whose
 * prediction grows with a parameter has a negative design column). Linearising
 * r(x + Δ) ≈ r(x) + A·Δ, the Gauss–Newton step minimises ‖W^½(r + AΔ)‖², i.e.
 * it solves A·Δ ≈ −r in the weighted least-squares sense: Δ = −A⁺r.
 */
import type { DoubleDouble } from '../time/epoch';
import { ddAddNumber } from '../time/double-double-typed';
import { TimingInputError } from '../engine-error';
import { solveWeightedLeastSquares, type LinearSolution } from './weighted-least-squares';
import { chiSquare, correlationFromCovariance, reducedChiSquare, weightedRms } from './fit-statistics';

/** What the model returns for one set of parameter values. */
export interface FitEvaluation {
  /** n residuals, observed − model, seconds */
  residualsS: Float64Array;
  /** column-major n×p, ∂residual_i/∂value_j in seconds per parameter unit; required when asked for */
  design?: Float64Array;
}

/** A non-linear weighted least-squares problem. */
export interface FitProblem {
  parameterNames: string[];
  /** parameters may need > float64 precision (a spin frequency): values are double-double, steps are float64 */
  initialValues: DoubleDouble[];
  /** effective uncertainties (s), fixed during the fit */
  sigmasS: Float64Array;
  evaluate(values: DoubleDouble[], wantDesign: boolean): FitEvaluation;
  /** default 20 */
  maxIterations?: number;
  /** for progress reporting; called once per accepted step */
  onIteration?(info: { iteration: number; chi2: number }): void;
}

/** The result of a fit; soft problems are listed in `warnings`, never hidden. */
export interface FitOutcome {
  values: DoubleDouble[];
  /** formal 1σ, from sigmasS (not rescaled by the reduced χ²), parameter units */
  uncertainties: number[];
  /** p×p, parameter units squared */
  covariance: number[][];
  correlation: number[][];
  chi2: number;
  /** n − p */
  dof: number;
  reducedChi2: number;
  /** sqrt(Σ r²/σ² / Σ 1/σ²), seconds */
  weightedRmsS: number;
  /** number of Gauss–Newton steps computed */
  iterations: number;
  converged: boolean;
  /** χ² at the initial values, then after every accepted step */
  chi2History: number[];
  /** of the column-scaled weighted design at the last linearisation point, descending */
  singularValues: number[];
  conditionNumber: number;
  /** final residuals, seconds */
  residualsS: Float64Array;
  warnings: string[];
}

const DEFAULT_MAX_ITERATIONS = 20;
/** Converged when every |Δ_j| < this fraction of σ_j (Note 2). */
const STEP_TOLERANCE_IN_SIGMAS = 1e-3;
/** … or when a full step changes χ² by less than this fraction (Note 2). */
const CHI2_RELATIVE_TOLERANCE = 1e-9;
/** A trial step is accepted if χ² rises by no more than this fraction (rounding noise). */
const CHI2_ROUNDING_SLACK = 1e-12;
/** At most this many step halvings per iteration (Note 3). */
const MAX_STEP_HALVINGS = 10;
/** Above this (column-scaled) condition number a warning is added (Note 4). */
const CONDITION_WARNING_LEVEL = 1e10;

/**
 * Fits the parameters of `problem` by damped Gauss–Newton iteration.
 *
 * @param problem  names, double-double initial values, fixed sigmas (s) and the model (FitProblem)
 * @returns        fitted values, formal uncertainties, covariance, χ² statistics,
 *                 convergence record and final residuals (FitOutcome)
 *
 * Notes: 1. Each iteration evaluates the residuals r and design A at the current
 *           values, solves A·Δ ≈ −r with weights 1/σ² (module header;
 *           worker/timing/fit/weighted-least-squares.ts), and adds the float64
 *           step to each double-double value (double-double's ddAddDouble,
 *           through ddAddNumber of time/double-double-typed.ts), so a 716 Hz spin
 *           frequency keeps its ~30 digits while the step carries only its own.
 *        2. Convergence rule: the fit has converged when, at the current values,
 *           every |Δ_j| < 1e-3·σ_j (σ_j the formal uncertainty), or when a full
 *           (undamped) step changes χ² by less than 1e-9 of χ². The small step
 *           is still applied, so the reported values are the minimum to well
 *           under 1e-3σ; the covariance is that of the last linearisation.
 *        3. Damping: if χ² rises, the step is halved, up to 10 times, before it
 *           is accepted (step halving, the simplest backtracking line search:
 *           Nocedal & Wright, Numerical Optimization, 2nd ed. 2006, §3.1 and
 *           §10.3). A trial with non-finite χ² counts as a rise. If no halving
 *           lowers χ², the fit stops: converged if the step was already below
 *           the tolerance of Note 2 or the linearisation predicts a χ² gain below
 *           1e-9 of χ² (a large-χ² minimum, where the gain is under χ²'s own
 *           rounding), otherwise converged = false with a warning.
 *        4. Non-convergence after maxIterations returns converged = false and a
 *           warning holding the last χ². A condition number above 1e10 (after
 *           column scaling) adds a warning that the uncertainties are fragile.
 *        5. The full design is requested only for trial steps that may need a
 *           next iteration; a step already below tolerance is evaluated with
 *           wantDesign = false.
 * Throws: TimingInputError for degenerate or zero-effect parameters (from the
 *   linear solver), non-finite initial χ² or inconsistent array sizes.
 * References: Nocedal & Wright 2006, §10.3 (Gauss–Newton); Björck, Numerical
 *   Methods for Least Squares Problems (1996), Ch. 9.
 */
export function fitGaussNewton(problem: FitProblem): FitOutcome {
  const names = problem.parameterNames;
  const p = names.length;
  const sigmas = problem.sigmasS;
  const n = sigmas.length;
  const maxIterations = problem.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  checkProblem(problem, p, maxIterations);

  let values: DoubleDouble[] = problem.initialValues.map((v) => [v[0], v[1]]);
  let current = evaluateChecked(problem, values, true, n, p);
  let chi2 = chiSquare(current.residualsS, sigmas);
  if (!Number.isFinite(chi2)) throw new TimingInputError(`χ² at the initial parameter values is not finite (${chi2})`);
  let design = current.design!;
  const chi2History = [chi2];
  const warnings: string[] = [];
  let converged = false;
  let stopped = false;
  let iterations = 0;
  let linear: LinearSolution | undefined;

  while (iterations < maxIterations && !converged && !stopped) {
    iterations++;
    const negativeResiduals = current.residualsS.map((r) => -r);
    linear = solveWeightedLeastSquares(design, n, p, negativeResiduals, sigmas, names); // Δ = −A⁺r (module header)
    const step = linear.solution;
    const stepIsSmall = step.every((d, j) => Math.abs(d) < STEP_TOLERANCE_IN_SIGMAS * linear!.uncertainties[j]);

    const trial = dampedStep(problem, values, step, chi2, stepIsSmall, n, p);
    if (!trial) {
      // At a minimum with a large χ² the remaining step can be worth less than the rounding of χ² itself:
      // the linear model's predicted gain (χ² − linear.chi2) below the tolerance of Note 2 means converged.
      const predictedGainIsNegligible = chi2 - linear.chi2 <= CHI2_RELATIVE_TOLERANCE * chi2;
      if (stepIsSmall || predictedGainIsNegligible) converged = true;
      else {
        warnings.push(
          `χ² could not be lowered along the Gauss–Newton step even after ${MAX_STEP_HALVINGS} halvings ` +
            `(iteration ${iterations}); stopped with χ² = ${chi2}`,
        );
        stopped = true;
      }
      break;
    }
    const previousChi2 = chi2;
    values = trial.values;
    current = trial.evaluation;
    chi2 = trial.chi2;
    chi2History.push(chi2);
    problem.onIteration?.({ iteration: iterations, chi2 });
    const chi2Settled = trial.factor === 1 && previousChi2 - chi2 <= CHI2_RELATIVE_TOLERANCE * previousChi2;
    if (stepIsSmall || chi2Settled) {
      converged = true;
      break;
    }
    design = current.design ?? evaluateChecked(problem, values, true, n, p).design!;
  }
  if (!converged && !stopped) {
    warnings.push(`did not converge within ${maxIterations} iterations; last χ² = ${chi2}`);
  }
  return buildOutcome(values, current.residualsS, sigmas, chi2, chi2History, linear!, iterations, converged, warnings);
}

interface AcceptedStep {
  values: DoubleDouble[];
  evaluation: FitEvaluation;
  chi2: number;
  factor: number;
}

/** Tries value + factor·step for factor = 1, ½, ¼, … (Note 3); undefined if none lowers χ². */
function dampedStep(
  problem: FitProblem,
  values: DoubleDouble[],
  step: Float64Array,
  chi2: number,
  stepIsSmall: boolean,
  n: number,
  p: number,
): AcceptedStep | undefined {
  let factor = 1;
  for (let halving = 0; halving <= MAX_STEP_HALVINGS; halving++) {
    const trialValues = values.map((v, j) => ddAddNumber(v, factor * step[j])); // double-double + float64 step (Note 1)
    const wantDesign = !stepIsSmall && halving === 0; // Note 5
    const evaluation = evaluateChecked(problem, trialValues, wantDesign, n, p);
    const trialChi2 = chiSquare(evaluation.residualsS, problem.sigmasS);
    if (trialChi2 <= chi2 * (1 + CHI2_ROUNDING_SLACK)) return { values: trialValues, evaluation, chi2: trialChi2, factor };
    factor /= 2;
  }
  return undefined;
}

function checkProblem(problem: FitProblem, p: number, maxIterations: number): void {
  if (p === 0) throw new RangeError('fitGaussNewton: parameterNames is empty; nothing to fit');
  if (problem.initialValues.length !== p) {
    throw new RangeError(`fitGaussNewton: ${problem.initialValues.length} initial values for ${p} parameters`);
  }
  problem.initialValues.forEach((v, j) => {
    if (!(Number.isFinite(v[0]) && Number.isFinite(v[1]))) {
      throw new TimingInputError(`initial value of ${problem.parameterNames[j]}: must be finite, got [${v[0]}, ${v[1]}]`);
    }
  });
  if (!(Number.isInteger(maxIterations) && maxIterations >= 1)) {
    throw new RangeError(`fitGaussNewton: maxIterations must be an integer ≥ 1, got ${maxIterations}`);
  }
}

/** Calls the model and checks the sizes of what it returns. */
function evaluateChecked(problem: FitProblem, values: DoubleDouble[], wantDesign: boolean, n: number, p: number): FitEvaluation {
  const evaluation = problem.evaluate(values, wantDesign);
  if (evaluation.residualsS.length !== n) {
    throw new RangeError(`fitGaussNewton: evaluate returned ${evaluation.residualsS.length} residuals for ${n} sigmas`);
  }
  if (wantDesign && evaluation.design?.length !== n * p) {
    throw new RangeError(
      `fitGaussNewton: evaluate must return a column-major ${n}×${p} design when asked, got length ${evaluation.design?.length}`,
    );
  }
  return evaluation;
}

function buildOutcome(
  values: DoubleDouble[],
  residualsS: Float64Array,
  sigmas: Float64Array,
  chi2: number,
  chi2History: number[],
  linear: LinearSolution,
  iterations: number,
  converged: boolean,
  warnings: string[],
): FitOutcome {
  const p = values.length;
  const n = residualsS.length;
  if (linear.conditionNumber > CONDITION_WARNING_LEVEL) {
    warnings.push(
      `design is ill-conditioned (condition number ${linear.conditionNumber.toExponential(2)} after column scaling): ` +
        'some parameters are nearly degenerate and their uncertainties are fragile',
    );
  }
  const covariance = Array.from({ length: p }, (_, j) => Array.from(linear.covariance.subarray(j * p, (j + 1) * p)));
  return {
    values,
    uncertainties: Array.from(linear.uncertainties),
    covariance,
    correlation: correlationFromCovariance(linear.covariance, p),
    chi2,
    dof: n - p,
    reducedChi2: reducedChiSquare(chi2, n - p),
    weightedRmsS: weightedRms(residualsS, sigmas),
    iterations,
    converged,
    chi2History,
    singularValues: Array.from(linear.singularValues),
    conditionNumber: linear.conditionNumber,
    residualsS,
    warnings,
  };
}
