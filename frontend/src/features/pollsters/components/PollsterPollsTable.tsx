import { POPULATION_LABELS, type PollDto } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import { paths } from '../../../lib/paths';
import { formatDate } from '../../../utils/format';
import { formatInteger, formatPercent } from '../../../lib/format';

const column = createDataTableColumnHelper<PollDto>();
const columns = column.columns([
  column.accessor('key', {
    header: 'Poll',
    cell: (info) => (
      <Link to={paths.poll.href(info.getValue())} className="font-mono text-xs whitespace-nowrap text-accent-700 underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('contestKey', {
    header: 'Contest',
    cell: (info) => (
      <Link to={paths.contest.href(info.getValue())} className="text-accent-700 underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('fieldworkEnd', {
    header: 'Fieldwork',
    cell: (info) => (
      <span className="whitespace-nowrap">
        {formatDate(info.row.original.fieldworkStart)} – {formatDate(info.getValue())}
      </span>
    ),
  }),
  column.accessor('sampleSize', { header: 'Sample', sortFn: 'basic', cell: (info) => formatInteger(info.row.original.sampleSize) }),
  column.accessor('population', { header: 'Population', cell: (info) => POPULATION_LABELS[info.row.original.population] }),
  column.accessor('mode', { header: 'Mode' }),
  column.accessor((row) => row.sponsor ?? '', { id: 'sponsor', header: 'Sponsor', cell: (info) => info.getValue() || <span className="text-ink-500">Not named</span> }),
  column.accessor((row) => row.disclosure.completeness, {
    id: 'disclosure',
    header: 'Disclosure',
    sortFn: 'basic',
    cell: (info) => formatPercent(info.getValue()),
  }),
]);

export function PollsterPollsTable({ polls, firm }: { polls: PollDto[]; firm: string }) {
  return (
    <DataTable
      caption={`Polls by ${firm}`}
      columns={columns}
      data={polls}
      getRowId={(row) => row.key}
      searchLabel="Search this firm's polls"
      initialSorting={[{ id: 'fieldworkEnd', desc: true }]}
      emptyMessage="No poll of this firm has been loaded."
    />
  );
}
