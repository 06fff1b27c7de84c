import { NOTE_STATE_LABELS, type NoteState } from '@veracast/shared-types';
import { cn } from '../../../lib/cn';

const STYLE: Record<NoteState, string> = {
  draft: 'border-ink-300 text-ink-700',
  in_review: 'border-caution-200 bg-caution-50 text-caution-900',
  published: 'border-accent-300 bg-accent-50 text-accent-900',
};

/** The state of a note in words (colour only repeats it). */
export function NoteStateLabel({ state }: { state: NoteState }) {
  return <span className={cn('inline-block rounded border px-1.5 py-0.5 text-xs font-medium', STYLE[state])}>{NOTE_STATE_LABELS[state]}</span>;
}
