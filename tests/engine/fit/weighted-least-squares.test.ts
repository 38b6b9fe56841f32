import { describe, expect, it } from 'vitest';
import { CholeskyDecomposition, Matrix, QrDecomposition, inverse } from 'ml-matrix';
import nist from '../../fixtures/nist/wampler.json';
import { solveWeightedLeastSquares } from '../../../worker/timing/fit/weighted-least-squares';
import { createSeededNormal, createSeededUniform } from '../../../worker/timing/fit/seeded-normal';
import { TimingInputError } from '../../../worker/timing/engine-error';
import { expectWithin } from '../time/expect-within';

/** A column-major n×p design from a row function. */
function columnMajor(n: number, p: number, row: (i: number) => number[]): Float64Array {
  const a = new Float64Array(n * p);
  for (let i = 0; i < n; i++) row(i).forEach((v, j) => (a[j * n + i] = v));
  return a;
}

/** The error `fn` throws (fails the test if it returns). */
function thrownBy(fn: () => unknown): Error {
  try {
    fn();
  } catch (e) {
    return e as Error;
  }
  throw new Error('expected a throw');
}

function relativeDifference(got: number, want: number): number {
  return Math.abs(got - want) / Math.abs(want);
}

describe('NIST StRD Wampler datasets (source: tests/fixtures/nist/wampler.json)', () => {
  // The data are generated from each dataset's defining polynomial on x = 0..20 (fixture note).
  // y·10⁵ is an exact integer, so one division gives the correctly rounded value of the exact
  // decimal y that NIST tabulates: the same double a parser of the NIST file would produce.
  it.each(nist.datasets)('$name: unit weights reproduce the certified coefficients to ≥ 8 digits', (dataset) => {
    const certified = dataset.certifiedCoefficients;
    const xs: number[] = [];
    for (let x = dataset.xValues.from; x <= dataset.xValues.to; x += dataset.xValues.step) xs.push(x);
    const n = xs.length;
    const p = certified.length;
    const coefficientsTimes1e5 = certified.map((c) => Math.round(c * 1e5));
    const y = Float64Array.from(xs, (x) => coefficientsTimes1e5.reduce((s, c, j) => s + c * x ** j, 0) / 1e5);
    const design = columnMajor(n, p, (i) => Array.from({ length: p }, (_, j) => xs[i] ** j));

    const fit = solveWeightedLeastSquares(design, n, p, y, new Float64Array(n).fill(1));

    expect(n).toBe(21);
    certified.forEach((c, j) => {
      const digits = -Math.log10(relativeDifference(fit.solution[j], c) || 1e-17);
      expect(digits, `B${j}: got ${fit.solution[j]}, certified ${c}`).toBeGreaterThanOrEqual(8);
    });
    // Certified residual standard deviation 0: ours must be at rounding level relative to the data.
    const residualSd = Math.sqrt(fit.chi2 / (n - p));
    const dataScale = Math.max(...y.map(Math.abs));
    expectWithin(residualSd / dataScale, dataset.certifiedResidualStandardDeviation, 1e-12, 'residual SD / max|y|');
  });
});

/** A random well-conditioned weighted problem, seeded. */
function randomProblem(n: number, p: number, seed: number) {
  const normal = createSeededNormal(seed);
  const uniform = createSeededUniform(seed + 1);
  const design = new Float64Array(n * p);
  for (let k = 0; k < n * p; k++) design[k] = normal() * 10 ** (Math.floor(k / n) % 3); // columns of different scale
  const sigmas = Float64Array.from({ length: n }, () => 0.5 + 2 * uniform());
  const truth = Float64Array.from({ length: p }, () => normal());
  const rhs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < p; j++) s += design[j * n + i] * truth[j];
    rhs[i] = s + sigmas[i] * normal();
  }
  return { design, sigmas, rhs };
}

/** Row-major ml-matrix Matrix of the weighted design W^½A, and W^½b. */
function weightedForMlMatrix(design: Float64Array, n: number, p: number, rhs: Float64Array, sigmas: Float64Array) {
  const a = new Matrix(n, p);
  const b = new Matrix(n, 1);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < p; j++) a.set(i, j, design[j * n + i] / sigmas[i]);
    b.set(i, 0, rhs[i] / sigmas[i]);
  }
  return { a, b };
}

describe('agreement with ml-matrix (a general-purpose reference library)', () => {
  it('a 2000 × 12 weighted problem: solution and covariance equal QrDecomposition and inverse(AᵀWA) to 1e-10', () => {
    const n = 2000;
    const p = 12;
    const { design, sigmas, rhs } = randomProblem(n, p, 20261201);
    const ours = solveWeightedLeastSquares(design, n, p, rhs, sigmas);
    const { a, b } = weightedForMlMatrix(design, n, p, rhs, sigmas);
    const reference = new QrDecomposition(a).solve(b);
    const referenceCovariance = inverse(a.transpose().mmul(a));
    for (let j = 0; j < p; j++) {
      expectWithin(relativeDifference(ours.solution[j], reference.get(j, 0)), 0, 1e-10, `x[${j}] relative`);
      for (let k = 0; k < p; k++) {
        const scale = Math.sqrt(referenceCovariance.get(j, j) * referenceCovariance.get(k, k));
        const diff = Math.abs(ours.covariance[j * p + k] - referenceCovariance.get(j, k)) / scale;
        expectWithin(diff, 0, 1e-10, `covariance[${j}][${k}] relative to sqrt(C_jj C_kk)`);
      }
    }
    expect(ours.rank).toBe(p);
    expect(ours.conditionNumber).toBeLessThan(10);
  });
});

describe('identity checks', () => {
  const n = 500;
  const p = 7;
  const { design, sigmas, rhs } = randomProblem(n, p, 7);
  const fit = solveWeightedLeastSquares(design, n, p, rhs, sigmas);

  it('weighted residuals are orthogonal to every design column: Aᵀ W r ≈ 0', () => {
    const r = rhs.map((v, i) => {
      let s = v;
      for (let j = 0; j < p; j++) s -= design[j * n + i] * fit.solution[j];
      return s;
    });
    for (let j = 0; j < p; j++) {
      let dot = 0;
      let columnNorm = 0;
      let residualNorm = 0;
      for (let i = 0; i < n; i++) {
        const w = 1 / sigmas[i];
        dot += design[j * n + i] * w * (r[i] * w);
        columnNorm += (design[j * n + i] * w) ** 2;
        residualNorm += (r[i] * w) ** 2;
      }
      expectWithin(Math.abs(dot) / Math.sqrt(columnNorm * residualNorm), 0, 1e-12, `cos(column ${j}, residual)`);
    }
  });

  it('χ² from the QR equals Σ ((rhs − A x)/σ)² recomputed directly', () => {
    let direct = 0;
    for (let i = 0; i < n; i++) {
      let s = rhs[i];
      for (let j = 0; j < p; j++) s -= design[j * n + i] * fit.solution[j];
      direct += (s / sigmas[i]) ** 2;
    }
    expectWithin(fit.chi2 / direct, 1, 1e-12, 'χ² ratio');
  });

  it('covariance is symmetric positive-definite and uncertainties are its root diagonal', () => {
    const c = new Matrix(p, p);
    for (let j = 0; j < p; j++) {
      for (let k = 0; k < p; k++) {
        expect(fit.covariance[j * p + k]).toBe(fit.covariance[k * p + j]);
        c.set(j, k, fit.covariance[j * p + k]);
      }
      expectWithin(fit.uncertainties[j], Math.sqrt(fit.covariance[j * p + j]), 1e-15 * fit.uncertainties[j], `σ[${j}]`);
    }
    expect(new CholeskyDecomposition(c).isPositiveDefinite()).toBe(true);
  });

  it('singular values are positive, descending, and give the condition number', () => {
    const s = Array.from(fit.singularValues);
    expect(s.length).toBe(p);
    for (let k = 1; k < p; k++) expect(s[k]).toBeLessThanOrEqual(s[k - 1]);
    expect(s[p - 1]).toBeGreaterThan(0);
    expect(fit.conditionNumber).toBe(s[0] / s[p - 1]);
  });

  it('is invariant to the units of a parameter (column scaling): scaling column 2 by 1e9 scales x₂ by 1e-9', () => {
    const rescaled = design.slice();
    for (let i = 0; i < n; i++) rescaled[2 * n + i] *= 1e9;
    const other = solveWeightedLeastSquares(rescaled, n, p, rhs, sigmas);
    expectWithin(other.solution[2] * 1e9, fit.solution[2], 1e-12 * Math.abs(fit.solution[2]), 'x₂ rescaled');
    expectWithin(other.uncertainties[2] * 1e9, fit.uncertainties[2], 1e-12 * fit.uncertainties[2], 'σ₂ rescaled');
    expectWithin(other.conditionNumber, fit.conditionNumber, 1e-9 * fit.conditionNumber, 'scaled condition number');
  });
});

describe('extreme column scales', () => {
  it('columns scaled by 2^±664 ≈ 1e±200 (whose squares overflow or underflow) give the same answer as unit columns', () => {
    const n = 300;
    const p = 3;
    const { design, sigmas, rhs } = randomProblem(n, p, 31);
    const reference = solveWeightedLeastSquares(design, n, p, rhs, sigmas);
    const extreme = design.slice();
    for (let i = 0; i < n; i++) {
      extreme[i] *= 2 ** 664; // powers of two: the scaled problem is exactly representable
      extreme[2 * n + i] *= 2 ** -664;
    }
    const got = solveWeightedLeastSquares(extreme, n, p, rhs, sigmas);
    const units = [2 ** 664, 1, 2 ** -664];
    for (let j = 0; j < p; j++) {
      const shiftInSigmas = Math.abs(got.solution[j] * units[j] - reference.solution[j]) / reference.uncertainties[j];
      expectWithin(shiftInSigmas, 0, 1e-14, `x[${j}] shift in σ`);
      expectWithin(relativeDifference(got.uncertainties[j] * units[j], reference.uncertainties[j]), 0, 1e-13, `σ[${j}]`);
    }
  });
});

describe('degenerate and invalid input', () => {
  const n = 50;
  const ones = new Float64Array(n).fill(1);
  const t = Float64Array.from({ length: n }, (_, i) => i / n);
  const names = ['offset', 'slope', 'curvature'];

  it('an all-zero column throws TimingInputError naming that parameter', () => {
    const design = columnMajor(n, 3, (i) => [1, t[i], 0]);
    const error = thrownBy(() => solveWeightedLeastSquares(design, n, 3, t, ones, names));
    expect(error).toBeInstanceOf(TimingInputError);
    expect(error.message).toBe('parameter has no effect on the residuals: curvature');
    expect((error as TimingInputError).details.map((d) => d.column)).toEqual(['curvature']);
  });

  it('two identical columns throw TimingInputError naming both and not the third', () => {
    const design = columnMajor(n, 3, (i) => [t[i], 1, t[i]]);
    const caught = thrownBy(() => solveWeightedLeastSquares(design, n, 3, t, ones, names));
    expect(caught).toBeInstanceOf(TimingInputError);
    expect(caught.message).toBe('parameters are degenerate (cannot be told apart): offset, curvature');
  });

  it('a column that is a linear combination of two others names all three', () => {
    const design = columnMajor(n, 4, (i) => [1, t[i], Math.sin(7 * t[i]), 2 - 3 * t[i]]);
    expect(() => solveWeightedLeastSquares(design, n, 4, t, ones, ['a', 'b', 'c', 'd'])).toThrowError(
      /^parameters are degenerate \(cannot be told apart\): a, b, d$/,
    );
  });

  it('uses "parameter j" when no names are given', () => {
    const design = columnMajor(n, 2, () => [1, 0]);
    expect(() => solveWeightedLeastSquares(design, n, 2, t, ones)).toThrowError('parameter has no effect on the residuals: parameter 1');
  });

  it('rejects σ ≤ 0, NaN data, n < p and mismatched lengths', () => {
    const design = columnMajor(n, 2, (i) => [1, t[i]]);
    const badSigma = ones.slice();
    badSigma[3] = 0;
    const sigmaError = thrownBy(() => solveWeightedLeastSquares(design, n, 2, t, badSigma));
    expect(sigmaError).toBeInstanceOf(TimingInputError);
    expect(sigmaError.message).toBe('sigmas[3]: must be finite and > 0, got 0');
    const badRhs = t.slice();
    badRhs[5] = Number.NaN;
    expect(() => solveWeightedLeastSquares(design, n, 2, badRhs, ones)).toThrowError(TimingInputError);
    const badDesign = design.slice();
    badDesign[n + 4] = Number.POSITIVE_INFINITY;
    expect(() => solveWeightedLeastSquares(badDesign, n, 2, t, ones, ['a', 'b'])).toThrowError(/design column b, row 4/);
    expect(() => solveWeightedLeastSquares(new Float64Array(2), 1, 2, new Float64Array(1), new Float64Array(1).fill(1))).toThrowError(
      TimingInputError,
    );
    expect(() => solveWeightedLeastSquares(design, n, 2, t.subarray(1), ones)).toThrowError(RangeError);
  });
});
