import type { SearchStopReason } from '../../../../api/contracts/search-runs';

/** Why a search stopped, in words (api/contracts/search-runs.ts SEARCH_STOP_REASONS). */
export const STOP_REASON_TEXT: Record<SearchStopReason, string> = {
  'false-alarm-above-threshold': 'the strongest remaining peak is not below the false-alarm threshold',
  'max-companions': 'the most companions asked for were found',
  'candidate-rejected': 'the last candidate’s fit was unstable or degenerate',
  'no-frequencies': 'the period range left no frequencies to search',
};

export function stopReasonText(reason: string): string {
  return (STOP_REASON_TEXT as Record<string, string>)[reason] ?? reason;
}
