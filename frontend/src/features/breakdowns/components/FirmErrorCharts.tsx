import type { AuditPollDto } from '@veracast/shared-types';
import { Axis, BarGroup, BarSeries, GlyphSeries, Grid, XYChart } from '@visx/xychart';
import { useMemo } from 'react';
import { formatNumber, formatPercent, formatSigned } from '../../../lib/format';
import { absErrorHistogram, firmElectionRows, leanWords, type ElectionInfo, type FirmElectionRow, type HistogramBin } from '../utils/firm-summary';
import { SimpleTable } from './BinTable';
import { ChartFigure } from './chart/ChartFigure';
import { DotIntervalChart, dotItems, type DotSeries } from './chart/DotIntervalChart';
import { ActiveRing, HorizontalRule, SvgLegend, chartTheme, glyphRenderer, paddedDomain } from './chart/marks';
import { chartPalette } from './chart/palette';

export interface FirmErrorChartsProps {
  pollsterId: number;
  firmName: string;
  elections: ElectionInfo[];
  /** Every poll of the firm in the audit's elections. */
  firmPolls: AuditPollDto[];
  /** Every firm's polls that the audit uses. */
  fieldPolls: AuditPollDto[];
}

type TimedPoll = AuditPollDto & { marginError: number; absMarginError: number; date: Date; used: boolean };

const dateFormat = new Intl.DateTimeFormat('en-GB', { year: 'numeric', month: 'short', day: 'numeric', timeZone: 'UTC' });
const day = (iso: string) => new Date(`${iso}T00:00:00Z`);

function PollsOverTime({ pollsterId, firmName, elections, firmPolls, fieldPolls }: FirmErrorChartsProps) {
  const palette = chartPalette();
  const usedKeys = useMemo(() => new Set(fieldPolls.map((p) => p.pollKey)), [fieldPolls]);
  const names = new Map(elections.map((e) => [e.key, e.name]));
  const polls: TimedPoll[] = firmPolls
    .filter((p): p is AuditPollDto & { marginError: number; absMarginError: number } => p.error === null && p.marginError !== null && p.absMarginError !== null && p.refBasis === 'blocs')
    .map((p) => ({ ...p, date: day(p.fieldworkEnd), used: usedKeys.has(p.pollKey) }))
    .sort((a, b) => a.date.getTime() - b.date.getTime() || a.pollKey.localeCompare(b.pollKey));
  const left = firmPolls.length - polls.length;
  const rows = firmElectionRows(pollsterId, fieldPolls, elections);
  const fieldMeans = rows
    .filter((r) => r.fieldMeanSigned !== null)
    .map((r) => ({ ...r, date: day(elections.find((e) => e.key === r.electionKey)?.date ?? '1970-01-01') }));
  const title = 'Signed error of each poll over time';
  const dates = [...polls.map((p) => p.date.getTime()), ...fieldMeans.map((m) => m.date.getTime())];
  const pad = 20 * 86_400_000;
  const xDomain = dates.length ? [new Date(Math.min(...dates) - pad), new Date(Math.max(...dates) + pad)] : [new Date(0), new Date(1)];
  const yDomain = paddedDomain([...polls.map((p) => p.marginError), ...fieldMeans.map((m) => m.fieldMeanSigned)], { includeZero: true });
  const describe = (p: TimedPoll) =>
    `${dateFormat.format(p.date)}, ${names.get(p.electionKey) ?? p.electionKey}: signed error ${formatSigned(p.marginError)} points${p.used ? '' : ' (not used by the audit)'}.`;

  return (
    <ChartFigure
      title={title}
      fileName={`${firmName} signed error over time`}
      explanation={`Each dot is one of ${firmName}’s polls at the end of its fieldwork, with its signed margin error; the diamonds are the field’s mean signed error at each election. Positive means the poll overstated the election’s first bloc.`}
      note={`Filled dots are polls the audit uses; hollow ones fell outside its window or were not the firm’s final poll.${left > 0 ? ` ${left} poll${left === 1 ? '' : 's'} without a signed error (referendum questions, contests without both blocs, or no result) are left out.` : ''}`}
      summary={`${polls.length} polls of ${firmName} by date with their signed margin errors, and the field’s mean at each of ${fieldMeans.length} elections.`}
      points={polls.map(describe)}
      table={
        <div className="max-h-96 overflow-y-auto">
          <SimpleTable<TimedPoll>
            caption={`${firmName}’s polls: the numbers`}
            rows={polls}
            rowKey={(p) => p.pollKey}
            columns={[
              { header: 'Fieldwork end', cell: (p) => dateFormat.format(p.date) },
              { header: 'Election', cell: (p) => names.get(p.electionKey) ?? p.electionKey },
              { header: 'Signed error', numeric: true, cell: (p) => formatSigned(p.marginError) },
              { header: 'Abs. error', numeric: true, cell: (p) => formatNumber(p.absMarginError) },
              { header: 'Used', cell: (p) => (p.used ? 'yes' : 'no') },
            ]}
          />
        </div>
      }
      downloads={[
        {
          label: 'CSV',
          rows: polls.map((p) => ({
            pollKey: p.pollKey,
            electionKey: p.electionKey,
            contestKey: p.contestKey,
            fieldworkEnd: p.fieldworkEnd,
            signedError: p.marginError,
            absError: p.absMarginError,
            usedByAudit: p.used,
          })),
        },
      ]}
    >
      {({ width, active, setActive }) => {
        const activePoll = active !== null ? polls[active] : undefined;
        return (
          <XYChart
            width={width}
            height={320}
            margin={{ top: 32, right: 16, bottom: 48, left: 56 }}
            theme={chartTheme(palette)}
            xScale={{ type: 'time', domain: xDomain }}
            yScale={{ type: 'linear', domain: yDomain, nice: true, zero: false }}
            accessibilityLabel={title}
            onPointerMove={({ key, datum }) => setActive(key === 'used' || key === 'unused' ? polls.indexOf(datum as TimedPoll) : null)}
            onPointerOut={() => setActive(null)}
          >
            <Grid columns={false} numTicks={5} />
            <Axis orientation="bottom" label="End of fieldwork" numTicks={6} />
            <Axis orientation="left" label="Signed margin error (points)" numTicks={5} />
            <HorizontalRule y={0} color={palette.axis} />
            <GlyphSeries dataKey="unused" data={polls.filter((p) => !p.used)} xAccessor={(p) => p.date} yAccessor={(p) => p.marginError} renderGlyph={glyphRenderer<TimedPoll>('ring', palette.primary, 0, 7)} />
            <GlyphSeries dataKey="used" data={polls.filter((p) => p.used)} xAccessor={(p) => p.date} yAccessor={(p) => p.marginError} renderGlyph={glyphRenderer<TimedPoll>('circle', palette.primary, 0, 7)} />
            <GlyphSeries
              dataKey="field"
              data={fieldMeans}
              xAccessor={(m) => m.date}
              yAccessor={(m) => m.fieldMeanSigned as number}
              enableEvents={false}
              renderGlyph={glyphRenderer<(typeof fieldMeans)[number]>('diamond', palette.secondary, 0, 10)}
            />
            {activePoll && <ActiveRing x={activePoll.date} y={activePoll.marginError} color={palette.text} />}
            <SvgLegend
              color={palette.text}
              items={[
                { label: 'Poll used', shape: 'circle', color: palette.primary },
                { label: 'Poll not used', shape: 'ring', color: palette.primary },
                { label: 'Field mean at the election', shape: 'diamond', color: palette.secondary },
              ]}
            />
          </XYChart>
        );
      }}
    </ChartFigure>
  );
}

function LeanPerElection({ pollsterId, firmName, elections, fieldPolls }: FirmErrorChartsProps) {
  const rows = firmElectionRows(pollsterId, fieldPolls, elections).filter((r) => r.firmPolls > 0);
  const title = 'Lean per election: the firm against the field';
  const categories = rows.map((r) => r.election);
  const series: DotSeries[] = [
    { key: 'firm', label: firmName, shape: 'circle', color: 'primary', points: rows.map((r) => ({ category: r.election, value: r.firmMeanSigned, lo: null, hi: null })) },
    { key: 'field', label: 'Field mean', shape: 'diamond', color: 'secondary', points: rows.map((r) => ({ category: r.election, value: r.fieldMeanSigned, lo: null, hi: null })) },
  ];
  const points = dotItems(categories, series).map(
    (item) => `${item.category}: ${item.series.key === 'firm' ? firmName : 'the field'} mean signed error ${formatSigned(item.point.value)} points.`,
  );
  const pts = (x: number) => `${formatNumber(x)} pts`;

  return (
    <ChartFigure
      title={title}
      fileName={`${firmName} lean per election`}
      explanation={`${firmName}’s mean signed error in each election beside the field’s (every firm’s polls that the audit uses, this firm included): a lean shared with the field is a common miss, not the firm’s own.`}
      note="Only contests that carry the election’s two orientation blocs enter a signed mean. Plain means without intervals: the firm’s interval clustered by contest is in its scorecard."
      summary={`Mean signed error of ${firmName} and of the field in ${rows.length} elections.`}
      points={points}
      table={
        <SimpleTable<FirmElectionRow>
          caption="Lean per election: the numbers"
          rows={rows}
          rowKey={(r) => r.electionKey}
          columns={[
            { header: 'Election', cell: (r) => r.election },
            { header: 'Polls', numeric: true, cell: (r) => r.firmPolls },
            {
              header: 'Firm mean signed',
              numeric: true,
              cell: (r) => (
                <>
                  {formatSigned(r.firmMeanSigned)}
                  <span className="block text-xs font-normal whitespace-normal text-ink-500">{leanWords(r.firmMeanSigned, r.blocA, r.blocB, pts)}</span>
                </>
              ),
            },
            { header: 'Field mean signed', numeric: true, cell: (r) => formatSigned(r.fieldMeanSigned) },
            { header: 'Firm − field', numeric: true, cell: (r) => formatSigned(r.difference) },
          ]}
        />
      }
      downloads={[
        {
          label: 'CSV',
          rows: rows.map((r) => ({
            electionKey: r.electionKey,
            election: r.election,
            blocA: r.blocA,
            blocB: r.blocB,
            firmPolls: r.firmPolls,
            firmSignedPolls: r.firmSignedPolls,
            firmMeanSignedError: r.firmMeanSigned,
            firmMeanAbsError: r.firmMeanAbs,
            fieldPolls: r.fieldPolls,
            fieldMeanSignedError: r.fieldMeanSigned,
            fieldMeanAbsError: r.fieldMeanAbs,
            firmMinusField: r.difference,
          })),
        },
      ]}
    >
      {({ width, active, setActive }) => (
        <DotIntervalChart width={width} categories={categories} series={series} yLabel="Mean signed error (points)" active={active} setActive={setActive} zeroRule accessibilityLabel={title} />
      )}
    </ChartFigure>
  );
}

function ErrorDistribution({ pollsterId, firmName, fieldPolls }: FirmErrorChartsProps) {
  const palette = chartPalette();
  const bins = absErrorHistogram(pollsterId, fieldPolls);
  const firmTotal = bins.reduce((s, b) => s + b.firm, 0);
  const fieldTotal = bins.reduce((s, b) => s + b.field, 0);
  const title = 'Absolute error: the firm’s distribution against the field’s';
  const points = bins.map((b) => `${b.label} points: ${formatPercent(b.firmShare)} of ${firmName}’s polls, ${formatPercent(b.fieldShare)} of the field’s.`);
  const yMax = Math.max(0.05, ...bins.flatMap((b) => [b.firmShare, b.fieldShare]));

  return (
    <ChartFigure
      title={title}
      fileName={`${firmName} error distribution`}
      explanation={`Share of ${firmName}’s polls (${firmTotal}) and of the field’s (${fieldTotal}, this firm included) whose absolute margin error fell in each 1-point band; a firm with smaller misses has its bars further left.`}
      note="In each band the left bar is the firm and the right bar the field."
      summary={`Histogram of absolute margin errors in ${bins.length} bands for the firm and the field.`}
      points={points}
      table={
        <SimpleTable<HistogramBin>
          caption="Error distribution: the numbers"
          rows={bins}
          rowKey={(b) => b.label}
          columns={[
            { header: 'Abs. error (pts)', cell: (b) => b.label },
            { header: 'Firm polls', numeric: true, cell: (b) => `${b.firm} (${formatPercent(b.firmShare)})` },
            { header: 'Field polls', numeric: true, cell: (b) => `${b.field} (${formatPercent(b.fieldShare)})` },
          ]}
        />
      }
      downloads={[
        {
          label: 'CSV',
          rows: bins.map((b) => ({ absErrorFrom: b.min, absErrorTo: Number.isFinite(b.max) ? b.max : null, firmPolls: b.firm, firmShare: b.firmShare, fieldPolls: b.field, fieldShare: b.fieldShare })),
        },
      ]}
    >
      {({ width, active, setActive }) => {
        const activeBin = active !== null ? bins[active] : undefined;
        return (
          <XYChart
            width={width}
            height={300}
            margin={{ top: 32, right: 16, bottom: 48, left: 56 }}
            theme={chartTheme(palette)}
            xScale={{ type: 'band', domain: bins.map((b) => b.label), paddingInner: 0.2 }}
            yScale={{ type: 'linear', domain: [0, yMax * 1.1], nice: true }}
            accessibilityLabel={title}
            onPointerMove={({ datum }) => setActive(bins.indexOf(datum as HistogramBin))}
            onPointerOut={() => setActive(null)}
          >
            <Grid columns={false} numTicks={5} />
            <Axis orientation="bottom" label="Absolute margin error (points)" />
            <Axis orientation="left" label="Share of polls" numTicks={5} tickFormat={(v: number) => formatPercent(v)} />
            <BarGroup padding={0.1}>
              <BarSeries dataKey="firm" data={bins} xAccessor={(b) => b.label} yAccessor={(b) => b.firmShare} colorAccessor={() => palette.primary} />
              <BarSeries dataKey="field" data={bins} xAccessor={(b) => b.label} yAccessor={(b) => b.fieldShare} colorAccessor={() => palette.secondaryLight} />
            </BarGroup>
            {activeBin && <ActiveRing x={activeBin.label} y={Math.max(activeBin.firmShare, activeBin.fieldShare)} color={palette.text} />}
            <SvgLegend
              color={palette.text}
              items={[
                { label: `${firmName} (left bar)`, shape: 'bar', color: palette.primary },
                { label: 'Field (right bar)', shape: 'bar', color: palette.secondaryLight },
              ]}
            />
          </XYChart>
        );
      }}
    </ChartFigure>
  );
}

/** The firm page's charts: its polls over time, its lean per election and its error distribution, each against the field. */
export function FirmErrorCharts(props: FirmErrorChartsProps) {
  return (
    <div className="space-y-6">
      <PollsOverTime {...props} />
      <LeanPerElection {...props} />
      <ErrorDistribution {...props} />
    </div>
  );
}
