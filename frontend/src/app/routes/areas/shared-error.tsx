import type { QueryClient } from '@tanstack/react-query';
import type { AuditDto } from '@veracast/shared-types';
import { Link, useNavigate, useParams, useSearchParams, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { Alert, FictionalDataLabel, LinkButton, LoadingState, PageHeader, Select } from '../../../components/ui';
import {
  AuditHistoryReport,
  SharedErrorChooser,
  SharedErrorReport,
  auditHistoryQueryOptions,
  auditIdSchema,
  auditListQueryOptions,
  auditQueryOptions,
  electionKeySchema,
  sharedErrorQueryOptions,
  useAudit,
  usedAuditPollsQueryOptions,
} from '../../../features/shared-error';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDate } from '../../../utils/format';
import { prefetchLoader } from '../../loaders';
import { NotFoundRoute } from '../not-found';

const linkClass = 'font-medium text-accent-700 underline hover:text-accent-900';

function parseAnalysisParams(params: Record<string, string | undefined>) {
  const id = auditIdSchema.safeParse(params.id);
  const key = electionKeySchema.safeParse(params.electionKey);
  return id.success && key.success ? { auditId: id.data, electionKey: key.data } : null;
}

function AuditNotice({ audit }: { audit: AuditDto }) {
  return (
    <div className="mb-6 space-y-3">
      {audit.fictional && <FictionalDataLabel />}
      {audit.outOfDate && (
        <Alert tone="caution" title="This audit is out of date">
          The archive changed after the audit was computed. The numbers below are the audit’s own and do not move; an analyst can run a new audit on
          the current data from the <Link to={paths.audit.href(audit.id)}>audit’s page</Link>.
        </Alert>
      )}
    </div>
  );
}

function useAuditOrMessage(auditId: number | null) {
  const audit = useAudit(auditId);
  if (audit.isPending) return { audit: null, message: <LoadingState label="Loading the audit…" /> };
  if (audit.isError) {
    return {
      audit: null,
      message: (
        <Alert tone="danger" title="The audit could not be loaded">
          {describeError(audit.error)} <Link to={paths.sharedError.href()}>Choose another audit</Link>.
        </Alert>
      ),
    };
  }
  return { audit: audit.data, message: null };
}

export function SharedErrorChooserRoute() {
  const [params, setParams] = useSearchParams();
  const parsed = auditIdSchema.safeParse(params.get('audit'));
  return (
    <>
      <title>Shared error · Veracast</title>
      <PageHeader
        title="Shared error"
        description="Did most polling firms miss the same way? Choose an audit and an election for the tests, or compare the audit’s elections."
      />
      <SharedErrorChooser auditId={parsed.success ? parsed.data : null} onAuditChange={(id) => setParams({ audit: String(id) }, { replace: true })} />
    </>
  );
}

export function AuditSharedErrorRoute() {
  const parsed = parseAnalysisParams(useParams());
  const navigate = useNavigate();
  const { audit, message } = useAuditOrMessage(parsed?.auditId ?? null);
  if (!parsed) return <NotFoundRoute />;
  if (!audit) return message;

  const election = audit.elections.find((e) => e.key === parsed.electionKey);
  if (!election) {
    return (
      <>
        <PageHeader title="Shared error" />
        <Alert tone="danger" title="Election not in this audit">
          Audit “{audit.name}” does not include the election {parsed.electionKey}.{' '}
          <Link to={paths.sharedError.href({ audit: audit.id })}>Choose one of its elections</Link>.
        </Alert>
      </>
    );
  }

  const elections = [...audit.elections].sort((a, b) => (a.date < b.date ? 1 : -1));
  return (
    <>
      <title>{`Shared error: ${election.name} · Veracast`}</title>
      <p className="mb-4 text-sm">
        <Link to={paths.sharedError.href({ audit: audit.id })} className={linkClass}>
          <span aria-hidden="true">← </span>All elections of this audit
        </Link>
      </p>
      <PageHeader
        title={`Shared error: ${election.name}`}
        description={`Audit “${audit.name}” (#${audit.id}) · election day ${formatDate(election.date)} · errors signed as ${election.blocA ?? 'bloc A'} − ${election.blocB ?? 'bloc B'}, so a negative error means the polls understated ${election.blocA ?? 'bloc A'}.`}
        actions={<LinkButton to={paths.auditHistory.href(audit.id)}>Across elections</LinkButton>}
      />
      <AuditNotice audit={{ ...audit, fictional: audit.fictional || election.fictional }} />
      {elections.length > 1 && (
        <Select
          label="Election"
          value={election.key}
          onChange={(event) => void navigate(paths.auditSharedError.href(audit.id, event.target.value))}
          fieldClassName="mb-8 max-w-md"
        >
          {elections.map((e) => (
            <option key={e.key} value={e.key}>
              {e.name}
            </option>
          ))}
        </Select>
      )}
      <SharedErrorReport key={`${audit.id}-${election.key}`} auditId={audit.id} electionKey={election.key} blocs={{ blocA: election.blocA, blocB: election.blocB }} />
    </>
  );
}

export function AuditHistoryRoute() {
  const parsed = auditIdSchema.safeParse(useParams().id);
  const { audit, message } = useAuditOrMessage(parsed.success ? parsed.data : null);
  if (!parsed.success) return <NotFoundRoute />;
  if (!audit) return message;
  const elections = [...audit.elections].sort((a, b) => (a.date < b.date ? -1 : 1));
  return (
    <>
      <title>Shared error across elections · Veracast</title>
      <p className="mb-4 text-sm">
        <Link to={paths.sharedError.href({ audit: audit.id })} className={linkClass}>
          <span aria-hidden="true">← </span>All elections of this audit
        </Link>
      </p>
      <PageHeader
        title="Shared error across elections"
        description={`Audit “${audit.name}” (#${audit.id}): how far each election’s polls missed together, and the interval the archive supports for a final poll average.`}
      />
      <AuditNotice audit={audit} />
      <AuditHistoryReport auditId={audit.id} elections={elections} />
      <nav aria-label="Each election’s analysis" className="mt-8 text-sm">
        <h2 className="mb-2 font-semibold text-ink-900">Each election’s analysis</h2>
        <ul className="flex flex-wrap gap-x-6 gap-y-2">
          {elections.map((e) => (
            <li key={e.key}>
              <Link to={paths.auditSharedError.href(audit.id, e.key)} className={linkClass}>
                {e.name}
              </Link>
            </li>
          ))}
        </ul>
      </nav>
    </>
  );
}

/** Routes of the Shared error area; the router spreads them into the signed-in shell. */
export function sharedErrorRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.sharedError.path,
      loader: prefetchLoader(queryClient, 'viewer', () => [auditListQueryOptions()]),
      element: <SharedErrorChooserRoute />,
    },
    {
      path: paths.auditSharedError.path,
      loader: (args: LoaderFunctionArgs) => {
        const parsed = parseAnalysisParams(args.params);
        return prefetchLoader(queryClient, 'viewer', () =>
          parsed
            ? [auditQueryOptions(parsed.auditId), sharedErrorQueryOptions(parsed), usedAuditPollsQueryOptions(parsed)]
            : [],
        )();
      },
      element: <AuditSharedErrorRoute />,
    },
    {
      path: paths.auditHistory.path,
      loader: (args: LoaderFunctionArgs) => {
        const parsed = auditIdSchema.safeParse(args.params.id);
        return prefetchLoader(queryClient, 'viewer', () =>
          parsed.success ? [auditQueryOptions(parsed.data), auditHistoryQueryOptions(parsed.data)] : [],
        )();
      },
      element: <AuditHistoryRoute />,
    },
  ];
}
