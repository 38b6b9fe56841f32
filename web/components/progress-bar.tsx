import type { ReactNode } from 'react';

/** A percentage rounded and held to 0..100 (a non-finite value counts as 0). */
export function clampPercent(percent: number): number {
  return Math.max(0, Math.min(100, Math.round(Number.isFinite(percent) ? percent : 0)));
}

export interface ProgressBarProps {
  /** The bar's accessible name. */
  label: string;
  /** 0..100 (clamped); null draws an indeterminate full bar without aria-valuenow. */
  percent: number | null;
  /** aria-valuetext, when the number alone says too little. */
  valueText?: string;
  /** Caption above the bar on the left (e.g. the stage). */
  start?: ReactNode;
  /** Caption above the bar on the right, in monospace (e.g. "40%"). */
  end?: ReactNode;
  className?: string;
}

/** A progress bar with a caption line above it: role="progressbar", 0..100. */
export function ProgressBar({ label, percent, valueText, start, end, className }: ProgressBarProps) {
  const value = percent === null ? null : clampPercent(percent);
  return (
    <div className={className}>
      <div className="mb-1 flex justify-between gap-3 text-xs text-night-300">
        <span>{start}</span>
        <span className="font-mono">{end}</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={value ?? undefined}
        aria-valuetext={valueText}
        className="h-2 overflow-hidden rounded-full bg-night-800"
      >
        <div className="h-full rounded-full bg-ember-500 transition-[width]" style={{ width: `${value ?? 100}%` }} />
      </div>
    </div>
  );
}

/** A job's progress: the worker's stage on the left, the percent on the right and in aria-valuetext. */
export function StageProgressBar({ label, percent, stage, className }: { label: string; percent: number; stage: string; className?: string }) {
  const clamped = clampPercent(percent);
  return <ProgressBar className={className} label={label} percent={clamped} valueText={`${clamped}% — ${stage}`} start={stage} end={`${clamped}%`} />;
}
