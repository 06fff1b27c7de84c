import type { ReactNode } from 'react';
import { useChartExport } from '../../../components/charts';
import { Alert, Button, Card } from '../../../components/ui';
import { downloadCsv, toCsv, type CsvColumn } from '../../../lib/csv';
import { safeFilename } from '../../../lib/download';
import { downloadPng, downloadSvg } from '../../../lib/svg-export';

export interface ChartFigureProps<Row> {
  title: string;
  /** One line: what the chart measures. */
  explanation: ReactNode;
  /** Base of the downloaded files' names. */
  filename: string;
  /** The chart; null when there is nothing to draw (then `emptyMessage` shows). */
  chart: ReactNode | null;
  emptyMessage?: ReactNode;
  /** Words under the chart saying what it means for this election. */
  meaning?: ReactNode;
  /** Thin-data cautions. */
  cautions?: readonly string[];
  /** The table alternative of the chart. */
  table: ReactNode;
  csvRows: readonly Row[];
  csvColumns: readonly CsvColumn<Row>[];
  headingLevel?: 2 | 3;
  /** Controls shown above the chart (e.g. a measure switch). */
  controls?: ReactNode;
}

/**
 * A chart in a card: a one-line explanation, SVG / PNG / CSV downloads, the chart, what it
 * means, cautions, and the same data as a table.
 */
export function ChartFigure<Row>({
  title,
  explanation,
  filename,
  chart,
  emptyMessage,
  meaning,
  cautions = [],
  table,
  csvRows,
  csvColumns,
  headingLevel = 3,
  controls,
}: ChartFigureProps<Row>) {
  const { ref: chartRef, failure, run, withSvg } = useChartExport();
  const base = safeFilename(filename);

  function download(kind: 'svg' | 'png' | 'csv') {
    if (kind === 'csv') return run(() => downloadCsv(toCsv(csvRows, csvColumns), `${base}.csv`));
    return withSvg((svg) => (kind === 'svg' ? downloadSvg(svg, `${base}.svg`) : downloadPng(svg, `${base}.png`)));
  }

  const hasChart = chart !== null;
  return (
    <Card
      title={title}
      headingLevel={headingLevel}
      description={explanation}
      actions={
        <div className="flex flex-wrap items-center gap-1.5" role="group" aria-label={`Downloads: ${title}`}>
          {hasChart && (
            <>
              <Button variant="secondary" size="sm" onClick={() => void download('svg')} aria-label={`Download ${title} as SVG`}>
                SVG
              </Button>
              <Button variant="secondary" size="sm" onClick={() => void download('png')} aria-label={`Download ${title} as PNG`}>
                PNG
              </Button>
            </>
          )}
          <Button variant="secondary" size="sm" onClick={() => void download('csv')} aria-label={`Download the data of ${title} as CSV`}>
            CSV
          </Button>
        </div>
      }
    >
      <div className="space-y-4">
        {failure && <Alert tone="danger">{failure}</Alert>}
        {controls}
        {hasChart ? (
          <div ref={chartRef} className="w-full">
            {chart}
          </div>
        ) : (
          <div className="rounded-md border border-dashed border-ink-300 px-4 py-6 text-center text-ink-700">{emptyMessage}</div>
        )}
        {meaning && <div className="max-w-3xl text-sm text-ink-800 [&_p+p]:mt-2">{meaning}</div>}
        {cautions.length > 0 && (
          <Alert tone="caution" title="Read with care">
            <ul className="list-disc space-y-1 pl-4">
              {cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          </Alert>
        )}
        <details className="rounded-md border border-ink-200">
          <summary className="cursor-pointer px-3 py-2 text-sm font-medium text-accent-800 hover:bg-ink-50">
            Table of the data<span className="sr-only">: {title}</span>
          </summary>
          <div className="p-3">{table}</div>
        </details>
      </div>
    </Card>
  );
}
