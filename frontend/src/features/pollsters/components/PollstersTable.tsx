import type { PollsterDto } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { Alert, DataTable, LoadingState, createDataTableColumnHelper } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { usePollsters } from '../api/list-pollsters';
import { formatPercent } from '../../../lib/format';

const column = createDataTableColumnHelper<PollsterDto>();
const columns = column.columns([
  column.accessor('name', {
    header: 'Pollster',
    cell: (info) => (
      <Link to={paths.pollster.href(info.row.original.id)} className="font-medium text-accent-700 underline hover:text-accent-900">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor((row) => row.aliases.join(', '), {
    id: 'aliases',
    header: 'Also published as',
    cell: (info) => info.getValue() || <span className="text-ink-500">No aliases</span>,
  }),
  column.accessor('pollCount', { header: 'Polls', sortFn: 'basic' }),
  column.accessor('contestCount', { header: 'Contests', sortFn: 'basic' }),
  column.accessor('electionCount', { header: 'Elections', sortFn: 'basic' }),
  column.accessor((row) => row.modes.join(', '), { id: 'modes', header: 'Modes' }),
  column.accessor((row) => row.disclosure ?? Number.NEGATIVE_INFINITY, {
    id: 'disclosure',
    header: 'Disclosure completeness',
    sortFn: 'basic',
    cell: (info) => formatPercent(info.row.original.disclosure),
  }),
]);

/** Every firm with its aliases, how much it polled, and how fully it discloses (not how accurate it is). */
export function PollstersTable() {
  const pollsters = usePollsters();
  if (pollsters.isPending) return <LoadingState label="Loading pollsters…" />;
  if (pollsters.isError) return <Alert tone="danger">{describeError(pollsters.error)}</Alert>;
  return (
    <DataTable
      caption="Pollsters"
      columns={columns}
      data={pollsters.data.items}
      getRowId={(row) => String(row.id)}
      searchLabel="Search pollsters and aliases"
      emptyMessage="No pollsters yet. They are created when polls are imported, or here."
    />
  );
}
