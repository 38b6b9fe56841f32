import { useId, useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';

const MAX_REASON_LENGTH = 500; // api/contracts/toas.ts ExcludeToasBody

export interface SelectionActionsProps {
  selectedCount: number;
  /** How many of the selected TOAs are excluded now. */
  selectedExcludedCount: number;
  canExclude: boolean;
  busy: boolean;
  error: unknown;
  /** Text of the last change that Undo reverts, or null when there is none. */
  undoLabel: string | null;
  onExclude(reason: string): void;
  onInclude(): void;
  onUndo(): void;
  onClear(): void;
  /** Keyboard alternative to box selection: TOAs with lo ≤ x ≤ hi. */
  onSelectRange(lo: number, hi: number): void;
  xTitle: string;
}

/** What can be done with the TOAs chosen by box, lasso or x range: exclude with a reason, include again, undo. */
export function SelectionActions(props: SelectionActionsProps) {
  const reasonId = useId();
  const fromId = useId();
  const toId = useId();
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const includedCount = props.selectedCount - props.selectedExcludedCount;

  const exclude = () => {
    const trimmed = reason.trim();
    if (trimmed.length === 0) return setProblem('Reason: say why these TOAs should be left out of fits.');
    if (trimmed.length > MAX_REASON_LENGTH) return setProblem(`Reason: at most ${MAX_REASON_LENGTH} characters.`);
    setProblem(null);
    props.onExclude(trimmed);
    setReason('');
  };
  const selectRange = () => {
    const lo = Number(from);
    const hi = Number(to);
    if (from.trim() === '' || to.trim() === '' || !Number.isFinite(lo) || !Number.isFinite(hi)) return setProblem('Range: give both ends as numbers.');
    setProblem(null);
    props.onSelectRange(Math.min(lo, hi), Math.max(lo, hi));
  };

  return (
    <section aria-label="Selected TOAs" className="flex flex-col gap-3 rounded-lg border border-night-700 bg-night-900 p-3">
      <div className="flex flex-wrap items-center gap-3">
        <p className="text-sm text-night-100" data-testid="selection-count">
          {props.selectedCount === 0
            ? 'No TOA selected — drag a box or lasso on the plot, or choose an x range.'
            : `${props.selectedCount} TOA${props.selectedCount === 1 ? '' : 's'} selected${props.selectedExcludedCount ? ` (${props.selectedExcludedCount} excluded now)` : ''}`}
        </p>
        {props.selectedCount > 0 ? (
          <Button variant="ghost" size="sm" onClick={props.onClear}>
            Clear selection
          </Button>
        ) : null}
        {props.undoLabel ? (
          <Button variant="secondary" size="sm" onClick={props.onUndo} disabled={!props.canExclude} busy={props.busy} title={`Undo: ${props.undoLabel}`}>
            Undo last change
          </Button>
        ) : null}
      </div>
      <form
        className="flex flex-wrap items-end gap-2"
        onSubmit={(event) => {
          event.preventDefault();
          selectRange();
        }}
      >
        <div className="flex flex-col gap-1">
          <label htmlFor={fromId} className="text-xs text-night-300">
            Select from ({props.xTitle})
          </label>
          <Input id={fromId} inputMode="decimal" className="h-8 w-36" value={from} onChange={(e) => setFrom(e.target.value)} />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={toId} className="text-xs text-night-300">
            to
          </label>
          <Input id={toId} inputMode="decimal" className="h-8 w-36" value={to} onChange={(e) => setTo(e.target.value)} />
        </div>
        <Button type="submit" variant="secondary" size="sm">
          Select range
        </Button>
      </form>
      {props.canExclude ? (
        props.selectedCount > 0 ? (
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(event) => {
              event.preventDefault();
              exclude();
            }}
          >
            <div className="flex min-w-64 flex-1 flex-col gap-1">
              <label htmlFor={reasonId} className="text-xs text-night-300">
                Reason for leaving them out
              </label>
              <Input
                id={reasonId}
                className="h-8"
                maxLength={MAX_REASON_LENGTH + 50}
                placeholder="e.g. RFI during the session, wrong clock file"
                value={reason}
                onChange={(e) => setReason(e.target.value)}
              />
            </div>
            <Button type="submit" variant="danger" size="sm" disabled={includedCount === 0} busy={props.busy}>
              Exclude with reason
            </Button>
            <Button variant="secondary" size="sm" disabled={props.selectedExcludedCount === 0} busy={props.busy} onClick={props.onInclude}>
              Include again
            </Button>
          </form>
        ) : null
      ) : (
        <p className="text-xs text-night-400">Your role can look at exclusions but not change them (an analyst can).</p>
      )}
      {problem ? <p className="text-xs font-medium text-alarm-300">{problem}</p> : null}
      {props.error ? <Alert tone="error">{describeError(props.error)}</Alert> : null}
    </section>
  );
}
