import type { QueryClient } from '@tanstack/react-query';
import { roleAtLeast } from '@veracast/shared-types';
import { Link, useParams, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { Alert, Card, LinkButton, LoadingState, PageHeader } from '../../../components/ui';
import { useCurrentUser } from '../../../features/auth';
import { FictionalDataNotice, useElections } from '../../../features/elections';
import {
  PollsterDisclosure,
  PollsterFacts,
  PollsterForm,
  PollsterPollsTable,
  PollstersTable,
  pollsterIdSchema,
  pollsterQueryOptions,
  pollstersQueryOptions,
  usePollster,
} from '../../../features/pollsters';
import { describeError, isApiError } from '../../../lib/api-client';
import { env } from '../../../lib/env';
import { paths } from '../../../lib/paths';
import { prefetchLoader } from '../../loaders';
import { NotFoundRoute } from '../not-found';

function useCanEdit() {
  const { data: user } = useCurrentUser();
  return Boolean(user && roleAtLeast(user.role, 'analyst'));
}

export function PollstersRoute() {
  const canEdit = useCanEdit();
  const elections = useElections();
  const anyFictional = elections.data?.items.some((e) => e.fictional) ?? false;
  return (
    <div className="space-y-6">
      <title>Pollsters · Veracast</title>
      <PageHeader
        title="Pollsters"
        description="Polling firms, the names they publish under, how much they polled, and how fully they disclose. Accuracy is on each firm's accuracy page, measured in audits."
        actions={
          <a href={`${env.apiBase}/pollsters?format=csv`} download className="text-sm font-medium text-accent-700 underline">
            Download as CSV
          </a>
        }
      />
      {anyFictional && <FictionalDataNotice scope="the firms of the demo scenario and their polls" />}
      <PollstersTable />
      {canEdit && (
        <Card title="Add a pollster" description="Firms are also created when an import names one that matches no firm or alias.">
          <PollsterForm />
        </Card>
      )}
    </div>
  );
}

export function PollsterRoute() {
  const parsed = pollsterIdSchema.safeParse(useParams().pollsterId);
  if (!parsed.success) return <NotFoundRoute />;
  return <PollsterPage id={parsed.data} />;
}

function PollsterPage({ id }: { id: number }) {
  const canEdit = useCanEdit();
  const pollster = usePollster(id);
  if (pollster.isPending) return <LoadingState label="Loading the pollster…" />;
  if (pollster.isError) {
    if (isApiError(pollster.error) && pollster.error.status === 404) return <NotFoundRoute />;
    return <Alert tone="danger">{describeError(pollster.error)}</Alert>;
  }
  const p = pollster.data;
  const fictional = p.polls.some((poll) => poll.fictional);
  return (
    <div className="space-y-6">
      <title>{`${p.name} · Veracast`}</title>
      <p className="text-sm">
        <Link to={paths.pollsters.href()} className="font-medium text-accent-700 underline">
          <span aria-hidden="true">← </span>All pollsters
        </Link>
      </p>
      <PageHeader
        title={p.name}
        description="The firm's names, its polls and its disclosure. How close its polls came is measured in audits."
        actions={
          <LinkButton to={paths.pollsterAccuracy.href(p.id)} variant="primary">
            Accuracy across audits
          </LinkButton>
        }
      />
      {fictional && <FictionalDataNotice scope="this firm and its polls" />}
      <Card title="The firm">
        <PollsterFacts pollster={p} />
      </Card>
      <Card
        title="Disclosure"
        description="What the firm published with its polls, item by item. Kept apart from accuracy: a fully disclosed poll can miss, and a sparse one can hit."
      >
        <PollsterDisclosure pollster={p} />
      </Card>
      <Card title="Polls">
        <PollsterPollsTable polls={p.polls} firm={p.name} />
      </Card>
      {canEdit && (
        <Card title="Edit the pollster" description="Replacing the aliases changes which names later imports match to this firm.">
          <PollsterForm pollster={p} />
        </Card>
      )}
    </div>
  );
}

/** Routes of the Pollsters area; the router spreads them into the signed-in shell. */
export function pollstersRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.pollsters.path,
      loader: prefetchLoader(queryClient, 'viewer', () => [pollstersQueryOptions()]),
      element: <PollstersRoute />,
    },
    {
      path: paths.pollster.path,
      loader: (args: LoaderFunctionArgs) => {
        const id = pollsterIdSchema.safeParse(args.params.pollsterId);
        return prefetchLoader(queryClient, 'viewer', () => (id.success ? [pollsterQueryOptions(id.data)] : []))();
      },
      element: <PollsterRoute />,
    },
  ];
}
