import { Select } from '../../../components/ui';
import type { ColumnMap } from '../mapping';

const HINTS: Record<string, string> = {
  election_key: 'Key of the election, e.g. cal-2026-general',
  election_date: 'YYYY-MM-DD',
  contest_key: 'Key of the contest',
  option_key: 'Key of the option (undecided and other are reserved)',
  votes: 'Whole number of votes',
  status: 'provisional or certified',
  certified_on: 'YYYY-MM-DD; needed when certified',
  source_url: 'Where the figure comes from',
  poll_key: 'One key per poll',
  pollster: 'Firm name; aliases match',
  fieldwork_start: 'YYYY-MM-DD',
  fieldwork_end: 'YYYY-MM-DD',
  published_on: 'YYYY-MM-DD',
  sample_size: 'Positive whole number',
  population: 'lv, rv or a',
  mode: 'phone, ivr, online, text, mixed, face or mail',
  moe: 'Stated 95% margin in points; may be empty',
  share: 'Points, 0–100',
};

export interface ColumnMapperProps {
  headers: string[];
  required: readonly string[];
  optional: readonly string[];
  value: ColumnMap;
  onChange: (next: ColumnMap) => void;
}

/** For each column Veracast expects, the file column that holds it. */
export function ColumnMapper({ headers, required, optional, value, onChange }: ColumnMapperProps) {
  const renderSelect = (column: string, isRequired: boolean) => (
    <Select
      key={column}
      label={
        <>
          <code className="font-mono">{column}</code>
          {isRequired ? <span className="ml-1 text-ink-600">(required)</span> : <span className="ml-1 text-ink-500">(optional)</span>}
        </>
      }
      aria-label={`File column for ${column}`}
      hint={HINTS[column]}
      error={isRequired && !value[column] ? 'not found in the file: choose a column' : undefined}
      value={value[column] ?? ''}
      onChange={(event) => onChange({ ...value, [column]: event.target.value })}
    >
      <option value="">{isRequired ? 'Choose a file column' : 'Not in the file'}</option>
      {headers.map((header) => (
        <option key={header} value={header}>
          {header}
        </option>
      ))}
    </Select>
  );
  return (
    <div className="space-y-4">
      <fieldset>
        <legend className="mb-2 text-sm font-semibold text-ink-900">Required columns</legend>
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">{required.map((c) => renderSelect(c, true))}</div>
      </fieldset>
      <fieldset>
        <legend className="mb-2 text-sm font-semibold text-ink-900">Optional columns</legend>
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">{optional.map((c) => renderSelect(c, false))}</div>
      </fieldset>
    </div>
  );
}
