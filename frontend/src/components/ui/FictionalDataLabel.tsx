import { cn } from '../../lib/cn';

/** The visible mark on anything that comes from, or was computed from, the fictional demo scenario. */
export function FictionalDataLabel({ className }: { className?: string }) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1.5 rounded-md border border-caution-200 bg-caution-50 px-2 py-0.5 text-sm font-medium text-caution-900',
        className,
      )}
    >
      <span aria-hidden="true">◇</span>
      Fictional demo data
    </span>
  );
}
