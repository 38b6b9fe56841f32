/** A real progress bar with the worker's stage name, for a queued or running fit. */
export function FitProgress({ percent, stage, label = 'Fit progress' }: { percent: number; stage: string; label?: string }) {
  const clamped = Math.max(0, Math.min(100, Math.round(Number.isFinite(percent) ? percent : 0)));
  return (
    <div className="min-w-40">
      <div className="mb-1 flex justify-between gap-3 text-xs text-night-300">
        <span>{stage}</span>
        <span className="font-mono">{clamped}%</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={clamped}
        aria-valuetext={`${clamped}% — ${stage}`}
        className="h-2 overflow-hidden rounded-full bg-night-800"
      >
        <div className="h-full rounded-full bg-ember-500 transition-[width]" style={{ width: `${clamped}%` }} />
      </div>
    </div>
  );
}
