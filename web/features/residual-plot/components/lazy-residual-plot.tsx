import { lazy, Suspense } from 'react';
import { EmptyState } from '../../../components/empty-state';
import { ErrorPanel, LoadingPanel } from '../../../components/query-state';
import { useResiduals } from '../api/get-residuals';

// React.lazy keeps Plotly (several MB) out of the page chunks until a plot is shown.
const ResidualPlot = lazy(() => import('./residual-plot'));

/** Fetches a finished run's residuals and draws them; loading, error and empty states included. */
export function ResidualPlotPanel({ fitRunId, title }: { fitRunId: string; title?: string }) {
  const residuals = useResiduals(fitRunId);
  if (residuals.isPending) return <LoadingPanel label="Loading residuals…" />;
  if (residuals.isError) return <ErrorPanel error={residuals.error} onRetry={() => void residuals.refetch()} title="Could not load the residuals" />;
  if (residuals.data.count === 0 || residuals.data.mjd.length === 0) {
    return <EmptyState title="No residuals">This fit stored no residuals.</EmptyState>;
  }
  return (
    <figure aria-label="Residual plot">
      <Suspense fallback={<LoadingPanel label="Loading the plot…" />}>
        <ResidualPlot residuals={residuals.data} title={title} />
      </Suspense>
      <figcaption className="mt-2 text-xs text-night-400">
        {residuals.data.count.toLocaleString('en-GB')} residuals; each backend has its own colour and marker shape.
      </figcaption>
    </figure>
  );
}
