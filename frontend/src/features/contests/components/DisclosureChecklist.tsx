import { DISCLOSURE_ITEMS, DISCLOSURE_LABELS, type PollDto } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { DataTable, createDataTableColumnHelper, type DataTableColumn } from '../../../components/ui';
import { paths } from '../../../lib/paths';
import { formatPercent } from '../../../lib/format';

function Present({ present }: { present: boolean }) {
  return present ? (
    <span className="text-ink-900">
      <span aria-hidden="true">✓ </span>Yes
    </span>
  ) : (
    <span className="text-caution-800">
      <span aria-hidden="true">✕ </span>No
    </span>
  );
}

const column = createDataTableColumnHelper<PollDto>();
const columns: DataTableColumn<PollDto>[] = [
  column.accessor('key', {
    header: 'Poll',
    cell: (info) => (
      <Link to={paths.poll.href(info.getValue())} className="font-mono text-xs whitespace-nowrap text-accent-700 underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('pollster', { header: 'Pollster' }),
  column.accessor((row) => row.disclosure.completeness, {
    id: 'completeness',
    header: 'Completeness',
    sortFn: 'basic',
    cell: (info) => formatPercent(info.getValue()),
  }),
  ...DISCLOSURE_ITEMS.map((item) =>
    column.accessor((row) => (row.disclosure.items[item] ? 'yes' : 'no'), {
      id: item,
      header: DISCLOSURE_LABELS[item],
      cell: (info) => <Present present={info.row.original.disclosure.items[item]} />,
    }),
  ),
];

/**
 * Which items of a published poll's standard disclosure each poll carries, and the share of the ten
 * it carries. Disclosure says what a poll told its readers, not how accurate it was.
 */
export function DisclosureChecklist({ polls, caption }: { polls: PollDto[]; caption: string }) {
  return (
    <DataTable
      caption={caption}
      columns={columns}
      data={polls}
      getRowId={(row) => row.key}
      searchLabel="Search the disclosure checklist"
      initialSorting={[{ id: 'completeness', desc: false }]}
      pageSize={10}
      emptyMessage="No polls."
    />
  );
}
