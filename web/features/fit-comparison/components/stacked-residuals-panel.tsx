import { useQueries } from '@tanstack/react-query';
import { lazy, Suspense } from 'react';
import type { ComparedRun } from '../../../../api/contracts/comparisons';
import { EmptyState } from '../../../components/empty-state';
import { ErrorPanel, LoadingPanel } from '../../../components/query-state';
import { residualsQueryOptions } from '../../residual-plot/api/get-residuals';
import { runLabel } from '../lib/comparison-format';

// React.lazy keeps Plotly (several MB) out of the page chunk until the plots are shown.
const StackedResidualPlots = lazy(() => import('./stacked-residual-plots'));

/** Fetches every compared run's residuals and draws them stacked on one time axis. */
export function StackedResidualsPanel({ runs }: { runs: ComparedRun[] }) {
  const results = useQueries({ queries: runs.map((run) => residualsQueryOptions(String(run.fitRunId))) });
  const failed = results.find((r) => r.isError);
  if (failed) return <ErrorPanel error={failed.error} onRetry={() => results.forEach((r) => void r.refetch())} title="Could not load the residuals" />;
  if (results.some((r) => r.isPending)) return <LoadingPanel label="Loading residuals…" />;
  const stacked = runs.map((run, i) => ({ fitRunId: run.fitRunId, label: runLabel(run), residuals: results[i].data! }));
  if (stacked.every((s) => s.residuals.count === 0)) return <EmptyState title="No residuals">These fits stored no residuals.</EmptyState>;
  return (
    <figure aria-label="Residuals of the compared runs">
      <Suspense fallback={<LoadingPanel label="Loading the plot…" />}>
        <StackedResidualPlots runs={stacked} />
      </Suspense>
      <figcaption className="mt-2 text-xs text-night-400">
        One panel per run, top to bottom in table order, on a shared MJD axis (zoom one, all follow). Each backend has its own colour and
        marker shape in every panel; click a legend entry to hide it everywhere.
      </figcaption>
    </figure>
  );
}
