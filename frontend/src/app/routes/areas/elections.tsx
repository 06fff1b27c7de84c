import type { QueryClient } from '@tanstack/react-query';
import { roleAtLeast, UNDECIDED_TREATMENTS, type UndecidedTreatment } from '@veracast/shared-types';
import { useCallback, useMemo, useRef, useState } from 'react';
import { Link, useParams, useSearchParams, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { Alert, Card, LoadingState, PageHeader, Select } from '../../../components/ui';
import { useCurrentUser } from '../../../features/auth';
import {
  ChangeHistory,
  ContestFacts,
  ContestForm,
  ContestPollsTable,
  DisclosureChecklist,
  MarginChart,
  PollForm,
  ResultForm,
  ResultTable,
  SourceDocumentPanel,
  certifiedMargin,
  contestKeyParamSchema,
  contestPollsQueryOptions,
  contestQueryOptions,
  marginPoints,
  undecidedTreatmentSchema,
  useContest,
  useContestPolls,
  type ContestPoll,
} from '../../../features/contests';
import { QualityIssues } from '../../../features/data-quality';
import {
  ElectionContestsTable,
  ElectionFacts,
  ElectionForm,
  ElectionsTable,
  FictionalDataNotice,
  OrientationForm,
  electionKeyParamSchema,
  electionQueryOptions,
  electionsQueryOptions,
  useElection,
  useElections,
} from '../../../features/elections';
import { pollstersQueryOptions, usePollsters } from '../../../features/pollsters';
import { describeError, isApiError } from '../../../lib/api-client';
import { env } from '../../../lib/env';
import { paths } from '../../../lib/paths';
import { formatDate } from '../../../utils/format';
import { prefetchLoader } from '../../loaders';
import { NotFoundRoute } from '../not-found';

const TREATMENT_LABELS: Record<UndecidedTreatment, string> = {
  raw: 'As published (raw)',
  proportional: 'Undecided shared out in proportion',
  two_party: 'A and B only (two-party)',
};

function useRoles() {
  const { data: user } = useCurrentUser();
  return {
    canEdit: Boolean(user && roleAtLeast(user.role, 'analyst')),
    canReview: Boolean(user && roleAtLeast(user.role, 'reviewer')),
  };
}

function BackLink({ to, children }: { to: string; children: string }) {
  return (
    <p className="mb-4 text-sm">
      <Link to={to} className="font-medium text-accent-700 underline">
        <span aria-hidden="true">← </span>
        {children}
      </Link>
    </p>
  );
}

export function ElectionsRoute() {
  const { canEdit } = useRoles();
  const elections = useElections();
  const anyFictional = elections.data?.items.some((e) => e.fictional) ?? false;
  return (
    <div className="space-y-6">
      <title>Elections · Veracast</title>
      <PageHeader
        title="Elections"
        description="Each election with its contests, how many results are certified and how many polls were published."
        actions={
          <a href={`${env.apiBase}/elections?format=csv`} download className="text-sm font-medium text-accent-700 underline">
            Download as CSV
          </a>
        }
      />
      {anyFictional && <FictionalDataNotice scope="the elections marked Fictional, their results and their polls" />}
      <ElectionsTable />
      {canEdit && (
        <Card title="Add an election" description="Or import a results file, which creates the elections it names.">
          <ElectionForm />
        </Card>
      )}
    </div>
  );
}

export function ElectionRoute() {
  const parsed = electionKeyParamSchema.safeParse(useParams().electionKey);
  if (!parsed.success) return <NotFoundRoute />;
  return <ElectionPage electionKey={parsed.data} />;
}

function ElectionPage({ electionKey }: { electionKey: string }) {
  const { canEdit, canReview } = useRoles();
  const election = useElection(electionKey);
  const blocs = useMemo(
    () => [...new Set((election.data?.contests ?? []).flatMap((c) => c.options.map((o) => o.bloc)).filter((b): b is string => Boolean(b)))].sort(),
    [election.data],
  );

  if (election.isPending) return <LoadingState label="Loading the election…" />;
  if (election.isError) {
    if (isApiError(election.error) && election.error.status === 404) return <NotFoundRoute />;
    return <Alert tone="danger">{describeError(election.error)}</Alert>;
  }
  const e = election.data;
  const warnings = e.quality.filter((q) => q.severity === 'warning').length;

  return (
    <div className="space-y-6">
      <title>{`${e.name} · Veracast`}</title>
      <BackLink to={paths.elections.href()}>All elections</BackLink>
      <PageHeader title={e.name} description={`${e.jurisdiction}, ${formatDate(e.date)}. Key: ${e.key}`} />
      {e.fictional && <FictionalDataNotice scope="this election, its results and its polls" />}
      <ElectionFacts election={e} />
      <Card
        title="Contests"
        description="Certification state, turnout and poll counts of each race or question. Open one for its result, its history and its polls."
      >
        <ElectionContestsTable contests={e.contests} />
      </Card>
      <Card
        title={`Quality warnings (${warnings} warning${warnings === 1 ? '' : 's'}, ${e.quality.length - warnings} note${e.quality.length - warnings === 1 ? '' : 's'})`}
        description="The checks run on this election's data after each import."
        actions={
          <Link to={paths.dataQuality.href({ election: e.key })} className="text-sm font-medium text-accent-700 underline">
            Open in Data quality
          </Link>
        }
      >
        <QualityIssues issues={e.quality} caption={`Data-quality issues of ${e.name}`} />
      </Card>
      <Card
        title="Orientation"
        description="Margins are A minus B. A and B are the election's two orientation blocs where both stand in a contest, otherwise the contest's top two."
      >
        {canReview ? (
          <OrientationForm election={e} blocs={blocs} />
        ) : (
          <p className="text-sm text-ink-700">
            {e.blocA && e.blocB ? `A is ${e.blocA}, B is ${e.blocB}` : 'No orientation yet'}
            {e.orientationSource === 'set' ? ', set by a reviewer.' : e.orientationSource === 'default' ? ', by default (most certified votes).' : '.'} A reviewer may change it.
          </p>
        )}
      </Card>
      {canEdit && (
        <>
          <Card title="Edit the election">
            <ElectionForm election={e} />
          </Card>
          <Card title="Add a contest" description="A race or question with its options; enter its result on the contest's page or import it.">
            <ContestForm electionKey={e.key} />
          </Card>
        </>
      )}
    </div>
  );
}

export function ContestRoute() {
  const parsed = contestKeyParamSchema.safeParse(useParams().contestKey);
  if (!parsed.success) return <NotFoundRoute />;
  return <ContestPage contestKey={parsed.data} />;
}

function ContestPage({ contestKey }: { contestKey: string }) {
  const { canEdit, canReview } = useRoles();
  const [search, setSearch] = useSearchParams();
  const undecided = undecidedTreatmentSchema.parse(search.get('undecided') ?? 'raw');
  const contest = useContest(contestKey);
  const polls = useContestPolls(contestKey, undecided);
  const pollsters = usePollsters();
  const [editing, setEditing] = useState<ContestPoll | null>(null);
  const editCard = useRef<HTMLDivElement>(null);
  const startEdit = useCallback((poll: ContestPoll) => {
    setEditing(poll);
    requestAnimationFrame(() => editCard.current?.scrollIntoView({ behavior: 'smooth', block: 'start' }));
  }, []);
  const firmChoices = useMemo(() => (pollsters.data?.items ?? []).map((p) => ({ id: p.id, name: p.name })), [pollsters.data]);
  const pollItems = useMemo(() => polls.data?.items ?? [], [polls.data]);
  const points = useMemo(() => (contest.data ? marginPoints(contest.data, pollItems) : []), [contest.data, pollItems]);
  const certified = useMemo(() => (contest.data ? certifiedMargin(contest.data, pollItems) : null), [contest.data, pollItems]);

  if (contest.isPending) return <LoadingState label="Loading the contest…" />;
  if (contest.isError) {
    if (isApiError(contest.error) && contest.error.status === 404) return <NotFoundRoute />;
    return <Alert tone="danger">{describeError(contest.error)}</Alert>;
  }
  const c = contest.data;
  const nameOf = (key: string | null) => (key ? (c.options.find((o) => o.key === key)?.name ?? key) : '—');

  return (
    <div className="space-y-6">
      <title>{`${c.name} · ${c.electionName} · Veracast`}</title>
      <BackLink to={paths.election.href(c.electionKey)}>{c.electionName}</BackLink>
      <PageHeader title={c.name} description={`${c.electionName}, ${formatDate(c.electionDate)}. Key: ${c.key}`} />
      {c.fictional && <FictionalDataNotice scope="this contest, its result and its polls" />}
      <ContestFacts contest={c} certifiedMargin={certified} />

      <Card title="Result" description="Votes per option; shares are of all options' votes.">
        <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
          <ResultTable contest={c} />
          <SourceDocumentPanel contest={c} canAttach={canReview} />
        </div>
      </Card>
      {canEdit && (
        <Card
          title={c.status === 'certified' ? 'Correct the certified result' : 'Enter the result'}
          description="Analysts enter provisional results. Marking a result certified needs the reviewer role and a source; changing a certified one needs a reason."
        >
          <ResultForm contest={c} canCertify={canReview} />
        </Card>
      )}
      <Card title="History of the result" description="Every change to this result, with who made it, when, why, and the values before and after.">
        <ChangeHistory contest={c} />
      </Card>

      <Card
        title="Poll margins against fieldwork date"
        description={`A is ${nameOf(c.refA)}, B is ${nameOf(c.refB)}.`}
        actions={
          <Select
            label="Undecided treatment"
            value={undecided}
            onChange={(event) => {
              const next = new URLSearchParams(search);
              if (event.target.value === 'raw') next.delete('undecided');
              else next.set('undecided', event.target.value);
              setSearch(next, { replace: true });
            }}
          >
            {UNDECIDED_TREATMENTS.map((t) => (
              <option key={t} value={t}>
                {TREATMENT_LABELS[t]}
              </option>
            ))}
          </Select>
        }
      >
        {polls.isPending ? (
          <LoadingState label="Loading polls…" />
        ) : polls.isError ? (
          <Alert tone="danger">{describeError(polls.error)}</Alert>
        ) : (
          <MarginChart contestKey={c.key} points={points} certified={certified} electionDate={c.electionDate} nameA={nameOf(c.refA)} nameB={nameOf(c.refB)} />
        )}
      </Card>

      {editing && canEdit && (
        <div ref={editCard}>
          <Card title={`Edit poll ${editing.key}`}>
            <PollForm key={editing.key} contest={c} pollsters={firmChoices} poll={editing} onDone={() => setEditing(null)} />
          </Card>
        </div>
      )}

      <Card title="Polls" description="Shares are in points as published; margins and errors follow the undecided treatment chosen above.">
        {polls.isPending ? (
          <LoadingState label="Loading polls…" />
        ) : polls.isError ? (
          <Alert tone="danger">{describeError(polls.error)}</Alert>
        ) : (
          <ContestPollsTable contest={c} polls={pollItems} onEdit={canEdit ? startEdit : undefined} />
        )}
      </Card>

      <Card
        title="Disclosure checklist"
        description="Which items of a published poll's standard disclosure each poll carries. Completeness is about what a poll told its readers; it is shown apart from accuracy and says nothing about it."
      >
        {polls.data && <DisclosureChecklist polls={pollItems} caption={`Disclosure of the polls of ${c.name}`} />}
      </Card>

      {canEdit && (
        <Card title="Add a poll" description="Or import a polls file, which checks every row before anything is written.">
          {pollsters.isError ? <Alert tone="danger">{describeError(pollsters.error)}</Alert> : <PollForm contest={c} pollsters={firmChoices} />}
        </Card>
      )}
    </div>
  );
}

/** Routes of the Elections area; the router spreads them into the signed-in shell. */
export function electionsRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.elections.path,
      loader: prefetchLoader(queryClient, 'viewer', () => [electionsQueryOptions()]),
      element: <ElectionsRoute />,
    },
    {
      path: paths.election.path,
      loader: (args: LoaderFunctionArgs) => {
        const key = electionKeyParamSchema.safeParse(args.params.electionKey);
        return prefetchLoader(queryClient, 'viewer', () => (key.success ? [electionQueryOptions(key.data)] : []))();
      },
      element: <ElectionRoute />,
    },
    {
      path: paths.contest.path,
      loader: (args: LoaderFunctionArgs) => {
        const key = contestKeyParamSchema.safeParse(args.params.contestKey);
        const undecided = undecidedTreatmentSchema.parse(new URL(args.request.url).searchParams.get('undecided') ?? 'raw');
        return prefetchLoader(queryClient, 'viewer', () =>
          key.success ? [contestQueryOptions(key.data), contestPollsQueryOptions(key.data, undecided), pollstersQueryOptions()] : [],
        )();
      },
      element: <ContestRoute />,
    },
  ];
}
