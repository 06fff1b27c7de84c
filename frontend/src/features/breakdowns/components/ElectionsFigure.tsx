import type { ElectionBreakdown } from '../api/types';
import { formatInterval, formatNumber, formatSigned } from '../../../lib/format';
import { SimpleTable } from './BinTable';
import { ChartFigure } from './chart/ChartFigure';
import { DotIntervalChart, dotItems, type DotSeries } from './chart/DotIntervalChart';

export interface ElectionName {
  key: string;
  name: string;
  date: string;
}

/** Across elections: each election's mean absolute and mean signed error, this year against history. */
export function ElectionsFigure({ rows, elections }: { rows: ElectionBreakdown[]; elections: ElectionName[] }) {
  const title = 'Error by election';
  const byKey = new Map(elections.map((e) => [e.key, e]));
  const ordered = [...rows].sort((a, b) => (byKey.get(a.electionKey)?.date ?? '').localeCompare(byKey.get(b.electionKey)?.date ?? ''));
  const nameOf = (key: string) => byKey.get(key)?.name ?? key;
  const categories = ordered.map((r) => nameOf(r.electionKey));
  const series: DotSeries[] = [
    {
      key: 'abs',
      label: 'Mean absolute error',
      shape: 'square',
      color: 'primary',
      points: ordered.map((r) => ({ category: nameOf(r.electionKey), value: r.meanAbs, lo: null, hi: null })),
    },
    {
      key: 'signed',
      label: 'Mean signed error',
      shape: 'diamond',
      color: 'secondary',
      points: ordered.map((r) => ({ category: nameOf(r.electionKey), value: r.meanSigned, lo: r.lo, hi: r.hi })),
    },
  ];
  const points = dotItems(categories, series).map((item) =>
    item.series.key === 'abs'
      ? `${item.category}: mean absolute error ${formatNumber(item.point.value)} points.`
      : `${item.category}: mean signed error ${formatSigned(item.point.value)} points, 95% interval ${
          item.point.lo !== null && item.point.hi !== null ? formatInterval([item.point.lo, item.point.hi]) : 'not available'
        }.`,
  );

  return (
    <ChartFigure
      title={title}
      explanation="Each election’s mean absolute margin error (the size of the misses) and mean signed error (the shared lean, with a 95% interval clustered by contest): one year against the others."
      note="A signed mean is shown only where the contests carry the election’s two orientation blocs (not for referendum questions). The absolute mean comes without an interval here."
      summary={`Mean absolute and mean signed error for ${ordered.length} elections, in date order.`}
      points={points}
      table={
        <SimpleTable<ElectionBreakdown>
          caption="Error by election: the numbers"
          rows={ordered}
          rowKey={(r) => r.electionKey}
          columns={[
            { header: 'Election', cell: (r) => nameOf(r.electionKey) },
            { header: 'Polls', numeric: true, cell: (r) => r.n },
            { header: 'Mean abs. error', numeric: true, cell: (r) => formatNumber(r.meanAbs) },
            {
              header: 'Mean signed error (95% interval)',
              numeric: true,
              cell: (r) => (
                <>
                  {formatSigned(r.meanSigned)}
                  <span className="block text-xs text-ink-500">{r.lo !== null && r.hi !== null ? `(${formatInterval([r.lo, r.hi])})` : r.meanSigned === null ? '' : '(none)'}</span>
                </>
              ),
            },
          ]}
        />
      }
      downloads={[
        {
          label: 'CSV',
          rows: ordered.map((r) => ({ electionKey: r.electionKey, election: nameOf(r.electionKey), polls: r.n, meanAbsError: r.meanAbs, meanSignedError: r.meanSigned, meanSignedErrorLo: r.lo, meanSignedErrorHi: r.hi })),
        },
      ]}
    >
      {({ width, active, setActive }) => (
        <DotIntervalChart
          width={width}
          categories={categories}
          series={series}
          yLabel="Error (points)"
          active={active}
          setActive={setActive}
          zeroRule
          accessibilityLabel={title}
        />
      )}
    </ChartFigure>
  );
}
