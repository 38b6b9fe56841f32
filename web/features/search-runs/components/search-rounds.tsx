import { Fact } from '../../../components/fact';
import { ErrorPanel, LoadingPanel } from '../../../components/query-state';
import { cn } from '../../../lib/cn';
import type { SearchCandidate, SearchPeak } from '../api/get-search-run';
import { useSearchPeriodograms, type SearchPeriodogram } from '../api/get-search-periodograms';
import { formatFap, formatPeriodDays, formatPower } from '../lib/format-search';
import { AliasWarningList } from './alias-warning-list';
import { RoundPeriodogram } from './lazy-periodogram-plot';

/** What became of a round's peak, in words (not colour alone). */
function outcomeText(peak: SearchPeak, candidate: SearchCandidate | undefined, last: boolean, threshold: number): string {
  if (candidate) {
    const verdict = candidate.status;
    if (verdict === 'accepted') return `Below the threshold ${formatFap(threshold)}: seeded companion “${candidate.name}”, accepted.`;
    return `Below the threshold ${formatFap(threshold)}: seeded companion “${candidate.name}”, but its fit was ${verdict} — not a discovery.`;
  }
  if (!peak.significant) return `Not below the threshold ${formatFap(threshold)}: the search stopped here.`;
  return last ? 'Below the threshold, but the search stopped here (see “Stopped” in the outcome).' : 'Below the threshold; no candidate was recorded for it.';
}

function RoundCard({
  peak,
  candidate,
  last,
  threshold,
  periodogram,
  periodogramState,
}: {
  peak: SearchPeak;
  candidate: SearchCandidate | undefined;
  last: boolean;
  threshold: number;
  periodogram: SearchPeriodogram | undefined;
  periodogramState: 'pending' | 'error' | 'ready';
}) {
  const titleId = `search-round-${peak.round}-title`;
  return (
    <section aria-labelledby={titleId} className="rounded-lg border border-night-700 bg-night-900/60 p-4">
      <h3 id={titleId} className="mb-3 text-sm font-semibold text-night-100">
        Round {peak.round}
        {last ? <span className="ml-2 text-xs font-normal text-night-400">(the peak that ended the search)</span> : null}
      </h3>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,1fr)_minmax(0,2fr)]">
        <div className="flex flex-col gap-3">
          <dl className="grid grid-cols-2 gap-3 text-sm" aria-label={`Peak of round ${peak.round}`}>
            <Fact label="Period">{formatPeriodDays(peak.periodDays)}</Fact>
            <Fact label="Power">{formatPower(peak.power)}</Fact>
            <Fact label="False-alarm probability">
              <span className={cn(peak.significant ? 'text-calm-400' : 'text-night-200')}>{formatFap(peak.falseAlarmProbability)}</span>
            </Fact>
            <Fact label="Significant">{peak.significant ? 'yes' : 'no'}</Fact>
          </dl>
          <p className="text-sm text-night-200">{outcomeText(peak, candidate, last, threshold)}</p>
          <AliasWarningList warnings={peak.aliasWarnings} />
        </div>
        <div className="min-w-0">
          {periodogramState === 'pending' ? (
            <LoadingPanel label="Loading the periodogram…" />
          ) : periodogramState === 'error' ? (
            <p className="text-sm text-night-300">The periodogram could not be loaded (see above).</p>
          ) : periodogram ? (
            <RoundPeriodogram periodogram={periodogram} peak={peak} falseAlarmThreshold={threshold} />
          ) : (
            <p className="text-sm text-night-300">No periodogram was stored for this round.</p>
          )}
        </div>
      </div>
    </section>
  );
}

/** Every round of a finished search: its peak with FAP and alias warnings beside its periodogram. */
export function SearchRounds({
  searchRunId,
  peaks,
  candidates,
  falseAlarmThreshold,
}: {
  searchRunId: string;
  peaks: SearchPeak[];
  candidates: SearchCandidate[];
  falseAlarmThreshold: number;
}) {
  const periodograms = useSearchPeriodograms(searchRunId);
  if (peaks.length === 0) return <p className="text-sm text-night-300">The search recorded no periodogram peak.</p>;
  const state = periodograms.isPending ? 'pending' : periodograms.isError ? 'error' : 'ready';
  return (
    <div className="flex flex-col gap-4">
      {periodograms.isError ? (
        <ErrorPanel error={periodograms.error} onRetry={() => void periodograms.refetch()} title="Could not load the periodograms" />
      ) : null}
      {peaks.map((peak, i) => (
        <RoundCard
          key={peak.round}
          peak={peak}
          candidate={candidates.find((c) => c.round === peak.round)}
          last={i === peaks.length - 1}
          threshold={falseAlarmThreshold}
          periodogram={periodograms.data?.rounds.find((r) => r.round === peak.round)}
          periodogramState={state}
        />
      ))}
    </div>
  );
}
