import type { ReactNode } from 'react';

/** One term and its value inside a `<dl>`: a small label over a monospace figure. */
export function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs text-night-400">{label}</dt>
      <dd className="mt-0.5 font-mono text-night-100">{children}</dd>
    </div>
  );
}
