import { useMemo } from 'react';
import { DataTable, createDataTableColumnHelper, type DataTableColumn } from '../../../components/ui';
import type { ParsedFile } from '../parse-file';

const PREVIEW_ROWS = 100;

interface PreviewRow {
  line: number;
  cells: string[];
}

const column = createDataTableColumnHelper<PreviewRow>();

/** The first rows of the chosen file as papaparse read them, with their spreadsheet row numbers. */
export function CsvPreview({ parsed, fileName }: { parsed: ParsedFile; fileName: string }) {
  const rows = useMemo(() => parsed.rows.slice(0, PREVIEW_ROWS).map((cells, i) => ({ line: i + 2, cells })), [parsed]);
  const columns = useMemo<DataTableColumn<PreviewRow>[]>(
    () => [
      column.accessor('line', { header: 'Row', sortFn: 'basic' }),
      ...parsed.headers.map((header, index) =>
        column.accessor((row) => row.cells[index] ?? '', {
          id: `c${index}`,
          header: header || `(column ${index + 1})`,
          cell: (info) => <span className="whitespace-nowrap">{info.getValue()}</span>,
        }),
      ),
    ],
    [parsed],
  );
  return (
    <div className="space-y-2">
      <p className="text-sm text-ink-700">
        {parsed.rows.length > PREVIEW_ROWS
          ? `The first ${PREVIEW_ROWS} of ${parsed.rows.length.toLocaleString('en-GB')} data rows.`
          : `All ${parsed.rows.length} data rows.`}{' '}
        Row numbers are as a spreadsheet shows them: the header is row 1.
      </p>
      <DataTable caption={`Preview of ${fileName}`} columns={columns} data={rows} getRowId={(r) => String(r.line)} pageSize={10} />
    </div>
  );
}
