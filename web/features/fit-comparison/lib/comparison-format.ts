/**
 * Small pure helpers of the comparison screen: which runs have the lowest
 * information criterion, when a difference counts as large, and how the
 * figures are written.
 */
import type { ComparedRun } from '../../../../api/contracts/comparisons';

/** A parameter difference beyond this many combined σ is highlighted (3σ: common practice). */
export const LARGE_DIFFERENCE_SIGMA = 3;

/** True when |differenceSigma| exceeds LARGE_DIFFERENCE_SIGMA. */
export function isLargeDifference(differenceSigma: number | null | undefined): boolean {
  return typeof differenceSigma === 'number' && Number.isFinite(differenceSigma) && Math.abs(differenceSigma) > LARGE_DIFFERENCE_SIGMA;
}

/**
 * The indices of the smallest finite value (all of them on a tie).
 *
 * @param values  one figure per run
 * @returns       indices into `values`; empty when no value is finite
 */
export function lowestIndices(values: readonly number[]): number[] {
  const finite = values.filter((v) => Number.isFinite(v));
  if (finite.length === 0) return [];
  const lowest = Math.min(...finite);
  return values.flatMap((v, i) => (v === lowest ? [i] : []));
}

/** A χ², AIC or BIC with two decimals, e.g. "1380.25"; '—' when not finite. */
export function formatCriterion(value: number | null | undefined): string {
  return typeof value === 'number' && Number.isFinite(value) ? value.toFixed(2) : '—';
}

/** A difference to the lowest criterion with a sign, e.g. "+4.10"; "0" is written for the lowest itself. */
export function formatCriterionDelta(value: number, lowest: number): string {
  if (!Number.isFinite(value) || !Number.isFinite(lowest)) return '—';
  const delta = value - lowest;
  return delta === 0 ? '0' : `+${delta.toFixed(2)}`;
}

/** A probability: fixed with three significant digits down to 1e-3, exponent notation below, "< 1e-300" at underflow. */
export function formatProbability(value: number): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '< 1e-300';
  if (value >= 1e-3) return value.toPrecision(3);
  return value.toExponential(1);
}

/** "Run #12 (revision 3)", the label a run has everywhere on the screen. */
export function runLabel(run: Pick<ComparedRun, 'fitRunId' | 'revision'>): string {
  return `Run #${run.fitRunId} (revision ${run.revision.number})`;
}

/**
 * Parses the `runs` search parameter ("12,15,20") into fit run ids, reference first.
 *
 * @returns the ids, or null when the text is not a comma-separated list of positive integers without repeats
 */
export function parseRunIds(text: string | null): number[] | null {
  if (!text || !/^\d+(,\d+)*$/.test(text)) return null;
  const ids = text.split(',').map(Number);
  if (ids.some((id) => id <= 0 || !Number.isSafeInteger(id)) || new Set(ids).size !== ids.length) return null;
  return ids;
}
