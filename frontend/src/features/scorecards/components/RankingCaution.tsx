import { Alert } from '../../../components/ui';
import type { ScorecardField } from '../api/types';

/** The plain cautions printed beside every ranking. */
export function RankingCaution({ field, minPolls }: { field: ScorecardField | null; minPolls: number }) {
  const noDifferences = field !== null && field.ranked > 1 && field.shrinkage.applied && field.shrinkage.tau2 === 0;
  return (
    <Alert tone="caution" title="Read the ranking with care">
      <ul className="grid list-disc gap-x-8 gap-y-1 pl-4 lg:grid-cols-2">
        <li>Rankings from few polls are mostly luck. A firm needs at least {minPolls} polls here to be ranked, and even then its rank is uncertain.</li>
        <li>Where two firms’ intervals overlap, their order is not established.</li>
        <li>A stated margin of error covers the sampling error of one share only; the margin between two options carries about twice that, and total error runs larger still.</li>
        <li>Accuracy and disclosure are separate dimensions: disclosure is shown beside accuracy and never enters the rank.</li>
        {noDifferences && (
          <li className="font-medium">
            In these polls the firms differ no more than noise would make them: every ranked firm is pulled to the same value and they all tie.
          </li>
        )}
      </ul>
    </Alert>
  );
}
