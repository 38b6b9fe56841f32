import type { ReactNode } from 'react';
import { cn } from '../lib/cn';

type Tone = 'error' | 'success' | 'info';
const toneClasses: Record<Tone, string> = {
  error: 'border-alarm-500/50 bg-alarm-500/10 text-alarm-300',
  success: 'border-calm-500/50 bg-calm-500/10 text-calm-400',
  info: 'border-night-600 bg-night-800 text-night-200',
};

/** A message box; errors are announced immediately (role="alert"), the rest politely. */
export function Alert({ tone = 'info', title, children, className }: { tone?: Tone; title?: string; children?: ReactNode; className?: string }) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={cn('rounded-md border px-4 py-3 text-sm', toneClasses[tone], className)}>
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className={title ? 'mt-1' : undefined}>{children}</div> : null}
    </div>
  );
}
