import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createPaginatedRowModel,
  createSortedRowModel,
  filterFn_includesString,
  globalFilteringFeature,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import { useId, type ReactNode } from 'react';
import { cn } from '../../lib/cn';
import { Button } from './Button';

/** The features every DataTable has: client-side sorting, a text search and paging. */
export const dataTableFeatures = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, datetime: sortFn_datetime, basic: sortFn_basic },
  columnFilteringFeature,
  globalFilteringFeature,
  filteredRowModel: createFilteredRowModel(),
  filterFns: { includesString: filterFn_includesString },
  rowPaginationFeature,
  paginatedRowModel: createPaginatedRowModel(),
});
export type DataTableFeatures = typeof dataTableFeatures;

// `any` is the value type of a heterogeneous column list, as the helper's own `columns()` returns.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type DataTableColumn<Row extends RowData> = ColumnDef<DataTableFeatures, Row, any>;

/** A column helper typed for DataTable; define columns at module scope so they stay stable. */
export function createDataTableColumnHelper<Row extends RowData>() {
  return createColumnHelper<DataTableFeatures, Row>();
}

export interface DataTableProps<Row extends RowData> {
  /** Stable column list (module scope or memoised). */
  columns: DataTableColumn<Row>[];
  /** Stable rows; pass a module-level empty array rather than a fresh `[]`. */
  data: Row[];
  /** Names the table for assistive technology; shown above it when `showCaption` is true. */
  caption: string;
  showCaption?: boolean;
  getRowId?: (row: Row) => string;
  /** Label of the search box; without it there is no search box. */
  searchLabel?: string;
  pageSize?: number;
  initialSorting?: SortingState;
  emptyMessage?: ReactNode;
  className?: string;
}

function SortIndicator({ direction }: { direction: false | 'asc' | 'desc' }) {
  return (
    <span aria-hidden="true" className={cn('text-xs', direction ? 'text-accent-700' : 'text-ink-400')}>
      {direction === 'asc' ? '▲' : direction === 'desc' ? '▼' : '↕'}
    </span>
  );
}

/**
 * A table of rows held in the browser, sortable by clicking a column heading (announced through
 * `aria-sort`), searchable across its text columns and paged.
 */
export function DataTable<Row extends RowData>({
  columns,
  data,
  caption,
  showCaption = false,
  getRowId,
  searchLabel,
  pageSize = 20,
  initialSorting = [],
  emptyMessage = 'Nothing to show yet.',
  className,
}: DataTableProps<Row>) {
  const searchId = useId();
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data,
    getRowId: getRowId ? (row: Row) => getRowId(row) : undefined,
    globalFilterFn: 'includesString',
    // The first click sorts ascending for every column, numbers included.
    sortDescFirst: false,
    initialState: { sorting: initialSorting, pagination: { pageIndex: 0, pageSize }, globalFilter: '' },
  });

  const rows = table.getRowModel().rows;
  const filteredCount = table.getFilteredRowModel().rows.length;
  const { pageIndex, pageSize: currentPageSize } = table.state.pagination;
  const first = filteredCount === 0 ? 0 : pageIndex * currentPageSize + 1;
  const last = Math.min(filteredCount, (pageIndex + 1) * currentPageSize);
  const pageCount = Math.max(1, table.getPageCount());
  const searchValue = typeof table.state.globalFilter === 'string' ? table.state.globalFilter : '';

  return (
    <div className={cn('space-y-3', className)}>
      {searchLabel && (
        <div className="flex max-w-sm flex-col gap-1.5">
          <label htmlFor={searchId} className="text-sm font-medium text-ink-800">
            {searchLabel}
          </label>
          <input
            id={searchId}
            type="search"
            value={searchValue}
            onChange={(event) => table.setGlobalFilter(event.target.value)}
            className="h-9 rounded-md border border-ink-300 bg-white px-3 text-sm shadow-sm focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-accent-600"
          />
        </div>
      )}
      <div className="overflow-x-auto rounded-lg border border-ink-200 bg-white">
        <table className="min-w-full divide-y divide-ink-200 text-sm">
          <caption className={showCaption ? 'px-4 py-2 text-left font-medium text-ink-800' : 'sr-only'}>
            {caption}
          </caption>
          <thead className="bg-ink-100">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : canSort ? 'none' : undefined}
                      className="px-4 py-2.5 text-left font-semibold whitespace-nowrap text-ink-700"
                    >
                      {header.isPlaceholder ? null : canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="-mx-1 inline-flex items-center gap-1.5 rounded px-1 hover:text-ink-950 focus-visible:outline-2 focus-visible:outline-accent-600"
                        >
                          <table.FlexRender header={header} />
                          <SortIndicator direction={sorted} />
                        </button>
                      ) : (
                        <table.FlexRender header={header} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-ink-100">
            {rows.length === 0 ? (
              <tr>
                <td colSpan={table.getAllLeafColumns().length} className="px-4 py-8 text-center text-ink-600">
                  {filteredCount === 0 && searchValue ? 'No rows match the search.' : emptyMessage}
                </td>
              </tr>
            ) : (
              rows.map((row) => (
                <tr key={row.id} className="hover:bg-ink-50">
                  {row.getAllCells().map((cell) => (
                    <td key={cell.id} className="px-4 py-2.5 align-middle text-ink-800">
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3 text-sm text-ink-600">
        <p aria-live="polite">
          {filteredCount === 0 ? 'No rows' : `Rows ${first}–${last} of ${filteredCount}`}
        </p>
        {pageCount > 1 && (
          <nav aria-label={`Pages of ${caption}`} className="flex items-center gap-2">
            <Button variant="secondary" size="sm" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
              Previous page
            </Button>
            <span>
              Page {pageIndex + 1} of {pageCount}
            </span>
            <Button variant="secondary" size="sm" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
              Next page
            </Button>
          </nav>
        )}
      </div>
    </div>
  );
}
