import { Card, CardTitle } from '../../../components/card';
import { EmptyState } from '../../../components/empty-state';
import { ErrorPanel, LoadingPanel } from '../../../components/query-state';
import { useRevisions } from '../../revisions/api/get-revisions';
import { useSearchRuns } from '../api/get-search-runs';
import { SearchRunList } from './search-run-list';
import { StartSearchPanel } from './start-search-panel';

/**
 * The pulsar page's "Companion search" card: the start form for those who may run searches (an
 * explanation for everyone else) and the pulsar's searches with their status.
 */
export function CompanionSearchSection({ pulsarId, canRun }: { pulsarId: string; canRun: boolean }) {
  const runs = useSearchRuns(pulsarId);
  const revisions = useRevisions(pulsarId);
  return (
    <Card aria-labelledby="companion-search-title">
      <CardTitle>
        <span id="companion-search-title">Companion search</span>
      </CardTitle>
      <p className="mb-4 text-sm text-night-300">
        Looks for periodic signals hidden in the timing residuals and fits each significant one as an orbiting companion.
      </p>
      <div className="mb-5">
        {canRun ? (
          revisions.isPending ? (
            <LoadingPanel label="Loading revisions…" />
          ) : revisions.isError ? (
            <ErrorPanel error={revisions.error} onRetry={() => void revisions.refetch()} title="Could not load the revisions" />
          ) : (
            <StartSearchPanel pulsarId={pulsarId} revisions={revisions.data} />
          )
        ) : (
          <p className="rounded-md border border-night-700 bg-night-800/60 px-4 py-3 text-sm text-night-300">
            Starting a search needs the analyst role or higher; you can read the searches below.
          </p>
        )}
      </div>
      {runs.isPending ? (
        <LoadingPanel label="Loading companion searches…" />
      ) : runs.isError ? (
        <ErrorPanel error={runs.error} onRetry={() => void runs.refetch()} title="Could not load the companion searches" />
      ) : runs.data.length === 0 ? (
        <EmptyState title="No searches yet">
          {canRun ? 'Choose a revision above and start a search.' : 'An analyst can search this pulsar for companions.'}
        </EmptyState>
      ) : (
        <SearchRunList runs={runs.data} />
      )}
    </Card>
  );
}
