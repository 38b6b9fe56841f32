/**
 * Weighted linear least squares through column scaling, Householder QR and an
 * SVD of the small triangular factor.
 */
import { Matrix, SingularValueDecomposition } from 'ml-matrix';
import { TimingInputError } from '../engine-error';
import { householderQr } from './householder-qr';
import { NeumaierSum } from './neumaier-sum';

/** The solution of a weighted linear least-squares problem and its diagnostics. */
export interface LinearSolution {
  /** p, in the caller's units */
  solution: Float64Array;
  /** p×p row-major, (AᵀWA)⁻¹ in the caller's units */
  covariance: Float64Array;
  /** sqrt(diag(covariance)), in the caller's units (Note 6) */
  uncertainties: Float64Array;
  /** of the column-scaled weighted design, descending */
  singularValues: Float64Array;
  /** largest / smallest singular value of the column-scaled weighted design */
  conditionNumber: number;
  /** numerical rank: singular values above max(n, p)·ε·σ_max (Note 4 of solveWeightedLeastSquares) */
  rank: number;
  /** Σ ((rhs_i − (A·solution)_i)/σ_i)² at the solution, from the QR (Note 5) */
  chi2: number;
}

/** Relative singular-value tolerance factor: σ_i ≤ max(n, p)·ε·σ_max counts as zero (Note 4). */
const RANK_TOLERANCE_EPSILONS = Number.EPSILON;

/** A null-space component at least this fraction of the largest one names its parameter. */
const DEGENERACY_COMPONENT_FRACTION = 0.25;

/**
 * Minimises Σ_i ((rhs_i − Σ_j A_ij x_j)/σ_i)² over x.
 *
 * @param design          column-major n×p (column j at offset j·n), A_ij in rhs units per unit of x_j; not modified
 * @param n               rows (data), n ≥ p
 * @param p               columns (parameters), p ≥ 1
 * @param rhs             n values, rhs units
 * @param sigmas          n one-sigma uncertainties of rhs, rhs units, finite and > 0
 * @param parameterNames  optional p names used in error messages (default "parameter j")
 * @returns               the solution with covariance and conditioning diagnostics
 *
 * Notes: 1. Rows are divided by σ_i, so the problem becomes ordinary least
 *           squares on Ã = W^½A, b̃ = W^½ rhs (Golub & Van Loan 2013, §6.1, row weighting).
 *        2. Each column of Ã is scaled to unit 2-norm (Ã = Â·D; applied to R after
 *           the QR, see equilibratedR). Column
 *           equilibration removes the conditioning that comes only from units
 *           (seconds per Hz against seconds per radian), so the singular values
 *           and the rank test describe real degeneracy (van der Sluis 1969,
 *           Numer. Math. 14, 14; Golub & Van Loan §3.5, scaling).
 *        3. Householder QR reduces Ã to the p×p factor R and Qᵀb̃
 *           (worker/timing/fit/householder-qr.ts); ml-matrix's SVD of R = UΣVᵀ
 *           then gives the singular values of Â, and the solution
 *           y = VΣ⁻¹Uᵀ(Qᵀb̃)_{0..p−1}, x = D⁻¹y; covariance D⁻¹VΣ⁻²VᵀD⁻¹
 *           (Golub & Van Loan §5.3 and §5.5: the SVD solution of least squares).
 *        4. Rank tolerance: σ_i ≤ max(n, p)·ε·σ_max (the usual default, e.g.
 *           Golub & Van Loan §5.4 and §5.5, and Press et al., Numerical Recipes 3rd ed.,
 *           §2.6). A rank-deficient problem throws TimingInputError naming the
 *           parameters with the largest components of the null singular vectors;
 *           a returned solution therefore always has rank = p.
 *        5. χ² = the sum of squares of the components of Qᵀb̃ beyond the first p
 *           (householder-qr.ts: residualComponents), summed with Neumaier
 *           compensation; exact in exact arithmetic and free of the
 *           cancellation of ‖b̃‖² − ‖(Qᵀb̃)_{0..p−1}‖².
 *        6. Covariance entries are products of two parameters' units; for a
 *           parameter whose natural size is beyond ~1e±154 they can under- or
 *           overflow even though the uncertainties (computed separately) do not.
 * Throws: TimingInputError for an all-zero column ("parameter has no effect on
 *   the residuals: <name>"), degenerate columns, non-finite data, σ ≤ 0 or n < p;
 *   RangeError for array lengths that do not match n and p.
 * Accuracy: backward stable; the solution's relative error is ≈ κ·ε with κ the
 *   (scaled) condition number. Agrees with ml-matrix's QR to 1e-10 on a
 *   well-conditioned problem and reproduces NIST's Wampler1/2 certified values
 *   (tests/engine/fit).
 * Cost: 2np² flops for the QR plus O(np) for the scaling; O(p³) for the SVD.
 */
export function solveWeightedLeastSquares(
  design: Float64Array,
  n: number,
  p: number,
  rhs: Float64Array,
  sigmas: Float64Array,
  parameterNames?: string[],
): LinearSolution {
  checkShapes(design, n, p, rhs, sigmas, parameterNames);
  const name = (j: number): string => parameterNames?.[j] ?? `parameter ${j}`;
  if (n < p) throw new TimingInputError(`fewer data (${n}) than parameters (${p}): the fit is underdetermined`);
  const weights = rowWeights(sigmas, rhs);
  const { weighted, powerOfTwoScales } = weightedDesign(design, n, p, weights, name);
  const weightedRhs = new Float64Array(n);
  for (let i = 0; i < n; i++) weightedRhs[i] = rhs[i] * weights[i];

  const qr = householderQr(weighted, n, p, weightedRhs);
  const { scaledR, columnNorms } = equilibratedR(qr.r, p, powerOfTwoScales);
  const svd = new SingularValueDecomposition(new Matrix(rowsOf(scaledR, p)));
  const singularValues = Float64Array.from(svd.diagonal);
  const u = svd.leftSingularVectors;
  const v = svd.rightSingularVectors;
  const tolerance = Math.max(n, p) * RANK_TOLERANCE_EPSILONS * singularValues[0];
  let rank = 0;
  while (rank < p && singularValues[rank] > tolerance) rank++;
  if (rank < p) throwDegenerate(v, singularValues, rank, p, name);

  const qtb = qr.qtRhs!;
  const scaledSolution = new Float64Array(p);
  for (let k = 0; k < p; k++) {
    let ukb = 0;
    for (let i = 0; i < p; i++) ukb += u.get(i, k) * qtb[i];
    const coefficient = ukb / singularValues[k]; // y = Σ_k v_k (u_kᵀ c)/σ_k: Golub & Van Loan §5.5
    for (let j = 0; j < p; j++) scaledSolution[j] += v.get(j, k) * coefficient;
  }
  const solution = new Float64Array(p);
  for (let j = 0; j < p; j++) solution[j] = scaledSolution[j] / columnNorms[j]; // x = D⁻¹y (Note 2)

  const covariance = new Float64Array(p * p);
  for (let a = 0; a < p; a++) {
    for (let b = a; b < p; b++) {
      let c = 0;
      for (let k = 0; k < p; k++) c += (v.get(a, k) * v.get(b, k)) / (singularValues[k] * singularValues[k]);
      c /= columnNorms[a] * columnNorms[b]; // (AᵀWA)⁻¹ = D⁻¹ V Σ⁻² Vᵀ D⁻¹ (Note 3)
      covariance[a * p + b] = c;
      covariance[b * p + a] = c;
    }
  }
  const uncertainties = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    // sqrt(C_jj) formed before unscaling, so it survives where C_jj itself would under/overflow (Note 6).
    let scaledVariance = 0;
    for (let k = 0; k < p; k++) scaledVariance += (v.get(j, k) / singularValues[k]) ** 2;
    uncertainties[j] = Math.sqrt(scaledVariance) / columnNorms[j];
  }

  const chi2 = new NeumaierSum();
  const tail = qr.residualComponents!;
  for (let i = 0; i < n; i++) chi2.add(tail[i] * tail[i]); // Note 5
  return {
    solution,
    covariance,
    uncertainties,
    singularValues,
    conditionNumber: singularValues[0] / singularValues[p - 1],
    rank,
    chi2: chi2.value,
  };
}

function checkShapes(
  design: Float64Array,
  n: number,
  p: number,
  rhs: Float64Array,
  sigmas: Float64Array,
  parameterNames: string[] | undefined,
): void {
  if (!(Number.isInteger(n) && n >= 0 && Number.isInteger(p) && p >= 1)) {
    throw new RangeError(`solveWeightedLeastSquares: need integers n ≥ 0 and p ≥ 1, got n = ${n}, p = ${p}`);
  }
  if (design.length !== n * p) throw new RangeError(`solveWeightedLeastSquares: design.length ${design.length} ≠ n·p = ${n * p}`);
  if (rhs.length !== n) throw new RangeError(`solveWeightedLeastSquares: rhs.length ${rhs.length} ≠ n = ${n}`);
  if (sigmas.length !== n) throw new RangeError(`solveWeightedLeastSquares: sigmas.length ${sigmas.length} ≠ n = ${n}`);
  if (parameterNames && parameterNames.length !== p) {
    throw new RangeError(`solveWeightedLeastSquares: parameterNames.length ${parameterNames.length} ≠ p = ${p}`);
  }
}

/** 1/σ_i, after checking every σ_i and rhs_i. */
function rowWeights(sigmas: Float64Array, rhs: Float64Array): Float64Array {
  const weights = new Float64Array(sigmas.length);
  for (let i = 0; i < sigmas.length; i++) {
    const s = sigmas[i];
    if (!(Number.isFinite(s) && s > 0)) throw new TimingInputError(`sigmas[${i}]: must be finite and > 0, got ${s}`);
    if (!Number.isFinite(rhs[i])) throw new TimingInputError(`residual ${i}: must be finite, got ${rhs[i]}`);
    weights[i] = 1 / s;
  }
  return weights;
}

/**
 * W^½A (Note 1), with a column multiplied by an exact power of two when its
 * largest entry lies outside [2⁻⁵⁰⁰, 2⁵⁰⁰], so the QR's sums of squares can
 * neither overflow nor underflow. Checks for non-finite and all-zero columns.
 */
function weightedDesign(
  design: Float64Array,
  n: number,
  p: number,
  weights: Float64Array,
  name: (j: number) => string,
): { weighted: Float64Array; powerOfTwoScales: Float64Array } {
  const weighted = new Float64Array(n * p);
  const powerOfTwoScales = new Float64Array(p).fill(1);
  const zeroColumns: number[] = [];
  for (let j = 0; j < p; j++) {
    const o = j * n;
    let maxAbs = 0;
    let finiteCheck = 0;
    for (let i = 0; i < n; i++) {
      const x = design[o + i] * weights[i];
      weighted[o + i] = x;
      finiteCheck += x * 0; // stays 0 unless some x is ±∞ or NaN
      const ax = Math.abs(x);
      if (ax > maxAbs) maxAbs = ax;
    }
    if (finiteCheck !== 0) throwNonFinite(design, weighted, o, n, j, name);
    if (maxAbs === 0) {
      zeroColumns.push(j);
      continue;
    }
    if (maxAbs > 2 ** 500 || maxAbs < 2 ** -500) {
      const scale = 2 ** -Math.round(Math.log2(maxAbs)); // exact: no rounding is introduced
      powerOfTwoScales[j] = scale;
      for (let i = 0; i < n; i++) weighted[o + i] *= scale;
    }
  }
  if (zeroColumns.length > 0) {
    const names = zeroColumns.map(name);
    throw new TimingInputError(
      `parameter has no effect on the residuals: ${names.join(', ')}`,
      names.map((column) => ({ column, message: 'design column is identically zero' })),
    );
  }
  return { weighted, powerOfTwoScales };
}

function throwNonFinite(
  design: Float64Array,
  weighted: Float64Array,
  offset: number,
  n: number,
  j: number,
  name: (j: number) => string,
): never {
  let row = 0;
  while (row < n - 1 && Number.isFinite(weighted[offset + row])) row++;
  throw new TimingInputError(`design column ${name(j)}, row ${row}: must be finite, got ${design[offset + row]}`, [
    { row, column: name(j), message: 'non-finite derivative' },
  ]);
}

/**
 * R·D⁻¹ with D = diag(‖column j of W^½A‖), the column norms being read off R
 * (Q is orthogonal, so ‖A_j‖ = ‖R_j‖). Scaling R's columns after the QR equals
 * a QR of the scaled matrix, because Householder QR's backward error is
 * column-wise (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed.
 * 2002, Ch. 19), so Note 2's equilibration costs no pass over the n rows.
 * Returned norms are in the caller's units (the power-of-two scales undone).
 */
function equilibratedR(
  r: Float64Array,
  p: number,
  powerOfTwoScales: Float64Array,
): { scaledR: Float64Array; columnNorms: Float64Array } {
  const scaledR = new Float64Array(p * p);
  const columnNorms = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    let sumSquares = 0;
    for (let i = 0; i <= j; i++) sumSquares += r[i * p + j] * r[i * p + j];
    const norm = Math.sqrt(sumSquares);
    for (let i = 0; i <= j; i++) scaledR[i * p + j] = r[i * p + j] / norm;
    columnNorms[j] = norm / powerOfTwoScales[j];
  }
  return { scaledR, columnNorms };
}

/** Row-major p×p Float64Array → array of rows for ml-matrix. */
function rowsOf(r: Float64Array, p: number): number[][] {
  const rows: number[][] = [];
  for (let i = 0; i < p; i++) rows.push(Array.from(r.subarray(i * p, (i + 1) * p)));
  return rows;
}

/** Throws the degeneracy error, naming the parameters that dominate each null singular vector (Note 4). */
function throwDegenerate(
  v: Matrix,
  singularValues: Float64Array,
  rank: number,
  p: number,
  name: (j: number) => string,
): never {
  const involved = new Set<number>();
  for (let k = rank; k < p; k++) {
    let largest = 0;
    for (let j = 0; j < p; j++) largest = Math.max(largest, Math.abs(v.get(j, k)));
    for (let j = 0; j < p; j++) {
      if (Math.abs(v.get(j, k)) >= DEGENERACY_COMPONENT_FRACTION * largest) involved.add(j);
    }
  }
  const names = [...involved].sort((a, b) => a - b).map(name);
  const smallest = singularValues[p - 1] / singularValues[0];
  throw new TimingInputError(
    `parameters are degenerate (cannot be told apart): ${names.join(', ')}`,
    names.map((column) => ({
      column,
      message: `in a combination with relative singular value ${smallest.toExponential(2)}`,
    })),
  );
}
