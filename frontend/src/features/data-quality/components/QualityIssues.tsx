import type { QualityIssueDto } from '@veracast/shared-types';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { DataTable, Select, createDataTableColumnHelper, type DataTableColumn } from '../../../components/ui';
import { cn } from '../../../lib/cn';
import { paths } from '../../../lib/paths';
import { checkLabel, countByCheck, type QualityCheck } from '../checks';

const column = createDataTableColumnHelper<QualityIssueDto>();

function Severity({ severity }: { severity: QualityIssueDto['severity'] }) {
  return severity === 'warning' ? (
    <span className="font-medium text-caution-800">
      <span aria-hidden="true">▲ </span>Warning
    </span>
  ) : (
    <span className="text-ink-700">
      <span aria-hidden="true">● </span>Note
    </span>
  );
}

function buildColumns(showElection: boolean): DataTableColumn<QualityIssueDto>[] {
  return [
    column.accessor('severity', { header: 'Severity', cell: (info) => <Severity severity={info.row.original.severity} /> }),
    column.accessor((row) => checkLabel(row.code), { id: 'check', header: 'Check' }),
    ...(showElection
      ? [
          column.accessor((row) => row.electionKey ?? '', {
            id: 'election',
            header: 'Election',
            cell: (info) =>
              info.getValue() ? (
                <Link to={paths.election.href(info.getValue())} className="text-accent-700 underline">
                  {info.getValue()}
                </Link>
              ) : (
                '—'
              ),
          }),
        ]
      : []),
    column.accessor((row) => row.contestKey ?? '', {
      id: 'contest',
      header: 'Contest',
      cell: (info) =>
        info.getValue() ? (
          <Link to={paths.contest.href(info.getValue())} className="text-accent-700 underline">
            {info.getValue()}
          </Link>
        ) : (
          '—'
        ),
    }),
    column.accessor((row) => row.pollKeys.join(' '), {
      id: 'polls',
      header: 'Polls',
      enableSorting: false,
      cell: (info) =>
        info.row.original.pollKeys.length === 0 ? (
          '—'
        ) : (
          <ul className="space-y-0.5">
            {info.row.original.pollKeys.map((key) => (
              <li key={key}>
                <Link to={paths.poll.href(key)} className="font-mono text-xs whitespace-nowrap text-accent-700 underline">
                  {key}
                </Link>
              </li>
            ))}
          </ul>
        ),
    }),
    column.accessor('message', { header: 'What was found', enableSorting: false }),
  ];
}

export interface QualityIssuesProps {
  issues: QualityIssueDto[];
  /** Show the election column (the all-elections screen). */
  showElection?: boolean;
  caption?: string;
}

/** A count per check, then every issue in a table that can be narrowed to one check. */
export function QualityIssues({ issues, showElection = false, caption = 'Data-quality issues' }: QualityIssuesProps) {
  const [check, setCheck] = useState<QualityCheck | ''>('');
  const counts = useMemo(() => countByCheck(issues), [issues]);
  const columns = useMemo(() => buildColumns(showElection), [showElection]);
  const shown = useMemo(() => (check ? issues.filter((i) => i.code === check) : issues), [issues, check]);

  return (
    <div className="space-y-4">
      <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-4" aria-label="Issues found by each check">
        {counts.map((c) => (
          <li
            key={c.code}
            className={cn('rounded-md border px-3 py-2 text-sm', c.count ? 'border-caution-200 bg-caution-50' : 'border-ink-200 bg-white')}
          >
            <p className="font-medium text-ink-900">{c.label}</p>
            <p className="tabular-nums text-ink-800">
              {c.count === 0 ? 'None found' : `${c.count} found`}
            </p>
            <p className="mt-1 text-xs text-ink-600">{c.explains}</p>
          </li>
        ))}
      </ul>
      <Select label="Show the issues of" value={check} onChange={(e) => setCheck(e.target.value as QualityCheck | '')} fieldClassName="max-w-sm">
        <option value="">Every check</option>
        {counts.map((c) => (
          <option key={c.code} value={c.code}>
            {c.label} ({c.count})
          </option>
        ))}
      </Select>
      <DataTable
        caption={caption}
        columns={columns}
        data={shown}
        getRowId={(row) => `${row.code}:${row.contestKey ?? ''}:${row.pollKeys.join(',')}:${row.message}`}
        searchLabel="Search the issues"
        initialSorting={[{ id: 'severity', desc: true }]}
        emptyMessage={issues.length === 0 ? 'Every check passed: nothing to look at.' : 'No issue of this check.'}
      />
    </div>
  );
}
