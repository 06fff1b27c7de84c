import type { ReactNode } from 'react';
import { Link, Outlet } from 'react-router-dom';
import { paths } from '../../lib/paths';

/** Frame of the pages used without a session: sign-in, password reset, invitation. */
export function PublicLayout() {
  return (
    <div className="flex min-h-screen flex-col items-center px-4 py-12">
      <Link to={paths.home.href()} className="text-2xl font-semibold tracking-tight text-accent-800">
        Veracast
      </Link>
      <p className="mt-1 text-sm text-ink-600">Audit pre-election polls against certified results</p>
      <main id="main" className="mt-8 w-full max-w-md">
        <Outlet />
      </main>
    </div>
  );
}

export function PublicPanel({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="rounded-lg border border-ink-200 bg-white px-6 py-6 shadow-sm">
      <title>{`${title} · Veracast`}</title>
      <h1 className="mb-5 text-xl font-semibold text-ink-950">{title}</h1>
      {children}
    </section>
  );
}
