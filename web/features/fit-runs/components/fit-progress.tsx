import { StageProgressBar } from '../../../components/progress-bar';

/** A real progress bar with the worker's stage name, for a queued or running fit. */
export function FitProgress({ percent, stage, label = 'Fit progress' }: { percent: number; stage: string; label?: string }) {
  return <StageProgressBar className="min-w-40" label={label} percent={percent} stage={stage} />;
}
