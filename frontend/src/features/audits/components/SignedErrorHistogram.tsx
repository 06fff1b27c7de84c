import { Axis, BarSeries, Grid, Tooltip, XYChart } from '@visx/xychart';
import { useMemo } from 'react';
import { toCsv } from '../../../lib/csv';
import { formatCount, formatSignedPoints } from '../format';
import { binValues, type HistogramBin } from '../histogram';
import { METHOD_ANCHORS } from '../method-catalogue';
import { ChartFrame } from './ChartFrame';
import { useChartColors, useChartTheme } from './chart-theme';

interface Bar extends HistogramBin {
  label: string;
}

function binLabel(bin: HistogramBin): string {
  return `${formatSignedPoints(bin.lower, 2).replace(/\.?0+$/, '')} to ${formatSignedPoints(bin.upper, 2).replace(/\.?0+$/, '')}`;
}

export interface SignedErrorHistogramProps {
  /** Signed margin errors in points (the used polls). */
  errors: readonly number[];
  filename: string;
  /** Says how the signs are oriented for these polls. */
  orientation: string;
}

/** How many used polls missed the margin by how much, in each direction. */
export function SignedErrorHistogram({ errors, filename, orientation }: SignedErrorHistogramProps) {
  const colors = useChartColors();
  const theme = useChartTheme(colors);
  const bars = useMemo<Bar[]>(() => binValues(errors).map((bin) => ({ ...bin, label: binLabel(bin) })), [errors]);
  const width = bars[0] ? bars[0].upper - bars[0].lower : 1;
  const every = Math.max(1, Math.ceil(bars.length / 8));
  const tickValues = bars.filter((_, i) => i % every === 0).map((bar) => bar.label);

  const csv = () =>
    toCsv(
      bars,
      [
        { header: 'lower_pts', value: (bar: Bar) => bar.lower },
        { header: 'upper_pts', value: (bar) => bar.upper },
        { header: 'polls', value: (bar) => bar.count },
      ],
    );

  return (
    <ChartFrame
      title="Signed margin errors of the used polls"
      explanation={`How many polls missed the margin by how much, in bins of ${width} pts.`}
      formulaAnchor={METHOD_ANCHORS.marginError}
      filename={filename}
      csv={csv}
      footnote={`${formatCount(errors.length)} polls; ${orientation} Under sampling error alone the bars would centre on 0.`}
      table={
        <table className="min-w-full text-sm">
          <caption className="sr-only">Signed margin errors of the used polls, counted in bins</caption>
          <thead className="bg-ink-100 text-left">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">From (pts, included)</th>
              <th scope="col" className="px-3 py-2 font-semibold">To (pts, excluded)</th>
              <th scope="col" className="px-3 py-2 font-semibold">Polls</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100 tabular-nums">
            {bars.map((bar) => (
              <tr key={bar.lower}>
                <td className="px-3 py-1.5">{formatSignedPoints(bar.lower)}</td>
                <td className="px-3 py-1.5">{formatSignedPoints(bar.upper)}</td>
                <td className="px-3 py-1.5">{bar.count}</td>
              </tr>
            ))}
          </tbody>
        </table>
      }
    >
      {bars.length === 0 ? (
        <p className="py-10 text-center text-ink-600">No used poll has a margin error to show.</p>
      ) : (
        <XYChart
          height={320}
          theme={theme}
          margin={{ top: 16, right: 16, bottom: 56, left: 56 }}
          xScale={{ type: 'band', paddingInner: 0.08 }}
          yScale={{ type: 'linear', nice: true, zero: true }}
          accessibilityLabel="Histogram of signed margin errors of the used polls"
        >
          <Grid columns={false} numTicks={5} />
          <BarSeries dataKey="Polls" data={bars} xAccessor={(bar) => bar.label} yAccessor={(bar) => bar.count} colorAccessor={() => colors.mark} />
          <Axis orientation="bottom" tickValues={tickValues} label="Signed margin error (pts)" />
          <Axis orientation="left" numTicks={5} label="Polls" />
          <Tooltip<Bar>
            snapTooltipToDatumX
            snapTooltipToDatumY
            renderTooltip={({ tooltipData }) => {
              const bar = tooltipData?.nearestDatum?.datum;
              return bar ? (
                <span>
                  {bar.label} pts: {bar.count} {bar.count === 1 ? 'poll' : 'polls'}
                </span>
              ) : null;
            }}
          />
        </XYChart>
      )}
    </ChartFrame>
  );
}
