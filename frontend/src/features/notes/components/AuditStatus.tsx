import type { NoteAuditRef } from '@veracast/shared-types';
import { Alert } from '../../../components/ui';

/** Says which cited audits are out of date or missing; silent when all is well. */
export function AuditStatus({ audits }: { audits: readonly NoteAuditRef[] }) {
  const stale = audits.filter((a) => a.outOfDate);
  const missing = audits.filter((a) => !a.exists);
  if (!stale.length && !missing.length) return null;
  return (
    <div className="space-y-2">
      {stale.length > 0 && (
        <Alert tone="caution" title={`Out of date: ${stale.map((a) => `audit #${a.id}`).join(', ')}`}>
          The archive changed after {stale.length > 1 ? 'these audits were' : 'this audit was'} computed. The blocks keep showing the stored numbers; cite a re-run of the audit to
          show the current data.
        </Alert>
      )}
      {missing.length > 0 && <Alert tone="danger" title={`Unknown audit: ${missing.map((a) => `#${a.id}`).join(', ')}`}>These blocks show an error box instead of figures.</Alert>}
    </div>
  );
}
