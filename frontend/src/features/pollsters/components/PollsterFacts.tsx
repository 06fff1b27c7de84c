import { SPONSOR_TYPE_LABELS } from '@veracast/shared-types';
import { Stat, StatGroup } from '../../../components/ui';
import type { PollsterDetail } from '../api/get-pollster';
import { formatInteger } from '../../../lib/format';

export function PollsterFacts({ pollster }: { pollster: PollsterDetail }) {
  return (
    <div className="space-y-4">
      <StatGroup columns={3}>
        <Stat label="Polls" value={formatInteger(pollster.pollCount)} />
        <Stat label="Contests" value={formatInteger(pollster.contestCount)} />
        <Stat label="Elections" value={formatInteger(pollster.electionCount)} />
      </StatGroup>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
        <dt className="font-medium text-ink-700">Also published as</dt>
        <dd>{pollster.aliases.length ? pollster.aliases.join(', ') : <span className="text-ink-500">No aliases</span>}</dd>
        <dt className="font-medium text-ink-700">Modes</dt>
        <dd>{pollster.modes.length ? pollster.modes.join(', ') : '—'}</dd>
        <dt className="font-medium text-ink-700">Sponsors</dt>
        <dd>
          {pollster.sponsors.length
            ? pollster.sponsors.map((s) => `${s.name} (${SPONSOR_TYPE_LABELS[s.type].toLowerCase()})`).join('; ')
            : <span className="text-ink-500">None named</span>}
        </dd>
        {pollster.notes && (
          <>
            <dt className="font-medium text-ink-700">Notes</dt>
            <dd className="whitespace-pre-line">{pollster.notes}</dd>
          </>
        )}
      </dl>
    </div>
  );
}
