import { useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { describeError } from '../../../components/query-state';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useQueueFitRun } from '../../fit-runs/api/queue-fit-run';
import type { FitRun } from '../../fit-runs/api/get-fit-run';
import { SaveRevisionDialog } from '../../model-editor/components/save-revision-dialog';
import type { SearchRun } from '../api/get-search-run';
import { useSaveSearchRevision } from '../api/save-search-revision';

function QueueFitOfRevision({ pulsarId, revisionId }: { pulsarId: string; revisionId: number }) {
  const queue = useQueueFitRun(pulsarId);
  const [fitRun, setFitRun] = useState<{ run: FitRun; reused: boolean } | null>(null);
  return (
    <div className="flex flex-col gap-2">
      <div>
        <Button
          size="sm"
          busy={queue.isPending}
          onClick={() => queue.mutate({ revisionId }, { onSuccess: (answer) => setFitRun({ run: answer.fitRun, reused: answer.reused }) })}
        >
          Queue a fit of revision #{revisionId}
        </Button>
      </div>
      {queue.isError ? <Alert tone="error">{describeError(queue.error)}</Alert> : null}
      {fitRun ? (
        <p className="text-sm text-night-200">
          {fitRun.reused ? 'These inputs were fitted already: ' : 'Fit queued as '}
          <TextLink to={paths.fitRun.href(String(fitRun.run.id))}>fit run #{fitRun.run.id}</TextLink>.
        </p>
      ) : null}
    </div>
  );
}

/**
 * "Save resulting model as a revision" (asks for a message; models:edit). Once saved, links to the
 * new revision and offers to queue a fit of it (fits:run); a run saved earlier shows the same.
 */
export function SaveSearchRevisionPanel({ run, canSave, canRunFits }: { run: SearchRun; canSave: boolean; canRunFits: boolean }) {
  const pulsarId = String(run.pulsarId);
  const save = useSaveSearchRevision(String(run.id), pulsarId);
  const [open, setOpen] = useState(false);
  const [savedHere, setSavedHere] = useState<number | null>(null);
  const savedRevisionId = savedHere ?? run.savedRevisionId;

  if (savedRevisionId !== null) {
    return (
      <div className="flex flex-col gap-3">
        <Alert tone="success" title={`Saved as revision #${savedRevisionId}`}>
          <p>
            The resulting model is <TextLink to={paths.pulsarModel.href(pulsarId, savedRevisionId)}>revision #{savedRevisionId}</TextLink> of the pulsar.
            Fit it to see the companions’ elements with every other parameter free.
          </p>
        </Alert>
        {canRunFits ? (
          <QueueFitOfRevision pulsarId={pulsarId} revisionId={savedRevisionId} />
        ) : (
          <p className="text-sm text-night-300">
            An analyst can queue a fit of it from the <TextLink to={paths.pulsar.href(pulsarId)}>pulsar page</TextLink>.
          </p>
        )}
      </div>
    );
  }
  if (!canSave) {
    return <p className="text-sm text-night-300">Saving the resulting model as a revision needs the analyst role or higher.</p>;
  }
  const found = run.result?.companionsFound ?? 0;
  if (found === 0) {
    return <p className="text-sm text-night-300">No companion was accepted, so the resulting model adds nothing to revision #{run.revisionId}; there is nothing to save.</p>;
  }
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-night-300">
        The resulting model is revision #{run.revisionId} with the {found === 1 ? 'accepted companion' : `${found} accepted companions`} added and
        everything refitted; rejected candidates are not in it.
      </p>
      <div>
        <Button onClick={() => setOpen(true)}>Save resulting model as a revision</Button>
      </div>
      {open ? (
        <SaveRevisionDialog
          busy={save.isPending}
          error={
            save.isError
              ? isApiError(save.error) && save.error.status === 409
                ? `${save.error.message} Reload the page to see the saved revision.`
                : describeError(save.error)
              : null
          }
          onClose={() => {
            setOpen(false);
            save.reset();
          }}
          onSave={(message) =>
            save.mutate(
              { message },
              {
                onSuccess: (revision) => {
                  setSavedHere(revision.id);
                  setOpen(false);
                },
              },
            )
          }
        />
      ) : null}
    </div>
  );
}
