import type { AuditDto } from '@veracast/shared-types';
import { useNavigate } from 'react-router-dom';
import { Alert, Button } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useRerunAudit } from '../api/rerun-audit';

export interface OutOfDateNoticeProps {
  audit: Pick<AuditDto, 'id' | 'dataHash' | 'currentHash'>;
  /** Analysts and above may re-run; others are told who can. */
  canRerun: boolean;
}

/**
 * Says that the data has changed since the audit was computed. The audit itself never changes:
 * a re-run makes a new audit with the same settings and goes there.
 */
export function OutOfDateNotice({ audit, canRerun }: OutOfDateNoticeProps) {
  const rerun = useRerunAudit();
  const navigate = useNavigate();
  return (
    <Alert tone="caution" title="This audit is out of date">
      <p>
        The elections’ data has changed since it was computed (data hash then <code className="font-mono">{audit.dataHash.slice(0, 12)}…</code>
        {audit.currentHash && (
          <>
            , now <code className="font-mono">{audit.currentHash.slice(0, 12)}…</code>
          </>
        )}
        ). Its figures stay as they were, so notes that cite it keep their numbers.
      </p>
      {canRerun ? (
        <div className="mt-2 space-y-2">
          <Button
            size="sm"
            busy={rerun.isPending}
            busyText="Re-running…"
            onClick={() => rerun.mutate(audit.id, { onSuccess: (created) => void navigate(paths.audit.href(created.id)) })}
          >
            Re-run with current data
          </Button>
          {rerun.isError && <p className="font-medium text-danger-800">{describeError(rerun.error)}</p>}
        </div>
      ) : (
        <p className="mt-1">An analyst can re-run it with the current data as a new audit.</p>
      )}
    </Alert>
  );
}
