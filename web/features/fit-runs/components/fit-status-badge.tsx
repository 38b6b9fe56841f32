import { cn } from '../../../lib/cn';
import type { FitRunStatus } from '../api/get-fit-run';

const STATUS_CLASSES: Record<FitRunStatus, string> = {
  queued: 'border-night-500 text-night-200',
  running: 'border-ember-500/70 text-ember-300',
  succeeded: 'border-calm-500/70 text-calm-400',
  failed: 'border-alarm-500/70 text-alarm-300',
  cancelled: 'border-night-600 text-night-400',
};

/** The run's status as a small outlined word (text, not colour alone, carries the meaning). */
export function FitStatusBadge({ status }: { status: FitRunStatus }) {
  return (
    <span className={cn('inline-flex rounded-full border px-2 py-0.5 text-xs font-medium', STATUS_CLASSES[status])}>{status}</span>
  );
}
