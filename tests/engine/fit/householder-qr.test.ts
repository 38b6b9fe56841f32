import { describe, expect, it } from 'vitest';
import { householderQr, thinQ } from '../../../worker/timing/fit/householder-qr';
import { createSeededNormal } from '../../../worker/timing/fit/seeded-normal';
import { expectWithin } from '../time/expect-within';

function randomColumnMajor(n: number, p: number, seed: number): Float64Array {
  const normal = createSeededNormal(seed);
  return Float64Array.from({ length: n * p }, normal);
}

/** max_ij |X_ij| of a column-major array. */
function maxAbs(x: Float64Array): number {
  return x.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
}

describe('householderQr (Golub & Van Loan 2013, §5.2.2)', () => {
  const n = 300;
  const p = 9;
  const original = randomColumnMajor(n, p, 42);
  const rhsOriginal = Float64Array.from({ length: n }, createSeededNormal(43));
  const qr = householderQr(original.slice(), n, p, rhsOriginal.slice());
  const q = thinQ(qr);

  it('Q·R reproduces A to rounding level (identity check)', () => {
    let worst = 0;
    for (let j = 0; j < p; j++) {
      for (let i = 0; i < n; i++) {
        let s = 0;
        for (let k = 0; k <= j; k++) s += q[k * n + i] * qr.r[k * p + j];
        worst = Math.max(worst, Math.abs(s - original[j * n + i]));
      }
    }
    expectWithin(worst / maxAbs(original), 0, 1e-14, 'max |QR − A| / max |A|');
  });

  it('Q has orthonormal columns', () => {
    for (let a = 0; a < p; a++) {
      for (let b = 0; b < p; b++) {
        let dot = 0;
        for (let i = 0; i < n; i++) dot += q[a * n + i] * q[b * n + i];
        expectWithin(dot, a === b ? 1 : 0, 1e-14, `q${a}·q${b}`);
      }
    }
  });

  it('R is upper triangular and the first p entries of Qᵀb equal the thin Q applied to b', () => {
    for (let i = 0; i < p; i++) for (let j = 0; j < i; j++) expect(qr.r[i * p + j]).toBe(0);
    for (let k = 0; k < p; k++) {
      let dot = 0;
      for (let i = 0; i < n; i++) dot += q[k * n + i] * rhsOriginal[i];
      expectWithin(qr.qtRhs![k], dot, 1e-13, `(Qᵀb)[${k}]`);
    }
  });

  it('the orthogonal transformation keeps the norm of b: ‖(Qᵀb)₀‥ₚ₋₁‖² + Σ residual components² = ‖b‖²', () => {
    const squares = (x: Float64Array) => x.reduce((s, v) => s + v * v, 0);
    const total = squares(qr.qtRhs!) + squares(qr.residualComponents!);
    expectWithin(total / squares(rhsOriginal), 1, 1e-14, 'norm² ratio');
  });

  it('Q·R = A across several chunks, a last chunk shorter than p and a column that is zero in one chunk', () => {
    const m = 2 * qr.chunkRows + 1;
    const a = randomColumnMajor(m, p, 99);
    for (let i = qr.chunkRows; i < 2 * qr.chunkRows; i++) a[3 * m + i] = 0; // column 3 vanishes in chunk 1
    const f = householderQr(a.slice(), m, p);
    const qm = thinQ(f);
    let worst = 0;
    for (let j = 0; j < p; j++) {
      for (let i = 0; i < m; i++) {
        let s = 0;
        for (let k = 0; k <= j; k++) s += qm[k * m + i] * f.r[k * p + j];
        worst = Math.max(worst, Math.abs(s - a[j * m + i]));
      }
    }
    expectWithin(worst / maxAbs(a), 0, 1e-14, 'max |QR − A| / max |A|');
  });

  it('hand check: columns (2, 0, 0, 0) and (1, 3, 4, 0) give |R₀₀| = 2, |R₀₁| = 1, |R₁₁| = 5', () => {
    const a = Float64Array.from([2, 0, 0, 0, 1, 3, 4, 0]);
    const f = householderQr(a, 4, 2);
    expectWithin(Math.abs(f.r[0]), 2, 1e-15, '|R00|');
    expectWithin(Math.abs(f.r[1]), 1, 1e-15, '|R01|');
    expectWithin(Math.abs(f.r[3]), 5, 1e-15, '|R11| = ‖(3, 4, 0)‖'); // 3-4-5 triangle
    expect(f.r[2]).toBe(0);
  });

  it('rejects shapes with n < p or wrong lengths', () => {
    expect(() => householderQr(new Float64Array(6), 2, 3)).toThrowError(RangeError);
    expect(() => householderQr(new Float64Array(5), 3, 2)).toThrowError(RangeError);
    expect(() => householderQr(new Float64Array(6), 3, 2, new Float64Array(2))).toThrowError(RangeError);
  });
});
