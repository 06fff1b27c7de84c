import { DISCLOSURE_ITEMS, DISCLOSURE_LABELS, type DisclosureItem } from '@veracast/shared-types';
import { useMemo } from 'react';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import type { PollsterDetail } from '../api/get-pollster';
import { formatPercent } from '../../../lib/format';

interface ItemRow {
  item: DisclosureItem;
  label: string;
  fraction: number | null;
  polls: number | null;
}

const column = createDataTableColumnHelper<ItemRow>();
const columns = column.columns([
  column.accessor('label', { header: 'Disclosure item' }),
  column.accessor((row) => row.fraction ?? Number.NEGATIVE_INFINITY, {
    id: 'fraction',
    header: 'Share of its polls that carry it',
    sortFn: 'basic',
    cell: (info) => {
      const { fraction, polls } = info.row.original;
      if (fraction === null) return '—';
      return (
        <span className="inline-flex items-center gap-3">
          <span className="w-12 tabular-nums">{formatPercent(fraction)}</span>
          <span aria-hidden="true" className="h-2 w-32 overflow-hidden rounded bg-ink-200">
            <span className="block h-full bg-accent-600" style={{ width: `${Math.round(fraction * 100)}%` }} />
          </span>
          {polls !== null && <span className="text-ink-600">{polls} polls</span>}
        </span>
      );
    },
  }),
]);

/**
 * How fully a firm discloses: for each item of the standard disclosure, the share of its polls that
 * published it, and the mean completeness. This is about what the firm told readers, not accuracy.
 */
export function PollsterDisclosure({ pollster }: { pollster: PollsterDetail }) {
  const rows = useMemo<ItemRow[]>(
    () =>
      DISCLOSURE_ITEMS.map((item) => {
        const fraction = pollster.disclosureItems[item] ?? null;
        return {
          item,
          label: DISCLOSURE_LABELS[item],
          fraction,
          polls: fraction === null ? null : Math.round(fraction * pollster.polls.length),
        };
      }),
    [pollster],
  );
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-700">
        Mean completeness over its {pollster.polls.length} polls:{' '}
        <strong className="tabular-nums">{formatPercent(pollster.disclosure)}</strong> of the ten items. Disclosure describes
        what the firm published with each poll; it says nothing about how close its polls came to the result.
      </p>
      <DataTable caption={`Disclosure by item for ${pollster.name}`} columns={columns} data={rows} getRowId={(r) => r.item} pageSize={10} />
    </div>
  );
}
