import type { AuditPollDto } from '@veracast/shared-types';
import { Axis, GlyphSeries, Grid, Tooltip, XYChart } from '@visx/xychart';
import type { GlyphProps } from '@visx/xychart';
import { useMemo } from 'react';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import type { CsvColumn } from '../../../lib/csv';
import { contestLabel, fmtSigned, isNum } from '../lib/format';
import type { Blocs } from '../lib/verdict';
import type { SharedErrorAnalysisDto } from '../types';
import { ChartBox, CHART_COLOURS, Cell, Legend, LegendItem, VerticalRule, chartTheme, useChartScales } from './chart-kit';
import { ChartFigure } from './ChartFigure';

export interface ContestPollPoint {
  contestKey: string;
  contest: string;
  pollKey: string;
  pollster: string;
  error: number;
  contestMean: number;
  /** Vertical spread inside the contest's row, −0.3 to 0.3 of the row height. */
  jitter: number;
}

interface ContestMeanPoint {
  contestKey: string;
  contest: string;
  mean: number;
  k: number;
}

/**
 * The polls of the analysis, each with its contest's mean. Only polls of contests the analysis
 * kept (oriented by the election's blocs) are drawn, so the chart agrees with the numbers.
 */
export function contestPollPoints(analysis: SharedErrorAnalysisDto, polls: readonly AuditPollDto[]): ContestPollPoint[] {
  const means = new Map(analysis.contestsDetail.map((c) => [c.contestKey, c.meanError]));
  const kept = polls.filter((p) => means.has(p.contestKey) && p.refBasis === 'blocs' && isNum(p.marginError));
  const byContest = new Map<string, AuditPollDto[]>();
  for (const p of kept) byContest.set(p.contestKey, [...(byContest.get(p.contestKey) ?? []), p]);
  const out: ContestPollPoint[] = [];
  for (const [contestKey, list] of byContest) {
    const sorted = [...list].sort((a, b) => (a.marginError as number) - (b.marginError as number));
    sorted.forEach((p, i) => {
      out.push({
        contestKey,
        contest: contestLabel(contestKey, analysis.electionKey),
        pollKey: p.pollKey,
        pollster: p.pollster,
        error: p.marginError as number,
        contestMean: means.get(contestKey) as number,
        jitter: sorted.length === 1 ? 0 : (i / (sorted.length - 1) - 0.5) * 0.6,
      });
    });
  }
  return out;
}

function PollGlyph({ x, y, datum }: GlyphProps<ContestPollPoint>) {
  const s = useChartScales();
  const dy = (s?.yBandwidth ?? 0) * datum.jitter;
  return <circle cx={x} cy={y + dy} r={4.5} fill={CHART_COLOURS.accent200} stroke={CHART_COLOURS.accent900} strokeWidth={1.25} />;
}

function MeanGlyph({ x, y }: GlyphProps<ContestMeanPoint>) {
  const s = useChartScales();
  const h = Math.max(10, (s?.yBandwidth ?? 16) * 0.95);
  return <rect x={x - 1.75} y={y - h / 2} width={3.5} height={h} fill={CHART_COLOURS.ink900} />;
}

const column = createDataTableColumnHelper<ContestPollPoint>();
const columns = column.columns([
  column.accessor('contest', { header: 'Contest' }),
  column.accessor('pollster', { header: 'Pollster' }),
  column.accessor('pollKey', { header: 'Poll' }),
  column.accessor('error', { header: 'Error (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor('contestMean', { header: 'Contest mean (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor((row) => row.error - row.contestMean, {
    id: 'around',
    header: 'Around the mean (pts)',
    sortFn: 'basic',
    cell: (i) => <Cell text={fmtSigned(i.getValue())} />,
  }),
]);

const csvColumns: CsvColumn<ContestPollPoint>[] = [
  { header: 'contest', value: (r) => r.contestKey },
  { header: 'pollster', value: (r) => r.pollster },
  { header: 'poll', value: (r) => r.pollKey },
  { header: 'signed_error_pts', value: (r) => r.error },
  { header: 'contest_mean_pts', value: (r) => r.contestMean },
  { header: 'error_around_mean_pts', value: (r) => r.error - r.contestMean },
];

export interface ContestErrorChartProps {
  analysis: SharedErrorAnalysisDto;
  polls: readonly AuditPollDto[];
  blocs: Blocs;
  filename: string;
}

/** Each poll's signed error in its contest's row, with the contest's mean (the shared part). */
export function ContestErrorChart({ analysis, polls, blocs, filename }: ContestErrorChartProps) {
  const points = useMemo(() => contestPollPoints(analysis, polls), [analysis, polls]);
  const means = useMemo<ContestMeanPoint[]>(
    () =>
      [...analysis.contestsDetail]
        .filter((c) => isNum(c.meanError))
        .sort((a, b) => a.meanError - b.meanError)
        .map((c) => ({ contestKey: c.contestKey, contest: contestLabel(c.contestKey, analysis.electionKey), mean: c.meanError, k: c.k })),
    [analysis],
  );
  const labels = means.map((m) => m.contest);
  const values = [0, ...points.map((p) => p.error), ...means.map((m) => m.mean)];
  const lo = Math.min(...values) - 0.5;
  const hi = Math.max(...values) + 0.5;
  const overall = analysis.meanSignedError;
  const a = blocs.blocA ?? 'bloc A';
  const b = blocs.blocB ?? 'bloc B';

  const sameSide = isNum(overall) && overall !== 0 ? means.filter((m) => Math.sign(m.mean) === Math.sign(overall)).length : null;
  const single = analysis.contestsDetail.filter((c) => c.k === 1).length;
  const cautions: string[] = [];
  if (analysis.contests > 0 && analysis.contests < 5) {
    cautions.push(`Only ${analysis.contests} ${analysis.contests === 1 ? 'contest' : 'contests'}: a pattern across contests is hard to tell from chance.`);
  }
  if (single > 0) {
    cautions.push(`${single} ${single === 1 ? 'contest has' : 'contests have'} a single poll: its mean is that one poll's error, not a shared one.`);
  }

  const chart =
    means.length === 0 ? null : (
      <>
        <ChartBox height={Math.max(190, 72 + 36 * labels.length)}>
          <XYChart
            height={Math.max(190, 72 + 36 * labels.length)}
            margin={{ top: 36, right: 24, bottom: 48, left: 120 }}
            theme={chartTheme}
            xScale={{ type: 'linear', domain: [lo, hi], nice: true }}
            yScale={{ type: 'band', domain: [...labels].reverse(), paddingInner: 0.25, paddingOuter: 0.15 }}
            accessibilityLabel={`Signed error of each poll by contest, with contest means, ${analysis.electionKey}`}
          >
            <Grid columns rows={false} numTicks={6} />
            <VerticalRule value={0} label="0 = result" strong />
            {isNum(overall) && (
              <VerticalRule value={overall} label={`election mean ${fmtSigned(overall)}`} dashed labelRow={1} anchor={overall < 0 ? 'end' : 'start'} />
            )}
            <GlyphSeries dataKey="Polls" data={points} xAccessor={(d) => d.error} yAccessor={(d) => d.contest} renderGlyph={PollGlyph} />
            <GlyphSeries dataKey="Contest means" data={means} xAccessor={(d) => d.mean} yAccessor={(d) => d.contest} renderGlyph={MeanGlyph} />
            <Axis orientation="bottom" numTicks={6} label={`Signed margin error (pts); positive = polls overstated ${a} against ${b}`} />
            <Axis orientation="left" />
            <Tooltip<ContestPollPoint | ContestMeanPoint>
              snapTooltipToDatumX
              snapTooltipToDatumY
              renderTooltip={({ tooltipData }) => {
                const d = tooltipData?.nearestDatum?.datum;
                if (!d) return null;
                return 'pollster' in d ? (
                  <div className="text-sm">
                    <strong>{d.pollster}</strong> in {d.contest}: {fmtSigned(d.error)} pts (contest mean {fmtSigned(d.contestMean)})
                  </div>
                ) : (
                  <div className="text-sm">
                    <strong>{d.contest}</strong>: mean {fmtSigned(d.mean)} pts over {d.k} {d.k === 1 ? 'poll' : 'polls'}
                  </div>
                );
              }}
            />
          </XYChart>
        </ChartBox>
        <Legend>
          <LegendItem shape={<circle cx={9} cy={7} r={4.5} fill={CHART_COLOURS.accent200} stroke={CHART_COLOURS.accent900} strokeWidth={1.25} />}>
            one poll’s error
          </LegendItem>
          <LegendItem shape={<rect x={7.5} y={0} width={3.5} height={14} fill={CHART_COLOURS.ink900} />}>contest mean (shared by its polls)</LegendItem>
          <LegendItem shape={<line x1={9} x2={9} y1={0} y2={14} stroke={CHART_COLOURS.ink500} strokeDasharray="3 3" />}>election mean</LegendItem>
        </Legend>
      </>
    );

  return (
    <ChartFigure
      title="Each poll’s error around its contest’s mean"
      explanation="Signed margin error of every poll the analysis uses, one row per contest; the bar is the contest’s mean error."
      filename={filename}
      chart={chart}
      emptyMessage="No contest has a poll with a usable signed error."
      meaning={
        sameSide !== null && means.length > 0 ? (
          <p>
            In {sameSide} of {means.length} {means.length === 1 ? 'contest' : 'contests'} the polls’ mean error fell on the same side of zero as the election mean. Dots
            spread around a bar are what firms did differently; a bar away from zero is what all polls of that contest shared, and
            averaging them cannot remove it.
          </p>
        ) : (
          <p>Dots spread around a bar are what firms did differently; a bar away from zero is what all polls of that contest shared.</p>
        )
      }
      cautions={cautions}
      table={<DataTable caption="Each poll’s error and its contest’s mean" columns={columns} data={points} getRowId={(r) => r.pollKey} searchLabel="Search polls" pageSize={15} />}
      csvRows={points}
      csvColumns={csvColumns}
    />
  );
}
