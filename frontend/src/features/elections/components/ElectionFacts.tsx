import { Stat, StatGroup } from '../../../components/ui';
import { formatDate } from '../../../utils/format';
import type { ElectionDetail } from '../api/get-election';
import { formatInteger } from '../../../lib/format';
import { formatFraction } from '../format';

const ORIENTATION_SOURCE: Record<ElectionDetail['orientationSource'], string> = {
  set: 'set by a reviewer',
  default: 'default: the two blocs with the most certified votes',
  none: 'not known until results are loaded',
};

/** Turnout over the contests whose electorate is known: ballots cast over the electorate, summed. */
function overallTurnout(election: ElectionDetail): number | null {
  let cast = 0;
  let electorate = 0;
  for (const contest of election.contests) {
    if (!contest.electorate || contest.validVotes === null) continue;
    cast += contest.validVotes + (contest.rejectedBallots ?? 0);
    electorate += contest.electorate;
  }
  return electorate > 0 ? cast / electorate : null;
}

export function ElectionFacts({ election }: { election: ElectionDetail }) {
  const turnout = overallTurnout(election);
  const provisional = election.contests.filter((c) => c.status === 'provisional').length;
  const missing = election.contests.filter((c) => c.status === null).length;
  return (
    <StatGroup>
      <Stat label="Election day" value={formatDate(election.date)} hint={election.jurisdiction} />
      <Stat
        label="Certified contests"
        value={`${election.certifiedCount} of ${election.contestCount}`}
        hint={
          provisional || missing
            ? [provisional ? `${provisional} provisional` : '', missing ? `${missing} without a result` : ''].filter(Boolean).join(', ')
            : 'every result is certified'
        }
      />
      <Stat label="Polls" value={formatInteger(election.pollCount)} hint="published polls of its contests" />
      <Stat
        label="Turnout"
        value={formatFraction(turnout)}
        hint={turnout === null ? 'no contest has a known electorate' : 'ballots cast over the electorate, where known'}
      />
      <Stat
        label="Orientation"
        value={election.blocA && election.blocB ? `${election.blocA} vs ${election.blocB}` : '—'}
        hint={ORIENTATION_SOURCE[election.orientationSource]}
        className="sm:col-span-2"
      />
      <Stat
        label="Blackout period"
        value={election.blackoutStart || election.blackoutEnd ? `${formatDate(election.blackoutStart)} – ${formatDate(election.blackoutEnd)}` : 'None'}
        hint="polls published inside it are flagged"
        className="sm:col-span-2"
      />
    </StatGroup>
  );
}
