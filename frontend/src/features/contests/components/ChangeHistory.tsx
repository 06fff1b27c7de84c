import type { ChangeLogEntryDto } from '@veracast/shared-types';
import { useMemo } from 'react';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import { formatDateTime } from '../../../utils/format';
import type { ContestDetail } from '../api/get-contest';
import { actionLabel, changesOf, type FieldChange } from '../history';

interface HistoryRow {
  entry: ChangeLogEntryDto;
  changes: FieldChange[];
}

const column = createDataTableColumnHelper<HistoryRow>();
const columns = column.columns([
  column.accessor((row) => row.entry.createdAt, { id: 'when', header: 'When', sortFn: 'datetime', cell: (info) => formatDateTime(info.getValue()) }),
  column.accessor((row) => row.entry.user ?? 'Unknown', { id: 'who', header: 'Who' }),
  column.accessor((row) => actionLabel(row.entry.action), { id: 'action', header: 'What' }),
  column.accessor((row) => row.entry.reason ?? '', {
    id: 'reason',
    header: 'Reason',
    cell: (info) => info.getValue() || <span className="text-ink-500">None given</span>,
  }),
  column.accessor((row) => row.changes.map((c) => `${c.field} ${c.before} ${c.after}`).join(' '), {
    id: 'changes',
    header: 'Before → after',
    enableSorting: false,
    cell: (info) =>
      info.row.original.changes.length === 0 ? (
        <span className="text-ink-500">No field changed</span>
      ) : (
        <ul className="space-y-0.5">
          {info.row.original.changes.map((c) => (
            <li key={c.field} className="relative">
              <span className="font-medium">{c.field}:</span> <span className="text-ink-600">{c.before}</span>
              <span aria-hidden="true"> → </span>
              <span className="sr-only"> changed to </span>
              <span>{c.after}</span>
            </li>
          ))}
        </ul>
      ),
  }),
]);

/** The append-only change log of a contest's result, newest first. */
export function ChangeHistory({ contest }: { contest: ContestDetail }) {
  const rows = useMemo(() => {
    const names = new Map(contest.options.map((o) => [o.key, o.name]));
    return contest.history.map((entry) => ({ entry, changes: changesOf(entry, names) }));
  }, [contest]);
  return (
    <DataTable
      caption="Change history of this result"
      columns={columns}
      data={rows}
      getRowId={(row) => String(row.entry.id)}
      initialSorting={[{ id: 'when', desc: true }]}
      pageSize={10}
      emptyMessage="No change has been logged for this result."
    />
  );
}
