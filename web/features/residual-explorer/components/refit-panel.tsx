import { Link } from 'react-router-dom';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { describeError } from '../../../components/query-state';
import { paths } from '../../../config/paths';
import { isFinalFitStatus, useFitRun } from '../../fit-runs/api/get-fit-run';
import { useQueueFitRun } from '../../fit-runs/api/queue-fit-run';
import { FitProgress } from '../../fit-runs/components/fit-progress';
import { FitStatusBadge } from '../../fit-runs/components/fit-status-badge';

function QueuedRun({ fitRunId, pulsarId }: { fitRunId: string; pulsarId: string }) {
  const run = useFitRun(fitRunId);
  if (run.isPending) return <p className="text-xs text-night-400">Fit #{fitRunId} queued…</p>;
  if (run.isError) return <Alert tone="error">{describeError(run.error)}</Alert>;
  const r = run.data;
  return (
    <div className="flex flex-col gap-2" aria-label="Queued fit">
      <p className="flex items-center gap-2 text-sm text-night-200">
        Fit #{r.id} <FitStatusBadge status={r.status} />
      </p>
      {!isFinalFitStatus(r.status) ? <FitProgress percent={r.progress?.percent ?? 0} stage={r.progress?.stage ?? r.status} /> : null}
      {r.status === 'succeeded' ? (
        <Link to={paths.residualExplorer.href(pulsarId, r.id)} className="text-sm font-medium text-ember-300 underline-offset-2 hover:underline focus-ring">
          Show fit #{r.id} here
        </Link>
      ) : null}
      {r.status === 'failed' ? <Alert tone="error">{r.errorMessage ?? 'The fit failed.'}</Alert> : null}
    </div>
  );
}

/**
 * Queues a real fit of the shown fit's revision with the TOA selection as it is now (exclusions
 * made here included), and follows it until it finishes.
 */
export function RefitPanel({ pulsarId, revisionId, queuedRunId, onQueued }: { pulsarId: string; revisionId: number; queuedRunId: number | null; onQueued(id: number): void }) {
  const queue = useQueueFitRun(pulsarId);
  return (
    <section aria-labelledby="refit-title" className="flex flex-col gap-2">
      <h3 id="refit-title" className="text-sm font-semibold text-night-100">
        Fit again
      </h3>
      <p className="text-xs text-night-400">Revision #{revisionId} with the TOAs in use now. Model edits made here need "save as revision" first.</p>
      <div>
        <Button size="sm" busy={queue.isPending} onClick={() => queue.mutate({ revisionId }, { onSuccess: (answer) => onQueued(answer.fitRun.id) })}>
          Queue fit with current exclusions
        </Button>
      </div>
      {queue.data?.reused ? <p className="text-xs text-night-300">Identical inputs were fitted before; that result is shown.</p> : null}
      {queue.isError ? <Alert tone="error">{describeError(queue.error)}</Alert> : null}
      {queuedRunId !== null ? <QueuedRun fitRunId={String(queuedRunId)} pulsarId={pulsarId} /> : null}
    </section>
  );
}
