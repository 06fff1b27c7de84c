import { useState, type ReactNode } from 'react';
import type { Breakdown, BreakdownBin } from '../api/types';
import { formatInterval, formatNumber, formatSigned } from '../../../lib/format';
import { BinTable, binCsvRows } from './BinTable';
import { ChartFigure } from './chart/ChartFigure';
import { DotIntervalChart, dotItems, type DotSeries } from './chart/DotIntervalChart';
import { MEASURE_LABELS, MeasureToggle, type Measure } from './MeasureToggle';

export interface CategoryBreakdownFigureProps {
  title: string;
  explanation: ReactNode;
  note?: ReactNode;
  breakdown: Breakdown | null;
  /** Header of the group column, e.g. "Population". */
  labelHeader: string;
  /** How a group is named on screen (e.g. `lv` → "Likely voters"). */
  labelOf?: (bin: BreakdownBin) => string;
  defaultMeasure?: Measure;
  /** Shown instead of the chart when the breakdown could not be computed. */
  emptyText?: string;
}

function seriesOf(bins: readonly BreakdownBin[], measure: Measure, name: (b: BreakdownBin) => string): DotSeries {
  return {
    key: measure,
    label: MEASURE_LABELS[measure],
    shape: measure === 'abs' ? 'square' : 'diamond',
    color: measure === 'abs' ? 'primary' : 'secondary',
    points: bins.map((b) => ({
      category: name(b),
      value: measure === 'abs' ? b.meanAbs : b.meanSigned,
      lo: measure === 'abs' ? (b.absInterval?.[0] ?? null) : b.lo,
      hi: measure === 'abs' ? (b.absInterval?.[1] ?? null) : b.hi,
    })),
  };
}

/** One categorical breakdown (population, mode, sponsor, undecided share): points with whiskers and a table. */
export function CategoryBreakdownFigure({ title, explanation, note, breakdown, labelHeader, labelOf = (b) => b.label, defaultMeasure = 'abs', emptyText }: CategoryBreakdownFigureProps) {
  const [measure, setMeasure] = useState<Measure>(defaultMeasure);
  if (!breakdown || breakdown.bins.length === 0) {
    return (
      <section aria-label={title} className="rounded-lg border border-dashed border-ink-300 bg-white px-5 py-4">
        <h3 className="text-base font-semibold text-ink-900">{title}</h3>
        <p className="mt-1 text-sm text-ink-600">{emptyText ?? 'Not enough polls to break the error down this way.'}</p>
      </section>
    );
  }
  const bins = breakdown.bins;
  const name = (b: BreakdownBin) => `${labelOf(b)} (n = ${b.n})`;
  const series = [seriesOf(bins, measure, name)];
  const categories = bins.map(name);
  const points = dotItems(categories, series).map(
    (item) =>
      `${item.category}: ${MEASURE_LABELS[measure].toLowerCase()} ${measure === 'abs' ? formatNumber(item.point.value) : formatSigned(item.point.value)} points, 95% interval ${
        item.point.lo !== null && item.point.hi !== null ? formatInterval([item.point.lo, item.point.hi]) : 'not available'
      }.`,
  );
  return (
    <ChartFigure
      title={title}
      explanation={explanation}
      note={note}
      summary={`${MEASURE_LABELS[measure]} in points for ${bins.length} groups, each with its 95% interval.`}
      points={points}
      controls={<MeasureToggle value={measure} onChange={setMeasure} chart={title} />}
      table={<BinTable caption={`${title}: the numbers`} labelHeader={labelHeader} bins={bins} labelOf={labelOf} excluded={breakdown.excluded} />}
      downloads={[{ label: 'CSV', rows: binCsvRows(bins, labelHeader.toLowerCase().replace(/\s+/g, '_'), labelOf) }]}
    >
      {({ width, active, setActive }) => (
        <DotIntervalChart
          width={width}
          categories={categories}
          series={series}
          yLabel={`${MEASURE_LABELS[measure]} (points)`}
          active={active}
          setActive={setActive}
          zeroRule={measure === 'signed'}
          accessibilityLabel={title}
        />
      )}
    </ChartFigure>
  );
}
