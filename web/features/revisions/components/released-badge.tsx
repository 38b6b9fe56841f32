import { cn } from '../../../lib/cn';

/**
 * The one mark of a released revision: a seal icon beside the word "released", so it reads
 * without colour. `title` carries the note (and who released it) for a pointer hover.
 */
export function ReleasedBadge({ title, className }: { title?: string; className?: string }) {
  return (
    <span
      className={cn('inline-flex items-center gap-1 rounded-full border border-calm-500/70 bg-calm-500/10 px-2 text-xs font-medium text-calm-400', className)}
      title={title}
    >
      <svg aria-hidden="true" viewBox="0 0 16 16" className="size-3" fill="none" stroke="currentColor" strokeWidth="2">
        <circle cx="8" cy="8" r="6.5" />
        <path d="M5 8.2l2 2 4-4.2" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
      released
    </span>
  );
}
