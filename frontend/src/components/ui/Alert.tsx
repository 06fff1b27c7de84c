import type { ReactNode } from 'react';
import { cn } from '../../lib/cn';

export type AlertTone = 'info' | 'success' | 'caution' | 'danger';

const tones: Record<AlertTone, { box: string; icon: string; word: string }> = {
  info: { box: 'border-ink-300 bg-ink-100 text-ink-800', icon: 'text-ink-600', word: 'Note' },
  success: { box: 'border-accent-300 bg-accent-50 text-accent-900', icon: 'text-accent-700', word: 'Done' },
  caution: { box: 'border-caution-200 bg-caution-50 text-caution-900', icon: 'text-caution-700', word: 'Caution' },
  danger: { box: 'border-danger-200 bg-danger-50 text-danger-800', icon: 'text-danger-700', word: 'Error' },
};

function ToneIcon({ tone }: { tone: AlertTone }) {
  const common = { width: 20, height: 20, viewBox: '0 0 20 20', 'aria-hidden': true, focusable: false } as const;
  switch (tone) {
    case 'success':
      return (
        <svg {...common} fill="none" stroke="currentColor" strokeWidth={2}>
          <circle cx="10" cy="10" r="8" />
          <path d="M6.5 10.5l2.3 2.3 4.7-5" />
        </svg>
      );
    case 'caution':
      return (
        <svg {...common} fill="none" stroke="currentColor" strokeWidth={2}>
          <path d="M10 2.8 18 17H2z" strokeLinejoin="round" />
          <path d="M10 8v4.2M10 14.4v.1" strokeLinecap="round" />
        </svg>
      );
    case 'danger':
      return (
        <svg {...common} fill="none" stroke="currentColor" strokeWidth={2}>
          <path d="M6.7 2.5h6.6l4.2 4.2v6.6l-4.2 4.2H6.7l-4.2-4.2V6.7z" strokeLinejoin="round" />
          <path d="M7.5 7.5l5 5M12.5 7.5l-5 5" strokeLinecap="round" />
        </svg>
      );
    default:
      return (
        <svg {...common} fill="none" stroke="currentColor" strokeWidth={2}>
          <circle cx="10" cy="10" r="8" />
          <path d="M10 9v5M10 6v.1" strokeLinecap="round" />
        </svg>
      );
  }
}

export interface AlertProps {
  tone?: AlertTone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
  /** Announce immediately (role="alert"); by default only errors do. */
  assertive?: boolean;
}

/** A boxed message. Its tone is carried by an icon shape and a word, not only by colour. */
export function Alert({ tone = 'info', title, children, className, assertive }: AlertProps) {
  const style = tones[tone];
  const role = (assertive ?? tone === 'danger') ? 'alert' : 'status';
  return (
    <div role={role} className={cn('flex gap-3 rounded-md border px-4 py-3 text-sm', style.box, className)}>
      <span className={cn('mt-0.5 shrink-0', style.icon)}>
        <ToneIcon tone={tone} />
      </span>
      <div className="min-w-0 space-y-1">
        {title ? (
          <p className="font-semibold">
            <span className="sr-only">{style.word}: </span>
            {title}
          </p>
        ) : (
          <span className="sr-only">{style.word}: </span>
        )}
        {children && <div className="[&_a]:underline">{children}</div>}
      </div>
    </div>
  );
}
