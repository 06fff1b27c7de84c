import { Axis, GlyphSeries, Grid, XYChart } from '@visx/xychart';
import { useMemo, useState } from 'react';
import type { AuditBreakdownsResponse, BreakdownBin, DaysOutPoint } from '../api/types';
import { formatInterval, formatNumber, formatSigned } from '../../../lib/format';
import { BinTable, binCsvRows } from './BinTable';
import { ChartFigure } from './chart/ChartFigure';
import { ActiveRing, HorizontalRule, IntervalMarks, SegmentMarks, SvgLegend, chartTheme, glyphRenderer, paddedDomain } from './chart/marks';
import { chartPalette } from './chart/palette';
import { MEASURE_LABELS, MeasureToggle, type Measure } from './MeasureToggle';

/**
 * The day range of a days-out bin. Labels name whole days: "4–7" is [4, 8) so that a fieldwork
 * midpoint 7.5 days out belongs to it, and "22+" runs to `top`.
 */
export function daysOutBinRange(label: string, top: number): [number, number] | null {
  const closed = /^(\d+)\s*[–-]\s*(\d+)$/.exec(label);
  if (closed) return [Number(closed[1]), Number(closed[2]) + 1];
  const open = /^(\d+)\+$/.exec(label);
  if (open) return [Number(open[1]), Math.max(Number(open[1]) + 1, top)];
  return null;
}

interface PlacedBin {
  bin: BreakdownBin;
  from: number;
  to: number;
  mid: number;
  value: number | null;
  lo: number | null;
  hi: number | null;
}

type PlottedPoint = DaysOutPoint & { daysOut: number };

export function DaysOutFigure({ data }: { data: AuditBreakdownsResponse['daysOut'] }) {
  const [measure, setMeasure] = useState<Measure>('signed');
  const palette = chartPalette();
  const plotted = useMemo(() => data.points.filter((p): p is PlottedPoint => p.daysOut !== null), [data.points]);
  const top = Math.max(22, ...plotted.map((p) => p.daysOut));
  const bins: PlacedBin[] = (data.bins?.bins ?? []).flatMap((bin) => {
    const range = daysOutBinRange(bin.label, top);
    if (!range) return [];
    const signed = measure === 'signed';
    return [{
      bin,
      from: range[0],
      to: range[1],
      mid: (range[0] + range[1]) / 2,
      value: signed ? bin.meanSigned : bin.meanAbs,
      lo: signed ? bin.lo : (bin.absInterval?.[0] ?? null),
      hi: signed ? bin.hi : (bin.absInterval?.[1] ?? null),
    }];
  });
  const yOf = (p: DaysOutPoint) => (measure === 'signed' ? p.signedError : p.absError);
  const used = plotted.filter((p) => p.used);
  const unused = plotted.filter((p) => !p.used);
  const domain = paddedDomain([...plotted.map(yOf), ...bins.flatMap((b) => [b.lo, b.hi])], { includeZero: true });
  const title = 'Error against days out';
  const points = bins.map(
    (b) =>
      `${b.bin.label} days out, ${b.bin.n} polls: ${MEASURE_LABELS[measure].toLowerCase()} ${measure === 'signed' ? formatSigned(b.value) : formatNumber(b.value)} points, 95% interval ${
        b.lo !== null && b.hi !== null ? formatInterval([b.lo, b.hi]) : 'not available'
      }.`,
  );

  return (
    <ChartFigure
      title={title}
      explanation="Each dot is a poll’s margin error against the days between its fieldwork midpoint and the election; bars are the binned means with 95% intervals. Error that shrinks toward election day is late movement: a poll measures opinion during its fieldwork and is not a forecast."
      note={`Every computable poll of the audit’s elections is drawn (filled: used by the audit; hollow: outside its window or not a final poll), and the bins use them all. ${plotted.length} polls.`}
      summary={`${plotted.length} polls and ${bins.length} binned means of the ${MEASURE_LABELS[measure].toLowerCase()} against days before the election.`}
      points={points}
      controls={<MeasureToggle value={measure} onChange={setMeasure} chart={title} />}
      table={<BinTable caption="Error by days out: the numbers" labelHeader="Days out" bins={data.bins?.bins ?? []} excluded={data.bins?.excluded} />}
      downloads={[
        { label: 'CSV', rows: binCsvRows(data.bins?.bins ?? [], 'days_out') },
        {
          label: 'points CSV',
          rows: data.points.map((p) => ({ pollKey: p.pollKey, pollster: p.pollster, daysOut: p.daysOut, signedError: p.signedError, absError: p.absError, used: p.used })),
        },
      ]}
    >
      {({ width, active, setActive }) => {
        const activeBin = active !== null ? bins[active] : undefined;
        return (
          <XYChart
            width={width}
            height={320}
            margin={{ top: 32, right: 16, bottom: 48, left: 56 }}
            theme={chartTheme(palette)}
            // Election day at the right: time runs left to right.
            xScale={{ type: 'linear', domain: [top + 1, 0] }}
            yScale={{ type: 'linear', domain, nice: true, zero: false }}
            accessibilityLabel={title}
            onPointerMove={({ key, datum }) => setActive(key === 'bins' ? bins.indexOf(datum as PlacedBin) : null)}
            onPointerOut={() => setActive(null)}
          >
            <Grid columns={false} numTicks={5} />
            <Axis orientation="bottom" label="Days before the election (election day at the right)" numTicks={8} />
            <Axis orientation="left" label={measure === 'signed' ? 'Signed margin error (points)' : 'Absolute margin error (points)'} numTicks={5} />
            {measure === 'signed' && <HorizontalRule y={0} color={palette.axis} />}
            <GlyphSeries dataKey="unused" data={unused} xAccessor={(p) => p.daysOut} yAccessor={yOf} enableEvents={false} renderGlyph={glyphRenderer<PlottedPoint>('ring', palette.faint, 0, 5)} />
            <GlyphSeries dataKey="used" data={used} xAccessor={(p) => p.daysOut} yAccessor={yOf} enableEvents={false} renderGlyph={glyphRenderer<PlottedPoint>('circle', palette.primaryLight, 0, 6)} />
            <SegmentMarks data={bins} x0={(b) => b.from} x1={(b) => b.to} y={(b) => b.value} color={palette.secondary} />
            <IntervalMarks data={bins} x={(b) => b.mid} lo={(b) => b.lo} hi={(b) => b.hi} color={palette.secondary} />
            <GlyphSeries
              dataKey="bins"
              data={bins.filter((b) => b.value !== null)}
              xAccessor={(b) => b.mid}
              yAccessor={(b) => b.value as number}
              renderGlyph={glyphRenderer<PlacedBin>('diamond', palette.secondary, 0, 9)}
            />
            {activeBin && <ActiveRing x={activeBin.mid} y={activeBin.value} color={palette.text} />}
            <SvgLegend
              color={palette.text}
              items={[
                { label: 'Poll used', shape: 'circle', color: palette.primaryLight },
                { label: 'Poll not used', shape: 'ring', color: palette.faint },
                { label: 'Bin mean, 95% interval', shape: 'diamond', color: palette.secondary },
              ]}
            />
          </XYChart>
        );
      }}
    </ChartFigure>
  );
}
