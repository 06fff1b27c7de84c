import type { AuditDto } from '@veracast/shared-types';
import { lazy, Suspense } from 'react';
import { Alert, Card, LoadingState } from '../../../components/ui';
import { Link } from 'react-router-dom';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { auditPollsCsvUrl, useAuditPolls } from '../api/list-audit-polls';
import { AuditHeadline } from './AuditHeadline';
import { AuditPollsTable } from './AuditPollsTable';
import { AuditSettingsPanel } from './AuditSettingsPanel';
import { OutOfDateNotice } from './OutOfDateNotice';

// The charting library is large: it loads only when an audit's charts are shown.
const AuditCharts = lazy(() => import('./AuditCharts').then((module) => ({ default: module.AuditCharts })));

export interface AuditViewProps {
  audit: AuditDto;
  canRerun: boolean;
}

/** One audit: whether it is current, its headline figures, its settings, charts and every poll. */
export function AuditView({ audit, canRerun }: AuditViewProps) {
  const polls = useAuditPolls(audit.id);
  return (
    <div className="space-y-6">
      {audit.outOfDate && <OutOfDateNotice audit={audit} canRerun={canRerun} />}

      <nav aria-label="Analyses of this audit" className="flex flex-wrap gap-x-6 gap-y-2 rounded-lg border border-ink-200 bg-white px-4 py-3 text-sm">
        <Link className="font-medium text-accent-700 underline-offset-2 hover:underline" to={paths.auditRankings.href(audit.id)}>
          Pollster rankings
        </Link>
        <Link className="font-medium text-accent-700 underline-offset-2 hover:underline" to={paths.auditBreakdowns.href(audit.id)}>
          Where the error came from
        </Link>
        {audit.elections.map((e) => (
          <Link key={e.key} className="font-medium text-accent-700 underline-offset-2 hover:underline" to={paths.auditSharedError.href(audit.id, e.key)}>
            Shared error: {e.name}
          </Link>
        ))}
        <Link className="font-medium text-accent-700 underline-offset-2 hover:underline" to={paths.auditHistory.href(audit.id)}>
          Across elections
        </Link>
      </nav>

      <Card title="Headline figures" description="Over the polls the audit uses. Every figure links to its formula.">
        <AuditHeadline headline={audit.headline} finalOnly={audit.settings.finalOnly} windowDays={audit.settings.windowDays} />
      </Card>

      <Card title="Settings and inputs" description="Everything this audit was computed from. The data hash identifies the exact inputs.">
        <AuditSettingsPanel audit={audit} />
      </Card>

      {polls.isPending ? (
        <LoadingState label="Loading the audit’s polls…" />
      ) : polls.isError ? (
        <Alert tone="danger" title="The audit’s polls could not be loaded">
          {describeError(polls.error)}
        </Alert>
      ) : (
        <>
          <section aria-labelledby="audit-charts" className="space-y-3">
            <h2 id="audit-charts" className="text-lg font-semibold text-ink-900">
              Charts
            </h2>
            <Suspense fallback={<LoadingState label="Loading the charts…" />}>
              <AuditCharts auditId={audit.id} polls={polls.data.items} settings={audit.settings} elections={audit.elections} />
            </Suspense>
          </section>
          <Card
            title="Every poll"
            description="Each poll with every metric. Click a column heading to sort; choose filters and columns above the table."
          >
            <AuditPollsTable
              polls={polls.data.items}
              settings={audit.settings}
              elections={audit.elections}
              auditId={audit.id}
              serverCsvUrl={auditPollsCsvUrl(audit.id)}
            />
          </Card>
        </>
      )}
    </div>
  );
}
