import { Axis, GlyphSeries, Grid, Tooltip, XYChart } from '@visx/xychart';
import { useMemo } from 'react';
import { Card, DataTable, Stat, StatGroup, createDataTableColumnHelper } from '../../../components/ui';
import type { CsvColumn } from '../../../lib/csv';
import { contestLabel, fmtHalfWidth, fmtNumber, fmtSigned, isNum } from '../lib/format';
import { reasonFor } from '../lib/reasons';
import type { Blocs } from '../lib/verdict';
import type { SharedErrorAnalysisDto } from '../types';
import { ChartBox, CHART_COLOURS, Cell, Legend, LegendItem, NotEnoughData, ValueOr, VerticalRule, Z95, chartTheme, useChartScales } from './chart-kit';
import { ChartFigure } from './ChartFigure';

export interface AverageRow {
  contestKey: string;
  contest: string;
  k: number;
  miss: number;
  certifiedMargin: number | null;
  averageMargin: number | null;
  naiveHalf: number | null;
  adjustedHalf: number | null;
  nEff: number | null;
  naiveCovered: boolean | null;
  adjustedCovered: boolean | null;
  i2: number | null;
}

export function averageRows(analysis: SharedErrorAnalysisDto): AverageRow[] {
  return analysis.contestsDetail
    .filter((c) => isNum(c.meanError))
    .map((c) => ({
      contestKey: c.contestKey,
      contest: contestLabel(c.contestKey, analysis.electionKey),
      k: c.k,
      miss: c.meanError,
      certifiedMargin: isNum(c.certifiedMargin) ? c.certifiedMargin : null,
      averageMargin: isNum(c.averageMargin) ? c.averageMargin : null,
      naiveHalf: isNum(c.naiveSe) ? Z95 * c.naiveSe : null,
      adjustedHalf: isNum(c.adjustedSe) ? Z95 * c.adjustedSe : null,
      nEff: isNum(c.nEff) ? c.nEff : null,
      naiveCovered: c.naiveCovered,
      adjustedCovered: c.adjustedCovered,
      i2: isNum(c.i2) ? c.i2 : null,
    }))
    .sort((a, b) => b.k - a.k || a.contest.localeCompare(b.contest));
}

/** Share of error variance shared within a contest (the ICC, truncated at 0); null without a fit. */
export function sharedCorrelation(analysis: SharedErrorAnalysisDto): number | null {
  const s = analysis.errorStructure;
  if (!s || !isNum(s.sharedVariance) || !isNum(s.withinVariance)) return null;
  const total = s.sharedVariance + s.withinVariance;
  return total > 0 ? s.sharedVariance / total : null;
}

function Intervals({ rows }: { rows: AverageRow[] }) {
  const s = useChartScales();
  if (!s) return null;
  return (
    <g>
      {rows.map((r) => {
        const y = s.y(r.contest);
        if (y === null) return null;
        const cy = y + s.yBandwidth / 2;
        const adj = r.adjustedHalf !== null ? [s.x(r.miss - r.adjustedHalf), s.x(r.miss + r.adjustedHalf)] : null;
        const naive = r.naiveHalf !== null ? [s.x(r.miss - r.naiveHalf), s.x(r.miss + r.naiveHalf)] : null;
        return (
          <g key={r.contestKey}>
            {adj && adj[0] !== null && adj[1] !== null && adj[0] !== undefined && adj[1] !== undefined && (
              <rect x={adj[0]} y={cy - 6} width={Math.max(1, adj[1] - adj[0])} height={12} fill={CHART_COLOURS.accent200} stroke={CHART_COLOURS.accent700} />
            )}
            {naive && naive[0] !== null && naive[1] !== null && naive[0] !== undefined && naive[1] !== undefined && (
              <g stroke={CHART_COLOURS.ink900} strokeWidth={1.5}>
                <line x1={naive[0]} x2={naive[1]} y1={cy} y2={cy} />
                <line x1={naive[0]} x2={naive[0]} y1={cy - 4} y2={cy + 4} />
                <line x1={naive[1]} x2={naive[1]} y1={cy - 4} y2={cy + 4} />
              </g>
            )}
          </g>
        );
      })}
    </g>
  );
}

const yesNo = (v: boolean | null) => (v === null ? null : v ? 'yes' : 'no');

const column = createDataTableColumnHelper<AverageRow>();
const columns = column.columns([
  column.accessor('contest', { header: 'Contest' }),
  column.accessor('k', { header: 'Polls', sortFn: 'basic' }),
  column.accessor('nEff', { header: 'Effective polls', sortFn: 'basic', cell: (i) => <Cell text={fmtNumber(i.getValue(), 1)} reason="needs the intraclass correlation" /> }),
  column.accessor('miss', { header: 'Miss of the average (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor('naiveHalf', { header: 'Naive 95% (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtHalfWidth(i.getValue())} reason="a poll lacks a sampling variance" /> }),
  column.accessor('adjustedHalf', { header: 'Allowing for shared error (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtHalfWidth(i.getValue())} reason="needs the intraclass correlation" /> }),
  column.accessor((r) => yesNo(r.naiveCovered), { id: 'naiveCovered', header: 'Naive held the result', cell: (i) => <Cell text={i.getValue()} /> }),
  column.accessor((r) => yesNo(r.adjustedCovered), { id: 'adjustedCovered', header: 'Adjusted held the result', cell: (i) => <Cell text={i.getValue()} /> }),
]);

const csvColumns: CsvColumn<AverageRow>[] = [
  { header: 'contest', value: (r) => r.contestKey },
  { header: 'polls', value: (r) => r.k },
  { header: 'effective_polls', value: (r) => r.nEff },
  { header: 'average_margin_pts', value: (r) => r.averageMargin },
  { header: 'certified_margin_pts', value: (r) => r.certifiedMargin },
  { header: 'miss_of_average_pts', value: (r) => r.miss },
  { header: 'naive_95_half_width_pts', value: (r) => r.naiveHalf },
  { header: 'adjusted_95_half_width_pts', value: (r) => r.adjustedHalf },
  { header: 'naive_held_result', value: (r) => r.naiveCovered },
  { header: 'adjusted_held_result', value: (r) => r.adjustedCovered },
  { header: 'i2', value: (r) => r.i2 },
];

function coverage(rows: AverageRow[], key: 'naiveCovered' | 'adjustedCovered') {
  const known = rows.filter((r) => r[key] !== null);
  return { held: known.filter((r) => r[key]).length, of: known.length };
}

/** What the shared error means for an average of the polls: effective polls and the interval it needed. */
export function PollAverageSummary({ analysis }: { analysis: SharedErrorAnalysisDto }) {
  const rows = useMemo(() => averageRows(analysis), [analysis]);
  const rho = sharedCorrelation(analysis);
  const top = rows[0];
  const reason = reasonFor(analysis.warnings, 'adjusted');
  const naive = coverage(rows, 'naiveCovered');
  const adjusted = coverage(rows, 'adjustedCovered');
  return (
    <Card
      title="Effective polls and honest intervals"
      headingLevel={3}
      description="Polls that share an error are worth fewer independent polls, so their average needs a wider interval than sampling error alone gives."
    >
      <StatGroup columns={4}>
        <Stat
          label="Correlation of polls within a contest"
          value={<ValueOr text={fmtNumber(rho, 2)} reason={reason} />}
          hint={rho !== null && rho > 0 ? `at most ${fmtNumber(1 / rho, 1)} independent polls, however many are averaged` : rho === 0 ? 'no shared part measured' : undefined}
        />
        <Stat
          label={top ? `Effective polls in ${top.contest}` : 'Effective polls'}
          value={<ValueOr text={top ? fmtNumber(top.nEff, 1) : null} reason={reason} />}
          hint={top ? `of ${top.k} ${top.k === 1 ? 'poll' : 'polls'}` : undefined}
        />
        <Stat
          label={top ? `Interval the average of ${top.contest} should have carried` : 'Interval the average should have carried'}
          value={<ValueOr text={top && top.adjustedHalf !== null ? `${fmtHalfWidth(top.adjustedHalf)} pts` : null} reason={reason} />}
          hint={top && top.naiveHalf !== null ? `instead of ${fmtHalfWidth(top.naiveHalf)} pts from sampling error alone` : undefined}
        />
        <Stat
          label="Contests whose interval held the result"
          value={<ValueOr text={adjusted.of > 0 ? `${adjusted.held} of ${adjusted.of}` : null} reason={reason} />}
          hint={naive.of > 0 ? `allowing for shared error; naive intervals held ${naive.held} of ${naive.of}` : undefined}
        />
      </StatGroup>
      <p className="mt-4 max-w-3xl text-sm text-ink-800">
        {top && top.nEff !== null && top.adjustedHalf !== null && top.naiveHalf !== null
          ? `Averaging the ${top.k} polls of ${top.contest} was worth about ${fmtNumber(top.nEff, 1)} independent polls. An honest 95% interval for their average was ${fmtHalfWidth(top.adjustedHalf)} points on the margin, not the ${fmtHalfWidth(top.naiveHalf)} that treating the polls as independent suggests. (Effective polls k/[1 + (k − 1)ρ] with ρ from the intraclass correlation by ANOVA moments.)`
          : 'The adjusted interval and the effective number of polls need the intraclass correlation, which this election’s data could not support.'}
      </p>
    </Card>
  );
}

/** Each contest's poll-average miss with its naive interval and the wider one allowing for shared error. */
export function PollAverageChart({ analysis, blocs, filename }: { analysis: SharedErrorAnalysisDto; blocs: Blocs; filename: string }) {
  const rows = useMemo(() => averageRows(analysis), [analysis]);
  const ends = rows.flatMap((r) => {
    const half = Math.max(r.naiveHalf ?? 0, r.adjustedHalf ?? 0);
    return [r.miss - half, r.miss + half];
  });
  const lo = Math.min(0, ...ends) - 0.5;
  const hi = Math.max(0, ...ends) + 0.5;
  const a = blocs.blocA ?? 'bloc A';
  const b = blocs.blocB ?? 'bloc B';
  const cautions: string[] = [];
  if (rows.some((r) => r.k === 1)) cautions.push('For a contest with a single poll, the "average" is that poll, and its interval is the poll’s own.');
  if (rows.length > 0 && rows.every((r) => r.adjustedHalf === null)) cautions.push(reasonFor(analysis.warnings, 'adjusted'));

  const chart =
    rows.length === 0 ? null : (
      <>
        <ChartBox height={Math.max(190, 72 + 34 * rows.length)}>
          <XYChart
            height={Math.max(190, 72 + 34 * rows.length)}
            margin={{ top: 36, right: 24, bottom: 48, left: 120 }}
            theme={chartTheme}
            xScale={{ type: 'linear', domain: [lo, hi], nice: true }}
            yScale={{ type: 'band', domain: rows.map((r) => r.contest).reverse(), paddingInner: 0.3, paddingOuter: 0.15 }}
            accessibilityLabel="Miss of each contest's poll average with its naive and adjusted 95% intervals"
          >
            <Grid columns rows={false} numTicks={6} />
            <Intervals rows={rows} />
            <VerticalRule value={0} label="0 = result" strong />
            <GlyphSeries
              dataKey="Average"
              data={rows}
              xAccessor={(d) => d.miss}
              yAccessor={(d) => d.contest}
              renderGlyph={({ x, y }) => <circle cx={x} cy={y} r={4} fill={CHART_COLOURS.ink900} />}
            />
            <Axis orientation="bottom" numTicks={6} label={`Miss of the poll average (pts); positive = overstated ${a} against ${b}`} />
            <Axis orientation="left" />
            <Tooltip<AverageRow>
              snapTooltipToDatumX
              snapTooltipToDatumY
              renderTooltip={({ tooltipData }) => {
                const d = tooltipData?.nearestDatum?.datum;
                return d ? (
                  <div className="text-sm">
                    <strong>{d.contest}</strong>: miss {fmtSigned(d.miss)} pts; naive {fmtHalfWidth(d.naiveHalf) ?? 'not computed'}, adjusted{' '}
                    {fmtHalfWidth(d.adjustedHalf) ?? 'not computed'}
                  </div>
                ) : null;
              }}
            />
          </XYChart>
        </ChartBox>
        <Legend>
          <LegendItem shape={<circle cx={9} cy={7} r={4} fill={CHART_COLOURS.ink900} />}>miss of the contest’s poll average</LegendItem>
          <LegendItem
            shape={
              <g stroke={CHART_COLOURS.ink900} strokeWidth={1.5}>
                <line x1={1} x2={17} y1={7} y2={7} />
                <line x1={1} x2={1} y1={3} y2={11} />
                <line x1={17} x2={17} y1={3} y2={11} />
              </g>
            }
          >
            naive 95% interval (polls independent)
          </LegendItem>
          <LegendItem shape={<rect x={1} y={2} width={16} height={10} fill={CHART_COLOURS.accent200} stroke={CHART_COLOURS.accent700} />}>
            95% interval allowing for shared error
          </LegendItem>
        </Legend>
      </>
    );

  return (
    <ChartFigure
      title="The interval each poll average should have carried"
      explanation="Each contest’s poll-average miss with its naive 95% interval and the wider interval that allows for error shared by its polls; an interval that does not reach 0 missed the result."
      filename={filename}
      chart={chart}
      emptyMessage={<NotEnoughData reason={reasonFor(analysis.warnings, 'adjusted')} />}
      cautions={cautions}
      table={<DataTable caption="Poll averages and their intervals by contest" columns={columns} data={rows} getRowId={(r) => r.contestKey} emptyMessage="No contests." />}
      csvRows={rows}
      csvColumns={csvColumns}
    />
  );
}
