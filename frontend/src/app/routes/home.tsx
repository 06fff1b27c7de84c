import type { QueryClient } from '@tanstack/react-query';
import { Alert, Card, PageHeader } from '../../components/ui';
import { HealthStatus, healthQueryOptions } from '../../features/health';

export function homeLoader(queryClient: QueryClient) {
  return () => {
    void queryClient.prefetchQuery(healthQueryOptions());
    return null;
  };
}

const CAUTIONS = [
  {
    title: 'A stated margin of error is narrower than the real uncertainty.',
    text: 'It covers the sampling error of one share in one poll, and nothing else: not who declined to answer, not question wording, not minds changed after fieldwork. The lead of one option over another is uncertain by roughly twice that margin.',
  },
  {
    title: 'Polls of one contest share their errors.',
    text: 'They meet the same people who will not answer and the same late swings. Averaging many polls cancels the noise that is theirs alone, not the error they have in common.',
  },
  {
    title: 'A ranking from a few polls is mostly luck.',
    text: 'Veracast shows every pollster figure with its uncertainty and leaves firms with too few polls unranked.',
  },
  {
    title: 'A poll is not a forecast.',
    text: 'It measures opinion while it was in the field. A result that differs from a poll weeks before the vote may be a change of opinion, not a failed poll.',
  },
];

export function HomeRoute() {
  return (
    <div className="space-y-6">
      <PageHeader
        title="Overview"
        description="Veracast is a shared workspace for auditing pre-election polls once the votes are certified."
      />
      <Card title="What Veracast does">
        <div className="max-w-3xl space-y-3 text-ink-800">
          <p>
            Load the certified results and the archive of published polls. Veracast measures how far each poll missed,
            compares polling firms on a fair basis, tests whether the misses were shared across firms, and helps you
            publish a reviewed methodology note that cites a frozen audit, so its numbers never change.
          </p>
          <p>Every figure comes with its uncertainty. There are no letter grades.</p>
        </div>
      </Card>
      <Card title="Read polls with care" description="The cautions that every audit and note carries.">
        <ul className="space-y-3">
          {CAUTIONS.map((caution) => (
            <li key={caution.title}>
              <Alert tone="caution" title={caution.title}>
                {caution.text}
              </Alert>
            </li>
          ))}
        </ul>
      </Card>
      <Card title="Service status">
        <HealthStatus />
      </Card>
    </div>
  );
}
