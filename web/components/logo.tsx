import { cn } from '../lib/cn';

/**
 * Pulsekeeper's mark: a rounded night tile, a faint orbit ring and an ember pulse trace
 * that rises once sharply through the centre, like a single timed arrival.
 */
export function PulseMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={cn('size-8', className)} aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="30" height="30" rx="8" fill="#1b2243" stroke="#3c4570" />
      <circle cx="16" cy="16" r="9.5" fill="none" stroke="#58618a" strokeWidth="1" strokeDasharray="2 2.5" />
      <path
        d="M4.5 18h6.2l2-3.2 3.1 9.2 3.4-17 2.3 11h6"
        fill="none"
        stroke="#ef8a32"
        strokeWidth="2"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
      <circle cx="19.2" cy="7" r="1.6" fill="#ffc184" />
    </svg>
  );
}

export function Logo({ className }: { className?: string }) {
  return (
    <span className={cn('inline-flex items-center gap-2.5', className)}>
      <PulseMark />
      <span className="text-lg font-semibold tracking-tight text-night-100">
        Pulse<span className="text-ember-400">keeper</span>
      </span>
    </span>
  );
}
