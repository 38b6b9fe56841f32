/**
 * Whether a fitted companion is a discovery, or an unstable or degenerate fit
 * that must be reported as such.
 */
import type { KeplerianCompanion } from '../model/timing-model';
import type { SearchCandidateStatus } from './companion-search-report';

/** Eccentricities at or above this count as running off to e → 1. */
export const UNSTABLE_ECCENTRICITY = 0.95;
/** x must exceed this many of its 1σ. */
export const MIN_AMPLITUDE_SIGNIFICANCE = 3;
/** The period's 1σ must stay below this fraction of the period. */
export const MAX_PERIOD_FRACTIONAL_UNCERTAINTY = 0.1;

export interface CandidateCheckInput {
  companion: KeplerianCompanion;
  /** 1σ keyed by file field name (period_days, projected_semimajor_axis_lt_s, …) */
  uncertainties: Record<string, number>;
  converged: boolean;
  /** the TOAs' span, days */
  spanDays: number;
}

/**
 * Classifies a fitted candidate companion.
 *
 * @param input  the fitted elements, their 1σ, the fit's convergence and the data span
 * @returns      'accepted', or 'unstable' / 'degenerate' with the reason (Note 1)
 *
 * Notes: 1. In order: a fit that did not converge, e ≥ 0.95 (e → 1) and a period beyond the data
 *           span are unstable; a non-finite uncertainty, x below 3σ (the signal is not significant)
 *           and a period known to worse than 10 % are degenerate. Thresholds are common practice
 *           for screening periodic signals, not a published rule.
 */
export function classifyCandidate(input: CandidateCheckInput): { status: SearchCandidateStatus; reason?: string } {
  const { companion: c, uncertainties: u, converged, spanDays } = input;
  if (!converged) return { status: 'unstable', reason: 'the orbit fit did not converge' };
  if (!(c.eccentricity < UNSTABLE_ECCENTRICITY)) {
    return { status: 'unstable', reason: `eccentricity ${c.eccentricity.toFixed(3)} runs off toward 1 (≥ ${UNSTABLE_ECCENTRICITY})` };
  }
  if (!(c.periodDays <= spanDays)) {
    return { status: 'unstable', reason: `period ${c.periodDays.toPrecision(6)} d is beyond the data span of ${spanDays.toFixed(1)} d` };
  }
  const bad = Object.entries(u).filter(([, s]) => !(Number.isFinite(s) && s > 0)).map(([key]) => key);
  if (bad.length > 0) return { status: 'degenerate', reason: `no finite uncertainty for ${bad.join(', ')}` };
  const xSigma = u.projected_semimajor_axis_lt_s;
  const significance = c.projectedSemimajorAxisLtS / xSigma;
  if (!(significance >= MIN_AMPLITUDE_SIGNIFICANCE)) {
    return { status: 'degenerate', reason: `projected semimajor axis is only ${significance.toFixed(1)}σ from zero (needs ≥ ${MIN_AMPLITUDE_SIGNIFICANCE}σ)` };
  }
  const periodFraction = u.period_days / c.periodDays;
  if (!(periodFraction <= MAX_PERIOD_FRACTIONAL_UNCERTAINTY)) {
    return { status: 'degenerate', reason: `period uncertainty is ${(100 * periodFraction).toFixed(0)} % of the period (needs ≤ ${100 * MAX_PERIOD_FRACTIONAL_UNCERTAINTY} %)` };
  }
  return { status: 'accepted' };
}
