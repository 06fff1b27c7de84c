import type { ImportRowError } from '@veracast/shared-types';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';

const column = createDataTableColumnHelper<ImportRowError>();
const columns = column.columns([
  column.accessor('row', { header: 'Row', sortFn: 'basic', cell: (info) => (info.getValue() === 0 ? 'File' : info.getValue()) }),
  column.accessor('column', { header: 'Column', cell: (info) => <code className="font-mono text-xs">{info.getValue() || '—'}</code> }),
  column.accessor('code', { header: 'Rule', cell: (info) => <code className="font-mono text-xs">{info.getValue()}</code> }),
  column.accessor('message', { header: 'Problem', enableSorting: false }),
]);

/** Every row error: the spreadsheet row, the column, the rule it broke and what was wrong. */
export function RowErrorsTable({ errors, caption = 'Row errors' }: { errors: ImportRowError[]; caption?: string }) {
  return (
    <DataTable
      caption={caption}
      columns={columns}
      data={errors}
      getRowId={(e) => `${e.row}:${e.column}:${e.code}:${e.message}`}
      searchLabel="Search the row errors"
      pageSize={25}
      emptyMessage="No row errors."
    />
  );
}
