import { Stat, StatGroup } from '../../../components/ui';
import { formatDate } from '../../../utils/format';
import type { ContestDetail } from '../api/get-contest';
import { formatInteger, formatPercent } from '../../../lib/format';
import { formatSignedPoints } from '../format';

function optionName(contest: ContestDetail, key: string | null) {
  return key ? (contest.options.find((o) => o.key === key)?.name ?? key) : null;
}

export function ContestFacts({ contest, certifiedMargin }: { contest: ContestDetail; certifiedMargin: number | null }) {
  const a = optionName(contest, contest.refA);
  const b = optionName(contest, contest.refB);
  return (
    <StatGroup>
      <Stat
        label="Result"
        value={contest.status === 'certified' ? 'Certified' : contest.status === 'provisional' ? 'Provisional' : 'None yet'}
        hint={contest.certifiedOn ? `certified on ${formatDate(contest.certifiedOn)}${contest.certifyingBody ? ` by ${contest.certifyingBody}` : ''}` : 'not certified'}
      />
      <Stat
        label="Valid votes"
        value={formatInteger(contest.validVotes)}
        hint={contest.turnout === null ? 'turnout unknown (no electorate)' : `turnout ${formatPercent(contest.turnout)}`}
      />
      <Stat label="Polls" value={formatInteger(contest.pollCount)} hint={`of ${contest.electionName}`} />
      <Stat
        label="Certified margin A − B"
        value={certifiedMargin === null ? '—' : `${formatSignedPoints(certifiedMargin)} pts`}
        hint={a && b ? `A: ${a}; B: ${b}` : 'needs a result'}
      />
    </StatGroup>
  );
}
