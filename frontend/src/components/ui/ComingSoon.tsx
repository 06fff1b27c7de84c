import type { ReactNode } from 'react';
import { PageHeader } from './PageHeader';

export const COMING_SOON_TEXT = 'This area is being built; no data is shown until it is real.';

export interface ComingSoonProps {
  title: string;
  /** What the area will do once it is built. */
  purpose?: ReactNode;
}

/** An honest placeholder for an area that does not exist yet. It never shows sample data. */
export function ComingSoon({ title, purpose }: ComingSoonProps) {
  return (
    <>
      <PageHeader title={title} description={purpose} />
      <div className="rounded-lg border border-dashed border-ink-300 bg-white px-6 py-10 text-center">
        <p className="text-base font-medium text-ink-800">Not built yet</p>
        <p className="mt-2 text-ink-600">{COMING_SOON_TEXT}</p>
      </div>
    </>
  );
}
