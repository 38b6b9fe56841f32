import { Alert } from '../../../components/alert';
import type { SearchRun } from '../api/get-search-run';
import { isOneYearWarning, ONE_YEAR_ADVICE, parseAliasWarning } from '../lib/alias-warnings';
import { isAccepted } from '../lib/candidate-elements';
import { formatFap } from '../lib/format-search';

/** A false-alarm probability above this is not small (common practice: 1 % is the loosest level in use). */
export const NOT_SMALL_FAP = 0.01;

/**
 * Everything that should stop a reader from taking the result at face value, as sentences: a
 * final fit that did not converge, a threshold or discovery FAP that is not small, an accepted
 * companion at a one-year alias or with an unconverged fit, rejected candidates, and the
 * warnings of the search and the final fit as the server sent them.
 */
export function searchWarnings(run: Pick<SearchRun, 'options' | 'result'>): string[] {
  const result = run.result;
  if (!result) return [];
  const found: string[] = [];
  if (!result.finalFit.converged) {
    found.push(`The final fit did not converge after ${result.finalFit.iterations} iterations: treat the elements and uncertainties below as unreliable.`);
  }
  const threshold = result.searchSettings?.falseAlarmThreshold ?? run.options.falseAlarmThreshold;
  if (threshold > NOT_SMALL_FAP) {
    found.push(`The false-alarm threshold ${formatFap(threshold)} is not small: candidates found at it may well be noise.`);
  }
  for (const c of result.candidates.filter(isAccepted)) {
    if (c.falseAlarmProbability > NOT_SMALL_FAP) {
      found.push(`Companion ${c.name} was found at a false-alarm probability of ${formatFap(c.falseAlarmProbability)}, which is not small.`);
    }
    const peak = result.peaks.find((p) => p.round === c.round);
    if (peak?.aliasWarnings.some((w) => isOneYearWarning(parseAliasWarning(w)))) {
      found.push(`Companion ${c.name} has a period near one year: ${ONE_YEAR_ADVICE}.`);
    }
    if (!c.converged) found.push(`The fit that added companion ${c.name} did not converge.`);
  }
  const rejected = result.candidates.filter((c) => !isAccepted(c));
  if (rejected.length > 0) {
    const names = rejected.map((c) => `${c.name} (${c.status})`).join(', ');
    found.push(
      rejected.length === 1
        ? `One candidate was rejected — ${names} — and is not in the resulting model.`
        : `${rejected.length} candidates were rejected — ${names} — and are not in the resulting model.`,
    );
  }
  found.push(...result.warnings);
  return found;
}

/** The warnings of a finished search in one prominent box; nothing when there are none. */
export function SearchWarnings({ run }: { run: Pick<SearchRun, 'options' | 'result'> }) {
  const warnings = searchWarnings(run);
  if (warnings.length === 0) return null;
  return (
    <Alert tone="error" title={`Read ${warnings.length === 1 ? 'this warning' : `these ${warnings.length} warnings`} before trusting the result`}>
      <ul className="mt-1 list-disc pl-5">
        {warnings.map((w) => (
          <li key={w}>{w}</li>
        ))}
      </ul>
    </Alert>
  );
}
