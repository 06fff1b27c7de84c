import type { ImportRecord } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { Alert, DataTable, LoadingState, createDataTableColumnHelper } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDateTime } from '../../../utils/format';
import { importErrorsCsvUrl, useImports } from '../api/list-imports';

export const IMPORT_STATUS_LABELS: Record<ImportRecord['status'], string> = {
  committed: 'Imported',
  dry_run: 'Dry run',
  failed: 'Refused (errors)',
};

const column = createDataTableColumnHelper<ImportRecord>();
const columns = column.columns([
  column.accessor('id', {
    header: 'Record',
    sortFn: 'basic',
    cell: (info) => (
      <Link to={paths.importRecord.href(info.getValue())} className="font-medium text-accent-700 underline">
        #{info.getValue()}
      </Link>
    ),
  }),
  column.accessor('createdAt', {
    header: 'When',
    sortFn: 'datetime',
    cell: (info) => <span className="whitespace-nowrap">{formatDateTime(info.getValue())}</span>,
  }),
  column.accessor((row) => row.user ?? 'Unknown', { id: 'user', header: 'Who' }),
  column.accessor((row) => (row.kind === 'polls' ? 'Polls' : 'Results'), { id: 'kind', header: 'Kind' }),
  column.accessor('fileName', { header: 'File', cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span> }),
  column.accessor((row) => IMPORT_STATUS_LABELS[row.status] + (row.validOnly ? ', valid rows only' : ''), { id: 'status', header: 'Outcome' }),
  column.accessor('rows', { header: 'Rows', sortFn: 'basic' }),
  column.accessor('created', { header: 'Created', sortFn: 'basic' }),
  column.accessor('updated', { header: 'Updated', sortFn: 'basic' }),
  column.accessor('unchanged', { header: 'Unchanged', sortFn: 'basic' }),
  column.accessor('skipped', { header: 'Skipped', sortFn: 'basic' }),
  column.accessor('errorCount', {
    header: 'Errors',
    sortFn: 'basic',
    cell: (info) =>
      info.getValue() === 0 ? (
        '0'
      ) : (
        <span className="inline-flex items-center gap-2">
          <span>{info.getValue()}</span>
          <a href={importErrorsCsvUrl(info.row.original.id)} download className="text-accent-700 underline" aria-label={`Download the errors of import ${info.row.original.id} as CSV`}>
            CSV
          </a>
        </span>
      ),
  }),
]);

/** Every import with who ran it, when, its counts and its errors. */
export function ImportsTable() {
  const imports = useImports();
  if (imports.isPending) return <LoadingState label="Loading imports…" />;
  if (imports.isError) return <Alert tone="danger">{describeError(imports.error)}</Alert>;
  return (
    <DataTable
      caption="Imports"
      columns={columns}
      data={imports.data.items}
      getRowId={(row) => String(row.id)}
      searchLabel="Search imports"
      initialSorting={[{ id: 'id', desc: true }]}
      pageSize={15}
      emptyMessage="Nothing has been imported yet."
    />
  );
}
