import { useEffect, useId, useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';

const MAX_MESSAGE_LENGTH = 500; // docs/api-workflow.md: message 1–500 characters

/**
 * Asks what changed before a new revision is saved; Escape or Cancel closes it.
 * The model editor uses the default wording; the residual explorer's parameter
 * panel passes its own title, description, hint and submit label.
 */
export function SaveRevisionDialog({
  busy,
  error,
  onSave,
  onClose,
  title = 'Save as a new revision',
  description = 'Saved revisions never change; this one becomes the newest model of the pulsar.',
  hint = 'For example: added the second companion, freed the parallax',
  submitLabel = 'Save revision',
}: {
  busy: boolean;
  error: string | null;
  onSave: (message: string) => void;
  onClose: () => void;
  title?: string;
  description?: string;
  hint?: string;
  submitLabel?: string;
}) {
  const titleId = useId();
  const [message, setMessage] = useState('');
  const [problem, setProblem] = useState<string | null>(null);

  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (event.key === 'Escape') onClose();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [onClose]);

  const submit = () => {
    const trimmed = message.trim();
    if (trimmed.length === 0) return setProblem('Message: say in a few words what changed.');
    if (trimmed.length > MAX_MESSAGE_LENGTH) return setProblem(`Message: at most ${MAX_MESSAGE_LENGTH} characters (now ${trimmed.length}).`);
    setProblem(null);
    onSave(trimmed);
  };

  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-night-950/80 px-4">
      <div role="dialog" aria-modal="true" aria-labelledby={titleId} className="w-full max-w-md rounded-xl border border-night-600 bg-night-900 p-6 shadow-2xl shadow-black/50">
        <h2 id={titleId} className="text-lg font-semibold text-night-100">
          {title}
        </h2>
        <p className="mt-1 text-sm text-night-300">{description}</p>
        <form
          className="mt-4 flex flex-col gap-4"
          onSubmit={(event) => {
            event.preventDefault();
            submit();
          }}
        >
          {error ? <Alert tone="error">{error}</Alert> : null}
          <Field label="Message" error={problem ?? undefined} hint={hint}>
            {(control) => <Input {...control} autoFocus maxLength={MAX_MESSAGE_LENGTH + 50} value={message} onChange={(event) => setMessage(event.target.value)} />}
          </Field>
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit" busy={busy}>
              {submitLabel}
            </Button>
          </div>
        </form>
      </div>
    </div>
  );
}
