import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../lib/paths.ts';

/** The frame of the signed-out pages: our mark, a card, and a short line about the product. */
export function AuthLayout({ title, children, footer }: { title: string; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-ink px-4 py-10">
      <Link to={paths.home} className="mb-6 flex items-center gap-2 text-2xl font-extrabold text-white">
        <span aria-hidden className="inline-block size-7 rounded-full border-[6px] border-brass-bright bg-ink" />
        Bumperline
      </Link>
      <main className="w-full max-w-md rounded-xl bg-white p-6 shadow-lg">
        <h1 className="mb-4 text-2xl font-extrabold text-ink">{title}</h1>
        {children}
      </main>
      {footer && <div className="mt-4 text-center text-white">{footer}</div>}
    </div>
  );
}

export function FormAlert({ children, tone = 'error' }: { children: ReactNode; tone?: 'error' | 'ok' }) {
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={`mb-4 rounded-md border p-3 font-semibold ${tone === 'error' ? 'border-down bg-down-tint text-down' : 'border-running bg-running-tint text-running'}`}
    >
      {children}
    </div>
  );
}
