import { Select } from '../../../components/ui';

export interface NewPollstersMapperProps {
  names: string[];
  pollsters: { id: number; name: string }[];
  /** Unknown name → id of the firm it is, as text ('' = create a new firm). */
  value: Record<string, string>;
  onChange: (next: Record<string, string>) => void;
}

/**
 * Pollster names in the file that match no firm and no alias. Each becomes a new firm, unless it is
 * mapped to an existing one, in which case the name is kept as that firm's alias.
 */
export function NewPollstersMapper({ names, pollsters, value, onChange }: NewPollstersMapperProps) {
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-700">
        These pollster names match no firm or alias. Choose the firm each one is, or leave it to be created as a new firm. A
        mapped name is saved as an alias, so later files match it.
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        {names.map((name) => (
          <Select key={name} label={`Firm for “${name}”`} value={value[name] ?? ''} onChange={(e) => onChange({ ...value, [name]: e.target.value })}>
            <option value="">Create a new firm named “{name}”</option>
            {pollsters.map((p) => (
              <option key={p.id} value={String(p.id)}>
                {p.name}
              </option>
            ))}
          </Select>
        ))}
      </div>
    </div>
  );
}
