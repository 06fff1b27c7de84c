import type { QueryClient } from '@tanstack/react-query';
import { roleAtLeast, UNDECIDED_TREATMENTS, type UndecidedTreatment } from '@veracast/shared-types';
import type { LoaderFunctionArgs, RouteObject } from 'react-router-dom';
import { useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { Alert, Card, FictionalDataLabel, LinkButton, LoadingState, PageHeader } from '../../../components/ui';
import {
  AuditsTable,
  AuditView,
  CreateAuditForm,
  MetricExplanation,
  auditIdSchema,
  auditPollsQueryOptions,
  auditQueryOptions,
  auditsQueryOptions,
  electionChoicesQueryOptions,
  isMethodAnchor,
  useAudit,
} from '../../../features/audits';
import { RequireRole, useCurrentUser } from '../../../features/auth';
import { PollView, pollKeySchema, pollQueryOptions } from '../../../features/polls';
import { describeError, isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDateTime } from '../../../utils/format';
import { ensureUser, prefetchLoader } from '../../loaders';

function useCanCreateAudits(): boolean {
  const { data: user } = useCurrentUser();
  return Boolean(user && roleAtLeast(user.role, 'analyst'));
}

export function AuditsListRoute() {
  const canCreate = useCanCreateAudits();
  return (
    <div className="space-y-6">
      <title>Audits · Veracast</title>
      <PageHeader
        title="Audits"
        description="Each audit is a frozen computation of every poll’s error for the elections chosen, with its settings and a hash of its inputs, so the numbers a note cites never change."
        actions={
          canCreate ? (
            <LinkButton to={paths.auditNew.href()} variant="primary">
              New audit
            </LinkButton>
          ) : undefined
        }
      />
      <Card>
        <AuditsTable />
      </Card>
    </div>
  );
}

export function NewAuditRoute() {
  const navigate = useNavigate();
  return (
    <div className="space-y-6">
      <title>New audit · Veracast</title>
      <PageHeader
        title="New audit"
        description="Choose the elections and the settings. Veracast measures every poll of those elections against the certified results and freezes the result."
      />
      <Card>
        <CreateAuditForm onCreated={(audit) => void navigate(paths.audit.href(audit.id))} />
      </Card>
    </div>
  );
}

function AuditPage({ id }: { id: number }) {
  const canRerun = useCanCreateAudits();
  const { data: audit, isPending, isError, error } = useAudit(id);
  if (isPending) return <LoadingState label="Loading the audit…" />;
  if (isError) {
    return (
      <>
        <PageHeader title={`Audit ${id}`} />
        <Alert tone="danger" title={isApiError(error) && error.status === 404 ? 'This audit was not found' : 'The audit could not be loaded'}>
          {describeError(error)}
        </Alert>
      </>
    );
  }
  return (
    <div className="space-y-6">
      <title>{`${audit.name} · Audit · Veracast`}</title>
      <PageHeader
        title={audit.name}
        description={`Audit ${audit.id}, computed ${formatDateTime(audit.createdAt)} over ${audit.elections.length} ${audit.elections.length === 1 ? 'election' : 'elections'}.`}
        actions={audit.fictional ? <FictionalDataLabel /> : undefined}
      />
      <AuditView audit={audit} canRerun={canRerun} />
    </div>
  );
}

export function AuditRoute() {
  const { auditId } = useParams();
  const id = auditIdSchema.safeParse(auditId);
  if (!id.success) {
    return (
      <>
        <PageHeader title="Audit" />
        <Alert tone="danger" title="This audit was not found">
          “{auditId}” is not an audit number.
        </Alert>
      </>
    );
  }
  // A new key per audit resets the page's filters and sorting when a re-run navigates here.
  return <AuditPage key={id.data} id={id.data} />;
}

function explainMetric(anchor: string, about?: string) {
  return isMethodAnchor(anchor) ? <MetricExplanation anchor={anchor} text={about} /> : about;
}

function isTreatment(value: string | null): value is UndecidedTreatment {
  return value !== null && (UNDECIDED_TREATMENTS as readonly string[]).includes(value);
}

export function PollRoute() {
  const { pollKey = '' } = useParams();
  const [search] = useSearchParams();
  const treatment = search.get('treatment');
  return <PollView key={pollKey} pollKey={pollKey} highlight={isTreatment(treatment) ? treatment : undefined} explain={explainMetric} />;
}

function auditLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const id = auditIdSchema.safeParse(params.auditId);
    const user = await ensureUser(queryClient).catch(() => null);
    if (!id.success || !user) return null;
    // The rows can be many: start them, but let the page show the audit while they arrive.
    void queryClient.prefetchQuery(auditPollsQueryOptions(id.data));
    await queryClient.prefetchQuery(auditQueryOptions(id.data));
    return null;
  };
}

/** Routes of the Audits area (and a poll's own page); the router spreads them into the signed-in shell. */
export function auditsRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.audits.path,
      loader: prefetchLoader(queryClient, 'viewer', () => [auditsQueryOptions()]),
      element: <AuditsListRoute />,
    },
    {
      element: <RequireRole minimum="analyst" />,
      children: [
        {
          path: paths.auditNew.path,
          loader: prefetchLoader(queryClient, 'analyst', () => [electionChoicesQueryOptions()]),
          element: <NewAuditRoute />,
        },
      ],
    },
    { path: paths.audit.path, loader: auditLoader(queryClient), element: <AuditRoute /> },
    {
      path: paths.poll.path,
      loader: (args) => {
        const key = pollKeySchema.safeParse(args.params.pollKey);
        return prefetchLoader(queryClient, 'viewer', () => (key.success ? [pollQueryOptions(key.data)] : []))();
      },
      element: <PollRoute />,
    },
  ];
}
