import type { ReactNode } from 'react';
import { Logo } from './logo';

/** The frame for signed-out pages: logo above one centred card. */
export function AuthFrame({ title, subtitle, children }: { title: string; subtitle?: ReactNode; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center px-4 py-10">
      <div className="w-full max-w-sm">
        <div className="mb-8 flex justify-center">
          <Logo />
        </div>
        <div className="rounded-2xl border border-night-700 bg-night-900/90 p-7 shadow-2xl shadow-black/40">
          <h1 className="text-xl font-semibold text-night-100">{title}</h1>
          {subtitle ? <p className="mt-1 text-sm text-night-300">{subtitle}</p> : null}
          <div className="mt-6">{children}</div>
        </div>
      </div>
    </main>
  );
}
