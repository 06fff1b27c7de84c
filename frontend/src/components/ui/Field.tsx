import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';
import { cn } from '../../lib/cn';

interface ControlIds {
  id: string;
  'aria-describedby': string | undefined;
  'aria-invalid': true | undefined;
}

export interface FieldProps {
  label: ReactNode;
  /** A message under the control explaining what is wrong; marks the control invalid. */
  error?: string;
  /** Guidance under the control. */
  hint?: ReactNode;
  /** Renders the control with the ids that tie it to its label, hint and error. */
  children: (ids: ControlIds) => ReactNode;
  className?: string;
  id?: string;
}

/** Label, control, hint and error, wired together for assistive technology. */
export function Field({ label, error, hint, children, className, id }: FieldProps) {
  const generated = useId();
  const controlId = id ?? generated;
  const hintId = hint ? `${controlId}-hint` : undefined;
  const errorId = error ? `${controlId}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={cn('flex flex-col gap-1.5', className)}>
      <label htmlFor={controlId} className="text-sm font-medium text-ink-800">
        {label}
      </label>
      {children({ id: controlId, 'aria-describedby': describedBy, 'aria-invalid': error ? true : undefined })}
      {hint && (
        <p id={hintId} className="text-sm text-ink-600">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} className="text-sm font-medium text-danger-700">
          <span aria-hidden="true">✕ </span>
          {error}
        </p>
      )}
    </div>
  );
}

const controlBase =
  'block w-full rounded-md border bg-white px-3 text-sm text-ink-900 shadow-sm ' +
  'placeholder:text-ink-400 focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-accent-600 ' +
  'disabled:cursor-not-allowed disabled:bg-ink-100';

function controlClasses(invalid: boolean, className?: string) {
  return cn(controlBase, invalid ? 'border-danger-600' : 'border-ink-300', className);
}

export type InputProps = Omit<ComponentPropsWithRef<'input'>, 'id'> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  id?: string;
  fieldClassName?: string;
};

export function Input({ label, error, hint, id, className, fieldClassName, ...rest }: InputProps) {
  return (
    <Field label={label} error={error} hint={hint} id={id} className={fieldClassName}>
      {(ids) => <input {...ids} className={controlClasses(Boolean(error), cn('h-10', className))} {...rest} />}
    </Field>
  );
}

export type SelectProps = Omit<ComponentPropsWithRef<'select'>, 'id'> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  id?: string;
  fieldClassName?: string;
};

export function Select({ label, error, hint, id, className, fieldClassName, children, ...rest }: SelectProps) {
  return (
    <Field label={label} error={error} hint={hint} id={id} className={fieldClassName}>
      {(ids) => (
        <select {...ids} className={controlClasses(Boolean(error), cn('h-10 pr-8', className))} {...rest}>
          {children}
        </select>
      )}
    </Field>
  );
}

export type TextareaProps = Omit<ComponentPropsWithRef<'textarea'>, 'id'> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  id?: string;
  fieldClassName?: string;
};

export function Textarea({ label, error, hint, id, className, fieldClassName, ...rest }: TextareaProps) {
  return (
    <Field label={label} error={error} hint={hint} id={id} className={fieldClassName}>
      {(ids) => <textarea {...ids} className={controlClasses(Boolean(error), cn('py-2', className))} {...rest} />}
    </Field>
  );
}

export type SwitchProps = Omit<ComponentPropsWithRef<'button'>, 'onChange' | 'role' | 'type'> & {
  checked: boolean;
  onCheckedChange: (checked: boolean) => void;
  /** The accessible name; shown only to assistive technology when `visibleLabel` is absent. */
  label: string;
  /** Words shown beside the switch for each state, so the state is not carried by colour alone. */
  stateLabels?: { on: string; off: string };
};

/** An on/off control announced as a switch, with its state written out beside it. */
export function Switch({
  checked,
  onCheckedChange,
  label,
  stateLabels = { on: 'On', off: 'Off' },
  className,
  disabled,
  ...rest
}: SwitchProps) {
  return (
    <span className={cn('inline-flex items-center gap-2', className)}>
      <button
        type="button"
        role="switch"
        aria-checked={checked}
        aria-label={label}
        disabled={disabled}
        onClick={() => onCheckedChange(!checked)}
        className={cn(
          'relative inline-flex h-6 w-11 shrink-0 items-center rounded-full border-2 border-transparent transition-colors',
          'focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent-600',
          'disabled:cursor-not-allowed disabled:opacity-60',
          checked ? 'bg-accent-700' : 'bg-ink-300',
        )}
        {...rest}
      >
        <span
          aria-hidden="true"
          className={cn(
            'inline-block size-5 rounded-full bg-white shadow transition-transform',
            checked ? 'translate-x-5' : 'translate-x-0',
          )}
        />
      </button>
      <span aria-hidden="true" className="text-sm text-ink-700">
        {checked ? stateLabels.on : stateLabels.off}
      </span>
    </span>
  );
}
