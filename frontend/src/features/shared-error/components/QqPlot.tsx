import { Axis, GlyphSeries, Grid, Tooltip, XYChart } from '@visx/xychart';
import { useMemo } from 'react';
import { DataTable, StatGroup, Stat, createDataTableColumnHelper } from '../../../components/ui';
import type { CsvColumn } from '../../../lib/csv';
import { fmtNumber, fmtPEquals, fmtSigned, isNum } from '../lib/format';
import { reasonFor } from '../lib/reasons';
import type { QqPointDto, SharedErrorAnalysisDto } from '../types';
import { ChartBox, CHART_COLOURS, Cell, NotEnoughData, ValueOr, chartTheme, useChartScales } from './chart-kit';
import { ChartFigure } from './ChartFigure';

function IdentityLine({ from, to }: { from: number; to: number }) {
  const s = useChartScales();
  if (!s) return null;
  const x1 = s.x(from);
  const y1 = s.y(from);
  const x2 = s.x(to);
  const y2 = s.y(to);
  if (x1 === null || y1 === null || x2 === null || y2 === null) return null;
  return <line x1={x1} y1={y1} x2={x2} y2={y2} stroke={CHART_COLOURS.ink500} strokeDasharray="5 4" />;
}

interface QqRow extends QqPointDto {
  rank: number;
}

const column = createDataTableColumnHelper<QqRow>();
const columns = column.columns([
  column.accessor('rank', { header: 'Rank', sortFn: 'basic' }),
  column.accessor('value', { header: 'Error (pts)', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue())} /> }),
  column.accessor('sample', { header: 'Standardised error', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue(), 2)} /> }),
  column.accessor('theoretical', { header: 'Normal quantile', sortFn: 'basic', cell: (i) => <Cell text={fmtSigned(i.getValue(), 2)} /> }),
]);

const csvColumns: CsvColumn<QqRow>[] = [
  { header: 'rank', value: (r) => r.rank },
  { header: 'error_pts', value: (r) => r.value },
  { header: 'standardised_error', value: (r) => r.sample },
  { header: 'normal_quantile_blom', value: (r) => r.theoretical },
];

/** Normal Q–Q plot of the errors with the Shapiro–Wilk, Jarque–Bera and Anderson–Darling checks. */
export function QqPlot({ analysis, filename }: { analysis: SharedErrorAnalysisDto; filename: string }) {
  const rows = useMemo<QqRow[]>(
    () => analysis.qq.filter((q) => isNum(q.theoretical) && isNum(q.sample)).map((q, i) => ({ ...q, rank: i + 1 })),
    [analysis.qq],
  );
  const reason = reasonFor(analysis.warnings, 'normality');
  const extent = rows.length ? Math.max(...rows.flatMap((r) => [Math.abs(r.theoretical), Math.abs(r.sample)])) + 0.3 : 3;
  const lowP = [analysis.shapiroP, analysis.jarqueBeraP, analysis.andersonDarlingP].filter(isNum).some((p) => p < 0.05);

  const cautions: string[] = [];
  if (rows.length > 0 && rows.length < 20) cautions.push(`Only ${rows.length} errors: normality tests have little power, and the plot’s ends rest on one or two polls.`);

  const chart =
    rows.length === 0 ? null : (
      <ChartBox height={320}>
        <XYChart
          height={320}
          margin={{ top: 16, right: 24, bottom: 48, left: 64 }}
          theme={chartTheme}
          xScale={{ type: 'linear', domain: [-extent, extent] }}
          yScale={{ type: 'linear', domain: [-extent, extent] }}
          accessibilityLabel="Normal quantile–quantile plot of the polls’ signed errors"
        >
          <Grid numTicks={5} />
          <IdentityLine from={-extent} to={extent} />
          <GlyphSeries
            dataKey="Errors"
            data={rows}
            xAccessor={(d) => d.theoretical}
            yAccessor={(d) => d.sample}
            renderGlyph={({ x, y }) => <circle cx={x} cy={y} r={4} fill={CHART_COLOURS.accent200} stroke={CHART_COLOURS.accent900} strokeWidth={1.25} />}
          />
          <Axis orientation="bottom" numTicks={5} label="Normal quantile (Blom positions)" />
          <Axis orientation="left" numTicks={5} label="Standardised error" />
          <Tooltip<QqRow>
            snapTooltipToDatumX
            snapTooltipToDatumY
            renderTooltip={({ tooltipData }) => {
              const d = tooltipData?.nearestDatum?.datum;
              return d ? (
                <div className="text-sm">
                  Error {fmtSigned(d.value)} pts (rank {d.rank} of {rows.length})
                </div>
              ) : null;
            }}
          />
        </XYChart>
      </ChartBox>
    );

  return (
    <ChartFigure
      title="Are the errors roughly normal?"
      explanation="Sorted errors, standardised, against where a normal distribution would put them; points on the dashed line mean normal-looking errors."
      filename={filename}
      chart={chart}
      emptyMessage={<NotEnoughData reason={reason} />}
      meaning={
        <>
          <StatGroup columns={3}>
            <Stat
              label="Shapiro–Wilk"
              value={<ValueOr text={isNum(analysis.shapiroW) ? `W = ${fmtNumber(analysis.shapiroW, 3)}` : null} reason={reason} />}
              hint={fmtPEquals(analysis.shapiroP) ?? undefined}
            />
            <Stat
              label="Jarque–Bera"
              value={<ValueOr text={fmtNumber(analysis.jarqueBera, 2)} reason={reason} />}
              hint={fmtPEquals(analysis.jarqueBeraP) ?? undefined}
            />
            <Stat
              label="Anderson–Darling A²"
              value={<ValueOr text={fmtNumber(analysis.andersonDarling, 3)} reason={reason} />}
              hint={fmtPEquals(analysis.andersonDarlingP) ?? undefined}
            />
          </StatGroup>
          {rows.length > 0 && (
            <p className="mt-3">
              {lowP
                ? 'At least one check finds the errors unlike a normal distribution (p < 0.05): intervals that assume normal errors, including the ones below, may be too narrow in the tails. Look for points far off the line at the ends.'
                : 'None of the checks finds the errors unlike a normal distribution (all p ≥ 0.05); with few polls that is weak reassurance, not proof.'}
            </p>
          )}
        </>
      }
      cautions={cautions}
      table={<DataTable caption="Sorted errors against normal quantiles" columns={columns} data={rows} getRowId={(r) => String(r.rank)} pageSize={15} emptyMessage="Not computed." />}
      csvRows={rows}
      csvColumns={csvColumns}
    />
  );
}
