import type { ContestDto } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import { paths } from '../../../lib/paths';
import { formatDate } from '../../../utils/format';
import { formatInteger } from '../../../lib/format';
import { formatFraction } from '../format';

export function certificationLabel(contest: Pick<ContestDto, 'status'>): string {
  return contest.status === 'certified' ? 'Certified' : contest.status === 'provisional' ? 'Provisional' : 'No result';
}

function optionName(contest: ContestDto, key: string | null): string {
  if (!key) return '';
  return contest.options.find((o) => o.key === key)?.name ?? key;
}

const column = createDataTableColumnHelper<ContestDto>();
const columns = column.columns([
  column.accessor('name', {
    header: 'Contest',
    cell: (info) => (
      <Link to={paths.contest.href(info.row.original.key)} className="font-medium text-accent-700 underline hover:text-accent-900">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('kind', { header: 'Kind', cell: (info) => (info.getValue() === 'referendum' ? 'Referendum' : 'Candidates') }),
  column.accessor((row) => certificationLabel(row), {
    id: 'status',
    header: 'Result',
    cell: (info) => (
      <span className={info.row.original.status === 'certified' ? 'text-ink-900' : 'font-medium text-caution-800'}>
        {info.getValue()}
        {info.row.original.certifiedOn ? ` on ${formatDate(info.row.original.certifiedOn)}` : ''}
      </span>
    ),
  }),
  column.accessor((row) => row.validVotes ?? -1, {
    id: 'validVotes',
    header: 'Valid votes',
    sortFn: 'basic',
    cell: (info) => formatInteger(info.row.original.validVotes),
  }),
  column.accessor((row) => row.turnout ?? -1, {
    id: 'turnout',
    header: 'Turnout',
    sortFn: 'basic',
    cell: (info) => (info.row.original.turnout === null ? <span className="text-ink-500">Electorate unknown</span> : formatFraction(info.row.original.turnout)),
  }),
  column.accessor('pollCount', { header: 'Polls', sortFn: 'basic' }),
  column.accessor((row) => (row.refA && row.refB ? `${optionName(row, row.refA)} vs ${optionName(row, row.refB)}` : ''), {
    id: 'reference',
    header: 'Reference pair (A vs B)',
    cell: (info) => info.getValue() || <span className="text-ink-500">Needs a result</span>,
  }),
]);

/** The contests of one election with their certification state, turnout and poll counts. */
export function ElectionContestsTable({ contests }: { contests: ContestDto[] }) {
  return (
    <DataTable
      caption="Contests of this election"
      columns={columns}
      data={contests}
      getRowId={(row) => row.key}
      searchLabel="Search contests"
      emptyMessage="This election has no contests yet."
    />
  );
}
