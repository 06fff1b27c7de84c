import { Link } from 'react-router-dom';
import { Alert, DataTable, LoadingState, createDataTableColumnHelper } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDateTime } from '../../../utils/format';
import { useAudits, type AuditSummary } from '../api/list-audits';
import { formatCount } from '../format';
import { UNDECIDED_LABELS } from '../settings-text';

const column = createDataTableColumnHelper<AuditSummary>();
const columns = column.columns([
  column.accessor('name', {
    header: 'Audit',
    cell: (info) => (
      <Link to={paths.audit.href(info.row.original.id)} className="font-medium text-accent-700 underline hover:text-accent-900">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor((a) => a.settings.electionKeys.length, {
    id: 'elections',
    header: 'Elections',
    sortFn: 'basic',
    cell: (info) => (
      <span title={info.row.original.settings.electionKeys.join(', ')}>{info.getValue()}</span>
    ),
  }),
  column.accessor((a) => settingsSummary(a.settings), { id: 'settings', header: 'Settings' }),
  column.accessor('pollCount', { header: 'Polls', sortFn: 'basic', cell: (info) => formatCount(info.getValue()) }),
  column.accessor('createdAt', { header: 'Computed', sortFn: 'text', cell: (info) => formatDateTime(info.getValue()) }),
  column.accessor((a) => a.createdBy ?? '—', { id: 'createdBy', header: 'By' }),
  column.accessor((a) => a.dataHash.slice(0, 12), {
    id: 'dataHash',
    header: 'Data hash',
    cell: (info) => <code className="font-mono text-xs">{info.getValue()}…</code>,
  }),
]);

function settingsSummary(s: AuditSummary['settings']): string {
  const parts = [`${s.windowDays}-day window`, s.finalOnly ? 'final polls' : 'all polls in window', UNDECIDED_LABELS[s.undecided].split(':')[0]!.toLowerCase()];
  if (s.designEffect !== 1) parts.push(`design effect ${s.designEffect}`);
  return parts.join(', ');
}

const EMPTY: AuditSummary[] = [];

export function AuditsTable() {
  const { data, isPending, isError, error } = useAudits();
  if (isPending) return <LoadingState label="Loading audits…" />;
  if (isError) return <Alert tone="danger">{describeError(error)}</Alert>;
  return (
    <DataTable
      caption="Audits"
      columns={columns}
      data={data.items.length ? data.items : EMPTY}
      getRowId={(a) => String(a.id)}
      searchLabel="Search audits"
      emptyMessage="No audit yet. An analyst creates one from the elections to audit."
    />
  );
}
