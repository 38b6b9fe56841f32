import { cn } from '../../../lib/cn';

/** An on/off switch (role="switch"); used for "solve for this parameter" and "companion enabled". */
export function Switch({ checked, onChange, label, visibleLabel }: { checked: boolean; onChange: (checked: boolean) => void; label: string; visibleLabel?: string }) {
  return (
    <button
      type="button"
      role="switch"
      aria-checked={checked}
      aria-label={label}
      title={label}
      onClick={() => onChange(!checked)}
      className="inline-flex shrink-0 items-center gap-2 rounded-full text-xs text-night-300 focus-ring"
    >
      <span className={cn('relative inline-flex h-5 w-9 items-center rounded-full border transition-colors', checked ? 'border-ember-400 bg-ember-500/80' : 'border-night-600 bg-night-800')}>
        <span className={cn('inline-block size-3.5 rounded-full bg-night-100 transition-transform', checked ? 'translate-x-4.5' : 'translate-x-0.5')} />
      </span>
      {visibleLabel ? <span aria-hidden="true">{visibleLabel}</span> : null}
    </button>
  );
}
