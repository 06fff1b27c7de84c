import type { ChangeLogEntryDto } from '@veracast/shared-types';

export interface FieldChange {
  field: string;
  before: string;
  after: string;
}

const ACTION_LABELS: Record<string, string> = {
  certify: 'Certified',
  change_certified: 'Changed a certified result',
  edit_provisional: 'Edited the provisional result',
  attach_source: 'Attached the source document',
  import: 'Imported',
};

export function actionLabel(action: string): string {
  return ACTION_LABELS[action] ?? action.replace(/_/g, ' ');
}

const FIELD_LABELS: Record<string, string> = {
  status: 'Status',
  certifiedOn: 'Certified on',
  sourceUrl: 'Source',
  certifyingBody: 'Certifying body',
  sourceDocument: 'Source document',
};

function show(value: unknown): string {
  if (value === null || value === undefined || value === '') return '—';
  if (typeof value === 'number') return value.toLocaleString('en-GB');
  if (typeof value === 'string') return value;
  return JSON.stringify(value);
}

function asRecord(value: unknown): Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Record<string, unknown>) : {};
}

/**
 * The fields a change-log entry changed, with their values before and after. Votes are compared
 * option by option; a first certification (no before) lists every value it set.
 */
export function changesOf(entry: Pick<ChangeLogEntryDto, 'before' | 'after'>, optionNames: ReadonlyMap<string, string> = new Map()): FieldChange[] {
  const before = asRecord(entry.before);
  const after = asRecord(entry.after);
  const changes: FieldChange[] = [];
  const fields = [...new Set([...Object.keys(before), ...Object.keys(after)])].filter((f) => f !== 'votes');
  for (const field of fields) {
    const b = show(before[field]);
    const a = show(after[field]);
    if (b !== a) changes.push({ field: FIELD_LABELS[field] ?? field, before: b, after: a });
  }
  const votesBefore = asRecord(before.votes);
  const votesAfter = asRecord(after.votes);
  const options = [...new Set([...Object.keys(votesBefore), ...Object.keys(votesAfter)])].sort();
  for (const option of options) {
    const b = show(votesBefore[option]);
    const a = show(votesAfter[option]);
    if (b !== a) changes.push({ field: `Votes: ${optionNames.get(option) ?? option}`, before: b, after: a });
  }
  return changes;
}
