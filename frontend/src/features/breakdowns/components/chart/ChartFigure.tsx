import { useId, useState, type KeyboardEvent, type ReactNode } from 'react';
import { useChartExport } from '../../../../components/charts';
import { Button } from '../../../../components/ui';
import { cn } from '../../../../lib/cn';
import { downloadCsv, recordsToCsv, type CsvRow } from '../../../../lib/csv';
import { downloadPng, downloadSvg, fileSlug } from './download';
import { useElementWidth } from './useElementWidth';

export interface ChartRenderContext {
  /** Width available to the chart, in pixels. */
  width: number;
  /** Index (into `points`) of the item being read with the keyboard or pointed at; null for none. */
  active: number | null;
  setActive: (index: number | null) => void;
}

export interface ChartDownload {
  /** Button text after "Download", e.g. "CSV" or "points CSV". */
  label: string;
  rows: CsvRow[];
  columns?: string[];
}

export interface ChartFigureProps {
  title: string;
  /** One line: what the chart measures. */
  explanation: ReactNode;
  /** Further caveats under the explanation. */
  note?: ReactNode;
  /** Read out instead of the picture: what the chart shows, in a sentence. */
  summary: string;
  /** One sentence per item that the arrow keys step through. */
  points: string[];
  /** The table beside the chart: the same numbers, readable without the picture. */
  table: ReactNode;
  /** Data files; the first is the table's data. */
  downloads: ChartDownload[];
  /** Controls shown above the chart (e.g. which measure to draw). */
  controls?: ReactNode;
  /** Base of the downloaded file names; defaults to the title. */
  fileName?: string;
  children: (context: ChartRenderContext) => ReactNode;
}

/**
 * A chart with its title, one-line explanation, a table beside it, and downloads of the picture
 * (SVG, PNG) and of its data (CSV). The picture is one keyboard stop: arrow keys read the items
 * one by one in a live region and mark the item on the chart.
 */
export function ChartFigure({ title, explanation, note, summary, points, table, downloads, controls, fileName, children }: ChartFigureProps) {
  const headingId = useId();
  const explanationId = useId();
  const [measureRef, width] = useElementWidth<HTMLDivElement>();
  const { ref: chartRef, failure: problem, withSvg } = useChartExport({ missingMessage: null, fallbackMessage: 'The image could not be saved.' });
  const [active, setActive] = useState<number | null>(null);
  const base = fileSlug(fileName ?? title);
  const activeIndex = active !== null && active < points.length ? active : null;

  const saveSvg = () => void withSvg((svg) => downloadSvg(svg, title, `${base}.svg`));
  const savePng = () => void withSvg((svg) => downloadPng(svg, title, `${base}.png`));

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    if (points.length === 0) return;
    const last = points.length - 1;
    let next: number | null | undefined;
    if (event.key === 'ArrowRight' || event.key === 'ArrowDown') next = activeIndex === null ? 0 : Math.min(last, activeIndex + 1);
    else if (event.key === 'ArrowLeft' || event.key === 'ArrowUp') next = activeIndex === null ? last : Math.max(0, activeIndex - 1);
    else if (event.key === 'Home') next = 0;
    else if (event.key === 'End') next = last;
    else if (event.key === 'Escape') next = null;
    if (next === undefined) return;
    event.preventDefault();
    setActive(next);
  }

  return (
    <figure aria-labelledby={headingId} className="rounded-lg border border-ink-200 bg-white shadow-sm">
      <header className="flex flex-wrap items-start justify-between gap-3 border-b border-ink-200 px-5 py-4">
        <div className="min-w-0 max-w-3xl">
          <h3 id={headingId} className="text-base font-semibold text-ink-900">
            {title}
          </h3>
          <p id={explanationId} className="mt-1 text-sm text-ink-700">
            {explanation}
          </p>
          {note && <p className="mt-1 text-sm text-ink-600">{note}</p>}
        </div>
        <div role="group" aria-label={`Downloads of ${title}`} className="flex flex-wrap items-center gap-1.5">
          <span className="text-xs font-medium text-ink-500">Download</span>
          <Button variant="secondary" size="sm" aria-label={`Download SVG of ${title}`} onClick={saveSvg}>
            SVG
          </Button>
          <Button variant="secondary" size="sm" aria-label={`Download PNG of ${title}`} onClick={savePng}>
            PNG
          </Button>
          {downloads.map((d) => (
            <Button
              key={d.label}
              variant="secondary"
              size="sm"
              aria-label={`Download ${d.label} of ${title}`}
              onClick={() => downloadCsv(recordsToCsv(d.rows, d.columns), `${base}${d.label === 'CSV' ? '' : `-${fileSlug(d.label.replace(/csv/i, ''))}`}.csv`)}
            >
              {d.label}
            </Button>
          ))}
        </div>
      </header>
      <div className="grid gap-6 px-5 py-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="min-w-0 space-y-2">
          {controls}
          <div ref={measureRef} className="min-w-0">
            <div
              ref={chartRef}
              role="img"
              tabIndex={0}
              aria-label={`${title}. ${summary}${points.length ? ' Use the arrow keys to read the items one by one.' : ''}`}
              aria-describedby={explanationId}
              onKeyDown={onKeyDown}
              onBlur={() => setActive(null)}
              className={cn('rounded-md focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent-600')}
            >
              {children({ width, active: activeIndex, setActive })}
            </div>
          </div>
          <p aria-live="polite" className="min-h-5 text-sm text-ink-700">
            {activeIndex !== null ? `${activeIndex + 1} of ${points.length}: ${points[activeIndex]}` : ''}
          </p>
          {problem && <p className="text-sm font-medium text-danger-700">{problem}</p>}
        </div>
        <div className="min-w-0 overflow-x-auto">{table}</div>
      </div>
    </figure>
  );
}
