import { CONTEST_KINDS, MODES, POPULATIONS } from '@veracast/shared-types';
import { useId, useState, type ReactNode } from 'react';
import { Button, Select } from '../../../components/ui';
import { SPONSOR_FILTER_VALUES, hasScorecardFilters, normalizeScorecardFilters, type ScorecardFilters } from '../api/filters';
import { MODE_LABELS, POPULATION_LABELS, SPONSOR_FILTER_LABELS } from '../utils/labels';

type ListKey = 'elections' | 'modes' | 'populations' | 'sponsorTypes';

interface CheckboxGroupProps {
  legend: string;
  options: { value: string; label: string }[];
  selected: readonly string[] | undefined;
  onToggle: (value: string, checked: boolean) => void;
}

function CheckboxGroup({ legend, options, selected, onToggle }: CheckboxGroupProps) {
  const hintId = useId();
  return (
    <fieldset className="min-w-0" aria-describedby={hintId}>
      <legend className="text-sm font-medium text-ink-800">{legend}</legend>
      <p id={hintId} className="text-xs text-ink-500">
        None ticked: all
      </p>
      <div className="mt-1.5 flex flex-wrap gap-x-4 gap-y-1">
        {options.map((option) => (
          <label key={option.value} className="inline-flex items-center gap-1.5 text-sm text-ink-800">
            <input
              type="checkbox"
              className="size-4 rounded border-ink-300 accent-accent-700"
              checked={selected?.includes(option.value) ?? false}
              onChange={(event) => onToggle(option.value, event.target.checked)}
            />
            {option.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

function MinPollsInput({ value, fallback, onCommit }: { value: number | undefined; fallback: number; onCommit: (n: number | undefined) => void }) {
  const id = useId();
  const [text, setText] = useState(value === undefined ? '' : String(value));
  const [seen, setSeen] = useState(value);
  if (seen !== value) {
    // The filters changed from outside (cleared, or a link): show them.
    setSeen(value);
    setText(value === undefined ? '' : String(value));
  }
  const parsed = text.trim() === '' ? undefined : Number(text);
  const invalid = parsed !== undefined && !(Number.isInteger(parsed) && parsed >= 1 && parsed <= 1000);
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-sm font-medium text-ink-800">
        Minimum polls to rank a firm
      </label>
      <input
        id={id}
        type="number"
        inputMode="numeric"
        min={1}
        max={1000}
        step={1}
        placeholder={`audit: ${fallback}`}
        value={text}
        aria-invalid={invalid || undefined}
        aria-describedby={`${id}-hint`}
        onChange={(event) => {
          const next = event.target.value;
          setText(next);
          const n = next.trim() === '' ? undefined : Number(next);
          if (n === undefined || (Number.isInteger(n) && n >= 1 && n <= 1000)) {
            setSeen(n);
            onCommit(n);
          }
        }}
        className="h-10 w-40 rounded-md border border-ink-300 bg-white px-3 text-sm shadow-sm focus-visible:outline-2 focus-visible:outline-accent-600 aria-invalid:border-danger-600"
      />
      <p id={`${id}-hint`} className={invalid ? 'text-sm font-medium text-danger-700' : 'text-xs text-ink-500'}>
        {invalid ? 'A whole number from 1 to 1000.' : 'Firms with fewer polls are listed but not ranked.'}
      </p>
    </div>
  );
}

export interface RankingFiltersProps {
  elections: { key: string; name: string }[];
  value: ScorecardFilters;
  onChange: (filters: ScorecardFilters) => void;
  /** The audit's own minimum, used when the filter is empty. */
  auditMinPolls: number;
  /** Shown while a filtered ranking is being computed. */
  status?: ReactNode;
}

/** Filters of the ranking; every change applies at once and is kept in the page address. */
export function RankingFilters({ elections, value, onChange, auditMinPolls, status }: RankingFiltersProps) {
  function toggle(key: ListKey, item: string, checked: boolean) {
    const current = new Set<string>(value[key] ?? []);
    if (checked) current.add(item);
    else current.delete(item);
    onChange(normalizeScorecardFilters({ ...value, [key]: [...current] }));
  }

  return (
    <form
      aria-label="Ranking filters"
      className="space-y-4"
      onSubmit={(event) => event.preventDefault()}
    >
      {elections.length > 1 && (
        <CheckboxGroup
          legend="Elections"
          options={elections.map((e) => ({ value: e.key, label: e.name }))}
          selected={value.elections}
          onToggle={(item, checked) => toggle('elections', item, checked)}
        />
      )}
      <div className="grid gap-4 lg:grid-cols-3">
        <CheckboxGroup
          legend="Mode"
          options={MODES.map((m) => ({ value: m, label: MODE_LABELS[m] }))}
          selected={value.modes}
          onToggle={(item, checked) => toggle('modes', item, checked)}
        />
        <CheckboxGroup
          legend="Population"
          options={POPULATIONS.map((p) => ({ value: p, label: POPULATION_LABELS[p] }))}
          selected={value.populations}
          onToggle={(item, checked) => toggle('populations', item, checked)}
        />
        <CheckboxGroup
          legend="Sponsor type"
          options={SPONSOR_FILTER_VALUES.map((s) => ({ value: s, label: SPONSOR_FILTER_LABELS[s] }))}
          selected={value.sponsorTypes}
          onToggle={(item, checked) => toggle('sponsorTypes', item, checked)}
        />
      </div>
      <div className="flex flex-wrap items-end gap-4">
        <Select
          label="Race type"
          fieldClassName="w-52"
          value={value.kind ?? ''}
          onChange={(event) => {
            const kind = CONTEST_KINDS.find((k) => k === event.target.value);
            onChange(normalizeScorecardFilters({ ...value, kind }));
          }}
        >
          <option value="">All races</option>
          <option value="candidate">Candidate races</option>
          <option value="referendum">Referendum questions</option>
        </Select>
        <MinPollsInput
          value={value.minPolls}
          fallback={auditMinPolls}
          onCommit={(minPolls) => onChange(normalizeScorecardFilters({ ...value, minPolls }))}
        />
        <Button variant="secondary" disabled={!hasScorecardFilters(value)} onClick={() => onChange({})}>
          Clear filters
        </Button>
        <div className="min-h-6 text-sm text-ink-600" aria-live="polite">
          {status}
        </div>
      </div>
    </form>
  );
}
