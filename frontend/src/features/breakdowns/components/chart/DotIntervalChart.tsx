import { Axis, GlyphSeries, Grid, XYChart } from '@visx/xychart';
import { ActiveRing, HorizontalRule, IntervalMarks, SvgLegend, chartTheme, glyphRenderer, paddedDomain, type MarkShape } from './marks';
import { chartPalette, type ChartPalette } from './palette';

export interface DotPoint {
  category: string;
  value: number | null;
  lo: number | null;
  hi: number | null;
}

export interface DotSeries {
  key: string;
  label: string;
  shape: MarkShape;
  color: keyof ChartPalette;
  points: DotPoint[];
}

export interface DotItem {
  category: string;
  series: DotSeries;
  point: DotPoint;
}

/** The items the arrow keys step through: each category, then each series within it. */
export function dotItems(categories: readonly string[], series: readonly DotSeries[]): DotItem[] {
  return categories.flatMap((category) =>
    series.flatMap((s) => {
      const point = s.points.find((p) => p.category === category);
      return point && point.value !== null ? [{ category, series: s, point }] : [];
    }),
  );
}

export interface DotIntervalChartProps {
  width: number;
  height?: number;
  categories: string[];
  series: DotSeries[];
  yLabel: string;
  xLabel?: string;
  active: number | null;
  setActive: (index: number | null) => void;
  /** Draw a dashed rule at 0 (for signed errors). */
  zeroRule?: boolean;
  accessibilityLabel: string;
}

const SPACING = 16;

/** Points with 95% whiskers per category, several series side by side; a legend inside the SVG. */
export function DotIntervalChart({ width, height = 300, categories, series, yLabel, xLabel, active, setActive, zeroRule, accessibilityLabel }: DotIntervalChartProps) {
  const palette = chartPalette();
  const items = dotItems(categories, series);
  const domain = paddedDomain(
    series.flatMap((s) => s.points.flatMap((p) => [p.value, p.lo, p.hi])),
    { includeZero: true },
  );
  const offsetOf = (index: number) => (index - (series.length - 1) / 2) * SPACING;
  const activeItem = active !== null ? items[active] : undefined;
  const margin = { top: 32, right: 16, bottom: 84, left: 56 };
  // Category names wrap within their band rather than overlap.
  const band = Math.max(48, (width - margin.left - margin.right) / Math.max(1, categories.length) - 6);

  return (
    <XYChart
      width={width}
      height={height}
      margin={margin}
      theme={chartTheme(palette)}
      xScale={{ type: 'band', domain: categories, paddingInner: 0.3, paddingOuter: 0.2 }}
      yScale={{ type: 'linear', domain, nice: true, zero: false }}
      accessibilityLabel={accessibilityLabel}
      onPointerMove={({ key, datum }) => {
        const point = datum as DotPoint;
        const index = items.findIndex((item) => item.series.key === key && item.category === point.category);
        setActive(index >= 0 ? index : null);
      }}
      onPointerOut={() => setActive(null)}
    >
      <Grid columns={false} numTicks={5} />
      <Axis
        orientation="bottom"
        label={xLabel}
        labelOffset={40}
        tickLabelProps={() => ({ width: band, verticalAnchor: 'start', textAnchor: 'middle', fontSize: 10, dy: '0.25em' })}
      />
      <Axis orientation="left" label={yLabel} numTicks={5} />
      {zeroRule && <HorizontalRule y={0} color={palette.axis} />}
      {series.map((s, i) => (
        <IntervalMarks
          key={`interval-${s.key}`}
          data={s.points.filter((p) => p.value !== null)}
          x={(p) => p.category}
          lo={(p) => p.lo}
          hi={(p) => p.hi}
          color={palette[s.color]}
          offset={offsetOf(i)}
        />
      ))}
      {series.map((s, i) => (
        <GlyphSeries
          key={s.key}
          dataKey={s.key}
          data={s.points.filter((p) => p.value !== null)}
          xAccessor={(p) => p.category}
          yAccessor={(p) => p.value as number}
          renderGlyph={glyphRenderer<DotPoint>(s.shape, palette[s.color], offsetOf(i), 9)}
        />
      ))}
      {activeItem && (
        <ActiveRing x={activeItem.category} y={activeItem.point.value} offset={offsetOf(series.indexOf(activeItem.series))} color={palette.text} />
      )}
      <SvgLegend
        color={palette.text}
        items={[
          ...series.map((s) => ({ label: s.label, shape: s.shape, color: palette[s.color] })),
          ...(series.some((s) => s.points.some((p) => p.lo !== null)) ? [{ label: '95% interval', shape: 'whisker' as const, color: palette.muted }] : []),
        ]}
      />
    </XYChart>
  );
}
