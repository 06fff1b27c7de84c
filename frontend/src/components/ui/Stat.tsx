import type { ReactNode } from 'react';
import { cn } from '../../lib/cn';

export interface StatProps {
  label: ReactNode;
  value: ReactNode;
  /** A short line under the value: a unit, an interval, a caveat. */
  hint?: ReactNode;
  className?: string;
}

/** One labelled figure. Rendered as a description-list pair so the label is read with the value. */
export function Stat({ label, value, hint, className }: StatProps) {
  return (
    <div className={cn('rounded-lg border border-ink-200 bg-white px-4 py-3', className)}>
      <dt className="text-xs font-medium uppercase tracking-wide text-ink-500">{label}</dt>
      <dd className="mt-1 text-2xl font-semibold tabular-nums text-ink-900">{value}</dd>
      {hint && <dd className="mt-0.5 text-sm text-ink-600">{hint}</dd>}
    </div>
  );
}

const GROUP_COLUMNS = { 2: 'sm:grid-cols-2', 3: 'sm:grid-cols-3', 4: 'sm:grid-cols-2 lg:grid-cols-4' } as const;

export function StatGroup({ children, columns = 4, className }: { children: ReactNode; columns?: 2 | 3 | 4; className?: string }) {
  return <dl className={cn('grid gap-3', GROUP_COLUMNS[columns], className)}>{children}</dl>;
}
