/**
 * Householder QR factorisation of a tall column-major matrix, written for speed.
 *
 * Why our own code: ml-matrix's QrDecomposition works on row-major arrays of
 * row objects and takes ~4.8 s on 100 000 × 30 here (shared/STACK.md §9), ~20×
 * this routine, which walks contiguous Float64Array columns with tight loops
 * (~0.2 s on the same problem; scripts/bench/fit.ts). An unblocked sweep was
 * measured against a row-chunked (cache-blocked) variant; on this machine the
 * two were within noise of each other, so the simpler unblocked form is kept
 * because it also leaves the Householder vectors in place, which lets tests
 * rebuild Q and check Q·R = A.
 *
 * Storage (LAPACK convention): after the call the upper triangle of `a` holds R
 * and the part below the diagonal of column k holds the Householder vector v_k
 * (whose k-th entry is an implicit 1); H_k = I − τ_k v_k v_kᵀ, Q = H_0 H_1 … H_{p−1}.
 *
 * References: Golub & Van Loan, Matrix Computations (4th ed., 2013), §5.1.2–5.1.3
 * (Algorithm 5.1.1, the Householder vector) and §5.2.2 (Algorithm 5.2.1,
 * Householder QR).
 */

/** The factored form of A = Q·R. */
export interface HouseholderQr {
  readonly n: number;
  readonly p: number;
  /** column-major n×p: R on and above the diagonal, Householder vectors below it */
  readonly factored: Float64Array;
  /** p reflector coefficients τ_k (0 for a column with nothing to eliminate) */
  readonly tau: Float64Array;
  /** p×p upper-triangular R, row-major (a copy, convenient for small dense algebra) */
  readonly r: Float64Array;
  /** Qᵀ·rhs, length n, when a right-hand side was given: entries p..n−1 are the residual's components */
  readonly qtRhs?: Float64Array;
}

/**
 * Householder QR of the n×p column-major matrix `a` (n ≥ p), applying the same
 * reflections to `rhs` when given.
 *
 * @param a    column-major n×p (column j at offset j·n); OVERWRITTEN by the factors (Note 1)
 * @param n    rows
 * @param p    columns, 1 ≤ p ≤ n
 * @param rhs  optional right-hand side of length n; OVERWRITTEN by Qᵀ·rhs (Note 1)
 * @returns    the factored form; `r` is a fresh p×p row-major copy of R
 *
 * Notes: 1. In place so that a 100 000 × 30 problem needs no second 24 MB array;
 *           pass a copy if the original is still needed.
 *        2. The reflector sign is chosen as −sign(α) so that α − β never cancels
 *           (Golub & Van Loan §5.1.3); R's diagonal may therefore be negative.
 * Cost: 2np² − 2p³/3 flops. Accuracy: backward stable, ‖A − QR‖ ≈ ε‖A‖ (Golub & Van Loan §5.2.2).
 */
export function householderQr(a: Float64Array, n: number, p: number, rhs?: Float64Array): HouseholderQr {
  if (!(Number.isInteger(n) && Number.isInteger(p) && p >= 1 && n >= p)) {
    throw new RangeError(`householderQr: need integers n ≥ p ≥ 1, got n = ${n}, p = ${p}`);
  }
  if (a.length !== n * p) throw new RangeError(`householderQr: a.length ${a.length} ≠ n·p = ${n * p}`);
  if (rhs && rhs.length !== n) throw new RangeError(`householderQr: rhs.length ${rhs.length} ≠ n = ${n}`);
  const tau = new Float64Array(p);
  for (let k = 0; k < p; k++) {
    tau[k] = makeReflector(a, n, k);
    if (tau[k] === 0) continue;
    for (let j = k + 1; j < p; j++) applyReflector(a, n, k, tau[k], a, j * n);
    if (rhs) applyReflector(a, n, k, tau[k], rhs, 0);
  }
  return { n, p, factored: a, tau, r: upperTriangle(a, n, p), qtRhs: rhs };
}

/**
 * Turns column k (rows k..n−1) into β·e_k and stores v_k below the diagonal.
 * Returns τ_k. Golub & Van Loan Algorithm 5.1.1 (sign choice of Note 2).
 */
function makeReflector(a: Float64Array, n: number, k: number): number {
  const ok = k * n;
  let tailSquares = 0;
  for (let i = k + 1; i < n; i++) tailSquares += a[ok + i] * a[ok + i];
  const alpha = a[ok + k];
  if (tailSquares === 0) return 0; // already upper triangular in this column: H_k = I
  const norm = Math.sqrt(alpha * alpha + tailSquares);
  const beta = alpha >= 0 ? -norm : norm;
  const scale = 1 / (alpha - beta); // v = x − βe_k, normalised so that v_k = 1: Golub & Van Loan §5.1.3
  for (let i = k + 1; i < n; i++) a[ok + i] *= scale;
  a[ok + k] = beta;
  return (beta - alpha) / beta; // τ = 2/(vᵀv) for that normalisation: Golub & Van Loan §5.1.3
}

/**
 * y ← H_k y for the vector y stored at `target[offset .. offset+n)`;
 * H_k = I − τ v vᵀ with v in column k of `a` (implicit 1 at row k).
 */
function applyReflector(a: Float64Array, n: number, k: number, tau: number, target: Float64Array, offset: number): void {
  const ok = k * n;
  let dot = target[offset + k];
  for (let i = k + 1; i < n; i++) dot += a[ok + i] * target[offset + i];
  const s = tau * dot;
  target[offset + k] -= s;
  for (let i = k + 1; i < n; i++) target[offset + i] -= s * a[ok + i];
}

/** The p×p upper triangle of the factored matrix, row-major. */
function upperTriangle(a: Float64Array, n: number, p: number): Float64Array {
  const r = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    for (let i = 0; i <= j; i++) r[i * p + j] = a[j * n + i];
  }
  return r;
}

/**
 * The thin orthogonal factor Q (n×p, column-major, orthonormal columns) with A = Q·R.
 *
 * @param qr  a factorisation from `householderQr`
 * @returns   Q's first p columns, Q = H_0 … H_{p−1} applied to the first p unit vectors
 *
 * Meant for checks and diagnostics (it costs another 2np² flops); the solver
 * never forms Q. Golub & Van Loan §5.1.6 (backward accumulation).
 */
export function thinQ(qr: HouseholderQr): Float64Array {
  const { n, p, factored, tau } = qr;
  const q = new Float64Array(n * p);
  for (let j = 0; j < p; j++) q[j * n + j] = 1;
  for (let k = p - 1; k >= 0; k--) {
    if (tau[k] === 0) continue;
    for (let j = 0; j < p; j++) applyReflector(factored, n, k, tau[k], q, j * n);
  }
  return q;
}
