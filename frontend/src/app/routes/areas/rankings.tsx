import type { QueryClient } from '@tanstack/react-query';
import type { AuditDto } from '@veracast/shared-types';
import type { ReactNode } from 'react';
import { useParams, useSearchParams, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { Alert, FictionalDataLabel, LinkButton, LoadingState, PageHeader } from '../../../components/ui';
import { AuditBreakdowns, breakdownsQueryOptions } from '../../../features/breakdowns';
import {
  AuditRankings,
  auditIdSchema,
  auditQueryOptions,
  scorecardFiltersFromSearch,
  scorecardFiltersToSearch,
  scorecardsQueryOptions,
  useAudit,
  type ScorecardFilters,
} from '../../../features/scorecards';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { prefetchLoader } from '../../loaders';

function useAuditIdParam(): number | null {
  const parsed = auditIdSchema.safeParse(useParams().id);
  return parsed.success ? parsed.data : null;
}

function AuditFrame({ auditId, view, children }: { auditId: number | null; view: 'rankings' | 'breakdowns'; children: (audit: AuditDto) => ReactNode }) {
  const audit = useAudit(auditId ?? 0, { enabled: auditId !== null });
  const heading = view === 'rankings' ? 'Pollster ranking' : 'Where the error came from';
  if (auditId === null) return <Alert tone="danger" title="No such audit">The address does not name an audit.</Alert>;
  if (audit.isPending) return <LoadingState label="Loading the audit…" />;
  if (audit.isError) {
    return (
      <Alert tone="danger" title="The audit could not be loaded">
        {describeError(audit.error)}
      </Alert>
    );
  }
  const a = audit.data;
  return (
    <div className="space-y-6">
      <title>{`${heading}: ${a.name} · Veracast`}</title>
      <PageHeader
        title={`${heading}: ${a.name}`}
        description={
          view === 'rankings'
            ? 'Firms compared on the same contests, every figure with its uncertainty. No grades: numbers with their intervals.'
            : 'The audit’s errors broken down by days out, population, mode, sponsor, undecided share, sample size and election.'
        }
        actions={
          <>
            <LinkButton to={view === 'rankings' ? paths.auditBreakdowns.href(a.id) : paths.auditRankings.href(a.id)}>
              {view === 'rankings' ? 'Breakdowns' : 'Ranking'}
            </LinkButton>
            <LinkButton to={paths.audit.href(a.id)}>The audit</LinkButton>
          </>
        }
      />
      <div className="flex flex-wrap items-center gap-3 text-sm text-ink-600">
        {a.fictional && <FictionalDataLabel />}
        <span>
          {a.elections.map((e) => e.name).join(', ')} · {a.settings.windowDays}-day window ·{' '}
          {a.settings.finalOnly ? 'each firm’s final poll per contest' : 'every poll in the window'} · undecided {a.settings.undecided.replace('_', '-')} ·
          data <span className="font-mono text-xs">{a.dataHash.slice(0, 12)}</span>
        </span>
      </div>
      {a.outOfDate && (
        <Alert tone="caution" title="This audit is out of date">
          The data changed after it was computed. Its numbers stay as they were; create a new audit from the audit’s page for current data.
        </Alert>
      )}
      {children(a)}
    </div>
  );
}

export function AuditRankingsRoute() {
  const auditId = useAuditIdParam();
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = scorecardFiltersFromSearch(searchParams);
  function onFiltersChange(next: ScorecardFilters) {
    const search = new URLSearchParams();
    for (const [key, value] of Object.entries(scorecardFiltersToSearch(next))) if (value !== undefined) search.set(key, value);
    setSearchParams(search, { replace: true, preventScrollReset: true });
  }
  return (
    <AuditFrame auditId={auditId} view="rankings">
      {(audit) => <AuditRankings audit={audit} filters={filters} onFiltersChange={onFiltersChange} />}
    </AuditFrame>
  );
}

export function AuditBreakdownsRoute() {
  const auditId = useAuditIdParam();
  return (
    <AuditFrame auditId={auditId} view="breakdowns">
      {(audit) => <AuditBreakdowns auditId={audit.id} elections={audit.elections} />}
    </AuditFrame>
  );
}

function idFrom(args: LoaderFunctionArgs): number | null {
  const parsed = auditIdSchema.safeParse(args.params.id);
  return parsed.success ? parsed.data : null;
}

/** The ranking and the breakdowns of an audit; the router spreads them into the signed-in shell. */
export function rankingsRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.auditRankings.path,
      loader: (args) => {
        const id = idFrom(args);
        const filters = scorecardFiltersFromSearch(new URL(args.request.url).searchParams);
        return prefetchLoader(queryClient, 'viewer', () => (id === null ? [] : [auditQueryOptions(id), scorecardsQueryOptions(id, filters)]))();
      },
      // Filters live in the search string; the screen refetches them itself and keeps the last
      // table on screen, so a filter change must not wait for the loader.
      shouldRevalidate: ({ currentUrl, nextUrl, defaultShouldRevalidate }) =>
        currentUrl.pathname === nextUrl.pathname ? false : defaultShouldRevalidate,
      element: <AuditRankingsRoute />,
    },
    {
      path: paths.auditBreakdowns.path,
      loader: (args) => {
        const id = idFrom(args);
        return prefetchLoader(queryClient, 'viewer', () => (id === null ? [] : [auditQueryOptions(id), breakdownsQueryOptions(id)]))();
      },
      element: <AuditBreakdownsRoute />,
    },
  ];
}
