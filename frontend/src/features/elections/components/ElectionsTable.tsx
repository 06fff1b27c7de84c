import type { ElectionDto } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { Alert, DataTable, LoadingState, createDataTableColumnHelper } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDate } from '../../../utils/format';
import { useElections } from '../api/list-elections';
import { formatInteger } from '../../../lib/format';
import { FictionalMarker } from './FictionalDataNotice';

const column = createDataTableColumnHelper<ElectionDto>();
const columns = column.columns([
  column.accessor('name', {
    header: 'Election',
    cell: (info) => (
      <Link to={paths.election.href(info.row.original.key)} className="font-medium text-accent-700 underline hover:text-accent-900">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('date', { header: 'Election day', sortFn: 'alphanumeric', cell: (info) => formatDate(info.getValue()) }),
  column.accessor('jurisdiction', { header: 'Jurisdiction' }),
  column.accessor('contestCount', { header: 'Contests', sortFn: 'basic' }),
  column.accessor((row) => row.contestCount - row.certifiedCount, {
    id: 'uncertified',
    header: 'Not yet certified',
    sortFn: 'basic',
    cell: (info) => (info.getValue() === 0 ? 'All certified' : `${info.getValue()} of ${info.row.original.contestCount}`),
  }),
  column.accessor('pollCount', { header: 'Polls', sortFn: 'basic', cell: (info) => formatInteger(info.getValue()) }),
  column.accessor((row) => (row.blocA && row.blocB ? `${row.blocA} vs ${row.blocB}` : ''), {
    id: 'orientation',
    header: 'Blocs A vs B',
    cell: (info) => info.getValue() || <span className="text-ink-500">Not set</span>,
  }),
  column.accessor((row) => (row.fictional ? 'Fictional' : 'Real'), {
    id: 'data',
    header: 'Data',
    cell: (info) => (info.row.original.fictional ? <FictionalMarker /> : 'Real'),
  }),
]);

export function ElectionsTable() {
  const elections = useElections();
  if (elections.isPending) return <LoadingState label="Loading elections…" />;
  if (elections.isError) return <Alert tone="danger">{describeError(elections.error)}</Alert>;
  return (
    <DataTable
      caption="Elections"
      columns={columns}
      data={elections.data.items}
      getRowId={(row) => row.key}
      searchLabel="Search elections"
      initialSorting={[{ id: 'date', desc: true }]}
      emptyMessage="No elections yet. Import a results file to add one."
    />
  );
}
