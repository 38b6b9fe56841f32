/**
 * Goodness-of-fit statistics over weighted residuals, every long sum
 * compensated (worker/timing/fit/neumaier-sum.ts).
 *
 * Definitions are the standard ones (common practice; e.g. Bevington &
 * Robinson, Data Reduction and Error Analysis, 3rd ed. 2003, Ch. 4 (weighted mean) and Ch. 11 (χ²)).
 */
import { NeumaierSum } from './neumaier-sum';

/**
 * χ² = Σ (r_i/σ_i)².
 *
 * @param residuals  n residuals, any unit
 * @param sigmas     n one-sigma uncertainties, same unit, > 0
 * @returns          χ², dimensionless (NaN if any term is NaN)
 */
export function chiSquare(residuals: ArrayLike<number>, sigmas: ArrayLike<number>): number {
  checkSameLength(residuals, sigmas, 'chiSquare');
  const sum = new NeumaierSum();
  for (let i = 0; i < residuals.length; i++) {
    const z = residuals[i] / sigmas[i];
    sum.add(z * z);
  }
  return sum.value;
}

/**
 * χ²/dof; NaN when dof ≤ 0 (no freedom left to judge the fit).
 *
 * @param chi2  χ²
 * @param dof   degrees of freedom, n − p
 */
export function reducedChiSquare(chi2: number, dof: number): number {
  return dof > 0 ? chi2 / dof : Number.NaN;
}

/**
 * Weighted mean Σ(x_i/σ_i²) / Σ(1/σ_i²).
 *
 * @param values  n values, any unit
 * @param sigmas  n uncertainties, same unit, > 0
 * @returns       the mean, values' unit (NaN for n = 0)
 */
export function weightedMean(values: ArrayLike<number>, sigmas: ArrayLike<number>): number {
  checkSameLength(values, sigmas, 'weightedMean');
  const num = new NeumaierSum();
  const den = new NeumaierSum();
  for (let i = 0; i < values.length; i++) {
    const w = 1 / (sigmas[i] * sigmas[i]);
    num.add(w * values[i]);
    den.add(w);
  }
  return num.value / den.value;
}

/**
 * Weighted RMS sqrt(Σ(r_i²/σ_i²) / Σ(1/σ_i²)) (about zero, not about the mean).
 *
 * @param residuals  n residuals, any unit
 * @param sigmas     n uncertainties, same unit, > 0
 * @returns          the RMS, residuals' unit (NaN for n = 0)
 */
export function weightedRms(residuals: ArrayLike<number>, sigmas: ArrayLike<number>): number {
  checkSameLength(residuals, sigmas, 'weightedRms');
  const den = new NeumaierSum();
  for (let i = 0; i < sigmas.length; i++) den.add(1 / (sigmas[i] * sigmas[i]));
  return Math.sqrt(chiSquare(residuals, sigmas) / den.value);
}

/**
 * Correlation matrix ρ_jk = C_jk / sqrt(C_jj·C_kk) from a row-major p×p covariance.
 *
 * @param covariance  p×p row-major, symmetric
 * @param p           its order
 * @returns           p rows of p correlations in [−1, 1], with exact 1 on the diagonal
 */
export function correlationFromCovariance(covariance: ArrayLike<number>, p: number): number[][] {
  if (covariance.length !== p * p) {
    throw new RangeError(`correlationFromCovariance: covariance.length ${covariance.length} ≠ p² = ${p * p}`);
  }
  const scale = Array.from({ length: p }, (_, j) => 1 / Math.sqrt(covariance[j * p + j]));
  return Array.from({ length: p }, (_, j) =>
    Array.from({ length: p }, (_, k) => (j === k ? 1 : covariance[j * p + k] * scale[j] * scale[k])),
  );
}

function checkSameLength(a: ArrayLike<number>, b: ArrayLike<number>, routine: string): void {
  if (a.length !== b.length) throw new RangeError(`${routine}: ${a.length} values but ${b.length} sigmas`);
}
