import { useId, useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { describeError } from '../../../components/query-state';
import { controlClasses } from '../../../components/input';
import { cn } from '../../../lib/cn';
import { formatDateTimeUtc } from '../../../lib/format';
import { MAX_RELEASE_NOTE_LENGTH, useReleaseRevision, useWithdrawRevisionRelease } from '../api/release-revision';
import type { Revision } from '../api/get-revisions';

/** Who released the revision, when, and the note; nothing for an unreleased revision. */
export function ReleaseDetails({ revision }: { revision: Revision }) {
  if (!revision.releasedAt) return null;
  return (
    <p className="mt-1 text-xs text-calm-400">
      Released {formatDateTimeUtc(revision.releasedAt)}
      {revision.releasedBy ? ` by ${revision.releasedBy.displayName}` : ''}
      {revision.releaseNote ? <span className="text-night-200">: “{revision.releaseNote}”</span> : null}
    </p>
  );
}

function ReleaseForm({ revision, onDone }: { revision: Revision; onDone: () => void }) {
  const noteId = useId();
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const release = useReleaseRevision();
  const submit = () => {
    const trimmed = note.trim();
    if (trimmed.length === 0) return setProblem('Release note: say in a few words why this model is ready.');
    if (trimmed.length > MAX_RELEASE_NOTE_LENGTH) return setProblem(`Release note: at most ${MAX_RELEASE_NOTE_LENGTH} characters (now ${trimmed.length}).`);
    setProblem(null);
    release.mutate({ revisionId: revision.id, note: trimmed }, { onSuccess: onDone });
  };
  return (
    <form
      aria-label={`Release revision #${revision.id}`}
      className="mt-2 flex flex-col gap-2 rounded-md border border-night-600 bg-night-900 p-3"
      onSubmit={(event) => {
        event.preventDefault();
        submit();
      }}
    >
      <label htmlFor={noteId} className="text-xs font-medium text-night-100">
        Release note
      </label>
      <textarea
        id={noteId}
        autoFocus
        rows={2}
        maxLength={MAX_RELEASE_NOTE_LENGTH + 50}
        value={note}
        onChange={(event) => setNote(event.target.value)}
        aria-invalid={problem ? true : undefined}
        aria-describedby={`${noteId}-hint`}
        className={cn(controlClasses, 'h-auto py-2')}
      />
      <p id={`${noteId}-hint`} className="text-xs text-night-400">
        Campaigns that ask for the released model will use this revision. The model itself cannot change.
      </p>
      {problem ? <p className="text-xs font-medium text-alarm-300">{problem}</p> : null}
      {release.isError ? <Alert tone="error">{describeError(release.error)}</Alert> : null}
      <div className="flex gap-2">
        <Button type="submit" size="sm" busy={release.isPending}>
          Release revision #{revision.id}
        </Button>
        <Button variant="secondary" size="sm" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

function WithdrawConfirm({ revision, onDone }: { revision: Revision; onDone: () => void }) {
  const withdraw = useWithdrawRevisionRelease();
  return (
    <div role="group" aria-label={`Withdraw the release of revision #${revision.id}`} className="mt-2 flex flex-col gap-2 rounded-md border border-alarm-500/50 bg-night-900 p-3">
      <p className="text-xs text-night-200">
        Withdraw the release of revision #{revision.id}? Campaigns will then use an older released revision, or skip the pulsar.
        The revision itself stays unchanged.
      </p>
      {withdraw.isError ? <Alert tone="error">{describeError(withdraw.error)}</Alert> : null}
      <div className="flex gap-2">
        <Button variant="danger" size="sm" autoFocus busy={withdraw.isPending} onClick={() => withdraw.mutate(revision.id, { onSuccess: onDone })}>
          Withdraw release
        </Button>
        <Button variant="secondary" size="sm" onClick={onDone}>
          Keep it released
        </Button>
      </div>
    </div>
  );
}

/**
 * "Release…" (with a note) for an unreleased revision, "Withdraw release…" (after a confirmation) for a
 * released one. Render it only for users holding models:release; the API checks again.
 */
export function ReleaseControls({ revision }: { revision: Revision }) {
  // Fixed when opened: the refetched revision turns released before the form's own success callback
  // runs, and swapping the form out then would drop that callback (and leave the panel open).
  const [mode, setMode] = useState<'release' | 'withdraw' | null>(null);
  const close = () => setMode(null);
  if (mode === 'withdraw') return <WithdrawConfirm revision={revision} onDone={close} />;
  if (mode === 'release') return <ReleaseForm revision={revision} onDone={close} />;
  return (
    <Button variant="ghost" size="sm" className="mt-1 h-7 px-2 text-xs" onClick={() => setMode(revision.releasedAt ? 'withdraw' : 'release')}>
      {revision.releasedAt ? `Withdraw release of #${revision.id}…` : `Release #${revision.id}…`}
    </Button>
  );
}
