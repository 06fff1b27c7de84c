import { Axis, GlyphSeries, Grid, Tooltip, XYChart } from '@visx/xychart';
import type { GlyphProps } from '@visx/xychart';
import { useMemo } from 'react';
import { Alert, Card, DataTable, Stat, StatGroup, createDataTableColumnHelper } from '../../../components/ui';
import type { CsvColumn } from '../../../lib/csv';
import { fmtHalfWidth, fmtNumber, fmtSigned, isNum } from '../lib/format';
import type { AuditElection, AuditHistoryDto, HistoryContestDto } from '../types';
import { ChartBox, CHART_COLOURS, Cell, Legend, LegendItem, ValueOr, chartTheme, useChartScales } from './chart-kit';
import { ChartFigure } from './ChartFigure';

const NO_INTERVAL = 'needs poll averages in at least 2 contests';

/** The archive's own interval for a final poll average, beside the naive sampling interval. */
export function HistoricalIntervalCard({ history }: { history: AuditHistoryDto }) {
  const interval = history.averageInterval;
  const naive = history.naiveHalfWidth;
  const ratio = interval && isNum(naive) && naive > 0 ? interval.halfWidth / naive : null;
  return (
    <Card
      title="How wide a poll average’s interval should be"
      description="The interval, in points on the margin, that past misses of final poll averages support, beside the interval sampling error alone would give."
    >
      <StatGroup columns={4}>
        <Stat
          label="Interval history supports"
          value={<ValueOr text={interval ? `${fmtHalfWidth(interval.halfWidth)} pts` : null} reason={NO_INTERVAL} />}
          hint={interval ? `from ${interval.n} contests’ poll averages` : undefined}
        />
        <Stat
          label="Naive sampling interval"
          value={<ValueOr text={isNum(naive) ? `${fmtHalfWidth(naive)} pts` : null} reason="no contest had polls with a sampling variance" />}
          hint="average over contests, polls taken as independent"
        />
        <Stat
          label="History ÷ naive"
          value={<ValueOr text={ratio !== null ? `${fmtNumber(ratio, 1)}×` : null} reason={NO_INTERVAL} />}
          hint="how much wider the honest interval is"
        />
        <Stat
          label="Mean miss of past averages"
          value={<ValueOr text={interval ? `${fmtSigned(interval.meanMiss)} pts` : null} reason={NO_INTERVAL} />}
          hint={interval ? `root-mean-square miss ${fmtNumber(interval.rmse, 1)} pts` : undefined}
        />
      </StatGroup>
      {interval && (
        <p className="mt-4 max-w-3xl text-sm text-ink-800">
          Two estimates, and the wider one is used: ±1.96 × the root-mean-square miss gives {fmtHalfWidth(interval.rmseHalfWidth)} pts, and the 95th percentile
          of the absolute misses gives {fmtHalfWidth(interval.empiricalHalfWidth)} pts. A final poll average’s margin is honest to about{' '}
          {fmtHalfWidth(interval.halfWidth)} points, not the {fmtHalfWidth(naive) ?? 'naive'} that sampling error alone suggests.
        </p>
      )}
      <p className="mt-3 max-w-3xl text-sm text-ink-700">
        <span className="font-medium">Method.</span> {history.method}
      </p>
      {interval?.fewContests && (
        <Alert tone="caution" className="mt-3" title="Few contests">
          Only {interval.n} contests: the 95th percentile of their misses is little more than the largest one, so this interval is rough.
        </Alert>
      )}
    </Card>
  );
}

interface ContestRow extends HistoryContestDto {
  electionName: string;
}

function ContestGlyph({ x, y, datum }: GlyphProps<ContestRow>) {
  if (datum.calledRight) return <circle cx={x} cy={y} r={4.5} fill={CHART_COLOURS.accent500} stroke={CHART_COLOURS.accent900} />;
  return (
    <g stroke={CHART_COLOURS.danger700} strokeWidth={2.25}>
      <line x1={x - 5} x2={x + 5} y1={y - 5} y2={y + 5} />
      <line x1={x - 5} x2={x + 5} y1={y + 5} y2={y - 5} />
    </g>
  );
}

function Band({ halfWidth, domain }: { halfWidth: number; domain: number }) {
  const s = useChartScales();
  if (!s) return null;
  const x0 = s.x(-halfWidth);
  const x1 = s.x(halfWidth);
  const y0 = s.y(-domain);
  const y1 = s.y(domain);
  if (x0 === null || x1 === null || y0 === null || y1 === null) return null;
  return (
    <g>
      <rect x={x0} y={s.top} width={x1 - x0} height={s.bottom - s.top} fill={CHART_COLOURS.caution200} opacity={0.55} />
      <text x={(x0 + x1) / 2} y={s.top + 12} fontSize={11} textAnchor="middle" fill={CHART_COLOURS.ink900}>
        too close to call
      </text>
      <line x1={s.x(-domain) ?? 0} y1={y0} x2={s.x(domain) ?? 0} y2={y1} stroke={CHART_COLOURS.ink500} strokeDasharray="5 4" />
    </g>
  );
}

const yesNo = (v: boolean | null) => (v === null ? null : v ? 'yes' : 'no');

const column = createDataTableColumnHelper<ContestRow>();
const columns = column.columns([
  column.accessor('contestKey', { header: 'Contest' }),
  column.accessor('electionName', { header: 'Election' }),
  column.accessor('k', { header: 'Polls', sortFn: 'basic' }),
  column.accessor('averageMargin', { header: 'Final average margin (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor('certifiedMargin', { header: 'Certified margin (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor('miss', { header: 'Miss (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor((r) => yesNo(r.tooClose), { id: 'tooClose', header: 'Too close to call', cell: (i) => <Cell text={i.getValue()} reason={NO_INTERVAL} /> }),
  column.accessor((r) => yesNo(r.calledRight), { id: 'calledRight', header: 'Average called it right', cell: (i) => <Cell text={i.getValue()} /> }),
]);

const csvColumns: CsvColumn<ContestRow>[] = [
  { header: 'contest', value: (r) => r.contestKey },
  { header: 'election', value: (r) => r.electionKey },
  { header: 'polls', value: (r) => r.k },
  { header: 'average_margin_pts', value: (r) => r.averageMargin },
  { header: 'certified_margin_pts', value: (r) => r.certifiedMargin },
  { header: 'miss_pts', value: (r) => r.miss },
  { header: 'naive_half_width_pts', value: (r) => r.naiveHalfWidth },
  { header: 'too_close_to_call', value: (r) => r.tooClose },
  { header: 'called_right', value: (r) => r.calledRight },
];

/** Contests' final poll-average margin against the result, with the "too close to call" band. */
export function TooCloseChart({ history, elections, filename }: { history: AuditHistoryDto; elections: readonly AuditElection[]; filename: string }) {
  const names = useMemo(() => new Map(elections.map((e) => [e.key, e.name])), [elections]);
  const rows = useMemo<ContestRow[]>(
    () =>
      history.contests
        .filter((c) => isNum(c.averageMargin) && isNum(c.certifiedMargin))
        .map((c) => ({ ...c, electionName: names.get(c.electionKey) ?? c.electionKey })),
    [history.contests, names],
  );
  const interval = history.averageInterval;
  const extent = Math.max(5, ...rows.flatMap((r) => [Math.abs(r.averageMargin), Math.abs(r.certifiedMargin)]), interval?.halfWidth ?? 0) + 2;
  const outside = rows.filter((r) => r.tooClose === false);
  const outsideRight = outside.filter((r) => r.calledRight).length;

  const cautions: string[] = [];
  if (history.tooCloseCount > 0 && history.tooCloseCount < 10) {
    cautions.push(`Only ${history.tooCloseCount} close contests: the share called right is a rough figure.`);
  }
  cautions.push('The interval is estimated from these same contests, so judging them by it is generous: a new election may miss by more.');

  const chart =
    rows.length === 0 ? null : (
      <>
        <ChartBox height={380}>
          <XYChart
            height={380}
            margin={{ top: 20, right: 24, bottom: 52, left: 64 }}
            theme={chartTheme}
            xScale={{ type: 'linear', domain: [-extent, extent] }}
            yScale={{ type: 'linear', domain: [-extent, extent] }}
            accessibilityLabel="Final poll-average margin against the certified margin for each contest, with the too-close-to-call band"
          >
            <Grid numTicks={6} />
            {interval && <Band halfWidth={interval.halfWidth} domain={extent} />}
            <GlyphSeries dataKey="Contests" data={rows} xAccessor={(d) => d.averageMargin} yAccessor={(d) => d.certifiedMargin} renderGlyph={ContestGlyph} />
            <Axis orientation="bottom" numTicks={6} label="Final poll-average margin (pts)" />
            <Axis orientation="left" numTicks={6} label="Certified margin (pts)" />
            <Tooltip<ContestRow>
              snapTooltipToDatumX
              snapTooltipToDatumY
              renderTooltip={({ tooltipData }) => {
                const d = tooltipData?.nearestDatum?.datum;
                return d ? (
                  <div className="text-sm">
                    <strong>{d.contestKey}</strong>: average {fmtSigned(d.averageMargin)}, result {fmtSigned(d.certifiedMargin)};{' '}
                    {d.calledRight ? 'called right' : 'called wrong'}
                    {d.tooClose ? ', too close to call' : ''}
                  </div>
                ) : null;
              }}
            />
          </XYChart>
        </ChartBox>
        <Legend>
          <LegendItem shape={<circle cx={9} cy={7} r={4.5} fill={CHART_COLOURS.accent500} stroke={CHART_COLOURS.accent900} />}>average named the winner</LegendItem>
          <LegendItem
            shape={
              <g stroke={CHART_COLOURS.danger700} strokeWidth={2.25}>
                <line x1={4} x2={14} y1={2} y2={12} />
                <line x1={4} x2={14} y1={12} y2={2} />
              </g>
            }
          >
            average named the loser
          </LegendItem>
          <LegendItem shape={<rect x={1} y={1} width={16} height={12} fill={CHART_COLOURS.caution200} />}>
            within the historical interval of a tie
          </LegendItem>
          <LegendItem shape={<line x1={1} x2={17} y1={13} y2={1} stroke={CHART_COLOURS.ink500} strokeDasharray="3 3" />}>average = result</LegendItem>
        </Legend>
      </>
    );

  return (
    <ChartFigure
      title="Contests too close for polls to call"
      explanation="Each contest’s final poll-average margin against its certified margin; the shaded band is the historical interval around a tie."
      filename={filename}
      chart={chart}
      emptyMessage="No contest has a final poll average and a certified result."
      meaning={
        interval ? (
          <p>
            <strong>
              {history.tooCloseCount} of {rows.length} contests
            </strong>{' '}
            had a final poll-average margin within {fmtHalfWidth(interval.halfWidth)} pts of a tie: too close for polls to call. The average named the winner in{' '}
            <strong>
              {history.tooCloseCalledRight} of those {history.tooCloseCount}
            </strong>
            {outside.length > 0 ? `, and in ${outsideRight} of the ${outside.length} contests outside the band.` : '.'}
          </p>
        ) : (
          <p>Without the historical interval, no contest can be marked too close to call.</p>
        )
      }
      cautions={cautions}
      table={
        <DataTable
          caption="Contests: final poll average, result and the too-close flag"
          columns={columns}
          data={rows}
          getRowId={(r) => r.contestKey}
          searchLabel="Search contests"
          pageSize={15}
          initialSorting={[{ id: 'tooClose', desc: true }]}
        />
      }
      csvRows={rows}
      csvColumns={csvColumns}
    />
  );
}
