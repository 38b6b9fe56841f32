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
  /** sqrt(diag(covariance)), in the caller's units */
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
 *           squares on Ã = W^½A, b̃ = W^½ rhs (Golub & Van Loan 2013, §6.1.5).
 *        2. Each column of Ã is then scaled to unit 2-norm (Ã = Â·D). Column
 *           equilibration removes the conditioning that comes only from units
 *           (seconds per Hz against seconds per radian), so the singular values
 *           and the rank test describe real degeneracy (van der Sluis 1969,
 *           Numer. Math. 14, 14; Golub & Van Loan §3.5.2).
 *        3. Householder QR reduces Â to the p×p factor R and Qᵀb̃
 *           (worker/timing/fit/householder-qr.ts); ml-matrix's SVD of R = UΣVᵀ
 *           then gives the singular values of Â, and the solution
 *           y = VΣ⁻¹Uᵀ(Qᵀb̃)_{0..p−1}, x = D⁻¹y; covariance D⁻¹VΣ⁻²VᵀD⁻¹
 *           (Golub & Van Loan §5.3.3 and §5.5.4).
 *        4. Rank tolerance: σ_i ≤ max(n, p)·ε·σ_max (the usual default, e.g.
 *           Golub & Van Loan §5.4.1 and Press et al., Numerical Recipes 3rd ed.,
 *           §2.6). A rank-deficient problem throws TimingInputError naming the
 *           parameters with the largest components of the null singular vectors;
 *           a returned solution therefore always has rank = p.
 *        5. χ² = Σ_{i ≥ p} (Qᵀb̃)_i², summed with Neumaier compensation; exact in
 *           exact arithmetic and free of the cancellation of ‖b̃‖² − ‖Qᵀb̃‖².
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
  const { scaled, columnNorms } = weightedScaledDesign(design, n, p, weights, name);
  const weightedRhs = new Float64Array(n);
  for (let i = 0; i < n; i++) weightedRhs[i] = rhs[i] * weights[i];

  const qr = householderQr(scaled, n, p, weightedRhs);
  const svd = new SingularValueDecomposition(new Matrix(rowsOf(qr.r, p)));
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
    const coefficient = ukb / singularValues[k]; // y = Σ_k v_k (u_kᵀ c)/σ_k: Golub & Van Loan §5.5.4
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
  for (let j = 0; j < p; j++) uncertainties[j] = Math.sqrt(covariance[j * p + j]);

  const chi2 = new NeumaierSum();
  for (let i = p; i < n; i++) chi2.add(qtb[i] * qtb[i]); // Note 5
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
 * Â = W^½ A D⁻¹ with D = diag(column 2-norms of W^½A) (Notes 1–2). The norms are
 * taken as max·‖column/max‖ so that entries near 1e±154 neither overflow nor
 * underflow when squared.
 */
function weightedScaledDesign(
  design: Float64Array,
  n: number,
  p: number,
  weights: Float64Array,
  name: (j: number) => string,
): { scaled: Float64Array; columnNorms: Float64Array } {
  const scaled = new Float64Array(n * p);
  const columnNorms = new Float64Array(p);
  const zeroColumns: number[] = [];
  for (let j = 0; j < p; j++) {
    const o = j * n;
    let maxAbs = 0;
    for (let i = 0; i < n; i++) {
      const x = design[o + i] * weights[i];
      if (!Number.isFinite(x)) {
        throw new TimingInputError(`design column ${name(j)}, row ${i}: must be finite, got ${design[o + i]}`, [
          { row: i, column: name(j), message: 'non-finite derivative' },
        ]);
      }
      scaled[o + i] = x;
      const ax = Math.abs(x);
      if (ax > maxAbs) maxAbs = ax;
    }
    if (maxAbs === 0) {
      zeroColumns.push(j);
      continue;
    }
    const inverseMax = 1 / maxAbs;
    let sumSquares = 0;
    for (let i = 0; i < n; i++) {
      const y = scaled[o + i] * inverseMax;
      sumSquares += y * y;
    }
    const norm = maxAbs * Math.sqrt(sumSquares);
    columnNorms[j] = norm;
    const inverseNorm = 1 / norm;
    for (let i = 0; i < n; i++) scaled[o + i] *= inverseNorm;
  }
  if (zeroColumns.length > 0) {
    const names = zeroColumns.map(name);
    throw new TimingInputError(
      `parameter has no effect on the residuals: ${names.join(', ')}`,
      names.map((column) => ({ column, message: 'design column is identically zero' })),
    );
  }
  return { scaled, columnNorms };
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
