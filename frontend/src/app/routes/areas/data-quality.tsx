import type { QueryClient } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { Alert, Card, LoadingState, PageHeader, Select } from '../../../components/ui';
import { QualityIssues, qualityFiltersSchema, qualityIssuesCsvUrl, qualityIssuesQueryOptions, useQualityIssues } from '../../../features/data-quality';
import { FictionalDataNotice, electionsQueryOptions, useElections } from '../../../features/elections';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { prefetchLoader } from '../../loaders';

function filtersOf(search: URLSearchParams) {
  const parsed = qualityFiltersSchema.safeParse({ election: search.get('election') ?? undefined });
  return parsed.success ? parsed.data : {};
}

export function DataQualityRoute() {
  const [search, setSearch] = useSearchParams();
  const filters = filtersOf(search);
  const elections = useElections();
  const issues = useQualityIssues(filters);
  const chosen = elections.data?.items.find((e) => e.key === filters.election);
  const fictional = chosen ? chosen.fictional : (elections.data?.items.some((e) => e.fictional) ?? false);

  return (
    <div className="space-y-6">
      <title>Data quality · Veracast</title>
      <PageHeader
        title="Data quality"
        description="Checks run on the loaded data after each import: possible duplicates, overlapping tracking waves, study versions without a headline, shares that do not add up, provisional results, contests without a result, and polls published during a blackout."
      />
      {fictional && <FictionalDataNotice scope={chosen ? 'this election and its polls' : 'the demo elections checked here and their polls'} />}
      <Card
        title={chosen ? `Checks of ${chosen.name}` : 'Checks of every election'}
        actions={
          <a href={qualityIssuesCsvUrl(filters)} download className="text-sm font-medium text-accent-700 underline">
            Download as CSV
          </a>
        }
      >
        <div className="space-y-5">
          <div className="flex flex-wrap items-end gap-4">
            <Select
              label="Election"
              value={filters.election ?? ''}
              onChange={(event) => {
                const next = new URLSearchParams(search);
                if (event.target.value) next.set('election', event.target.value);
                else next.delete('election');
                setSearch(next, { replace: true });
              }}
              fieldClassName="min-w-72"
            >
              <option value="">Every election</option>
              {(elections.data?.items ?? []).map((e) => (
                <option key={e.key} value={e.key}>
                  {e.name}
                </option>
              ))}
            </Select>
            {chosen && (
              <Link to={paths.election.href(chosen.key)} className="pb-2 text-sm font-medium text-accent-700 underline">
                Open the election
              </Link>
            )}
          </div>
          {issues.isPending ? (
            <LoadingState label="Running the checks…" />
          ) : issues.isError ? (
            <Alert tone="danger">{describeError(issues.error)}</Alert>
          ) : (
            <QualityIssues issues={issues.data.items} showElection={!chosen} caption={chosen ? `Data-quality issues of ${chosen.name}` : 'Data-quality issues'} />
          )}
        </div>
      </Card>
    </div>
  );
}

/** Routes of the Data quality area; the router spreads them into the signed-in shell. */
export function dataQualityRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.dataQuality.path,
      loader: (args: LoaderFunctionArgs) => {
        const filters = filtersOf(new URL(args.request.url).searchParams);
        return prefetchLoader(queryClient, 'viewer', () => [qualityIssuesQueryOptions(filters), electionsQueryOptions()])();
      },
      element: <DataQualityRoute />,
    },
  ];
}
