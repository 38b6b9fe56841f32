import type { ReactNode } from 'react';
import { PulseMark } from './logo';

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-3 rounded-xl border border-dashed border-night-600 px-6 py-12 text-center">
      <PulseMark className="size-10 opacity-70" />
      <p className="text-base font-semibold text-night-100">{title}</p>
      {children ? <div className="max-w-md text-sm text-night-300">{children}</div> : null}
      {action}
    </div>
  );
}
