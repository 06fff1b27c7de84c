import { Axis, GlyphSeries, Grid, LineSeries, Tooltip, XYChart } from '@visx/xychart';
import { useMemo } from 'react';
import { toCsv } from '../../../lib/csv';
import { formatCount, formatPoints, formatSignedPoints } from '../format';
import { METHOD_ANCHORS } from '../method-catalogue';
import { ChartFrame } from './ChartFrame';
import { useChartColors, useChartTheme } from './chart-theme';

export interface DaysOutPoint {
  pollKey: string;
  pollster: string;
  contestKey: string;
  daysOut: number;
  marginError: number;
}

/** Rows shown in the table alternative; the CSV always holds them all. */
const TABLE_LIMIT = 500;
/** Points drawn; beyond it an evenly spaced subset is drawn so the page stays responsive. */
const DRAW_LIMIT = 4000;

export interface ErrorByDaysOutProps {
  points: readonly DaysOutPoint[];
  filename: string;
  orientation: string;
  /** Which polls the points are, in a few words. */
  scope: string;
}

/** Signed margin error against how long before election day the poll was in the field. */
export function ErrorByDaysOut({ points, filename, orientation, scope }: ErrorByDaysOutProps) {
  const colors = useChartColors();
  const theme = useChartTheme(colors);
  const data = useMemo(() => [...points].sort((a, b) => b.daysOut - a.daysOut), [points]);
  const step = Math.ceil(data.length / DRAW_LIMIT);
  const drawn = useMemo(() => (step > 1 ? data.filter((_, i) => i % step === 0) : data), [data, step]);
  const domains = useMemo(() => {
    let maxDays = 1;
    let maxError = 1;
    for (const p of data) {
      maxDays = Math.max(maxDays, p.daysOut);
      maxError = Math.max(maxError, Math.abs(p.marginError));
    }
    // Symmetric about zero, so a lean to either side reads at a glance; a little room at the edges.
    return { days: Math.ceil(maxDays * 1.04 + 0.5), error: Math.ceil(maxError * 1.08) };
  }, [data]);
  const zeroLine = useMemo(
    () => [
      { daysOut: domains.days, marginError: 0 },
      { daysOut: 0, marginError: 0 },
    ],
    [domains],
  );

  const csv = () =>
    toCsv(
      data,
      [
        { header: 'poll_key', value: (p: DaysOutPoint) => p.pollKey },
        { header: 'pollster', value: (p) => p.pollster },
        { header: 'contest_key', value: (p) => p.contestKey },
        { header: 'days_out', value: (p) => p.daysOut },
        { header: 'margin_error_pts', value: (p) => p.marginError },
      ],
    );

  return (
    <ChartFrame
      title="Signed margin error against days out"
      explanation="Whether polls taken further from election day missed by more, or leaned one way."

      formulaAnchor={METHOD_ANCHORS.daysOut}
      filename={filename}
      csv={csv}
      footnote={`${formatCount(data.length)} ${scope}${step > 1 ? ` (1 in ${step} drawn; the CSV holds them all)` : ''}; ${orientation} The dashed line marks no error. A poll measures opinion during its fieldwork: late movement is real change, not poll error.`}
      table={
        <table className="min-w-full text-sm">
          <caption className="sr-only">Signed margin error and days out of each poll in the chart</caption>
          <thead className="bg-ink-100 text-left">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">Poll</th>
              <th scope="col" className="px-3 py-2 font-semibold">Pollster</th>
              <th scope="col" className="px-3 py-2 font-semibold">Days out</th>
              <th scope="col" className="px-3 py-2 font-semibold">Signed margin error (pts)</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100 tabular-nums">
            {data.slice(0, TABLE_LIMIT).map((p) => (
              <tr key={p.pollKey}>
                <td className="px-3 py-1.5 font-mono text-xs">{p.pollKey}</td>
                <td className="px-3 py-1.5">{p.pollster}</td>
                <td className="px-3 py-1.5">{formatPoints(p.daysOut, 1)}</td>
                <td className="px-3 py-1.5">{formatSignedPoints(p.marginError)}</td>
              </tr>
            ))}
            {data.length > TABLE_LIMIT && (
              <tr>
                <td colSpan={4} className="px-3 py-2 text-ink-600">
                  The first {TABLE_LIMIT} of {formatCount(data.length)} rows; the CSV download holds them all.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      }
    >
      {data.length === 0 ? (
        <p className="py-10 text-center text-ink-600">No poll has both a margin error and days out to show.</p>
      ) : (
        <XYChart
          height={320}
          theme={theme}
          margin={{ top: 16, right: 16, bottom: 56, left: 56 }}
          xScale={{ type: 'linear', domain: [0, domains.days], reverse: true }}
          yScale={{ type: 'linear', domain: [-domains.error, domains.error] }}
          accessibilityLabel="Scatter plot of signed margin error against days out"
        >
          <Grid numTicks={6} />
          <LineSeries
            dataKey="No error"
            data={zeroLine}
            xAccessor={(d) => d.daysOut}
            yAccessor={(d) => d.marginError}
            stroke={colors.reference}
            strokeDasharray="6 4"
            strokeWidth={1.5}
          />
          <GlyphSeries
            dataKey="Polls"
            data={drawn}
            xAccessor={(p) => p.daysOut}
            yAccessor={(p) => p.marginError}
            size={6}
            colorAccessor={() => colors.mark}
          />
          <Axis orientation="bottom" numTicks={6} label="Days out (election day at the right)" />
          <Axis orientation="left" numTicks={6} label="Signed margin error (pts)" />
          <Tooltip<DaysOutPoint>
            snapTooltipToDatumX
            snapTooltipToDatumY
            renderTooltip={({ tooltipData }) => {
              const p = tooltipData?.nearestDatum?.datum;
              if (!p || !('pollKey' in p)) return null;
              return (
                <span className="block text-xs">
                  <strong>{p.pollster}</strong>
                  <br />
                  {p.pollKey}
                  <br />
                  {formatPoints(p.daysOut, 1)} days out, error {formatSignedPoints(p.marginError)} pts
                </span>
              );
            }}
          />
        </XYChart>
      )}
    </ChartFrame>
  );
}
