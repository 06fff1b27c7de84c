import { Axis, GlyphSeries, Grid, LineSeries, Tooltip, XYChart, buildChartTheme } from '@visx/xychart';
import { useId, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { useChartExport } from '../../../components/charts';
import { Alert, Button, DataTable, createDataTableColumnHelper } from '../../../components/ui';
import { paletteColor as token } from '../../../lib/palette';
import { paths } from '../../../lib/paths';
import { formatDate } from '../../../utils/format';
import { downloadCsv, toCsv, type CsvColumn } from '../../../lib/csv';
import { downloadPng, downloadSvg } from '../../../lib/svg-export';
import { formatSignedPoints } from '../format';
import type { MarginPoint } from '../margins';

interface LinePoint {
  date: Date;
  margin: number;
}

function chartTheme() {
  return buildChartTheme({
    backgroundColor: token('white'),
    colors: [token('accent-700'), token('ink-900')],
    gridColor: token('ink-200'),
    gridColorDark: token('ink-400'),
    tickLength: 4,
    svgLabelSmall: { fill: token('ink-700'), fontSize: 12 },
    svgLabelBig: { fill: token('ink-800'), fontSize: 13 },
  });
}

const column = createDataTableColumnHelper<MarginPoint>();
const tableColumns = column.columns([
  column.accessor('pollKey', {
    header: 'Poll',
    cell: (info) => (
      <Link to={paths.poll.href(info.getValue())} className="font-mono text-xs whitespace-nowrap text-accent-700 underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('pollster', { header: 'Pollster' }),
  column.accessor('midpoint', { header: 'Fieldwork midpoint', cell: (info) => formatDate(info.getValue()) }),
  column.accessor('margin', { header: 'Margin A − B (points)', sortFn: 'basic', cell: (info) => formatSignedPoints(info.getValue()) }),
  column.accessor((row) => row.marginError ?? Number.NEGATIVE_INFINITY, {
    id: 'marginError',
    header: 'Margin error (points)',
    sortFn: 'basic',
    cell: (info) => formatSignedPoints(info.row.original.marginError),
  }),
]);

const CSV_COLUMNS: CsvColumn<MarginPoint>[] = [
  { header: 'poll_key', value: (p) => p.pollKey },
  { header: 'pollster', value: (p) => p.pollster },
  { header: 'fieldwork_start', value: (p) => p.fieldworkStart },
  { header: 'fieldwork_end', value: (p) => p.fieldworkEnd },
  { header: 'fieldwork_midpoint', value: (p) => p.midpoint },
  { header: 'sample_size', value: (p) => p.sampleSize },
  { header: 'margin_a_minus_b', value: (p) => Math.round(p.margin * 1000) / 1000 },
  { header: 'margin_error', value: (p) => (p.marginError === null ? null : Math.round(p.marginError * 1000) / 1000) },
];

const asDate = (iso: string) => new Date(`${iso}T12:00:00Z`);

export interface MarginChartProps {
  contestKey: string;
  points: MarginPoint[];
  /** Certified A − B in points; null while the result is not certified. */
  certified: number | null;
  electionDate: string;
  nameA: string;
  nameB: string;
}

/**
 * Each poll's margin between options A and B against the middle of its fieldwork, with the
 * certified margin drawn as a line, and the same numbers as a table.
 */
export function MarginChart({ contestKey, points, certified, electionDate, nameA, nameB }: MarginChartProps) {
  const [view, setView] = useState<'chart' | 'table'>('chart');
  const { ref: frame, failure: saveError, run, withSvg } = useChartExport({
    missingMessage: 'Show the chart first, then save it.',
    fallbackMessage: 'The chart could not be saved.',
  });
  const descriptionId = useId();
  const theme = useMemo(chartTheme, []);

  const line = useMemo<LinePoint[]>(() => {
    if (certified === null || points.length === 0) return [];
    const first = asDate(points[0]!.midpoint);
    return [
      { date: first, margin: certified },
      { date: asDate(electionDate), margin: certified },
    ];
  }, [certified, points, electionDate]);

  const base = `${contestKey}-margins`;
  const save = (kind: 'svg' | 'png') => withSvg((node) => (kind === 'svg' ? downloadSvg(node, `${base}.svg`) : downloadPng(node, `${base}.png`)));

  if (points.length === 0) {
    return <p className="text-ink-600">No poll of this contest has shares for both {nameA} and {nameB}, so there is nothing to plot.</p>;
  }

  return (
    <div className="space-y-3">
      <p id={descriptionId} className="text-sm text-ink-700">
        Each dot is one poll: its lead of <strong>{nameA}</strong> (A) over <strong>{nameB}</strong> (B) in points, placed at the
        middle of its fieldwork. {certified === null ? 'The result is not certified yet, so no certified margin is drawn.' : (
          <>The solid line is the certified margin ({formatSignedPoints(certified)}); a dot above it overstated A.</>
        )}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <div role="group" aria-label="Show the margins as" className="inline-flex gap-1">
          <Button size="sm" variant={view === 'chart' ? 'primary' : 'secondary'} aria-pressed={view === 'chart'} onClick={() => setView('chart')}>
            Chart
          </Button>
          <Button size="sm" variant={view === 'table' ? 'primary' : 'secondary'} aria-pressed={view === 'table'} onClick={() => setView('table')}>
            Table
          </Button>
        </div>
        <span className="mx-1 h-5 w-px bg-ink-200" aria-hidden="true" />
        <Button size="sm" variant="ghost" onClick={() => void save('svg')} disabled={view !== 'chart'}>
          Save chart as SVG
        </Button>
        <Button size="sm" variant="ghost" onClick={() => void save('png')} disabled={view !== 'chart'}>
          Save chart as PNG
        </Button>
        <Button size="sm" variant="ghost" onClick={() => void run(() => downloadCsv(toCsv(points, CSV_COLUMNS), `${base}.csv`))}>
          Download data (CSV)
        </Button>
      </div>
      {saveError && <Alert tone="danger">{saveError}</Alert>}
      {view === 'chart' ? (
        <div ref={frame} className="rounded-lg border border-ink-200 bg-white p-2" aria-describedby={descriptionId}>
          {/* XYChart measures its parent (ParentSize), so the parent needs a height. */}
          <div className="h-[340px]">
          <XYChart
            height={340}
            margin={{ top: 16, right: 24, bottom: 48, left: 64 }}
            xScale={{ type: 'time' }}
            yScale={{ type: 'linear', nice: true }}
            theme={theme}
            accessibilityLabel={`Poll margins of ${nameA} over ${nameB} by fieldwork date${certified === null ? '' : ', with the certified margin'}`}
          >
            <Grid columns={false} numTicks={6} />
            <Axis orientation="bottom" numTicks={6} label="Fieldwork midpoint" />
            <Axis orientation="left" numTicks={6} label={`Margin A − B (points)`} tickFormat={(v) => formatSignedPoints(Number(v))} />
            {line.length > 0 && (
              <LineSeries
                dataKey="Certified margin"
                className="stroke-ink-900"
                data={line}
                xAccessor={(d) => d.date}
                yAccessor={(d) => d.margin}
                strokeWidth={2}
              />
            )}
            <GlyphSeries
              dataKey="Polls"
              data={points}
              xAccessor={(d) => asDate(d.midpoint)}
              yAccessor={(d) => d.margin}
              size={7}
              renderGlyph={({ x, y, size }) => (
                <circle cx={x} cy={y} r={size / 2} className="fill-accent-700 stroke-white" strokeWidth={1} fillOpacity={0.75} />
              )}
            />
            <Tooltip<MarginPoint | LinePoint>
              snapTooltipToDatumX
              snapTooltipToDatumY
              showSeriesGlyphs={false}
              renderTooltip={({ tooltipData }) => {
                const nearest = tooltipData?.nearestDatum;
                if (!nearest) return null;
                if (nearest.key !== 'Polls') return <span>Certified margin {formatSignedPoints(certified)}</span>;
                const p = nearest.datum as MarginPoint;
                return (
                  <div className="space-y-0.5 text-xs">
                    <p className="font-semibold">{p.pollster}</p>
                    <p className="font-mono">{p.pollKey}</p>
                    <p>
                      Fieldwork {formatDate(p.fieldworkStart)} – {formatDate(p.fieldworkEnd)}
                    </p>
                    <p>Margin A − B {formatSignedPoints(p.margin)} points</p>
                    {p.marginError !== null && <p>Error {formatSignedPoints(p.marginError)} points</p>}
                  </div>
                );
              }}
            />
          </XYChart>
          </div>
          <p className="px-2 pt-1 text-xs text-ink-600">
            <span aria-hidden="true">● </span>poll margin · <span aria-hidden="true">— </span>certified margin
          </p>
        </div>
      ) : (
        <DataTable
          caption={`Poll margins of ${nameA} over ${nameB}`}
          columns={tableColumns}
          data={points}
          getRowId={(p) => p.pollKey}
          initialSorting={[{ id: 'midpoint', desc: false }]}
          searchLabel="Search the margins"
        />
      )}
    </div>
  );
}
