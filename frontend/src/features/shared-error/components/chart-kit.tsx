import { buildChartTheme, DataContext } from '@visx/xychart';
import { useContext, type ReactNode } from 'react';
import { NOT_ENOUGH_DATA } from '../lib/format';

/** Colours of the charts, from the palette in index.css (never raw values). */
export const CHART_COLOURS = {
  ink300: 'var(--color-ink-300)',
  ink400: 'var(--color-ink-400)',
  ink500: 'var(--color-ink-500)',
  ink600: 'var(--color-ink-600)',
  ink700: 'var(--color-ink-700)',
  ink900: 'var(--color-ink-900)',
  accent200: 'var(--color-accent-200)',
  accent500: 'var(--color-accent-500)',
  accent700: 'var(--color-accent-700)',
  accent900: 'var(--color-accent-900)',
  caution200: 'var(--color-caution-200)',
  caution500: 'var(--color-caution-500)',
  caution700: 'var(--color-caution-700)',
  danger700: 'var(--color-danger-700)',
} as const;

export const chartTheme = buildChartTheme({
  backgroundColor: 'transparent',
  colors: [CHART_COLOURS.accent700, CHART_COLOURS.caution700, CHART_COLOURS.ink600],
  tickLength: 4,
  gridColor: CHART_COLOURS.ink300,
  gridColorDark: CHART_COLOURS.ink500,
  svgLabelSmall: { fill: CHART_COLOURS.ink700, fontSize: 11, fontFamily: 'inherit' },
  svgLabelBig: { fill: CHART_COLOURS.ink900, fontSize: 12, fontFamily: 'inherit' },
  xAxisLineStyles: { stroke: CHART_COLOURS.ink400 },
  yAxisLineStyles: { stroke: CHART_COLOURS.ink400 },
  xTickLineStyles: { stroke: CHART_COLOURS.ink400 },
  yTickLineStyles: { stroke: CHART_COLOURS.ink400 },
});

export const Z95 = 1.959964;

type Scale = ((value: never) => number | undefined) & { bandwidth?: () => number };

export interface ChartScales {
  x: (value: number | string) => number | null;
  y: (value: number | string) => number | null;
  xBandwidth: number;
  yBandwidth: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

function wrap(scale: Scale | undefined) {
  return (value: number | string): number | null => {
    if (!scale) return null;
    const out = (scale as unknown as (v: number | string) => number | undefined)(value);
    return typeof out === 'number' && Number.isFinite(out) ? out : null;
  };
}

/** The chart's scales and inner frame, for layers drawn by hand inside an XYChart. */
export function useChartScales(): ChartScales | null {
  const ctx = useContext(DataContext);
  if (!ctx.xScale || !ctx.yScale || !ctx.margin || ctx.width === undefined || ctx.height === undefined) return null;
  const xs = ctx.xScale as unknown as Scale;
  const ys = ctx.yScale as unknown as Scale;
  return {
    x: wrap(xs),
    y: wrap(ys),
    xBandwidth: typeof xs.bandwidth === 'function' ? xs.bandwidth() : 0,
    yBandwidth: typeof ys.bandwidth === 'function' ? ys.bandwidth() : 0,
    left: ctx.margin.left,
    right: ctx.width - ctx.margin.right,
    top: ctx.margin.top,
    bottom: ctx.height - ctx.margin.bottom,
  };
}

/** A vertical reference line at x = value across the plot, with a label at the top. */
export function VerticalRule({
  value,
  label,
  dashed = false,
  strong = false,
  labelRow = 0,
  anchor = 'start',
}: {
  value: number;
  label?: string;
  dashed?: boolean;
  strong?: boolean;
  /** 0 for the first line above the plot, 1 for the second, so two labels never overlap. */
  labelRow?: 0 | 1;
  anchor?: 'start' | 'end';
}) {
  const s = useChartScales();
  const x = s?.x(value) ?? null;
  if (!s || x === null) return null;
  return (
    <g>
      <line
        x1={x}
        x2={x}
        y1={s.top}
        y2={s.bottom}
        stroke={strong ? CHART_COLOURS.ink900 : CHART_COLOURS.ink500}
        strokeWidth={strong ? 1.5 : 1}
        strokeDasharray={dashed ? '5 4' : undefined}
      />
      {label && (
        <text x={anchor === 'start' ? x + 4 : x - 4} y={s.top - 16 + 12 * labelRow} fontSize={11} textAnchor={anchor} fill={CHART_COLOURS.ink700}>
          {label}
        </text>
      )}
    </g>
  );
}

/** A horizontal reference line at y = value across the plot, with a label at the left. */
export function HorizontalRule({ value, label, dashed = false, strong = false }: { value: number; label?: string; dashed?: boolean; strong?: boolean }) {
  const s = useChartScales();
  const y = s?.y(value) ?? null;
  if (!s || y === null) return null;
  return (
    <g>
      <line
        x1={s.left}
        x2={s.right}
        y1={y}
        y2={y}
        stroke={strong ? CHART_COLOURS.ink900 : CHART_COLOURS.ink500}
        strokeWidth={strong ? 1.5 : 1}
        strokeDasharray={dashed ? '5 4' : undefined}
      />
      {label && (
        <text x={s.left + 4} y={y - 4} fontSize={11} fill={CHART_COLOURS.ink700}>
          {label}
        </text>
      )}
    </g>
  );
}

/** "not enough data" with the reason beneath, in place of a number. */
export function NotEnoughData({ reason, inline = false }: { reason: string; inline?: boolean }) {
  if (inline) {
    return (
      <span className="text-ink-600">
        {NOT_ENOUGH_DATA} <span className="text-sm">({reason})</span>
      </span>
    );
  }
  return (
    <span className="block">
      <span className="block text-base font-medium text-ink-700">{NOT_ENOUGH_DATA}</span>
      <span className="mt-0.5 block text-xs font-normal text-ink-600">{reason}</span>
    </span>
  );
}

/** A number as text, or "not enough data" with its reason. */
export function ValueOr({ text, reason, inline }: { text: string | null; reason: string; inline?: boolean }) {
  return text === null ? <NotEnoughData reason={reason} inline={inline} /> : <>{text}</>;
}

/** A table cell for a missing figure: a dash, with the reason for assistive technology and on hover. */
export function MissingCell({ reason }: { reason: string }) {
  return (
    <span title={reason}>
      <span aria-hidden="true">—</span>
      <span className="sr-only">not computed: {reason}</span>
    </span>
  );
}

/** Text for a table cell: the formatted figure or a dash with the reason. */
export function Cell({ text, reason = 'not computed' }: { text: string | null; reason?: string }): ReactNode {
  return text === null ? <MissingCell reason={reason} /> : text;
}

/** A legend entry: a shape drawn beside its words, so meaning never rests on colour alone. */
export function LegendItem({ shape, children }: { shape: ReactNode; children: ReactNode }) {
  return (
    <li className="inline-flex items-center gap-1.5">
      <svg width={18} height={14} aria-hidden="true" focusable="false">
        {shape}
      </svg>
      <span>{children}</span>
    </li>
  );
}

export function Legend({ children }: { children: ReactNode }) {
  return <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink-700">{children}</ul>;
}

/**
 * Gives a responsive XYChart its height: the chart measures its parent, which must therefore
 * have one.
 */
export function ChartBox({ height, children }: { height: number; children: ReactNode }) {
  return (
    <div className="w-full" style={{ height }}>
      {children}
    </div>
  );
}
