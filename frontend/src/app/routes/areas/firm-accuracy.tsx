import type { QueryClient } from '@tanstack/react-query';
import { useParams, useSearchParams, type RouteObject } from 'react-router-dom';
import { Alert, LinkButton, PageHeader } from '../../../components/ui';
import { FirmErrorCharts } from '../../../features/breakdowns';
import {
  FirmAccuracyPanel,
  auditIdSchema,
  auditListQueryOptions,
  pollsterIdSchema,
  pollsterProfileQueryOptions,
  usePollsterProfile,
  type FirmChartsData,
} from '../../../features/scorecards';
import { paths } from '../../../lib/paths';
import { prefetchLoader } from '../../loaders';

/** The firm's error charts against the field, drawn inside the accuracy panel. */
export function renderFirmCharts(data: FirmChartsData) {
  return (
    <FirmErrorCharts
      pollsterId={data.pollsterId}
      firmName={data.firmName}
      elections={data.elections}
      firmPolls={data.firmPolls}
      fieldPolls={data.fieldPolls}
    />
  );
}

export function FirmAccuracyRoute() {
  const parsed = pollsterIdSchema.safeParse(useParams().id);
  const [searchParams, setSearchParams] = useSearchParams();
  const audit = auditIdSchema.safeParse(searchParams.get('audit') ?? undefined);
  const pollsterId = parsed.success ? parsed.data : 0;
  const profile = usePollsterProfile(pollsterId, { enabled: parsed.success });
  if (!parsed.success) return <Alert tone="danger" title="No such pollster">The address does not name a polling firm.</Alert>;
  const name = profile.data?.name ?? 'Pollster';
  return (
    <div className="space-y-6">
      <title>{`${name}: accuracy · Veracast`}</title>
      <PageHeader
        title={`${name}: accuracy`}
        description="The firm’s polls and their errors against the field’s in one audit, its disclosure, and the names it publishes under."
        actions={<LinkButton to={paths.pollsters.href()}>All pollsters</LinkButton>}
      />
      <FirmAccuracyPanel
        pollsterId={pollsterId}
        auditId={audit.success ? audit.data : undefined}
        onAuditChange={(id) => setSearchParams({ audit: String(id) }, { replace: true, preventScrollReset: true })}
        renderCharts={renderFirmCharts}
      />
    </div>
  );
}

/** A firm's accuracy across one audit; the router spreads it into the signed-in shell. */
export function firmAccuracyRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.pollsterAccuracy.path,
      loader: (args) => {
        const id = pollsterIdSchema.safeParse(args.params.id);
        return prefetchLoader(queryClient, 'viewer', () => [auditListQueryOptions(), ...(id.success ? [pollsterProfileQueryOptions(id.data)] : [])])();
      },
      element: <FirmAccuracyRoute />,
    },
  ];
}
