import { cn } from '../lib/cn';

/** A small rotating ring; `label` is read by screen readers (empty to stay silent inside a busy button). */
export function Spinner({ size = 'md', label = 'Loading…', className }: { size?: 'sm' | 'md'; label?: string; className?: string }) {
  return (
    <span role={label ? 'status' : undefined} className={cn('inline-flex items-center gap-2 text-night-300', className)}>
      <span
        aria-hidden="true"
        className={cn(
          'inline-block animate-spin rounded-full border-2 border-current border-r-transparent',
          size === 'sm' ? 'size-3.5' : 'size-5',
        )}
      />
      {label ? <span className="text-sm">{label}</span> : null}
    </span>
  );
}
