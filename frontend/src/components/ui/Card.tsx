import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

export type CardProps = Omit<ComponentPropsWithRef<'section'>, 'title'> & {
  title?: ReactNode;
  description?: ReactNode;
  /** Buttons or links shown beside the title. */
  actions?: ReactNode;
  /** Heading level of the title; cards inside a page use h2 by default. */
  headingLevel?: 2 | 3;
};

export function Card({ title, description, actions, headingLevel = 2, className, children, ...rest }: CardProps) {
  const headingId = useId();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section
      aria-labelledby={title ? headingId : undefined}
      className={cn('rounded-lg border border-ink-200 bg-white shadow-sm', className)}
      {...rest}
    >
      {(title || actions) && (
        <header className="flex flex-wrap items-start justify-between gap-3 border-b border-ink-200 px-5 py-4">
          <div className="min-w-0">
            {title && (
              <Heading id={headingId} className="text-base font-semibold text-ink-900">
                {title}
              </Heading>
            )}
            {description && <p className="mt-1 text-sm text-ink-600">{description}</p>}
          </div>
          {actions && <div className="flex shrink-0 items-center gap-2">{actions}</div>}
        </header>
      )}
      <div className="px-5 py-4">{children}</div>
    </section>
  );
}
