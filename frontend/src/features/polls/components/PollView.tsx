import type { UndecidedTreatment } from '@veracast/shared-types';
import type { ReactNode } from 'react';
import { Alert, Card, FictionalDataLabel, LoadingState, PageHeader } from '../../../components/ui';
import { describeError, isApiError } from '../../../lib/api-client';
import { usePoll } from '../api/get-poll';
import { ContestResultFacts, PollFacts, PollSharesTable } from './PollFacts';
import { PollMetricsTable } from './PollMetricsTable';

export interface PollViewProps {
  pollKey: string;
  highlight?: UndecidedTreatment;
  explain: (anchor: string, about?: string) => ReactNode;
}

/** A poll's own page: what it published, the certified result, and every metric with its inputs. */
export function PollView({ pollKey, highlight, explain }: PollViewProps) {
  const { data: poll, isPending, isError, error } = usePoll(pollKey);

  if (isPending) return <LoadingState label="Loading the poll…" />;
  if (isError) {
    return (
      <>
        <PageHeader title={`Poll ${pollKey}`} />
        <Alert tone="danger" title={isApiError(error) && error.status === 404 ? 'This poll was not found' : 'The poll could not be loaded'}>
          {describeError(error)}
        </Alert>
      </>
    );
  }

  const raw = poll.metrics.raw ?? poll.metrics[highlight ?? 'raw'] ?? null;
  return (
    <div className="space-y-6">
      <title>{`Poll ${poll.key} · Veracast`}</title>
      <PageHeader
        title={
          <>
            {poll.pollster}: {poll.contest.name}
            <span className="mt-1 block font-mono text-sm font-normal text-ink-600">{poll.key}</span>
          </>
        }
        description={`${poll.contest.electionName}. A poll measures opinion during its fieldwork; it is not a forecast.`}
        actions={poll.fictional || poll.contest.fictional ? <FictionalDataLabel /> : undefined}
      />
      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="What the poll published">
          <PollFacts poll={poll} />
        </Card>
        <Card title="Certified result">
          <ContestResultFacts poll={poll} />
        </Card>
      </div>
      <Card title="Shares" description="The poll’s published shares beside the certified shares. (A) and (B) mark the reference pair.">
        <PollSharesTable poll={poll} refA={raw?.refA} refB={raw?.refB} />
      </Card>
      <Card
        title="Every metric and its inputs"
        description="Under each undecided treatment. An audit uses one treatment; never compare errors made under different ones."
      >
        <PollMetricsTable poll={poll} highlight={highlight} explain={explain} />
      </Card>
    </div>
  );
}
