import { Axis, GlyphSeries, Grid, XYChart } from '@visx/xychart';
import type { QqPoint } from '../api/types';
import { formatNumber, formatSigned } from '../../../lib/format';
import { SimpleTable } from './BinTable';
import { ChartFigure } from './chart/ChartFigure';
import { ActiveRing, DataLine, SvgLegend, chartTheme, glyphRenderer, paddedDomain } from './chart/marks';
import { chartPalette } from './chart/palette';

/** Rows shown in the table beside the Q–Q plot: the tails, where departures from normal show. */
const TAIL = 5;

export function QqFigure({ points }: { points: QqPoint[] | null }) {
  const palette = chartPalette();
  const title = 'Q–Q plot of signed errors';
  if (!points || points.length === 0) {
    return (
      <section aria-label={title} className="rounded-lg border border-dashed border-ink-300 bg-white px-5 py-4">
        <h3 className="text-base font-semibold text-ink-900">{title}</h3>
        <p className="mt-1 text-sm text-ink-600">At least three polls are needed.</p>
      </section>
    );
  }
  const domain = paddedDomain(points.flatMap((p) => [p.theoretical, p.sample]));
  const tails = points.length > 2 * TAIL ? [...points.slice(0, TAIL), ...points.slice(-TAIL)] : points;
  const describe = (p: QqPoint) =>
    `Signed error ${formatSigned(p.value)} points: ${formatNumber(p.sample, 2)} standard deviations from the mean, where a normal sample would put it at ${formatNumber(p.theoretical, 2)}.`;

  return (
    <ChartFigure
      title={title}
      explanation="Each poll’s signed error, standardised, against where it would fall if errors were normally distributed; points on the line fit a normal shape, points bending away at the ends show heavier tails or skew."
      note="A diagnostic only: the shared-error analysis reports a formal normality test. Polls of one contest share error, so the points are not independent."
      summary={`${points.length} standardised signed errors against normal quantiles, with the line of a perfect fit.`}
      points={points.map(describe)}
      table={
        <SimpleTable<QqPoint>
          caption={points.length > 2 * TAIL ? `The ${TAIL} lowest and ${TAIL} highest errors (all ${points.length} in the CSV)` : 'Every error'}
          rows={tails}
          rowKey={(p, i) => `${i}-${p.value}`}
          columns={[
            { header: 'Signed error (pts)', cell: (p) => formatSigned(p.value) },
            { header: 'Standardised', numeric: true, cell: (p) => formatNumber(p.sample, 2) },
            { header: 'Normal quantile', numeric: true, cell: (p) => formatNumber(p.theoretical, 2) },
          ]}
        />
      }
      downloads={[{ label: 'CSV', rows: points.map((p) => ({ signedError: p.value, standardised: p.sample, normalQuantile: p.theoretical })) }]}
    >
      {({ width, active, setActive }) => {
        const activePoint = active !== null ? points[active] : undefined;
        return (
          <XYChart
            width={width}
            height={320}
            margin={{ top: 32, right: 16, bottom: 48, left: 56 }}
            theme={chartTheme(palette)}
            xScale={{ type: 'linear', domain }}
            yScale={{ type: 'linear', domain }}
            accessibilityLabel={title}
            onPointerMove={({ datum }) => setActive(points.indexOf(datum as QqPoint))}
            onPointerOut={() => setActive(null)}
          >
            <Grid numTicks={5} />
            <Axis orientation="bottom" label="Normal quantile" numTicks={6} />
            <Axis orientation="left" label="Standardised signed error" numTicks={6} />
            <DataLine points={[{ x: domain[0], y: domain[0] }, { x: domain[1], y: domain[1] }]} color={palette.secondary} dash="5 4" />
            <GlyphSeries dataKey="qq" data={points} xAccessor={(p) => p.theoretical} yAccessor={(p) => p.sample} renderGlyph={glyphRenderer<QqPoint>('circle', palette.primary, 0, 6)} />
            {activePoint && <ActiveRing x={activePoint.theoretical} y={activePoint.sample} color={palette.text} />}
            <SvgLegend
              color={palette.text}
              items={[
                { label: 'Poll', shape: 'circle', color: palette.primary },
                { label: 'Normal errors would lie here', shape: 'dashed', color: palette.secondary },
              ]}
            />
          </XYChart>
        );
      }}
    </ChartFigure>
  );
}
