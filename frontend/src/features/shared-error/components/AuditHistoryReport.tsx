import { Alert, LoadingState } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { useAuditHistory } from '../api/get-audit-history';
import type { AuditElection } from '../types';
import { HistoricalIntervalCard, TooCloseChart } from './HistoricalInterval';
import { HistoryChart } from './HistoryChart';

/** Across the audit's elections: the shared miss of each, the archive's interval, and close contests. */
export function AuditHistoryReport({ auditId, elections }: { auditId: number; elections: readonly AuditElection[] }) {
  const history = useAuditHistory(auditId);
  if (history.isPending) return <LoadingState label="Loading the history…" />;
  if (history.isError) return <Alert tone="danger" title="The history could not be loaded">{describeError(history.error)}</Alert>;
  return (
    <div className="space-y-8">
      <HistoryChart history={history.data} elections={elections} filename={`audit-${auditId}-history`} />
      <HistoricalIntervalCard history={history.data} />
      <TooCloseChart history={history.data} elections={elections} filename={`audit-${auditId}-too-close`} />
    </div>
  );
}
