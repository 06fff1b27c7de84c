import { createContext, use, useMemo } from 'react';
import { Link } from 'react-router-dom';
import { DataTable, createDataTableColumnHelper } from '../../../components/ui';
import { paths } from '../../../lib/paths';
import type { Interval, ScorecardItem } from '../api/types';
import { formatInterval, formatNumber, formatPercent, formatRank, formatSigned } from '../../../lib/format';
import { IntervalBar, sharedDomain } from './IntervalBar';

interface RankingScale {
  auditId: number;
  excessDomain: Interval;
  rankDomain: Interval;
  rankedCount: number;
}

const RankingScaleContext = createContext<RankingScale | null>(null);

function useScale(): RankingScale {
  const scale = use(RankingScaleContext);
  if (!scale) throw new Error('RankingTable cells need RankingScaleContext');
  return scale;
}

function RankCell({ item }: { item: ScorecardItem }) {
  const { rankDomain, rankedCount } = useScale();
  if (!item.ranked) {
    return (
      <div className="max-w-56 text-sm">
        <span className="font-medium text-ink-800">Not ranked</span>
        <span className="block text-xs text-ink-600">{item.reason ?? 'too few polls'}</span>
      </div>
    );
  }
  const interval = item.rankInterval;
  const label = interval
    ? `Rank ${formatRank(item.rank)} of ${rankedCount}, 95% interval ${formatRank(interval[0])} to ${formatRank(interval[1])}`
    : `Rank ${formatRank(item.rank)} of ${rankedCount}, no interval`;
  return (
    <div className="flex items-center gap-2">
      <span className="w-8 text-right font-semibold tabular-nums text-ink-900">{formatRank(item.rank)}</span>
      <IntervalBar estimate={item.rank} interval={interval} domain={rankDomain} label={label} width={90} />
      <span className="text-xs whitespace-nowrap text-ink-600 tabular-nums">
        {interval ? `${formatRank(interval[0])}–${formatRank(interval[1])}` : 'no interval'}
      </span>
    </div>
  );
}

function PollsterCell({ item }: { item: ScorecardItem }) {
  const { auditId } = useScale();
  return (
    <Link
      to={paths.pollsterAccuracy.href(item.pollsterId, { audit: auditId })}
      className="inline-block min-w-36 font-medium text-accent-700 underline decoration-accent-300 underline-offset-2 hover:text-accent-900"
    >
      {item.pollster}
    </Link>
  );
}

function ExcessCell({ item }: { item: ScorecardItem }) {
  const { excessDomain } = useScale();
  const interval = item.excessErrorShrunkInterval;
  if (item.excessErrorShrunk === null) return <span className="text-ink-500">not computable</span>;
  const label = `Excess error ${formatSigned(item.excessErrorShrunk, 2)} points, 95% interval ${interval ? formatInterval(interval, 2) : 'not available'}`;
  return (
    <div className="flex items-center gap-2">
      <IntervalBar estimate={item.excessErrorShrunk} interval={interval} domain={excessDomain} reference={0} label={label} />
      <span className="text-xs whitespace-nowrap tabular-nums text-ink-700">
        {formatSigned(item.excessErrorShrunk, 2)}
        <span className="block text-ink-500">{interval ? `(${formatInterval(interval, 2)})` : '(no interval)'}</span>
      </span>
    </div>
  );
}

function SignedCell({ item }: { item: ScorecardItem }) {
  return (
    <span className="tabular-nums">
      {formatSigned(item.meanSignedError)}
      <span className="block text-xs text-ink-500">
        {item.meanSignedErrorInterval ? `(${formatInterval(item.meanSignedErrorInterval)})` : '(one contest: no interval)'}
      </span>
    </span>
  );
}

function RateCell({ rate, n, noun }: { rate: number | null; n: number | undefined; noun: string }) {
  return (
    <span className="tabular-nums">
      {formatPercent(rate)}
      {n !== undefined && <span className="block text-xs text-ink-500">of {n} {noun}</span>}
    </span>
  );
}

/** Nulls (unranked, not computable) sort after every number whichever way the column is sorted. */
function byNumber(get: (item: ScorecardItem) => number | null) {
  return (a: { original: ScorecardItem }, b: { original: ScorecardItem }) => {
    const x = get(a.original);
    const y = get(b.original);
    if (x === null && y === null) return 0;
    if (x === null) return 1;
    if (y === null) return -1;
    return x - y;
  };
}

const column = createDataTableColumnHelper<ScorecardItem>();
const columns = column.columns([
  column.accessor('rank', {
    header: 'Rank (95% interval)',
    sortFn: byNumber((i) => i.rank),
    cell: (info) => <RankCell item={info.row.original} />,
  }),
  column.accessor('pollster', { header: 'Pollster', cell: (info) => <PollsterCell item={info.row.original} /> }),
  column.accessor('polls', { header: 'Polls', sortFn: 'basic', cell: (info) => <span className="tabular-nums">{info.getValue()}</span> }),
  column.accessor('contests', { header: 'Contests', sortFn: 'basic', cell: (info) => <span className="tabular-nums">{info.getValue()}</span> }),
  column.accessor('excessErrorShrunk', {
    header: 'Excess error, shrunk (pts)',
    sortFn: byNumber((i) => i.excessErrorShrunk),
    cell: (info) => <ExcessCell item={info.row.original} />,
  }),
  column.accessor('pRankFirst', {
    header: 'Chance of rank 1',
    sortFn: byNumber((i) => i.pRankFirst),
    cell: (info) => <span className="tabular-nums">{formatPercent(info.getValue())}</span>,
  }),
  column.accessor('meanAbsMarginError', {
    header: 'Mean abs. error (pts)',
    sortFn: 'basic',
    cell: (info) => <span className="tabular-nums">{formatNumber(info.getValue())}</span>,
  }),
  column.accessor('meanSignedError', {
    header: 'Mean signed error (pts)',
    sortFn: 'basic',
    cell: (info) => <SignedCell item={info.row.original} />,
  }),
  column.accessor('rmse', { header: 'RMSE (pts)', sortFn: 'basic', cell: (info) => <span className="tabular-nums">{formatNumber(info.getValue())}</span> }),
  column.accessor('winnerCalledRate', {
    header: 'Winner called',
    sortFn: byNumber((i) => i.winnerCalledRate),
    cell: (info) => <RateCell rate={info.getValue()} n={info.row.original.calls} noun="calls" />,
  }),
  column.accessor('coverageRate', {
    header: 'Margin interval held',
    sortFn: byNumber((i) => i.coverageRate),
    cell: (info) => <RateCell rate={info.getValue()} n={info.row.original.coverageN} noun="polls" />,
  }),
  column.accessor('disclosure', {
    header: 'Disclosure (separate)',
    sortFn: byNumber((i) => i.disclosure),
    cell: (info) => <span className="tabular-nums">{formatPercent(info.getValue())}</span>,
  }),
]);

/** What each column measures, one line each, shown under the table. */
export const RANKING_COLUMN_NOTES: { term: string; text: string }[] = [
  { term: 'Rank (95% interval)', text: 'Order by shrunk excess error among ranked firms (1 = smallest); the bar spans the ranks the firm took in 95% of bootstrap draws that resample whole contests. Tied firms share an average rank.' },
  { term: 'Excess error, shrunk', text: 'A firm’s absolute margin error minus that of the other firms’ polls of the same contests, averaged over its polls and pulled toward 0 when it has few polls; below 0 means smaller misses than its rivals. The dashed rule marks 0.' },
  { term: 'Chance of rank 1', text: 'Share of bootstrap draws in which the firm came first (ties shared).' },
  { term: 'Mean abs. error', text: 'Average size of the miss on the margin between the two reference options, in points.' },
  { term: 'Mean signed error', text: 'The firm’s lean: positive means its polls overstated the election’s first orientation bloc; the interval is clustered by contest.' },
  { term: 'RMSE', text: 'Root-mean-square margin error: like the mean absolute error, but large misses count more.' },
  { term: 'Winner called', text: 'Share of polls whose leader won; tied polls make no call and are left out.' },
  { term: 'Margin interval held', text: 'Share of polls whose 95% interval for the margin held the certified margin; sampling error alone would give about 95%.' },
  { term: 'Disclosure', text: 'Average completeness of what the firm published about its polls. It is not part of accuracy or of the rank.' },
];

export interface RankingTableProps {
  auditId: number;
  items: ScorecardItem[];
}

/**
 * The ranking: every firm of the audit (ranked firms first, by rank), each interval drawn inline on
 * a scale shared by its column. Sortable by any column.
 */
export function RankingTable({ auditId, items }: RankingTableProps) {
  const scale = useMemo<RankingScale>(() => {
    const ranked = items.filter((i) => i.ranked);
    return {
      auditId,
      excessDomain: sharedDomain(items.map((i) => i.excessErrorShrunk), items.map((i) => i.excessErrorShrunkInterval), [0]),
      rankDomain: [0.5, Math.max(1, ranked.length) + 0.5],
      rankedCount: ranked.length,
    };
  }, [auditId, items]);

  return (
    <RankingScaleContext value={scale}>
      <DataTable
        caption="Pollster ranking"
        columns={columns}
        data={items}
        getRowId={(row) => String(row.pollsterId)}
        searchLabel="Search pollsters"
        pageSize={50}
        emptyMessage="No polls match these filters."
      />
    </RankingScaleContext>
  );
}
