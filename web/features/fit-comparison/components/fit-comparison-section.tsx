import { Card, CardTitle } from '../../../components/card';
import { EmptyState } from '../../../components/empty-state';
import { ErrorPanel, LoadingPanel } from '../../../components/query-state';
import { useFitRuns } from '../../fit-runs/api/get-fit-runs';
import { useRevisions } from '../../revisions/api/get-revisions';
import { useSavedComparisons } from '../api/get-saved-comparisons';
import { FitRunPicker } from './fit-run-picker';
import { SavedComparisonList } from './saved-comparison-list';

function SavedComparisons({ pulsarId, canSave }: { pulsarId: string; canSave: boolean }) {
  const saved = useSavedComparisons(pulsarId);
  if (saved.isPending) return <LoadingPanel label="Loading saved comparisons…" />;
  if (saved.isError) return <ErrorPanel error={saved.error} onRetry={() => void saved.refetch()} title="Could not load the saved comparisons" />;
  if (saved.data.length === 0) {
    return (
      <p className="text-sm text-night-300">
        No saved comparisons yet.{' '}
        {canSave ? 'Open a comparison above and save it with a comment.' : 'A group lead can save a comparison with a comment.'}
      </p>
    );
  }
  return <SavedComparisonList comparisons={saved.data} />;
}

/** The pulsar page's "Compare fits" card: pick runs to compare, and the comparisons saved so far. */
export function FitComparisonSection({ pulsarId, canSave }: { pulsarId: string; canSave: boolean }) {
  const runs = useFitRuns(pulsarId);
  const revisions = useRevisions(pulsarId);
  return (
    <Card aria-labelledby="compare-fits-title">
      <CardTitle>
        <span id="compare-fits-title">Compare fits</span>
      </CardTitle>
      {runs.isPending || revisions.isPending ? (
        <LoadingPanel label="Loading fit runs…" />
      ) : runs.isError ? (
        <ErrorPanel error={runs.error} onRetry={() => void runs.refetch()} title="Could not load the fit runs" />
      ) : runs.data.length === 0 ? (
        <EmptyState title="No fits to compare yet">Queue fits of two revisions in “Fit runs”; once both finish, tick them here.</EmptyState>
      ) : (
        <FitRunPicker pulsarId={pulsarId} runs={runs.data} revisions={revisions.data ?? []} />
      )}
      <h3 className="mb-2 mt-6 text-sm font-semibold text-night-100">Saved comparisons</h3>
      <SavedComparisons pulsarId={pulsarId} canSave={canSave} />
    </Card>
  );
}
