import { clampPercent, ProgressBar } from '../../../components/progress-bar';
import { cn } from '../../../lib/cn';

const STATUS_CLASSES: Record<string, string> = {
  queued: 'border-night-600 text-night-300',
  running: 'border-ember-400/60 text-ember-300',
  succeeded: 'border-calm-500/50 text-calm-400',
  failed: 'border-alarm-500/50 text-alarm-300',
  cancelled: 'border-night-600 text-night-400',
  skipped: 'border-night-600 text-night-400',
};

/** A campaign's or a run's status as a small outlined label. */
export function StatusBadge({ status }: { status: string }) {
  return <span className={cn('inline-block rounded-full border px-2 py-0.5 text-xs font-medium', STATUS_CLASSES[status] ?? 'border-night-600 text-night-300')}>{status}</span>;
}

/** Progress of a campaign: percent, stage name and done/total runs. */
export function CampaignProgressBar({ label, percent, stage, done, total }: { label: string; percent: number; stage: string; done: number; total: number }) {
  const clamped = clampPercent(percent);
  return (
    <ProgressBar
      className="min-w-40"
      label={label}
      percent={clamped}
      valueText={`${clamped}% — ${stage}, ${done} of ${total} pulsars`}
      start={stage}
      end={`${done}/${total} · ${clamped}%`}
    />
  );
}
