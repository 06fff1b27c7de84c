import type { ComponentPropsWithRef } from 'react';
import { Link, type LinkProps } from 'react-router-dom';
import { cn } from '../../lib/cn';

export type ButtonVariant = 'primary' | 'secondary' | 'ghost' | 'danger';
export type ButtonSize = 'sm' | 'md';

const base =
  'inline-flex items-center justify-center gap-2 rounded-md font-medium transition-colors ' +
  'focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent-600 ' +
  'disabled:cursor-not-allowed disabled:opacity-60';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-accent-700 text-white hover:bg-accent-800 shadow-sm',
  secondary: 'border border-ink-300 bg-white text-ink-800 hover:bg-ink-100 shadow-sm',
  ghost: 'text-ink-700 hover:bg-ink-100 hover:text-ink-900',
  danger: 'bg-danger-700 text-white hover:bg-danger-800 shadow-sm',
};

const sizes: Record<ButtonSize, string> = {
  sm: 'h-8 px-3 text-sm',
  md: 'h-10 px-4 text-sm',
};

export function buttonClasses(options: { variant?: ButtonVariant; size?: ButtonSize; className?: string } = {}) {
  return cn(base, variants[options.variant ?? 'primary'], sizes[options.size ?? 'md'], options.className);
}

export type ButtonProps = ComponentPropsWithRef<'button'> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows the busy text and disables the button while an action runs. */
  busy?: boolean;
  busyText?: string;
};

export function Button({
  variant,
  size,
  busy = false,
  busyText,
  className,
  disabled,
  children,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses({ variant, size, className })}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy && busyText ? busyText : children}
    </button>
  );
}

export type LinkButtonProps = LinkProps & { variant?: ButtonVariant; size?: ButtonSize };

/** A router link that looks like a button. */
export function LinkButton({ variant = 'secondary', size, className, ...rest }: LinkButtonProps) {
  return <Link className={buttonClasses({ variant, size, className })} {...rest} />;
}
