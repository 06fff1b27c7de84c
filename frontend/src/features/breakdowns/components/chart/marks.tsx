import { DataContext, buildChartTheme, type GlyphProps } from '@visx/xychart';
import { useContext } from 'react';
import { chartPalette, type ChartPalette } from './palette';

/** Shapes of the series: each series differs by shape as well as by colour. */
export type MarkShape = 'circle' | 'ring' | 'diamond' | 'square' | 'triangle';

export function Shape({ shape, x, y, size = 7, color }: { shape: MarkShape; x: number; y: number; size?: number; color: string }) {
  const r = size / 2;
  const white = chartPalette().white;
  switch (shape) {
    case 'ring':
      return <circle cx={x} cy={y} r={r} fill={white} stroke={color} strokeWidth={1.5} />;
    case 'diamond':
      return <path d={`M${x},${y - r * 1.3}L${x + r * 1.3},${y}L${x},${y + r * 1.3}L${x - r * 1.3},${y}Z`} fill={color} stroke={white} strokeWidth={1} />;
    case 'square':
      return <rect x={x - r} y={y - r} width={size} height={size} fill={color} stroke={white} strokeWidth={1} />;
    case 'triangle':
      return <path d={`M${x},${y - r * 1.3}L${x + r * 1.2},${y + r}L${x - r * 1.2},${y + r}Z`} fill={color} stroke={white} strokeWidth={1} />;
    default:
      return <circle cx={x} cy={y} r={r} fill={color} stroke={white} strokeWidth={1} />;
  }
}

/** A `renderGlyph` for GlyphSeries that draws `shape`, shifted sideways by `offset` pixels. */
export function glyphRenderer<D extends object>(shape: MarkShape, color: string, offset = 0, size = 7) {
  return function Glyph({ x, y }: GlyphProps<D>) {
    return <Shape shape={shape} x={x + offset} y={y} size={size} color={color} />;
  };
}

export function chartTheme(palette: ChartPalette) {
  return buildChartTheme({
    backgroundColor: palette.white,
    colors: [palette.primary, palette.secondary, palette.faint],
    gridColor: palette.grid,
    gridColorDark: palette.axis,
    tickLength: 4,
    svgLabelSmall: { fill: palette.muted, fontSize: 11, fontFamily: 'inherit' },
    svgLabelBig: { fill: palette.text, fontSize: 12, fontFamily: 'inherit' },
    xAxisLineStyles: { stroke: palette.axis },
    yAxisLineStyles: { stroke: palette.axis },
    xTickLineStyles: { stroke: palette.axis },
    yTickLineStyles: { stroke: palette.axis },
  });
}

type AnyScale = ((value: never) => number | undefined) & { bandwidth?: () => number };

/** Pixel position of a data value on a scale (the band centre for a band scale); null when off-scale. */
export function scaled(scale: unknown, value: unknown): number | null {
  if (typeof scale !== 'function') return null;
  const s = scale as AnyScale;
  const v = (s as (value: unknown) => number | undefined)(value);
  if (v === undefined || v === null || Number.isNaN(v)) return null;
  return v + (typeof s.bandwidth === 'function' ? s.bandwidth() / 2 : 0);
}

function useChartScales() {
  const { xScale, yScale, margin, width, height } = useContext(DataContext);
  return { xScale, yScale, margin, width: width ?? 0, height: height ?? 0 };
}

export interface IntervalMarksProps<D> {
  data: readonly D[];
  x: (d: D) => unknown;
  lo: (d: D) => number | null;
  hi: (d: D) => number | null;
  color: string;
  /** Sideways shift in pixels (for series side by side in one band). */
  offset?: number;
}

/** Vertical interval whiskers with end caps. */
export function IntervalMarks<D>({ data, x, lo, hi, color, offset = 0 }: IntervalMarksProps<D>) {
  const { xScale, yScale } = useChartScales();
  return (
    <g stroke={color} strokeWidth={1.75} strokeLinecap="round">
      {data.map((d, i) => {
        const l = lo(d);
        const h = hi(d);
        const px = scaled(xScale, x(d));
        if (l === null || h === null || px === null) return null;
        const y0 = scaled(yScale, l);
        const y1 = scaled(yScale, h);
        if (y0 === null || y1 === null) return null;
        const cx = px + offset;
        return (
          <g key={i}>
            <line x1={cx} x2={cx} y1={y0} y2={y1} />
            <line x1={cx - 4} x2={cx + 4} y1={y0} y2={y0} />
            <line x1={cx - 4} x2={cx + 4} y1={y1} y2={y1} />
          </g>
        );
      })}
    </g>
  );
}

/** Horizontal segments from x0 to x1 at height y (e.g. a bin's mean across the bin). */
export function SegmentMarks<D>({ data, x0, x1, y, color, width = 2.5 }: { data: readonly D[]; x0: (d: D) => number; x1: (d: D) => number; y: (d: D) => number | null; color: string; width?: number }) {
  const { xScale, yScale } = useChartScales();
  return (
    <g stroke={color} strokeWidth={width} strokeLinecap="round">
      {data.map((d, i) => {
        const v = y(d);
        if (v === null) return null;
        const a = scaled(xScale, x0(d));
        const b = scaled(xScale, x1(d));
        const py = scaled(yScale, v);
        if (a === null || b === null || py === null) return null;
        return <line key={i} x1={a} x2={b} y1={py} y2={py} />;
      })}
    </g>
  );
}

/** A straight line through data points (a reference such as y = x, or y = 0 across the plot). */
export function DataLine({ points, color, dash, width = 1.25 }: { points: readonly { x: unknown; y: number }[]; color: string; dash?: string; width?: number }) {
  const { xScale, yScale } = useChartScales();
  const coords = points
    .map((p) => [scaled(xScale, p.x), scaled(yScale, p.y)] as const)
    .filter((c): c is readonly [number, number] => c[0] !== null && c[1] !== null);
  if (coords.length < 2) return null;
  return <polyline points={coords.map((c) => c.join(',')).join(' ')} fill="none" stroke={color} strokeWidth={width} strokeDasharray={dash} />;
}

/** A horizontal rule across the whole plot at `y` (e.g. zero error). */
export function HorizontalRule({ y, color, dash = '4 3', label }: { y: number; color: string; dash?: string; label?: string }) {
  const { yScale, margin, width } = useChartScales();
  const py = scaled(yScale, y);
  if (py === null || !margin) return null;
  return (
    <g>
      <line x1={margin.left} x2={width - margin.right} y1={py} y2={py} stroke={color} strokeDasharray={dash} strokeWidth={1} />
      {label && (
        <text x={width - margin.right - 2} y={py - 4} textAnchor="end" fontSize={10} fill={color}>
          {label}
        </text>
      )}
    </g>
  );
}

/** The ring that marks the item being read with the keyboard or pointed at. */
export function ActiveRing({ x, y, offset = 0, color }: { x: unknown; y: number | null; offset?: number; color: string }) {
  const { xScale, yScale } = useChartScales();
  if (y === null) return null;
  const px = scaled(xScale, x);
  const py = scaled(yScale, y);
  if (px === null || py === null) return null;
  return <circle cx={px + offset} cy={py} r={9} fill="none" stroke={color} strokeWidth={2} />;
}

export interface LegendItem {
  label: string;
  shape: MarkShape | 'line' | 'dashed' | 'whisker' | 'bar';
  color: string;
}

/** A legend drawn inside the SVG (top left), so that a saved picture explains itself. */
export function SvgLegend({ items, color }: { items: readonly LegendItem[]; color: string }) {
  const { margin } = useChartScales();
  if (!margin) return null;
  let x = margin.left;
  return (
    <g transform="translate(0, 12)" fontSize={11} fill={color}>
      {items.map((item) => {
        const start = x;
        x += 22 + item.label.length * 6.2 + 14;
        return (
          <g key={item.label} transform={`translate(${start}, 0)`}>
            {item.shape === 'line' || item.shape === 'dashed' ? (
              <line x1={0} x2={16} y1={0} y2={0} stroke={item.color} strokeWidth={2} strokeDasharray={item.shape === 'dashed' ? '4 3' : undefined} />
            ) : item.shape === 'whisker' ? (
              <g stroke={item.color} strokeWidth={1.75}>
                <line x1={8} x2={8} y1={-6} y2={6} />
                <line x1={4} x2={12} y1={-6} y2={-6} />
                <line x1={4} x2={12} y1={6} y2={6} />
              </g>
            ) : item.shape === 'bar' ? (
              <rect x={2} y={-5} width={12} height={10} fill={item.color} />
            ) : (
              <Shape shape={item.shape} x={8} y={0} size={8} color={item.color} />
            )}
            <text x={22} y={4}>
              {item.label}
            </text>
          </g>
        );
      })}
    </g>
  );
}

/** Lower and upper ends of a y axis that holds every value, padded by 8% and, when asked, holding 0. */
export function paddedDomain(values: readonly (number | null | undefined)[], options: { includeZero?: boolean } = {}): [number, number] {
  const finite = values.filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  if (options.includeZero) finite.push(0);
  if (finite.length === 0) return [0, 1];
  const lo = Math.min(...finite);
  const hi = Math.max(...finite);
  const pad = (hi - lo || Math.abs(hi) || 1) * 0.08;
  return [lo - pad, hi + pad];
}
