import { useId, type ReactNode } from 'react';
import { Alert, LoadingState } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { safeFilename } from '../../../lib/download';
import type { Blocs } from '../lib/verdict';
import { useSharedError } from '../api/get-shared-error';
import { useUsedAuditPolls } from '../api/list-audit-polls';
import { ContestErrorChart } from './ContestErrorChart';
import { CorrelationHeatmap } from './CorrelationHeatmap';
import { PollAverageChart, PollAverageSummary } from './PollAverageChart';
import { QqPlot } from './QqPlot';
import { SharedErrorCautions } from './SharedErrorCautions';
import { SharedMissHeadline } from './SharedMissHeadline';
import { VarianceSplitChart } from './VarianceSplitChart';

function Part({ title, lead, children }: { title: string; lead: ReactNode; children: ReactNode }) {
  const id = useId();
  return (
    <section aria-labelledby={id} className="space-y-4">
      <div>
        <h2 id={id} className="text-lg font-semibold text-ink-950">
          {title}
        </h2>
        <p className="mt-1 max-w-3xl text-sm text-ink-700">{lead}</p>
      </div>
      {children}
    </section>
  );
}

export interface SharedErrorReportProps {
  auditId: number;
  electionKey: string;
  blocs: Blocs;
}

/**
 * The shared-error page of one election, read top-down as an argument: the headline, the
 * evidence, what it means for a poll average, and where the data are thin.
 */
export function SharedErrorReport({ auditId, electionKey, blocs }: SharedErrorReportProps) {
  const analysis = useSharedError({ auditId, electionKey });
  const polls = useUsedAuditPolls({ auditId, electionKey });
  const base = safeFilename(`audit-${auditId}-${electionKey}`);

  if (analysis.isPending) return <LoadingState label="Loading the shared-error analysis…" />;
  if (analysis.isError) return <Alert tone="danger" title="The analysis could not be loaded">{describeError(analysis.error)}</Alert>;
  const data = analysis.data;

  return (
    <div className="space-y-10">
      <SharedMissHeadline analysis={data} blocs={blocs} />

      <Part
        title="The evidence"
        lead="Four views of the same errors: where each poll landed in its contest, how the variation splits, whether firms’ errors move together, and whether the errors look normal."
      >
        {polls.isPending ? (
          <LoadingState label="Loading the polls…" />
        ) : polls.isError ? (
          <Alert tone="danger" title="The polls could not be loaded">{describeError(polls.error)}</Alert>
        ) : (
          <ContestErrorChart analysis={data} polls={polls.data.items} blocs={blocs} filename={`${base}-contest-errors`} />
        )}
        <VarianceSplitChart analysis={data} filename={`${base}-variance-split`} />
        <CorrelationHeatmap analysis={data} filename={`${base}-firm-correlation`} />
        <QqPlot analysis={data} filename={`${base}-qq`} />
      </Part>

      <Part
        title="What it means for a poll average"
        lead="A shared error does not shrink when polls are averaged. Here is how many independent polls the election’s polls were worth, and the interval their averages should have carried."
      >
        <PollAverageSummary analysis={data} />
        <PollAverageChart analysis={data} blocs={blocs} filename={`${base}-average-intervals`} />
      </Part>

      <Part title="Cautions" lead="Where the data behind this page are thin, and what no analysis of poll error can settle.">
        <SharedErrorCautions analysis={data} />
      </Part>
    </div>
  );
}
