import { POPULATION_LABELS, type ContestDto } from '@veracast/shared-types';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { Button, DataTable, createDataTableColumnHelper, type DataTableColumn } from '../../../components/ui';
import { paths } from '../../../lib/paths';
import { formatDate } from '../../../utils/format';
import type { ContestPoll } from '../api/list-contest-polls';
import { formatInteger, formatPercent, formatPoints } from '../../../lib/format';
import { formatSignedPoints } from '../format';
import { pollMargin } from '../margins';

const column = createDataTableColumnHelper<ContestPoll>();

/** Option keys that appear in the polls but are not options of the contest (undecided, other). */
function extraShareKeys(contest: ContestDto, polls: readonly ContestPoll[]): string[] {
  const known = new Set(contest.options.map((o) => o.key));
  const extra = new Set<string>();
  for (const poll of polls) for (const key of Object.keys(poll.shares)) if (!known.has(key)) extra.add(key);
  return [...extra].sort((a, b) => (a === 'undecided' ? 1 : b === 'undecided' ? -1 : a.localeCompare(b)));
}

export interface ContestPollsTableProps {
  contest: ContestDto;
  polls: ContestPoll[];
  /** Shown for analysts: opens the poll in the edit form. */
  onEdit?: (poll: ContestPoll) => void;
}

/** Every poll of the contest with its dates, sample, population, mode, shares and margin. */
export function ContestPollsTable({ contest, polls, onEdit }: ContestPollsTableProps) {
  const columns = useMemo(() => {
    const shareColumns = [
      ...contest.options.map((o) => ({ key: o.key, label: o.name })),
      ...extraShareKeys(contest, polls).map((key) => ({ key, label: key === 'undecided' ? 'Undecided' : key === 'other' ? 'Other' : key })),
    ].map((option) =>
      column.accessor((row) => row.shares[option.key] ?? Number.NEGATIVE_INFINITY, {
        id: `share:${option.key}`,
        header: () => (
          // `relative` keeps the visually hidden text inside the scrolling table (it is absolutely placed).
          <span title={option.label} className="relative">
            {option.key}
            <span className="sr-only"> ({option.label}) share</span>
          </span>
        ),
        sortFn: 'basic',
        cell: (info) => formatPoints(info.row.original.shares[option.key]),
      }),
    );
    const list: DataTableColumn<ContestPoll>[] = [
      column.accessor('key', {
        header: 'Poll',
        cell: (info) => (
          <Link to={paths.poll.href(info.getValue())} className="font-mono text-xs whitespace-nowrap text-accent-700 underline">
            {info.getValue()}
          </Link>
        ),
      }),
      column.accessor('pollster', {
        header: 'Pollster',
        cell: (info) => (
          <Link to={paths.pollster.href(info.row.original.pollsterId)} className="text-accent-700 underline">
            {info.getValue()}
          </Link>
        ),
      }),
      column.accessor('fieldworkEnd', {
        header: 'Fieldwork',
        cell: (info) => (
          <span className="whitespace-nowrap">
            {formatDate(info.row.original.fieldworkStart)} – {formatDate(info.getValue())}
          </span>
        ),
      }),
      column.accessor('publishedOn', { header: 'Published', cell: (info) => <span className="whitespace-nowrap">{formatDate(info.getValue())}</span> }),
      column.accessor('sampleSize', { header: 'Sample', sortFn: 'basic', cell: (info) => formatInteger(info.getValue()) }),
      column.accessor('population', { header: 'Population', cell: (info) => POPULATION_LABELS[info.row.original.population] }),
      column.accessor('mode', { header: 'Mode' }),
      column.accessor((row) => row.moe ?? Number.NEGATIVE_INFINITY, {
        id: 'moe',
        header: 'Stated MOE',
        sortFn: 'basic',
        cell: (info) => (info.row.original.moe === null ? <span className="text-ink-500">Not stated</span> : `±${formatPoints(info.row.original.moe)}`),
      }),
      ...shareColumns,
      column.accessor((row) => pollMargin(row, contest.refA, contest.refB) ?? Number.NEGATIVE_INFINITY, {
        id: 'margin',
        header: 'Margin A − B',
        sortFn: 'basic',
        cell: (info) => formatSignedPoints(pollMargin(info.row.original, contest.refA, contest.refB)),
      }),
      column.accessor((row) => row.metrics?.marginError ?? Number.NEGATIVE_INFINITY, {
        id: 'marginError',
        header: 'Margin error',
        sortFn: 'basic',
        cell: (info) => formatSignedPoints(info.row.original.metrics?.marginError),
      }),
      column.accessor((row) => row.disclosure.completeness, {
        id: 'disclosure',
        header: 'Disclosure',
        sortFn: 'basic',
        cell: (info) => formatPercent(info.getValue()),
      }),
    ];
    if (onEdit) {
      list.push(
        column.display({
          id: 'actions',
          header: () => (
            <span className="relative">
              <span className="sr-only">Actions</span>
            </span>
          ),
          cell: (info) => (
            <Button size="sm" variant="secondary" onClick={() => onEdit(info.row.original)} aria-label={`Edit poll ${info.row.original.key}`}>
              Edit
            </Button>
          ),
        }),
      );
    }
    return list;
  }, [contest, polls, onEdit]);

  return (
    <DataTable
      caption={`Polls of ${contest.name}`}
      columns={columns}
      data={polls}
      getRowId={(row) => row.key}
      searchLabel="Search polls"
      initialSorting={[{ id: 'fieldworkEnd', desc: true }]}
      emptyMessage="No poll of this contest has been loaded."
    />
  );
}
