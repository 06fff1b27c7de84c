import { RESERVED_OPTION_KEYS } from '@veracast/shared-types';
import { Select } from '../../../components/ui';
import type { OptionChoice, OptionMap } from '../mapping';

export interface OptionMapperProps {
  /** File columns left over for options. */
  columns: string[];
  /** Options of the contests the file names, to choose from. */
  known: OptionChoice[];
  value: OptionMap;
  onChange: (next: OptionMap) => void;
}

/** Wide layout: which option each remaining file column holds, or that it is ignored. */
export function OptionMapper({ columns, known, value, onChange }: OptionMapperProps) {
  if (columns.length === 0) {
    return <p className="text-sm text-danger-700">The file has no column left for options: in the wide layout each option has its own column.</p>;
  }
  const reserved = RESERVED_OPTION_KEYS.filter((k) => !known.some((o) => o.key === k));
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
      {columns.map((column) => {
        const id = column.trim().toLowerCase();
        const current = value[id] ?? '';
        const custom = current && !known.some((o) => o.key === current) && !(reserved as string[]).includes(current);
        return (
          <Select
            key={column}
            label={
              <>
                Option in column <code className="font-mono">{column}</code>
              </>
            }
            aria-label={`Option held by file column ${column}`}
            value={current}
            onChange={(event) => onChange({ ...value, [id]: event.target.value })}
          >
            <option value="">Ignore this column</option>
            {known.map((o) => (
              <option key={o.key} value={o.key}>
                {o.name} ({o.key})
              </option>
            ))}
            {reserved.map((k) => (
              <option key={k} value={k}>
                {k === 'undecided' ? 'Undecided (don’t know, refused)' : 'Other'} ({k})
              </option>
            ))}
            {custom && <option value={current}>{current} (as written in the file)</option>}
            {!custom && /^[a-z0-9][a-z0-9._-]*$/.test(id) && !known.some((o) => o.key === id) && !(reserved as string[]).includes(id) && (
              <option value={id}>{id} (as written in the file)</option>
            )}
          </Select>
        );
      })}
    </div>
  );
}
