import { POPULATION_LABELS, type Mode, type Population } from '@veracast/shared-types';
import { Alert, LoadingState } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { useBreakdowns } from '../api/get-breakdowns';
import type { BreakdownBin } from '../api/types';
import { CategoryBreakdownFigure } from './CategoryBreakdownFigure';
import { DaysOutFigure } from './DaysOutFigure';
import { ElectionsFigure, type ElectionName } from './ElectionsFigure';
import { FunnelFigure } from './FunnelFigure';
import { QqFigure } from './QqFigure';

const MODE_NAMES: Record<Mode, string> = {
  phone: 'Phone',
  ivr: 'Automated phone',
  online: 'Online',
  text: 'Text message',
  mixed: 'Mixed modes',
  face: 'Face to face',
  mail: 'Mail',
};

const SPONSOR_NAMES: Record<string, string> = { partisan: 'Partisan sponsor', 'not partisan': 'Not partisan' };

const populationName = (b: BreakdownBin) => POPULATION_LABELS[b.label as Population] ?? b.label;
const modeName = (b: BreakdownBin) => MODE_NAMES[b.label as Mode] ?? b.label;
const sponsorName = (b: BreakdownBin) => SPONSOR_NAMES[b.label] ?? b.label;
const undecidedName = (b: BreakdownBin) => `${b.label} pts`;

const INDEPENDENCE_NOTE = 'Whiskers are 95% t intervals that treat polls as independent; polls of one contest share error, so they are too narrow.';

export interface AuditBreakdownsProps {
  auditId: number;
  /** The audit's elections, to name and order them. */
  elections: ElectionName[];
}

/** "Where did the error come from": every breakdown of one audit, each a chart with a table beside it. */
export function AuditBreakdowns({ auditId, elections }: AuditBreakdownsProps) {
  const breakdowns = useBreakdowns(auditId);
  if (breakdowns.isPending) return <LoadingState label="Computing the breakdowns…" />;
  if (breakdowns.isError) {
    return (
      <Alert tone="danger" title="The breakdowns could not be loaded">
        {describeError(breakdowns.error)}
      </Alert>
    );
  }
  const data = breakdowns.data;
  return (
    <div className="space-y-6">
      <Alert tone="caution" title="What the errors are measured against">
        Errors are margin errors in points: the poll’s lead of one reference option over the other minus the certified lead. A
        stated margin of error covers the sampling error of one share only; the margin carries about twice that, and the total
        error of election polls runs larger still. {data.usedPolls} polls are used by this audit.
      </Alert>
      <DaysOutFigure data={data.daysOut} />
      <CategoryBreakdownFigure
        title="Error by population"
        explanation="Mean error of the polls the audit uses by the population they sampled: likely voters, registered voters or all adults."
        note={INDEPENDENCE_NOTE}
        breakdown={data.population}
        labelHeader="Population"
        labelOf={populationName}
      />
      <CategoryBreakdownFigure
        title="Error by mode"
        explanation="Mean error by how the interviews were done (phone, online, text…)."
        note={INDEPENDENCE_NOTE}
        breakdown={data.mode}
        labelHeader="Mode"
        labelOf={modeName}
      />
      <CategoryBreakdownFigure
        title="Error by sponsor type"
        explanation="Mean error of polls paid for by a party or campaign against all others; a partisan lean shows in the signed error."
        note={INDEPENDENCE_NOTE}
        breakdown={data.sponsor}
        labelHeader="Sponsor"
        labelOf={sponsorName}
        defaultMeasure="signed"
      />
      <CategoryBreakdownFigure
        title="Error by undecided share"
        explanation="Does error grow with the share of respondents who were undecided? Mean error by the poll’s undecided share, in points."
        note={`${INDEPENDENCE_NOTE} Polls that did not publish an undecided share are left out.`}
        breakdown={data.undecided}
        labelHeader="Undecided share"
        labelOf={undecidedName}
      />
      <FunnelFigure data={data.sampleSize} />
      <QqFigure points={data.qq} />
      <ElectionsFigure rows={data.byElection} elections={elections} />
    </div>
  );
}
