import {
  columnVisibilityFeature,
  createColumnHelper,
  createPaginatedRowModel,
  createSortedRowModel,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_basic,
  tableFeatures,
  useTable,
  type ColumnDef,
} from '@tanstack/react-table';
import type { AuditDto, AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { useId, useMemo, useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui';
import { cn } from '../../../lib/cn';
import { paths } from '../../../lib/paths';
import { downloadCsv, toCsv, type CsvValue } from '../../../lib/csv';
import { formatBoolean, formatCount, formatPoints, formatRate, formatSignedPoints, formatStat } from '../format';
import { METHOD_ANCHORS, type MethodAnchor } from '../method-catalogue';
import { AUDIT_POLL_STATUS_LABELS, auditPollStatus, type AuditPollStatus } from '../used';
import { FormulaLink } from './FormulaLink';

export interface AuditPollRow extends AuditPollDto {
  status: AuditPollStatus;
}

const pollTableFeatures = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { basic: sortFn_basic },
  columnVisibilityFeature,
  rowPaginationFeature,
  paginatedRowModel: createPaginatedRowModel(),
});

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type PollColumn = ColumnDef<typeof pollTableFeatures, AuditPollRow, any>;
const column = createColumnHelper<typeof pollTableFeatures, AuditPollRow>();

interface ColumnSpec {
  id: string;
  header: string;
  /** What the column holds, in one line. */
  about: string;
  anchor?: MethodAnchor;
  hidden?: boolean;
  /** Sort and CSV value; null and undefined sort last. */
  value: (row: AuditPollRow) => string | number | undefined;
  /** What the cell shows. */
  show: (row: AuditPollRow) => ReactNode;
  numeric?: boolean;
}

const orNone = <T,>(value: T | null): T | undefined => (value === null ? undefined : value);
const flag = (value: boolean | null) => (value === null ? undefined : value ? 1 : 0);

function specs(treatment: string): ColumnSpec[] {
  return [
    {
      id: 'pollKey',
      header: 'Poll',
      about: 'The poll’s key; opens the poll’s own page with every metric and its inputs.',
      value: (r) => r.pollKey,
      show: (r) => (
        <Link to={paths.poll.href(r.pollKey, { treatment })} className="font-mono text-xs text-accent-700 underline hover:text-accent-900">
          {r.pollKey}
        </Link>
      ),
    },
    { id: 'pollster', header: 'Pollster', about: 'The polling firm.', value: (r) => r.pollster, show: (r) => r.pollster },
    { id: 'electionKey', header: 'Election', about: 'The election the poll belongs to.', hidden: true, value: (r) => r.electionKey, show: (r) => r.electionKey },
    { id: 'contestKey', header: 'Contest', about: 'The race or question polled.', value: (r) => r.contestKey, show: (r) => <span className="font-mono text-xs">{r.contestKey}</span> },
    { id: 'fieldworkEnd', header: 'Fieldwork end', about: 'Last day of fieldwork.', hidden: true, value: (r) => r.fieldworkEnd, show: (r) => r.fieldworkEnd },
    {
      id: 'daysOut',
      header: 'Days out',
      about: 'Election date minus fieldwork midpoint, in days.',
      anchor: METHOD_ANCHORS.daysOut,
      numeric: true,
      value: (r) => orNone(r.daysOut),
      show: (r) => formatPoints(r.daysOut, 1),
    },
    { id: 'sampleSize', header: 'n', about: 'Published sample size.', numeric: true, value: (r) => r.sampleSize, show: (r) => formatCount(r.sampleSize) },
    { id: 'population', header: 'Population', about: 'Likely voters (lv), registered voters (rv) or adults (a).', hidden: true, value: (r) => r.population, show: (r) => r.population },
    { id: 'mode', header: 'Mode', about: 'How respondents were reached.', hidden: true, value: (r) => r.mode, show: (r) => r.mode },
    {
      id: 'pair',
      header: 'A vs B',
      about: 'The reference pair the margin is taken between: by bloc, or else the certified top two.',
      anchor: METHOD_ANCHORS.referencePair,
      value: (r) => (r.refA && r.refB ? `${r.refA} vs ${r.refB}` : undefined),
      show: (r) =>
        r.refA && r.refB ? (
          <span>
            {r.refA} vs {r.refB}
            {r.refBasis === 'top_two' && <span className="text-ink-500"> (top two)</span>}
          </span>
        ) : (
          '—'
        ),
    },
    {
      id: 'marginError',
      header: 'Margin error (pts)',
      about: '(p_A − p_B) − (V_A − V_B); positive means the poll overstated A.',
      anchor: METHOD_ANCHORS.marginError,
      numeric: true,
      value: (r) => orNone(r.marginError),
      show: (r) => formatSignedPoints(r.marginError),
    },
    {
      id: 'absMarginError',
      header: 'Abs. margin error (pts)',
      about: 'The size of the miss on the margin, whichever side it favoured.',
      anchor: METHOD_ANCHORS.absMarginError,
      numeric: true,
      value: (r) => orNone(r.absMarginError),
      show: (r) => formatPoints(r.absMarginError),
    },
    { id: 'lean', header: 'Lean', about: 'Which side of the pair the poll overstated.', anchor: METHOD_ANCHORS.lean, value: (r) => orNone(r.lean), show: (r) => r.lean ?? '—' },
    {
      id: 'twoPartyShareError',
      header: 'Two-party share error (pts)',
      about: 'Miss on A’s share of the A + B vote.',
      anchor: METHOD_ANCHORS.twoPartyShareError,
      hidden: true,
      numeric: true,
      value: (r) => orNone(r.twoPartyShareError),
      show: (r) => formatSignedPoints(r.twoPartyShareError),
    },
    { id: 'mosteller3', header: 'M3 (pts)', about: 'Mosteller’s measure 3: mean absolute miss on each option’s share.', anchor: METHOD_ANCHORS.mosteller3, numeric: true, value: (r) => orNone(r.mosteller3), show: (r) => formatPoints(r.mosteller3) },
    { id: 'mosteller5', header: 'M5 (pts)', about: 'Mosteller’s measure 5: absolute miss on the lead between the certified top two.', anchor: METHOD_ANCHORS.mosteller5, numeric: true, value: (r) => orNone(r.mosteller5), show: (r) => formatPoints(r.mosteller5) },
    { id: 'mtkA', header: 'A', about: 'Predictive accuracy A: log odds ratio of the poll’s A:B against the result’s; 0 is perfect.', anchor: METHOD_ANCHORS.mtkA, numeric: true, value: (r) => orNone(r.mtkA), show: (r) => formatStat(r.mtkA) },
    { id: 'mtkSe', header: 'SE of A', about: 'Standard error of A (delta method).', anchor: METHOD_ANCHORS.mtkA, hidden: true, numeric: true, value: (r) => orNone(r.mtkSe), show: (r) => formatStat(r.mtkSe) },
    { id: 'mtkP', header: 'p of A', about: 'Two-sided p-value of A = 0.', anchor: METHOD_ANCHORS.mtkA, hidden: true, numeric: true, value: (r) => orNone(r.mtkP), show: (r) => formatStat(r.mtkP) },
    { id: 'aeB', header: 'B', about: 'Multi-option accuracy B: mean absolute log-odds miss over the named options.', anchor: METHOD_ANCHORS.multiOptionB, numeric: true, value: (r) => orNone(r.aeB), show: (r) => formatStat(r.aeB) },
    { id: 'aeBw', header: 'B_w', about: 'B weighted by certified shares.', anchor: METHOD_ANCHORS.multiOptionB, hidden: true, numeric: true, value: (r) => orNone(r.aeBw), show: (r) => formatStat(r.aeBw) },
    {
      id: 'winnerCalled',
      header: 'Winner called',
      about: 'The poll’s leader was the certified winner; a tied poll is “no call”.',
      anchor: METHOD_ANCHORS.winnerCalled,
      value: (r) => (r.error !== null ? undefined : r.winnerCalled === null ? 0.5 : r.winnerCalled ? 1 : 0),
      show: (r) => (r.error !== null ? '—' : formatBoolean(r.winnerCalled, { yes: 'Yes', no: 'No', none: 'No call' })),
    },
    { id: 'shareCovered', header: 'Share covered', about: 'The certified share of A fell inside the poll’s 95% interval.', anchor: METHOD_ANCHORS.coverage, value: (r) => flag(r.shareCovered), show: (r) => formatBoolean(r.shareCovered) },
    { id: 'marginCovered', header: 'Margin covered', about: 'The certified margin fell inside the poll’s 95% interval for the margin.', anchor: METHOD_ANCHORS.coverage, value: (r) => flag(r.marginCovered), show: (r) => formatBoolean(r.marginCovered) },
    { id: 'undecidedShare', header: 'Undecided (pts)', about: 'Published undecided share.', anchor: METHOD_ANCHORS.undecided, hidden: true, numeric: true, value: (r) => orNone(r.undecidedShare), show: (r) => formatPoints(r.undecidedShare, 1) },
    { id: 'nEff', header: 'n_eff', about: 'Effective sample size of the intervals: from the stated MOE, else n ÷ design effect.', anchor: METHOD_ANCHORS.effectiveN, hidden: true, numeric: true, value: (r) => orNone(r.nEff), show: (r) => formatPoints(r.nEff, 0) },
    { id: 'disclosure', header: 'Disclosure', about: 'Share of the disclosure items the poll published; a separate dimension from accuracy.', hidden: true, numeric: true, value: (r) => r.disclosure, show: (r) => formatRate(r.disclosure, 0) },
    { id: 'inWindow', header: 'In window', about: 'Fieldwork ended within the audit’s window before election day.', anchor: METHOD_ANCHORS.window, hidden: true, value: (r) => (r.inWindow ? 1 : 0), show: (r) => formatBoolean(r.inWindow) },
    { id: 'isFinal', header: 'Final', about: 'The pollster’s last poll of the contest in the window.', anchor: METHOD_ANCHORS.finalPoll, hidden: true, value: (r) => (r.isFinal ? 1 : 0), show: (r) => formatBoolean(r.isFinal) },
    { id: 'status', header: 'Counts', about: 'Whether the poll counts in the audit’s figures, and if not, why.', value: (r) => AUDIT_POLL_STATUS_LABELS[r.status], show: (r) => AUDIT_POLL_STATUS_LABELS[r.status] },
    {
      id: 'notes',
      header: 'Notes',
      about: 'Why a metric is missing, or why the poll could not be scored.',
      hidden: true,
      value: (r) => [r.error, ...r.notes].filter(Boolean).join(' ') || undefined,
      show: (r) => <span className="whitespace-normal">{[r.error, ...r.notes].filter(Boolean).join(' ') || '—'}</span>,
    },
  ];
}

function toColumns(list: ColumnSpec[]): PollColumn[] {
  return list.map((spec) =>
    column.accessor((row) => spec.value(row), {
      id: spec.id,
      header: spec.header,
      cell: (info) => spec.show(info.row.original),
      sortFn: 'basic',
      sortUndefined: 'last',
    }),
  );
}

type StatusFilter = 'used' | 'all' | AuditPollStatus;
type LeanFilter = 'any' | 'A' | 'B' | 'none';

const STATUS_OPTIONS: { value: StatusFilter; label: string }[] = [
  { value: 'used', label: 'Used in the figures' },
  { value: 'all', label: 'Every poll of the audit' },
  { value: 'not_final', label: AUDIT_POLL_STATUS_LABELS.not_final },
  { value: 'outside_window', label: AUDIT_POLL_STATUS_LABELS.outside_window },
  { value: 'not_computable', label: AUDIT_POLL_STATUS_LABELS.not_computable },
];

const PAGE_SIZES = [25, 50, 100, 250] as const;

const selectClasses =
  'h-9 rounded-md border border-ink-300 bg-white px-2 text-sm shadow-sm focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-accent-600';

function SortIndicator({ direction }: { direction: false | 'asc' | 'desc' }) {
  return (
    <span aria-hidden="true" className={cn('text-xs', direction ? 'text-accent-700' : 'text-ink-400')}>
      {direction === 'asc' ? '▲' : direction === 'desc' ? '▼' : '↕'}
    </span>
  );
}

export interface AuditPollsTableProps {
  polls: readonly AuditPollDto[];
  settings: AuditSettings;
  elections: AuditDto['elections'];
  /** The audit's id, for file names. */
  auditId: number;
  /** Link to the server's CSV of every poll. */
  serverCsvUrl: string;
}

/**
 * Every poll of the audit with every metric: sortable by any column, filtered by election,
 * pollster, lean and whether it counts, with a choice of columns, and paged so that thousands of
 * rows never reach the page at once.
 */
export function AuditPollsTable({ polls, settings, elections, auditId, serverCsvUrl }: AuditPollsTableProps) {
  const ids = useId();
  const rows = useMemo<AuditPollRow[]>(() => polls.map((p) => ({ ...p, status: auditPollStatus(p, settings) })), [polls, settings]);
  const columnSpecs = useMemo(() => specs(settings.undecided), [settings.undecided]);
  const columns = useMemo(() => toColumns(columnSpecs), [columnSpecs]);

  const [election, setElection] = useState('');
  const [pollster, setPollster] = useState('');
  const [status, setStatus] = useState<StatusFilter>('used');
  const [lean, setLean] = useState<LeanFilter>('any');

  const filtered = useMemo(() => {
    const needle = pollster.trim().toLowerCase();
    return rows.filter(
      (r) =>
        (!election || r.electionKey === election) &&
        (!needle || r.pollster.toLowerCase().includes(needle)) &&
        (status === 'all' || r.status === status) &&
        (lean === 'any' || r.lean === lean),
    );
  }, [rows, election, pollster, status, lean]);

  const table = useTable({
    features: pollTableFeatures,
    columns,
    data: filtered,
    getRowId: (row) => row.pollKey,
    sortDescFirst: false,
    initialState: {
      sorting: [],
      pagination: { pageIndex: 0, pageSize: PAGE_SIZES[0] },
      columnVisibility: Object.fromEntries(columnSpecs.filter((s) => s.hidden).map((s) => [s.id, false])),
    },
  });

  function changeFilter(apply: () => void) {
    apply();
    table.setPageIndex(0);
  }

  const { pageIndex, pageSize } = table.state.pagination;
  const total = filtered.length;
  const first = total === 0 ? 0 : pageIndex * pageSize + 1;
  const last = Math.min(total, (pageIndex + 1) * pageSize);
  const pageCount = Math.max(1, table.getPageCount());
  const visibleSpecs = columnSpecs.filter((s) => table.getColumn(s.id)?.getIsVisible());

  function downloadRows() {
    const sorted = table.getSortedRowModel().rows.map((r) => r.original);
    const csvColumns = visibleSpecs.map((s) => ({ header: s.id, value: (r: AuditPollRow): CsvValue => s.value(r) }));
    downloadCsv(toCsv(sorted, csvColumns), `audit-${auditId}-polls-selection.csv`);
  }

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${ids}-status`} className="text-sm font-medium text-ink-800">
            Polls shown
          </label>
          <select id={`${ids}-status`} className={selectClasses} value={status} onChange={(e) => changeFilter(() => setStatus(e.target.value as StatusFilter))}>
            {STATUS_OPTIONS.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        </div>
        {elections.length > 1 && (
          <div className="flex flex-col gap-1.5">
            <label htmlFor={`${ids}-election`} className="text-sm font-medium text-ink-800">
              Election
            </label>
            <select id={`${ids}-election`} className={selectClasses} value={election} onChange={(e) => changeFilter(() => setElection(e.target.value))}>
              <option value="">All elections</option>
              {elections.map((e) => (
                <option key={e.key} value={e.key}>
                  {e.name}
                </option>
              ))}
            </select>
          </div>
        )}
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${ids}-pollster`} className="text-sm font-medium text-ink-800">
            Pollster contains
          </label>
          <input
            id={`${ids}-pollster`}
            type="search"
            value={pollster}
            onChange={(e) => changeFilter(() => setPollster(e.target.value))}
            className={cn(selectClasses, 'w-48 px-3')}
          />
        </div>
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${ids}-lean`} className="text-sm font-medium text-ink-800">
            Side overstated
          </label>
          <select id={`${ids}-lean`} className={selectClasses} value={lean} onChange={(e) => changeFilter(() => setLean(e.target.value as LeanFilter))}>
            <option value="any">Any</option>
            <option value="A">Overstated A</option>
            <option value="B">Overstated B</option>
            <option value="none">None</option>
          </select>
        </div>
        <details className="relative">
          <summary className="flex h-9 cursor-pointer items-center rounded-md border border-ink-300 bg-white px-3 text-sm font-medium text-ink-800 shadow-sm">
            Columns ({visibleSpecs.length} of {columnSpecs.length})
          </summary>
          <fieldset className="absolute z-20 mt-1 max-h-80 w-72 overflow-auto rounded-md border border-ink-200 bg-white p-3 shadow-lg">
            <legend className="sr-only">Columns shown</legend>
            <div className="mb-2 flex gap-2">
              <Button size="sm" variant="ghost" onClick={() => table.toggleAllColumnsVisible(true)}>
                Show all
              </Button>
              <Button size="sm" variant="ghost" onClick={() => table.resetColumnVisibility()}>
                Reset
              </Button>
            </div>
            {columnSpecs.map((spec) => {
              const col = table.getColumn(spec.id);
              return (
                <label key={spec.id} className="flex items-center gap-2 py-0.5 text-sm text-ink-800">
                  <input
                    type="checkbox"
                    checked={col?.getIsVisible() ?? false}
                    disabled={spec.id === 'pollKey'}
                    onChange={(e) => col?.toggleVisibility(e.target.checked)}
                  />
                  {spec.header}
                </label>
              );
            })}
          </fieldset>
        </details>
      </div>

      <div className="overflow-x-auto rounded-lg border border-ink-200 bg-white">
        <table className="min-w-full divide-y divide-ink-200 text-sm">
          <caption className="sr-only">Per-poll metrics of the audit</caption>
          <thead className="bg-ink-100">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const spec = columnSpecs.find((s) => s.id === header.column.id);
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}
                      className={cn('px-3 py-2.5 font-semibold whitespace-nowrap text-ink-700', spec?.numeric ? 'text-right' : 'text-left')}
                    >
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        title={spec?.about}
                        className="-mx-1 inline-flex items-center gap-1.5 rounded px-1 hover:text-ink-950 focus-visible:outline-2 focus-visible:outline-accent-600"
                      >
                        <table.FlexRender header={header} />
                        <SortIndicator direction={sorted} />
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-ink-100">
            {table.getRowModel().rows.length === 0 ? (
              <tr>
                <td colSpan={visibleSpecs.length} className="px-4 py-8 text-center text-ink-600">
                  No poll matches these filters.
                </td>
              </tr>
            ) : (
              table.getRowModel().rows.map((row) => (
                <tr key={row.id} className="hover:bg-ink-50">
                  {row.getVisibleCells().map((cell) => {
                    const spec = columnSpecs.find((s) => s.id === cell.column.id);
                    return (
                      <td
                        key={cell.id}
                        className={cn('px-3 py-2 whitespace-nowrap text-ink-800', spec?.numeric && 'text-right tabular-nums')}
                      >
                        <table.FlexRender cell={cell} />
                      </td>
                    );
                  })}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>

      <div className="flex flex-wrap items-center justify-between gap-3 text-sm text-ink-600">
        <p aria-live="polite">
          {total === 0 ? 'No rows' : `Rows ${formatCount(first)}–${formatCount(last)} of ${formatCount(total)}`} ({formatCount(rows.length)} polls in
          the audit)
        </p>
        <div className="flex flex-wrap items-center gap-2">
          <label htmlFor={`${ids}-size`}>Rows per page</label>
          <select
            id={`${ids}-size`}
            className={selectClasses}
            value={pageSize}
            onChange={(e) => {
              table.setPageSize(Number(e.target.value));
              table.setPageIndex(0);
            }}
          >
            {PAGE_SIZES.map((size) => (
              <option key={size} value={size}>
                {size}
              </option>
            ))}
          </select>
          {pageCount > 1 && (
            <nav aria-label="Pages of the per-poll table" className="flex items-center gap-2">
              <Button variant="secondary" size="sm" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
                Previous page
              </Button>
              <span>
                Page {formatCount(pageIndex + 1)} of {formatCount(pageCount)}
              </span>
              <Button variant="secondary" size="sm" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
                Next page
              </Button>
            </nav>
          )}
        </div>
      </div>

      <div className="flex flex-wrap items-center gap-3 text-sm">
        <Button variant="secondary" size="sm" onClick={downloadRows} disabled={total === 0}>
          Download these rows (CSV)
        </Button>
        <a href={serverCsvUrl} className="font-medium text-accent-700 underline hover:text-accent-900" download>
          Download every poll of the audit (CSV)
        </a>
      </div>

      <details className="rounded-md border border-ink-200 bg-white">
        <summary className="cursor-pointer px-3 py-2 text-sm font-medium text-ink-800">What the columns mean</summary>
        <dl className="grid gap-x-6 gap-y-2 border-t border-ink-200 px-3 py-3 text-sm sm:grid-cols-[max-content_1fr]">
          {columnSpecs.map((spec) => (
            <div key={spec.id} className="contents">
              <dt className="font-medium text-ink-900">{spec.header}</dt>
              <dd className="text-ink-700">
                {spec.about} {spec.anchor && <FormulaLink anchor={spec.anchor} />}
              </dd>
            </div>
          ))}
        </dl>
      </details>
    </div>
  );
}
