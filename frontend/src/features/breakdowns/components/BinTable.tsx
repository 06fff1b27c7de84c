import type { ReactNode } from 'react';
import type { BreakdownBin } from '../api/types';
import { formatInterval, formatNumber, formatSigned } from '../../../lib/format';

export interface SimpleTableColumn<R> {
  header: string;
  cell: (row: R) => ReactNode;
  /** Right-aligned numbers. */
  numeric?: boolean;
}

/** A compact table for beside a chart; the first column heads each row. */
export function SimpleTable<R>({ caption, columns, rows, rowKey, footer }: { caption: string; columns: SimpleTableColumn<R>[]; rows: readonly R[]; rowKey: (row: R, index: number) => string; footer?: ReactNode }) {
  return (
    <table className="w-full text-sm">
      <caption className="pb-2 text-left text-xs font-medium text-ink-600">{caption}</caption>
      <thead>
        <tr className="border-b border-ink-200 text-ink-700">
          {columns.map((c, j) => (
            <th key={j} scope="col" className={`px-2 py-1.5 font-semibold ${c.numeric ? 'text-right' : 'text-left'}`}>
              {c.header}
            </th>
          ))}
        </tr>
      </thead>
      <tbody className="divide-y divide-ink-100">
        {rows.map((row, i) => (
          <tr key={rowKey(row, i)}>
            {columns.map((c, j) =>
              j === 0 ? (
                <th key={j} scope="row" className="px-2 py-1.5 text-left font-normal text-ink-900">
                  {c.cell(row)}
                </th>
              ) : (
                <td key={j} className={`px-2 py-1.5 text-ink-800 ${c.numeric ? 'text-right tabular-nums whitespace-nowrap' : ''}`}>
                  {c.cell(row)}
                </td>
              ),
            )}
          </tr>
        ))}
      </tbody>
      {footer && (
        <tfoot>
          <tr>
            <td colSpan={columns.length} className="px-2 pt-2 text-xs text-ink-600">
              {footer}
            </td>
          </tr>
        </tfoot>
      )}
    </table>
  );
}

function withInterval(value: string, interval: readonly [number, number] | null) {
  return (
    <>
      {value}
      <span className="block text-xs text-ink-500">{interval ? `(${formatInterval(interval)})` : value === '—' ? '' : '(n < 2: none)'}</span>
    </>
  );
}

/** The standard table of a breakdown: polls, mean absolute and mean signed error with 95% intervals. */
export function BinTable({ caption, labelHeader, bins, labelOf = (b) => b.label, excluded }: { caption: string; labelHeader: string; bins: readonly BreakdownBin[]; labelOf?: (bin: BreakdownBin) => string; excluded?: number }) {
  return (
    <SimpleTable
      caption={caption}
      rows={bins}
      rowKey={(b) => b.label}
      footer={excluded ? `${excluded} poll${excluded === 1 ? '' : 's'} left out: value unknown or outside every group.` : undefined}
      columns={[
        { header: labelHeader, cell: (b) => labelOf(b) },
        { header: 'Polls', numeric: true, cell: (b) => b.n },
        { header: 'Mean abs. error (95% interval)', numeric: true, cell: (b) => withInterval(formatNumber(b.meanAbs), b.absInterval) },
        {
          header: 'Mean signed error (95% interval)',
          numeric: true,
          cell: (b) => withInterval(formatSigned(b.meanSigned), b.lo !== null && b.hi !== null ? [b.lo, b.hi] : null),
        },
      ]}
    />
  );
}

/** Rows of a breakdown for its CSV file. */
export function binCsvRows(bins: readonly BreakdownBin[], labelHeader: string, labelOf: (bin: BreakdownBin) => string = (b) => b.label) {
  return bins.map((b) => ({
    [labelHeader]: labelOf(b),
    polls: b.n,
    meanAbsError: b.meanAbs,
    meanAbsErrorLo: b.absInterval?.[0] ?? null,
    meanAbsErrorHi: b.absInterval?.[1] ?? null,
    meanSignedError: b.meanSigned,
    meanSignedErrorLo: b.lo,
    meanSignedErrorHi: b.hi,
  }));
}
