import type { AuditHeadline as Headline } from '@veracast/shared-types';
import type { ReactNode } from 'react';
import { formatCount, formatPoints, formatRate, formatSignedPoints } from '../format';
import { METHOD_ANCHORS, type MethodAnchor } from '../method-catalogue';
import { FormulaLink } from './FormulaLink';

function Figure({ label, value, detail, explanation, anchor }: { label: string; value: ReactNode; detail?: ReactNode; explanation: ReactNode; anchor: MethodAnchor }) {
  return (
    <div className="flex flex-col rounded-lg border border-ink-200 bg-white px-4 py-3">
      <dt className="text-xs font-medium tracking-wide text-ink-500 uppercase">{label}</dt>
      <dd className="mt-1 text-2xl font-semibold text-ink-900 tabular-nums">{value}</dd>
      {detail && <dd className="mt-0.5 text-sm text-ink-700">{detail}</dd>}
      <dd className="mt-2 text-sm text-ink-600">
        {explanation} <FormulaLink anchor={anchor} />
      </dd>
    </div>
  );
}

export interface AuditHeadlineProps {
  headline: Headline;
  finalOnly: boolean;
  windowDays: number;
}

/** The audit's headline figures, each with what it measures and a link to its formula. */
export function AuditHeadline({ headline: h, finalOnly, windowDays }: AuditHeadlineProps) {
  const interval = h.meanSignedErrorInterval;
  return (
    <dl className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
      <Figure
        label="Polls used"
        value={
          <>
            {formatCount(h.pollsUsed)} <span className="text-base font-normal text-ink-600">of {formatCount(h.pollsTotal)}</span>
          </>
        }
        detail={h.notComputable > 0 ? `${formatCount(h.notComputable)} could not be scored (see the table’s notes).` : undefined}
        explanation={`Polls whose fieldwork ended 0–${windowDays} days before election day${finalOnly ? ', each firm’s final poll per contest,' : ''} with a certified result to compare.`}
        anchor={METHOD_ANCHORS.window}
      />
      <Figure
        label="Mean absolute margin error"
        value={`${formatPoints(h.meanAbsMarginError)} pts`}
        explanation="The average size of the miss on the lead of A over B, whichever side it favoured."
        anchor={METHOD_ANCHORS.absMarginError}
      />
      <Figure
        label="Mean signed error"
        value={`${formatSignedPoints(h.meanSignedError)} pts`}
        detail={
          <>
            {interval ? `95% interval ${formatSignedPoints(interval[0])} to ${formatSignedPoints(interval[1])} pts (contests as clusters)` : 'No interval: it needs polls from at least two contests.'}
            {h.signedDirection && (
              <>
                <br />
                Direction: {h.signedDirection}.
              </>
            )}
          </>
        }
        explanation="Whether the polls as a group leaned to one bloc; positive means bloc A was overstated."
        anchor={METHOD_ANCHORS.meanSignedError}
      />
      <Figure
        label="Margin interval coverage"
        value={formatRate(h.marginCoverage)}
        detail={`Nominal 95%. Share interval coverage: ${formatRate(h.shareCoverage)}.`}
        explanation="How often the poll’s own 95% interval for the margin held the certified margin; about 95% under sampling error alone."
        anchor={METHOD_ANCHORS.coverage}
      />
      <Figure
        label="Winner called"
        value={formatRate(h.winnerCalledRate)}
        detail={`${formatCount(h.calls)} polls with a leader; ${formatCount(h.noCalls)} tied (no call), left out of the rate.`}
        explanation="How often the poll’s leader was the certified winner. A poll is not a forecast."
        anchor={METHOD_ANCHORS.winnerCalled}
      />
    </dl>
  );
}
