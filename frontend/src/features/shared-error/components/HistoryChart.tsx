import { Axis, GlyphSeries, Grid, Tooltip, XYChart } from '@visx/xychart';
import { useMemo } from 'react';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import { formatDate } from '../../../utils/format';
import type { CsvColumn } from '../../../lib/csv';
import { describeDirection } from '../lib/verdict';
import { electionShortLabel, fmtInterval, fmtSigned, isNum } from '../lib/format';
import type { AuditElection, AuditHistoryDto } from '../types';
import { ChartBox, CHART_COLOURS, Cell, HorizontalRule, Legend, LegendItem, chartTheme, useChartScales } from './chart-kit';
import { ChartFigure } from './ChartFigure';

export interface HistoryRow {
  electionKey: string;
  label: string;
  name: string;
  date: string;
  polls: number;
  mean: number | null;
  lo: number | null;
  hi: number | null;
  blocA: string | null;
  blocB: string | null;
}

export function historyRows(history: AuditHistoryDto, elections: readonly AuditElection[]): HistoryRow[] {
  const meta = new Map(elections.map((e) => [e.key, e]));
  return history.elections.map((e) => ({
    electionKey: e.electionKey,
    label: electionShortLabel(e.electionKey, e.name),
    name: e.name,
    date: e.date,
    polls: e.polls,
    mean: isNum(e.meanSignedError) ? e.meanSignedError : null,
    lo: isNum(e.lo) ? e.lo : null,
    hi: isNum(e.hi) ? e.hi : null,
    blocA: meta.get(e.electionKey)?.blocA ?? null,
    blocB: meta.get(e.electionKey)?.blocB ?? null,
  }));
}

function Whiskers({ rows }: { rows: HistoryRow[] }) {
  const s = useChartScales();
  if (!s) return null;
  return (
    <g>
      {rows.map((r) => {
        const x0 = s.x(r.label);
        if (x0 === null) return null;
        const cx = x0 + s.xBandwidth / 2;
        if (r.mean === null) {
          const y = s.y(0);
          return y === null ? null : (
            <text key={r.electionKey} x={cx} y={y - 8} fontSize={11} textAnchor="middle" fill={CHART_COLOURS.ink600}>
              not enough data
            </text>
          );
        }
        const ylo = r.lo === null ? null : s.y(r.lo);
        const yhi = r.hi === null ? null : s.y(r.hi);
        if (ylo === null || yhi === null) return null;
        return (
          <g key={r.electionKey} stroke={CHART_COLOURS.ink900} strokeWidth={1.5}>
            <line x1={cx} x2={cx} y1={ylo} y2={yhi} />
            <line x1={cx - 6} x2={cx + 6} y1={ylo} y2={ylo} />
            <line x1={cx - 6} x2={cx + 6} y1={yhi} y2={yhi} />
          </g>
        );
      })}
    </g>
  );
}

const orientation = (r: HistoryRow) => (r.blocA && r.blocB ? `${r.blocA} − ${r.blocB}` : null);

const column = createDataTableColumnHelper<HistoryRow>();
const columns = column.columns([
  column.accessor('name', { header: 'Election' }),
  column.accessor('date', { header: 'Date', sortFn: 'text', cell: (i) => formatDate(i.getValue()) }),
  column.accessor((r) => orientation(r), { id: 'orientation', header: 'Sign is', cell: (i) => <Cell text={i.getValue()} reason="no bloc pair" /> }),
  column.accessor('polls', { header: 'Polls', sortFn: 'basic' }),
  column.accessor('mean', { header: 'Mean signed error (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} reason="needs polls in at least 2 contests" /> }),
  column.accessor((r) => fmtInterval(r.lo, r.hi), { id: 'interval', header: '95% interval', cell: (i) => <Cell text={i.getValue()} reason="needs polls in at least 2 contests" /> }),
]);

const csvColumns: CsvColumn<HistoryRow>[] = [
  { header: 'election', value: (r) => r.electionKey },
  { header: 'name', value: (r) => r.name },
  { header: 'date', value: (r) => r.date },
  { header: 'bloc_a', value: (r) => r.blocA },
  { header: 'bloc_b', value: (r) => r.blocB },
  { header: 'polls', value: (r) => r.polls },
  { header: 'mean_signed_error_pts', value: (r) => r.mean },
  { header: 'ci_low_pts', value: (r) => r.lo },
  { header: 'ci_high_pts', value: (r) => r.hi },
];

/** Each election's shared miss (mean signed error) with its contest-clustered 95% interval. */
export function HistoryChart({ history, elections, filename }: { history: AuditHistoryDto; elections: readonly AuditElection[]; filename: string }) {
  const rows = useMemo(() => historyRows(history, elections), [history, elections]);
  const drawn = rows.filter((r) => r.mean !== null);
  const ends = rows.flatMap((r) => [r.mean, r.lo, r.hi].filter(isNum));
  const lo = Math.min(0, ...ends) - 0.5;
  const hi = Math.max(0, ...ends) + 0.5;
  const largest = [...drawn].sort((a, b) => Math.abs(b.mean as number) - Math.abs(a.mean as number))[0];
  const clear = rows.filter((r) => r.lo !== null && r.hi !== null && (r.lo > 0 || r.hi < 0));
  const orientations = new Set(rows.map(orientation).filter((o): o is string => o !== null));

  const cautions: string[] = [];
  if (orientations.size > 1) {
    cautions.push(
      `Signs follow each election’s own blocs (${[...orientations].join('; ')}): compare sizes across elections, and read each direction with its own blocs.`,
    );
  }
  if (rows.length > 0 && rows.length < 4) cautions.push(`Only ${rows.length} elections: a history this short says little about the next one.`);

  const chart =
    rows.length === 0 ? null : (
      <>
        <ChartBox height={300}>
          <XYChart
            height={300}
            margin={{ top: 20, right: 24, bottom: 48, left: 64 }}
            theme={chartTheme}
            xScale={{ type: 'band', domain: rows.map((r) => r.label), paddingInner: 0.4, paddingOuter: 0.2 }}
            yScale={{ type: 'linear', domain: [lo, hi], nice: true }}
            accessibilityLabel="Mean signed error of each election with its 95% interval"
          >
            <Grid rows columns={false} numTicks={5} />
            <HorizontalRule value={0} strong />
            <Whiskers rows={rows} />
            <GlyphSeries
              dataKey="Mean signed error"
              data={drawn}
              xAccessor={(d) => d.label}
              yAccessor={(d) => d.mean as number}
              renderGlyph={({ x, y }) => <rect x={x - 5} y={y - 5} width={10} height={10} fill={CHART_COLOURS.accent700} stroke={CHART_COLOURS.ink900} />}
            />
            <Axis orientation="bottom" />
            <Axis orientation="left" numTicks={5} label="Mean signed error (pts)" />
            <Tooltip<HistoryRow>
              snapTooltipToDatumX
              snapTooltipToDatumY
              renderTooltip={({ tooltipData }) => {
                const d = tooltipData?.nearestDatum?.datum;
                return d ? (
                  <div className="text-sm">
                    <strong>{d.name}</strong>: {fmtSigned(d.mean)} pts ({fmtInterval(d.lo, d.hi) ?? 'no interval'}); {describeDirection(d.mean, d)}
                  </div>
                ) : null;
              }}
            />
          </XYChart>
        </ChartBox>
        <Legend>
          <LegendItem shape={<rect x={4} y={2} width={10} height={10} fill={CHART_COLOURS.accent700} stroke={CHART_COLOURS.ink900} />}>mean signed error</LegendItem>
          <LegendItem
            shape={
              <g stroke={CHART_COLOURS.ink900} strokeWidth={1.5}>
                <line x1={9} x2={9} y1={1} y2={13} />
                <line x1={5} x2={13} y1={1} y2={1} />
                <line x1={5} x2={13} y1={13} y2={13} />
              </g>
            }
          >
            95% interval, clustered by contest
          </LegendItem>
          <LegendItem shape={<line x1={1} x2={17} y1={7} y2={7} stroke={CHART_COLOURS.ink900} strokeWidth={1.5} />}>0: no shared miss</LegendItem>
        </Legend>
      </>
    );

  return (
    <ChartFigure
      title="The shared miss, election by election"
      explanation="Mean signed margin error of each election’s polls with its 95% interval (contests as clusters); an interval clear of 0 is a shared miss."
      filename={filename}
      chart={chart}
      emptyMessage="The audit has no elections."
      meaning={
        largest ? (
          <p>
            The largest shared miss was in {largest.name}: {fmtSigned(largest.mean)} pts, {describeDirection(largest.mean, largest)}.{' '}
            {clear.length} of {rows.length} {rows.length === 1 ? 'election has' : 'elections have'} an interval that excludes zero.
          </p>
        ) : (
          <p>No election has polls in at least 2 contests, so no shared miss could be estimated.</p>
        )
      }
      cautions={cautions}
      table={<DataTable caption="Mean signed error by election" columns={columns} data={rows} getRowId={(r) => r.electionKey} />}
      csvRows={rows}
      csvColumns={csvColumns}
    />
  );
}
