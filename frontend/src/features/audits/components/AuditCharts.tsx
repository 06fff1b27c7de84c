import type { AuditDto, AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { useId, useMemo, useState } from 'react';
import { formatCount } from '../format';
import { auditPollStatus } from '../used';
import { ErrorByDaysOut, type DaysOutPoint } from './ErrorByDaysOut';
import { SignedErrorHistogram } from './SignedErrorHistogram';

type Scope = 'used' | 'window';

const selectClasses =
  'h-9 rounded-md border border-ink-300 bg-white px-2 text-sm shadow-sm focus-visible:outline-2 focus-visible:outline-offset-1 focus-visible:outline-accent-600';

/** How the sign reads for the chosen elections, in one sentence. */
export function orientationSentence(elections: AuditDto['elections'], polls: readonly AuditPollDto[]): string {
  const pairs = new Set(elections.map((e) => (e.blocA && e.blocB ? `${e.blocA} against ${e.blocB}` : null)));
  const topTwo = polls.filter((p) => p.refBasis === 'top_two').length;
  const sign =
    pairs.size === 1 && !pairs.has(null)
      ? `positive means the poll overstated ${[...pairs][0]}.`
      : 'positive means the poll overstated bloc A of its election (see the pairs under Settings).';
  return topTwo > 0
    ? `${sign} ${formatCount(topTwo)} of these polls are in contests without both blocs and are oriented by the certified winner.`
    : sign;
}

export interface AuditChartsProps {
  auditId: number;
  polls: readonly AuditPollDto[];
  settings: AuditSettings;
  elections: AuditDto['elections'];
}

/** The histogram of signed errors and the error-by-days-out plot, for all or one election. */
export function AuditCharts({ auditId, polls, settings, elections }: AuditChartsProps) {
  const ids = useId();
  const [election, setElection] = useState('');
  const [scope, setScope] = useState<Scope>('used');

  const chosenElections = useMemo(() => (election ? elections.filter((e) => e.key === election) : elections), [election, elections]);
  const inElection = useMemo(() => polls.filter((p) => !election || p.electionKey === election), [polls, election]);
  const used = useMemo(() => inElection.filter((p) => auditPollStatus(p, settings) === 'used'), [inElection, settings]);
  const errors = useMemo(() => used.map((p) => p.marginError!), [used]);
  const scatterPolls = useMemo(
    () => (scope === 'used' ? used : inElection.filter((p) => p.inWindow && p.error === null && p.marginError !== null)),
    [scope, used, inElection],
  );
  const points = useMemo<DaysOutPoint[]>(
    () =>
      scatterPolls
        .filter((p) => p.daysOut !== null && p.marginError !== null)
        .map((p) => ({ pollKey: p.pollKey, pollster: p.pollster, contestKey: p.contestKey, daysOut: p.daysOut!, marginError: p.marginError! })),
    [scatterPolls],
  );
  const suffix = election ? `-${election}` : '';

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        {elections.length > 1 && (
          <div className="flex flex-col gap-1.5">
            <label htmlFor={`${ids}-election`} className="text-sm font-medium text-ink-800">
              Charts for
            </label>
            <select id={`${ids}-election`} className={selectClasses} value={election} onChange={(e) => setElection(e.target.value)}>
              <option value="">All elections of the audit</option>
              {elections.map((e) => (
                <option key={e.key} value={e.key}>
                  {e.name}
                </option>
              ))}
            </select>
          </div>
        )}
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${ids}-scope`} className="text-sm font-medium text-ink-800">
            Days-out chart shows
          </label>
          <select id={`${ids}-scope`} className={selectClasses} value={scope} onChange={(e) => setScope(e.target.value as Scope)}>
            <option value="used">The used polls</option>
            <option value="window">Every scored poll in the window</option>
          </select>
        </div>
      </div>
      <div className="grid gap-4 xl:grid-cols-2">
        <SignedErrorHistogram
          errors={errors}
          filename={`audit-${auditId}${suffix}-signed-errors`}
          orientation={orientationSentence(chosenElections, used)}
        />
        <ErrorByDaysOut
          points={points}
          filename={`audit-${auditId}${suffix}-error-by-days-out`}
          orientation={orientationSentence(chosenElections, scatterPolls)}
          scope={scope === 'used' ? 'used polls' : 'scored polls in the window'}
        />
      </div>
    </div>
  );
}
