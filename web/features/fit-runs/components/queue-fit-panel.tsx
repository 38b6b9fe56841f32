import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { describeError } from '../../../components/query-state';
import { Select } from '../../../components/select';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { formatDateTimeUtc } from '../../../lib/format';
import type { Revision } from '../../revisions/api/get-revisions';
import { RevisionOptions } from '../../revisions/components/revision-options';
import type { FitRun } from '../api/get-fit-run';
import { useQueueFitRun } from '../api/queue-fit-run';
import { formatReducedChi2, formatRmsUs } from '../lib/format-fit';

/**
 * "Queue fit": choose a revision (the newest by default) and queue a fit of the current TOAs.
 * When the server answers that identical inputs already succeeded (`reused: true`), nothing was
 * queued and the user chooses between opening that result and recomputing anyway.
 */
export function QueueFitPanel({ pulsarId, revisions }: { pulsarId: string; revisions: Revision[] }) {
  const navigate = useNavigate();
  const queue = useQueueFitRun(pulsarId);
  const [chosen, setChosen] = useState<string>('');
  const revisionId = Number(chosen || revisions[0]?.id);
  const [reused, setReused] = useState<FitRun | null>(null);
  const [queued, setQueued] = useState<FitRun | null>(null);

  const send = (recompute: boolean) => {
    setQueued(null);
    queue.mutate(
      { revisionId, ...(recompute ? { recompute: true } : {}) },
      {
        onSuccess: (answer) => {
          if (answer.reused) {
            setReused(answer.fitRun);
          } else {
            setReused(null);
            setQueued(answer.fitRun);
          }
        },
      },
    );
  };

  if (revisions.length === 0) {
    return <p className="text-sm text-night-300">Save a model revision first; a fit starts from one.</p>;
  }

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <Field label="Model revision" className="min-w-64 flex-1">
          {(control) => (
            <Select {...control} value={String(revisionId)} onChange={(e) => { setChosen(e.target.value); setReused(null); }}>
              <RevisionOptions revisions={revisions} />
            </Select>
          )}
        </Field>
        <Button onClick={() => send(false)} busy={queue.isPending && !reused}>
          Queue fit
        </Button>
      </div>
      {queue.isError ? <Alert tone="error">{describeError(queue.error)}</Alert> : null}
      {queued ? (
        <Alert tone="success">
          Fit queued as <TextLink to={paths.fitRun.href(String(queued.id))}>run #{queued.id}</TextLink>.
        </Alert>
      ) : null}
      {reused ? (
        <div role="group" aria-label="Existing result" className="rounded-md border border-ember-500/50 bg-ember-500/10 px-4 py-3 text-sm text-night-100">
          <p className="font-semibold text-ember-200">These inputs were fitted already</p>
          <p className="mt-1 text-night-200">
            Run #{reused.id} used the same revision, TOAs and settings
            {reused.finishedAt ? ` and finished ${formatDateTimeUtc(reused.finishedAt)}` : ''}: reduced χ²{' '}
            {formatReducedChi2(reused.result?.reducedChi2)}, weighted RMS {formatRmsUs(reused.result?.weightedRmsUs)}. Nothing was queued.
          </p>
          <div className="mt-3 flex flex-wrap gap-2">
            <Button size="sm" onClick={() => navigate(paths.fitRun.href(String(reused.id)))}>
              Open existing result
            </Button>
            <Button size="sm" variant="secondary" busy={queue.isPending} onClick={() => send(true)}>
              Recompute anyway
            </Button>
          </div>
        </div>
      ) : null}
    </div>
  );
}
