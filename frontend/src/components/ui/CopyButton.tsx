import { useEffect, useState } from 'react';
import { Button, type ButtonProps } from './Button';

export type CopyButtonProps = Omit<ButtonProps, 'onClick' | 'children'> & {
  value: string;
  label?: string;
};

/** Copies `value` to the clipboard and says so for a few seconds. */
export function CopyButton({ value, label = 'Copy', variant = 'secondary', size = 'sm', ...rest }: CopyButtonProps) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');

  useEffect(() => {
    if (state === 'idle') return;
    const timer = setTimeout(() => setState('idle'), 3000);
    return () => clearTimeout(timer);
  }, [state]);

  async function copy() {
    try {
      await navigator.clipboard.writeText(value);
      setState('copied');
    } catch {
      setState('failed');
    }
  }

  return (
    <span className="inline-flex items-center gap-2">
      <Button variant={variant} size={size} onClick={() => void copy()} {...rest}>
        {label}
      </Button>
      <span role="status" className="text-sm text-ink-600">
        {state === 'copied' ? 'Copied.' : state === 'failed' ? 'Copy failed; select the text and copy it by hand.' : ''}
      </span>
    </span>
  );
}
