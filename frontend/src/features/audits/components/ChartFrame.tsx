import { useId, type ReactNode } from 'react';
import { useChartExport } from '../../../components/charts';
import { Alert, Button } from '../../../components/ui';
import { downloadCsv } from '../../../lib/csv';
import { downloadPng, downloadSvg } from '../../../lib/svg-export';
import type { MethodAnchor } from '../method-catalogue';
import { FormulaLink } from './FormulaLink';

export interface ChartFrameProps {
  title: string;
  /** What the chart measures, in one line. */
  explanation: ReactNode;
  formulaAnchor: MethodAnchor;
  /** File name without extension for the downloads. */
  filename: string;
  /** The chart's data as CSV text. */
  csv: () => string;
  /** The chart. */
  children: ReactNode;
  /** The same data as a table, for readers who cannot use the chart. */
  table: ReactNode;
  /** Notes under the chart: counts left out, orientation. */
  footnote?: ReactNode;
}

/**
 * A chart with its heading, a one-line explanation and formula link, downloads of the picture
 * (SVG, PNG) and of the data (CSV), and its table alternative in a disclosure.
 */
export function ChartFrame({ title, explanation, formulaAnchor, filename, csv, children, table, footnote }: ChartFrameProps) {
  const headingId = useId();
  const { ref: chartRef, failure, run, withSvg } = useChartExport({ missingMessage: 'The chart is not drawn yet; try again in a moment.' });

  return (
    <section aria-labelledby={headingId} className="rounded-lg border border-ink-200 bg-white shadow-sm">
      <header className="flex flex-wrap items-start justify-between gap-3 border-b border-ink-200 px-5 py-4">
        <div className="min-w-0 max-w-2xl">
          <h3 id={headingId} className="text-base font-semibold text-ink-900">
            {title}
          </h3>
          <p className="mt-1 text-sm text-ink-600">
            {explanation} <FormulaLink anchor={formulaAnchor} />
          </p>
        </div>
        <div role="group" aria-label={`Download ${title}`} className="flex shrink-0 items-center gap-2">
          <span className="text-sm text-ink-600" aria-hidden="true">
            Download
          </span>
          <Button
            variant="secondary"
            size="sm"
            onClick={() => void withSvg((svg) => downloadSvg(svg, `${filename}.svg`))}
          >
            SVG
          </Button>
          <Button
            variant="secondary"
            size="sm"
            onClick={() => void withSvg((svg) => downloadPng(svg, `${filename}.png`))}
          >
            PNG
          </Button>
          <Button variant="secondary" size="sm" onClick={() => void run(() => downloadCsv(csv(), `${filename}.csv`))}>
            CSV
          </Button>
        </div>
      </header>
      <div className="space-y-3 px-5 py-4">
        {failure && <Alert tone="danger">{failure}</Alert>}
        <div ref={chartRef} className="relative h-80 w-full">
          {children}
        </div>
        {footnote && <p className="text-sm text-ink-600">{footnote}</p>}
        <details className="rounded-md border border-ink-200">
          <summary className="cursor-pointer px-3 py-2 text-sm font-medium text-ink-800">Show the data as a table</summary>
          <div className="max-h-96 overflow-auto border-t border-ink-200">{table}</div>
        </details>
      </div>
    </section>
  );
}
