import { Axis, GlyphSeries, Grid, LineSeries, XYChart } from '@visx/xychart';
import type { AuditBreakdownsResponse, FunnelPoint, SampleSizePoint } from '../api/types';
import { formatNumber } from '../../../lib/format';
import { BinTable, SimpleTable, binCsvRows } from './BinTable';
import { ChartFigure } from './chart/ChartFigure';
import { ActiveRing, SvgLegend, chartTheme, glyphRenderer, paddedDomain } from './chart/marks';
import { chartPalette } from './chart/palette';

const nFormat = new Intl.NumberFormat('en-GB');

export function FunnelFigure({ data }: { data: AuditBreakdownsResponse['sampleSize'] }) {
  const palette = chartPalette();
  const funnel = data.funnel ?? [];
  const title = 'Absolute error against sample size';
  if (data.points.length === 0) {
    return (
      <section aria-label={title} className="rounded-lg border border-dashed border-ink-300 bg-white px-5 py-4">
        <h3 className="text-base font-semibold text-ink-900">{title}</h3>
        <p className="mt-1 text-sm text-ink-600">No polls to draw.</p>
      </section>
    );
  }
  const ns = [...data.points.map((p) => p.n), ...funnel.map((f) => f.n)];
  const xDomain: [number, number] = [Math.min(...ns) * 0.9, Math.max(...ns) * 1.1];
  const yDomain = paddedDomain([...data.points.map((p) => p.absError), ...funnel.map((f) => f.marginMoe95)], { includeZero: true });
  const points = funnel.map(
    (f) =>
      `Sample size ${nFormat.format(f.n)}: sampling alone gives an average absolute margin error of ${formatNumber(f.expectedAbsMarginError)} points and a 95% margin of error of the margin of ${formatNumber(f.marginMoe95)} points.`,
  );

  return (
    <ChartFigure
      title={title}
      explanation="Each dot is a poll’s absolute margin error against its sample size. The solid line is the average miss that sampling alone would give in a 50/50 race; the dashed line is the 95% margin of error of the margin. Dots above the dashed line missed by more than sampling explains."
      note={`The stated margin of error of a poll covers the sampling error of one share only; the margin between two options carries about twice that.`}
      summary={`${data.points.length} polls’ absolute margin errors against sample size on a logarithmic axis, with the error expected from sampling alone.`}
      points={points}
      table={
        <div className="space-y-4">
          <BinTable caption="Error by sample size: the numbers" labelHeader="Sample size" bins={data.bins?.bins ?? []} excluded={data.bins?.excluded} />
          <SimpleTable<FunnelPoint>
            caption="What sampling alone gives (50/50 race, no design effect)"
            rows={funnel}
            rowKey={(f) => String(f.n)}
            columns={[
              { header: 'Sample size', cell: (f) => nFormat.format(f.n) },
              { header: 'Average abs. error', numeric: true, cell: (f) => formatNumber(f.expectedAbsMarginError) },
              { header: '95% MOE of the margin', numeric: true, cell: (f) => formatNumber(f.marginMoe95) },
            ]}
          />
        </div>
      }
      downloads={[
        { label: 'CSV', rows: binCsvRows(data.bins?.bins ?? [], 'sample_size') },
        { label: 'funnel CSV', rows: funnel.map((f) => ({ n: f.n, nEff: f.nEff, marginSe: f.marginSe, expectedAbsMarginError: f.expectedAbsMarginError, marginMoe95: f.marginMoe95 })) },
        { label: 'points CSV', rows: data.points.map((p) => ({ pollKey: p.pollKey, n: p.n, absError: p.absError })) },
      ]}
    >
      {({ width, active, setActive }) => {
        const activePoint = active !== null ? funnel[active] : undefined;
        return (
          <XYChart
            width={width}
            height={320}
            margin={{ top: 32, right: 16, bottom: 48, left: 56 }}
            theme={chartTheme(palette)}
            xScale={{ type: 'log', domain: xDomain }}
            yScale={{ type: 'linear', domain: yDomain, nice: true }}
            accessibilityLabel={title}
            onPointerMove={({ key, datum }) => setActive(key === 'expected' ? funnel.indexOf(datum as FunnelPoint) : null)}
            onPointerOut={() => setActive(null)}
          >
            <Grid columns={false} numTicks={5} />
            <Axis orientation="bottom" label="Sample size (logarithmic)" numTicks={6} tickFormat={(n: number) => nFormat.format(n)} />
            <Axis orientation="left" label="Absolute margin error (points)" numTicks={5} />
            <GlyphSeries
              dataKey="polls"
              data={data.points}
              xAccessor={(p: SampleSizePoint) => p.n}
              yAccessor={(p: SampleSizePoint) => p.absError}
              enableEvents={false}
              renderGlyph={glyphRenderer<SampleSizePoint>('circle', palette.primaryLight, 0, 6)}
            />
            <LineSeries dataKey="expected" data={funnel} xAccessor={(f) => f.n} yAccessor={(f) => f.expectedAbsMarginError} stroke={palette.secondary} strokeWidth={2} />
            <LineSeries
              dataKey="moe"
              data={funnel}
              xAccessor={(f) => f.n}
              yAccessor={(f) => f.marginMoe95}
              stroke={palette.secondary}
              strokeWidth={2}
              strokeDasharray="5 4"
              enableEvents={false}
            />
            {activePoint && <ActiveRing x={activePoint.n} y={activePoint.expectedAbsMarginError} color={palette.text} />}
            <SvgLegend
              color={palette.text}
              items={[
                { label: 'Poll', shape: 'circle', color: palette.primaryLight },
                { label: 'Sampling alone: average miss', shape: 'line', color: palette.secondary },
                { label: '95% MOE of the margin', shape: 'dashed', color: palette.secondary },
              ]}
            />
          </XYChart>
        );
      }}
    </ChartFigure>
  );
}
