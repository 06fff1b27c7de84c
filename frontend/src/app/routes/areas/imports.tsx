import { useQueries, type QueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { Link, useParams, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { Card, PageHeader } from '../../../components/ui';
import { RequireRole } from '../../../features/auth';
import { contestQueryOptions } from '../../../features/contests';
import { FictionalDataNotice, useElections } from '../../../features/elections';
import { ImportRecordView, ImportWizard, ImportsTable, importIdSchema, importQueryOptions, importsQueryOptions, type OptionChoice } from '../../../features/imports';
import { pollstersQueryOptions, usePollsters } from '../../../features/pollsters';
import { paths } from '../../../lib/paths';
import { prefetchLoader } from '../../loaders';
import { NotFoundRoute } from '../not-found';

/** The options of each contest a file names, for mapping the columns of a wide-layout file. */
function optionsByContest(results: { data?: { key: string; options: { key: string; name: string }[] } }[]): Record<string, OptionChoice[]> {
  const byContest: Record<string, OptionChoice[]> = {};
  for (const result of results) if (result.data) byContest[result.data.key] = result.data.options.map((o) => ({ key: o.key, name: o.name }));
  return byContest;
}

export function ImportsRoute() {
  const pollsters = usePollsters();
  const elections = useElections();
  const [contestKeys, setContestKeys] = useState<string[]>([]);
  const contestOptions = useQueries({
    queries: contestKeys.slice(0, 20).map((key) => ({ ...contestQueryOptions(key), retry: false })),
    combine: optionsByContest,
  });
  const firms = useMemo(() => (pollsters.data?.items ?? []).map((p) => ({ id: p.id, name: p.name })), [pollsters.data]);
  const demoLoaded = elections.data?.items.some((e) => e.fictional) ?? false;

  return (
    <div className="space-y-6">
      <title>Imports · Veracast</title>
      <PageHeader
        title="Imports"
        description="Load certified results and published polls from CSV files. The file is read in your browser, mapped, checked row by row on the server, and written in one transaction: every row or none, unless you choose the valid rows only."
      />
      {demoLoaded && <FictionalDataNotice scope="the demo files listed below (demo-results.csv, demo-polls.csv) and what they loaded" />}
      <ImportWizard pollsters={firms} contestOptions={contestOptions} onContestKeysChange={setContestKeys} />
      <Card title="Import history" description="Every import and dry run: who ran it, when, its counts and its errors (downloadable as CSV).">
        <ImportsTable />
      </Card>
    </div>
  );
}

export function ImportRecordRoute() {
  const parsed = importIdSchema.safeParse(useParams().importId);
  if (!parsed.success) return <NotFoundRoute />;
  return (
    <div className="space-y-6">
      <title>{`Import ${parsed.data} · Veracast`}</title>
      <p className="text-sm">
        <Link to={paths.imports.href()} className="font-medium text-accent-700 underline">
          <span aria-hidden="true">← </span>All imports
        </Link>
      </p>
      <PageHeader title={`Import #${parsed.data}`} />
      <ImportRecordView id={parsed.data} />
    </div>
  );
}

/** Routes of the Imports area (analysts and above); the router spreads them into the signed-in shell. */
export function importsRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      element: <RequireRole minimum="analyst" />,
      children: [
        {
          path: paths.imports.path,
          loader: prefetchLoader(queryClient, 'analyst', () => [importsQueryOptions(), pollstersQueryOptions()]),
          element: <ImportsRoute />,
        },
        {
          path: paths.importRecord.path,
          loader: (args: LoaderFunctionArgs) => {
            const id = importIdSchema.safeParse(args.params.importId);
            return prefetchLoader(queryClient, 'analyst', () => (id.success ? [importQueryOptions(id.data)] : []))();
          },
          element: <ImportRecordRoute />,
        },
      ],
    },
  ];
}
