/**
 * Parts the pages of a queued run share (the fit-run and companion-search
 * pages): a titled section card, the queued/started/finished line, the cancel
 * button with its error, the load-error panel, and the alert for a run that
 * ended without a result.
 */
import type { ReactNode } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Card, CardTitle } from '../../../components/card';
import { Page } from '../../../components/page';
import { describeError, ErrorPanel } from '../../../components/query-state';
import { isApiError } from '../../../lib/api-client';
import { formatDateTimeUtc } from '../../../lib/format';

/** A card with a title and, optionally, a short description under it. */
export function RunSection({ title, children, description }: { title: string; children: ReactNode; description?: ReactNode }) {
  return (
    <Card>
      <CardTitle>{title}</CardTitle>
      {description ? <p className="-mt-2 mb-3 text-xs text-night-400">{description}</p> : null}
      {children}
    </Card>
  );
}

export interface RunTimes {
  queuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  requestedBy: { displayName: string } | null;
}

/** "Queued … · Started … · Finished … · by …" (UTC), leaving out the times not reached yet. */
export function RunTimeline({ run }: { run: RunTimes }) {
  const items: [string, string | null][] = [
    ['Queued', run.queuedAt],
    ['Started', run.startedAt],
    ['Finished', run.finishedAt],
  ];
  return (
    <p className="text-xs text-night-400">
      {items
        .filter(([, at]) => at)
        .map(([label, at]) => `${label} ${formatDateTimeUtc(at!)}`)
        .join(' · ')}
      {run.requestedBy ? ` · by ${run.requestedBy.displayName}` : ''}
    </p>
  );
}

/** The part of a cancel mutation (useCancelFitRun, useCancelSearchRun) the button needs. */
export interface CancelMutation {
  isPending: boolean;
  isError: boolean;
  error: unknown;
  mutate(): void;
}

/**
 * The cancel button (when allowed) and the cancel's error; a 409 (the run
 * had finished meanwhile) shows `finishedText`.
 */
export function RunCancelControl({ cancel, canCancel, label, finishedText }: { cancel: CancelMutation; canCancel: boolean; label: string; finishedText: string }) {
  return (
    <>
      {canCancel ? (
        <div>
          <Button variant="danger" busy={cancel.isPending} onClick={() => cancel.mutate()}>
            {label}
          </Button>
        </div>
      ) : null}
      {cancel.isError ? (
        <Alert tone="error">{isApiError(cancel.error) && cancel.error.status === 409 ? finishedText : describeError(cancel.error)}</Alert>
      ) : null}
    </>
  );
}

/** The page shown when a run could not be loaded: "No … with this id" for a 404, else a retry. */
export function RunLoadError({ title, noun, error, onRetry }: { title: string; noun: string; error: unknown; onRetry: () => void }) {
  return (
    <Page title={title}>
      {isApiError(error) && error.status === 404 ? (
        <ErrorPanel error={error} title={`No ${noun} with this id`} />
      ) : (
        <ErrorPanel error={error} onRetry={onRetry} title={`Could not load the ${noun}`} />
      )}
    </Page>
  );
}

/**
 * The alert for a failed or cancelled run ("The fit failed", "The search was
 * cancelled"); null for any other status.
 */
export function RunEndedAlert({ run, noun }: { run: { status: string; errorMessage: string | null }; noun: string }) {
  if (run.status === 'failed') {
    return (
      <Alert tone="error" title={`The ${noun} failed`}>
        {run.errorMessage ?? 'No reason was given.'}
      </Alert>
    );
  }
  if (run.status === 'cancelled') return <Alert title={`The ${noun} was cancelled`}>It stopped before a result was written.</Alert>;
  return null;
}
