import { clampPercent, ProgressBar } from '../../../components/progress-bar';
import { cn } from '../../../lib/cn';
import { formatBytes } from '../upload-rules';

export type UploadStage = 'uploading' | 'processing' | 'done';

const STAGES: readonly { stage: UploadStage; label: string }[] = [
  { stage: 'uploading', label: 'Uploading' },
  { stage: 'processing', label: 'Validating and storing' },
  { stage: 'done', label: 'Done' },
];

/** The three steps of an upload, the current one highlighted. */
export function UploadStageIndicator({ stage }: { stage: UploadStage }) {
  const current = STAGES.findIndex((s) => s.stage === stage);
  return (
    <ol aria-label="Upload stages" className="flex flex-wrap items-center gap-2 text-xs">
      {STAGES.map((s, index) => (
        <li
          key={s.stage}
          aria-current={index === current ? 'step' : undefined}
          className={cn(
            'rounded-full border px-3 py-1',
            index < current && 'border-calm-500/50 text-calm-400',
            index === current && 'border-ember-400 bg-ember-500/10 font-semibold text-ember-300',
            index > current && 'border-night-700 text-night-400',
          )}
        >
          {index < current ? '✓ ' : ''}
          {s.label}
        </li>
      ))}
    </ol>
  );
}

/** Byte progress of the request body; indeterminate (no aria-valuenow) when the size is unknown. */
export function UploadProgressBar({ loadedBytes, totalBytes }: { loadedBytes: number; totalBytes: number | null }) {
  const percent = totalBytes ? clampPercent((100 * loadedBytes) / totalBytes) : null;
  return (
    <ProgressBar
      label="Upload progress"
      percent={percent}
      start={
        <span className="font-mono">
          {formatBytes(loadedBytes)}
          {totalBytes ? ` of ${formatBytes(totalBytes)}` : ''}
        </span>
      }
      end={percent === null ? '…' : `${percent}%`}
    />
  );
}
