/**
 * Statistics for choosing between fitted models of the same TOAs: the
 * information criteria and the F-test for nested models. Distribution
 * functions come from jstat (a general-purpose statistics library).
 */
import jstat from 'jstat';

const { jStat } = jstat; // a UMD module: Node's ESM loader gives it only as the default export

/** One fitted model, as the comparison needs it. */
export interface FitSummary {
  chi2: number;
  /** TOAs used by the fit */
  count: number;
  /** free parameters, including the implicit phase offset */
  freeParameters: number;
}

/**
 * Akaike information criterion for Gaussian errors of known σ: AIC = χ² + 2k
 * (Akaike 1974, IEEE Trans. Autom. Control 19, 716; the constant log-likelihood terms dropped).
 */
export function akaikeInformationCriterion(fit: FitSummary): number {
  return fit.chi2 + 2 * fit.freeParameters;
}

/** Bayesian information criterion: BIC = χ² + k ln N (Schwarz 1978, Ann. Stat. 6, 461). */
export function bayesianInformationCriterion(fit: FitSummary): number {
  return fit.chi2 + fit.freeParameters * Math.log(fit.count);
}

export interface FTestResult {
  /** F = (Δχ²/Δk) / (χ²_larger/ν_larger) */
  statistic: number;
  /** numerator and denominator degrees of freedom */
  addedParameters: number;
  dof: number;
  /** chance of an F this large if the added parameters are not needed */
  probability: number;
}

/**
 * F-test for additional terms in nested models (Bevington & Robinson, Data Reduction
 * and Error Analysis for the Physical Sciences, 3rd ed. 2003, §11.4, the F test for an additional term; section from memory).
 *
 * @param smaller  the model with fewer free parameters
 * @param larger   the model that adds parameters to `smaller` (same TOAs)
 * @returns        the statistic and its upper-tail probability under F(Δk, ν_larger)
 * Throws RangeError when the models are not nested by parameter count or have no dof left.
 */
export function nestedFTest(smaller: FitSummary, larger: FitSummary): FTestResult {
  const addedParameters = larger.freeParameters - smaller.freeParameters;
  const dof = larger.count - larger.freeParameters;
  if (addedParameters <= 0) throw new RangeError(`nestedFTest: the larger model must have more free parameters (${larger.freeParameters} vs ${smaller.freeParameters})`);
  if (dof <= 0) throw new RangeError(`nestedFTest: no degrees of freedom left (${larger.count} TOAs, ${larger.freeParameters} parameters)`);
  const statistic = Math.max(0, (smaller.chi2 - larger.chi2) / addedParameters) / (larger.chi2 / dof);
  return { statistic, addedParameters, dof, probability: fUpperTail(statistic, addedParameters, dof) };
}

/** P(F > f) for the F distribution with (df1, df2) degrees of freedom. */
export function fUpperTail(f: number, df1: number, df2: number): number {
  if (!(f > 0)) return 1;
  // Upper tail straight from the regularized incomplete beta, so tiny probabilities keep their digits:
  // P(F > f) = I_{ν2/(ν2+ν1 f)}(ν2/2, ν1/2) (Abramowitz & Stegun 1964, eq. 26.6.2).
  return jStat.ibeta(df2 / (df2 + df1 * f), df2 / 2, df1 / 2);
}

/** P(χ² > x) for `dof` degrees of freedom. */
export function chiSquareUpperTail(x: number, dof: number): number {
  return 1 - jStat.chisquare.cdf(x, dof);
}
