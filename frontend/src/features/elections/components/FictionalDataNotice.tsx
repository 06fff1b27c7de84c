import { cn } from '../../../lib/cn';

export const FICTIONAL_LABEL = 'Fictional demo data';

/**
 * The visible label on every screen that shows the invented demo scenario. `scope` says what is
 * invented, e.g. "this election, its results and its polls".
 */
export function FictionalDataNotice({ scope, className }: { scope?: string; className?: string }) {
  return (
    <p
      role="note"
      className={cn(
        'inline-flex items-center gap-2 rounded-md border border-caution-200 bg-caution-50 px-3 py-1.5 text-sm text-caution-900',
        className,
      )}
    >
      <span aria-hidden="true" className="font-mono text-xs font-semibold">
        DEMO
      </span>
      <span>
        <strong className="font-semibold">{FICTIONAL_LABEL}</strong>
        {scope ? `: ${scope} are invented for demonstration and describe no real place or firm.` : '.'}
      </span>
    </p>
  );
}

/** A short inline marker for a table cell. */
export function FictionalMarker() {
  return <span className="text-sm text-caution-800">Fictional</span>;
}
