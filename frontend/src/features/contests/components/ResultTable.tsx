import type { OptionDto } from '@veracast/shared-types';
import { useMemo } from 'react';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import type { ContestDetail } from '../api/get-contest';
import { formatInteger, formatPoints } from '../../../lib/format';

interface ResultRow extends OptionDto {
  role: 'A' | 'B' | '';
}

const column = createDataTableColumnHelper<ResultRow>();
const columns = column.columns([
  column.accessor('name', { header: 'Option' }),
  column.accessor('key', { header: 'Key', cell: (info) => <code className="font-mono text-xs">{info.getValue()}</code> }),
  column.accessor((row) => row.bloc ?? '', { id: 'bloc', header: 'Bloc', cell: (info) => info.getValue() || <span className="text-ink-500">None</span> }),
  column.accessor((row) => row.votes ?? -1, { id: 'votes', header: 'Votes', sortFn: 'basic', cell: (info) => formatInteger(info.row.original.votes) }),
  column.accessor((row) => row.share ?? -1, {
    id: 'share',
    header: 'Share (points)',
    sortFn: 'basic',
    cell: (info) => formatPoints(info.row.original.share),
  }),
  column.accessor('role', {
    header: 'Reference',
    cell: (info) => (info.getValue() ? `Option ${info.getValue()}` : ''),
  }),
]);

/** The result per option: votes, share of all options' votes, and which options are A and B. */
export function ResultTable({ contest }: { contest: ContestDetail }) {
  const rows = useMemo<ResultRow[]>(
    () => contest.options.map((o) => ({ ...o, role: o.key === contest.refA ? 'A' : o.key === contest.refB ? 'B' : '' })),
    [contest],
  );
  return (
    <DataTable
      caption={`Result of ${contest.name}`}
      columns={columns}
      data={rows}
      getRowId={(row) => row.key}
      initialSorting={[{ id: 'votes', desc: true }]}
      emptyMessage="This contest has no options."
    />
  );
}
