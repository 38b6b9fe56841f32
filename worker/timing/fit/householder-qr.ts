/**
 * Householder QR factorisation of a tall column-major matrix, written for speed.
 *
 * Why our own code: ml-matrix's QrDecomposition works on row-major arrays of
 * row objects and takes ~4.8 s on 100 000 × 30 here (shared/STACK.md §9),
 * roughly 10× this routine, which walks contiguous Float64Array column
 * segments with tight loops (scripts/bench/fit.ts prints both).
 *
 * Method: the rows are taken in chunks of CHUNK_ROWS (cache blocking). The
 * running p×p factor R is stacked on each new chunk, [R; A_c], and that
 * (p + m)×p matrix is reduced by p Householder reflections back to [R'; 0]
 * (sequential "tall-skinny" QR: Demmel, Grigori, Hoemmen & Langou 2012, SIAM J.
 * Sci. Comput. 34, A206; appending rows to a QR factorisation: Golub & Van
 * Loan §6.5). The flop count equals that of one unblocked sweep, but each chunk (~60 kB) stays
 * in cache for all p columns, where an unblocked sweep streams the whole 24 MB
 * matrix through memory p times. Both were measured in interleaved runs on
 * this shared, loaded 2-core machine: the chunked form was faster on average
 * (about 1.3×; single pairs ranged from 0.8× to 2.3×), and it leans less on
 * memory bandwidth that other processes compete for.
 *
 * Storage after the call: `r` holds R (row-major p×p). Below the R rows, the
 * chunk's part of each Householder vector overwrites column k of `a` in that
 * chunk (its R-row component is an implicit 1 at row k; its other R-row
 * components are zero because R is triangular), and `tau[c·p + k]` is its
 * coefficient: H = I − τ v vᵀ. `thinQ` rebuilds Q from these for checks.
 *
 * References: Golub & Van Loan, Matrix Computations (4th ed., 2013), §5.1
 * (Householder reflections; Algorithm 5.1.1, the Householder vector), §5.2
 * (Algorithm 5.2.1, Householder QR), §6.5 (updating: appending rows).
 */

/** Rows per chunk: 256 rows × 30 columns × 8 B ≈ 60 kB stays in L2 (Note 3 of householderQr). */
const CHUNK_ROWS = 256;

/** The factored form of A = Q·R (module header: storage). */
export interface HouseholderQr {
  readonly n: number;
  readonly p: number;
  readonly chunkRows: number;
  /** column-major n×p: the chunk parts of the Householder vectors (module header) */
  readonly factored: Float64Array;
  /** ceil(n / chunkRows)·p reflector coefficients, chunk-major; 0 where nothing was eliminated */
  readonly tau: Float64Array;
  /** p×p upper-triangular R, row-major */
  readonly r: Float64Array;
  /** the first p entries of Qᵀ·rhs, when a right-hand side was given */
  readonly qtRhs?: Float64Array;
  /**
   * the given rhs array, overwritten by the remaining n components of Qᵀ·rhs:
   * their sum of squares is the least-squares residual norm² min‖A x − rhs‖²
   */
  readonly residualComponents?: Float64Array;
}

/**
 * Householder QR of the n×p column-major matrix `a` (n ≥ p), applying the same
 * reflections to `rhs` when given.
 *
 * @param a    column-major n×p (column j at offset j·n); OVERWRITTEN by the reflectors (Note 1)
 * @param n    rows
 * @param p    columns, 1 ≤ p ≤ n
 * @param rhs  optional right-hand side of length n; OVERWRITTEN (Note 1, HouseholderQr.residualComponents)
 * @returns    the factored form with R (row-major p×p) and Qᵀ·rhs
 *
 * Notes: 1. In place so that a 100 000 × 30 problem needs no second 24 MB array;
 *           pass a copy if the original is still needed.
 *        2. The reflector sign is chosen as −sign(α) so that α − β never cancels
 *           (Golub & Van Loan §5.1); R's diagonal may therefore be negative.
 *        3. Chunking changes the order of operations, not the algorithm: the
 *           result is a Householder QR with the same backward stability.
 *        4. No overflow protection inside: entries of `a` must stay below ~1e150
 *           in magnitude (weighted-least-squares.ts pre-scales by powers of two).
 * Cost: 2np² flops (+ p³ per chunk). Accuracy: backward stable, ‖A − QR‖ ≈ ε‖A‖
 *   column by column (Golub & Van Loan §5.2; Higham, Accuracy and Stability of
 *   Numerical Algorithms, 2nd ed. 2002, Ch. 19).
 */
export function householderQr(a: Float64Array, n: number, p: number, rhs?: Float64Array): HouseholderQr {
  if (!(Number.isInteger(n) && Number.isInteger(p) && p >= 1 && n >= p)) {
    throw new RangeError(`householderQr: need integers n ≥ p ≥ 1, got n = ${n}, p = ${p}`);
  }
  if (a.length !== n * p) throw new RangeError(`householderQr: a.length ${a.length} ≠ n·p = ${n * p}`);
  if (rhs && rhs.length !== n) throw new RangeError(`householderQr: rhs.length ${rhs.length} ≠ n = ${n}`);
  const chunks = Math.ceil(n / CHUNK_ROWS);
  const tau = new Float64Array(chunks * p);
  const r = new Float64Array(p * p);
  const qtRhs = rhs ? new Float64Array(p) : undefined;
  for (let c = 0; c < chunks; c++) {
    const first = c * CHUNK_ROWS;
    const end = Math.min(n, first + CHUNK_ROWS);
    for (let k = 0; k < p; k++) {
      const t = makeReflector(a, n, k, first, end, r, k * p + k);
      tau[c * p + k] = t;
      if (t === 0) continue;
      for (let j = k + 1; j < p; j++) applyReflector(a, n, k, first, end, t, r, k * p + j, a, j * n);
      if (rhs) applyReflector(a, n, k, first, end, t, qtRhs!, k, rhs, 0);
    }
  }
  return { n, p, chunkRows: CHUNK_ROWS, factored: a, tau, r, qtRhs, residualComponents: rhs };
}

/**
 * Reflects the vector (R_kk; a[first..end) of column k) onto β·e_k: R_kk ← β,
 * chunk part ← v (normalised so that v's R-row component is 1). Returns τ.
 * Golub & Van Loan Algorithm 5.1.1 (sign choice of Note 2).
 */
function makeReflector(a: Float64Array, n: number, k: number, first: number, end: number, top: Float64Array, topIndex: number): number {
  const ok = k * n;
  let tailSquares = 0;
  for (let i = first; i < end; i++) tailSquares += a[ok + i] * a[ok + i];
  if (tailSquares === 0) return 0; // nothing to eliminate in this chunk: H = I
  const alpha = top[topIndex];
  const norm = Math.sqrt(alpha * alpha + tailSquares);
  const beta = alpha >= 0 ? -norm : norm;
  const scale = 1 / (alpha - beta); // v = x − βe_k, normalised to v_k = 1: Golub & Van Loan §5.1
  for (let i = first; i < end; i++) a[ok + i] *= scale;
  top[topIndex] = beta;
  return (beta - alpha) / beta; // τ = 2/(vᵀv) for that normalisation: Golub & Van Loan §5.1
}

/**
 * y ← H y for the stacked vector y = (top[topIndex]; target[offset + first .. offset + end)),
 * H = I − τ v vᵀ with v = (1; chunk part of column k of `a`).
 */
function applyReflector(
  a: Float64Array,
  n: number,
  k: number,
  first: number,
  end: number,
  tau: number,
  top: Float64Array,
  topIndex: number,
  target: Float64Array,
  offset: number,
): void {
  const ok = k * n;
  let dot = top[topIndex];
  for (let i = first; i < end; i++) dot += a[ok + i] * target[offset + i];
  const s = tau * dot;
  top[topIndex] -= s;
  for (let i = first; i < end; i++) target[offset + i] -= s * a[ok + i];
}

/**
 * The thin orthogonal factor Q (n×p, column-major, orthonormal columns) with A = Q·R.
 *
 * @param qr  a factorisation from `householderQr`
 * @returns   Q's first p columns
 *
 * Meant for checks and diagnostics (another ~2np² flops); the solver never
 * forms Q. Chunk c's stacked step is [R_{c−1}; A_c] = Q_c [R_c; 0], so the rows
 * of chunk c in Q are B_c·M with M = T_{c+1}⋯T_last, where T_c and B_c are the
 * top p and bottom rows of Q_c's first p columns; M is carried from the last
 * chunk backwards (backward accumulation of the factored form, Golub & Van Loan §5.1).
 */
export function thinQ(qr: HouseholderQr): Float64Array {
  const { n, p, chunkRows, factored, tau } = qr;
  const q = new Float64Array(n * p);
  const chunks = Math.ceil(n / chunkRows);
  let m = new Float64Array(p * p); // column-major p×p
  for (let j = 0; j < p; j++) m[j * p + j] = 1;
  for (let c = chunks - 1; c >= 0; c--) {
    const first = c * chunkRows;
    const end = Math.min(n, first + chunkRows);
    const top = m.slice();
    // Q_c = H_0 H_1 … H_{p−1}, applied to [M; 0] from the right-most reflector first.
    for (let k = p - 1; k >= 0; k--) {
      const t = tau[c * p + k];
      if (t === 0) continue;
      for (let j = 0; j < p; j++) applyReflector(factored, n, k, first, end, t, top, j * p + k, q, j * n);
    }
    m = top;
  }
  return q;
}
