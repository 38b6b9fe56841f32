import { useId, type ReactNode } from 'react';
import { Button } from '../../../components/button';

/**
 * A modal confirmation (role="alertdialog"): the cancel button takes focus first, Escape cancels.
 * Drawn with a fixed overlay instead of <dialog>, whose showModal jsdom does not implement.
 */
export function ConfirmDialog({
  title,
  children,
  confirmLabel,
  busy = false,
  onConfirm,
  onCancel,
}: {
  title: string;
  children: ReactNode;
  confirmLabel: string;
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const titleId = useId();
  const bodyId = useId();
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-night-950/70 px-4">
      <div
        role="alertdialog"
        aria-modal="true"
        aria-labelledby={titleId}
        aria-describedby={bodyId}
        onKeyDown={(e) => {
          if (e.key === 'Escape' && !busy) onCancel();
        }}
        className="w-full max-w-md rounded-xl border border-night-600 bg-night-900 p-6 shadow-2xl shadow-black/50"
      >
        <h2 id={titleId} className="text-base font-semibold text-night-100">
          {title}
        </h2>
        <div id={bodyId} className="mt-2 text-sm text-night-200">
          {children}
        </div>
        <div className="mt-5 flex justify-end gap-2">
          <Button variant="secondary" onClick={onCancel} disabled={busy} autoFocus>
            Cancel
          </Button>
          <Button variant="danger" onClick={onConfirm} busy={busy}>
            {confirmLabel}
          </Button>
        </div>
      </div>
    </div>
  );
}
