import { Axis, BarSeries, Grid, XYChart } from '@visx/xychart';
import { useMemo } from 'react';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import type { CsvColumn } from '../../../lib/csv';
import { fmtNumber, fmtPercent, isNum } from '../lib/format';
import { reasonFor } from '../lib/reasons';
import type { SharedErrorAnalysisDto } from '../types';
import { ChartBox, CHART_COLOURS, Cell, NotEnoughData, chartTheme, useChartScales } from './chart-kit';
import { ChartFigure } from './ChartFigure';

export interface VariancePart {
  key: 'shared' | 'house' | 'noise';
  label: string;
  share: number;
  /** Raw moment estimate (points²); may be negative, read as zero. */
  component: number | null;
  colour: string;
}

const PARTS: { key: VariancePart['key']; label: string; colour: string }[] = [
  { key: 'shared', label: 'Shared (contest)', colour: CHART_COLOURS.accent700 },
  { key: 'house', label: 'House (firm)', colour: CHART_COLOURS.caution500 },
  { key: 'noise', label: 'Noise (poll)', colour: CHART_COLOURS.ink400 },
];

export function varianceParts(analysis: SharedErrorAnalysisDto): VariancePart[] {
  const split = analysis.varianceSplit;
  if (!split) return [];
  return PARTS.filter((p) => isNum(split[p.key])).map((p) => ({
    ...p,
    share: split[p.key],
    component: analysis.varianceComponents && isNum(analysis.varianceComponents[p.key]) ? analysis.varianceComponents[p.key] : null,
  }));
}

function ShareLabels({ parts }: { parts: VariancePart[] }) {
  const s = useChartScales();
  if (!s) return null;
  return (
    <g>
      {parts.map((p) => {
        const x = s.x(p.share);
        const y = s.y(p.label);
        if (x === null || y === null) return null;
        return (
          <text key={p.key} x={x + 6} y={y + s.yBandwidth / 2 + 4} fontSize={12} fill={CHART_COLOURS.ink900}>
            {fmtPercent(p.share)}
          </text>
        );
      })}
    </g>
  );
}

const column = createDataTableColumnHelper<VariancePart>();
const columns = column.columns([
  column.accessor('label', { header: 'Part of the error' }),
  column.accessor('share', { header: 'Share', sortFn: 'basic', cell: (i) => <Cell text={fmtPercent(i.getValue(), 1)} /> }),
  column.accessor('component', {
    header: 'Variance estimate (pts²)',
    sortFn: 'basic',
    cell: (i) => <Cell text={fmtNumber(i.getValue(), 2)} reason="not reported" />,
  }),
]);

const csvColumns: CsvColumn<VariancePart>[] = [
  { header: 'part', value: (r) => r.key },
  { header: 'share', value: (r) => r.share },
  { header: 'variance_estimate_pts2', value: (r) => r.component },
];

/** The split of error variance into a shared contest part, a firm part and poll noise. */
export function VarianceSplitChart({ analysis, filename }: { analysis: SharedErrorAnalysisDto; filename: string }) {
  const parts = useMemo(() => varianceParts(analysis), [analysis]);
  const shared = parts.find((p) => p.key === 'shared');
  const house = parts.find((p) => p.key === 'house');
  const noise = parts.find((p) => p.key === 'noise');
  const negatives = parts.filter((p) => isNum(p.component) && p.component < 0).map((p) => p.label.toLowerCase());
  const cautions: string[] = [];
  if (negatives.length > 0) {
    cautions.push(`The raw estimate for ${negatives.join(' and ')} came out below zero and is read as zero: that part is too small to measure here.`);
  }
  if (parts.length > 0 && analysis.contests < 5) {
    cautions.push(`Only ${analysis.contests} contests: the shared part rests on very few contest means.`);
  }

  const chart =
    parts.length === 0 ? null : (
      <ChartBox height={170}>
        <XYChart
          height={170}
          margin={{ top: 12, right: 56, bottom: 40, left: 130 }}
          theme={chartTheme}
          xScale={{ type: 'linear', domain: [0, 1] }}
          yScale={{ type: 'band', domain: parts.map((p) => p.label).reverse(), paddingInner: 0.3 }}
          accessibilityLabel="Shares of error variance: shared, house and noise"
        >
          <Grid columns rows={false} numTicks={5} />
          <BarSeries
            dataKey="Share of error variance"
            data={parts}
            xAccessor={(d) => d.share}
            yAccessor={(d) => d.label}
            colorAccessor={(d) => d.colour}
          />
          <ShareLabels parts={parts} />
          <Axis orientation="bottom" numTicks={5} tickFormat={(v) => fmtPercent(Number(v)) ?? ''} label="Share of the variance of poll errors" />
          <Axis orientation="left" />
        </XYChart>
      </ChartBox>
    );

  return (
    <ChartFigure
      title="Where the error came from"
      explanation="How the variance of poll errors splits into a part shared by all polls of a contest, a firm’s own habit, and poll-to-poll noise."
      filename={filename}
      chart={chart}
      emptyMessage={<NotEnoughData reason={reasonFor(analysis.warnings, 'split')} />}
      meaning={
        shared && house && noise ? (
          <p>
            {fmtPercent(shared.share)} of the variation in poll errors was shared by every poll of a contest, {fmtPercent(house.share)}{' '}
            came from firms’ own habits and {fmtPercent(noise.share)} was noise. Only the last two shrink when polls are averaged;
            the shared part stays. (Method of moments on pairs of polls; the mean error itself is not part of this split.)
          </p>
        ) : null
      }
      cautions={cautions}
      table={<DataTable caption="Shares of error variance" columns={columns} data={parts} getRowId={(r) => r.key} emptyMessage="Not computed." />}
      csvRows={parts}
      csvColumns={csvColumns}
    />
  );
}
