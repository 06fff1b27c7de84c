import {
  DISCLOSURE_ITEMS,
  DISCLOSURE_LABELS,
  SPONSOR_TYPE_LABELS,
  type AuditDto,
  type AuditPollDto,
} from '@veracast/shared-types';
import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Alert, Card, FictionalDataLabel, LoadingState, Select, Stat, StatGroup } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDate } from '../../../utils/format';
import { useAudit } from '../api/get-audit';
import { usePollsterProfile } from '../api/get-pollster';
import { useScorecards } from '../api/get-scorecards';
import { useAuditList } from '../api/list-audits';
import { useAuditPolls } from '../api/list-audit-polls';
import type { PollsterProfile, ScorecardField, ScorecardItem } from '../api/types';
import { formatInterval, formatNumber, formatPercent, formatRank, formatSigned } from '../../../lib/format';
import { IntervalBar, sharedDomain } from './IntervalBar';

/** What a chart of the firm's errors needs; handed to `renderCharts`. */
export interface FirmChartsData {
  auditId: number;
  pollsterId: number;
  firmName: string;
  /** The audit's elections in the audit's order, with their orientation blocs. */
  elections: AuditDto['elections'];
  /** Every poll of the firm in the audit's elections (`inWindow`/`isFinal` say which were used). */
  firmPolls: AuditPollDto[];
  /** Every firm's polls that the audit uses: the field. */
  fieldPolls: AuditPollDto[];
}

export interface FirmAccuracyPanelProps {
  pollsterId: number;
  /** The audit to show; the newest when absent. */
  auditId?: number;
  /** Called when the reader picks another audit (e.g. to put it in the address). */
  onAuditChange?: (auditId: number) => void;
  /** Charts of the firm's errors against the field's, drawn by the page that mounts the panel. */
  renderCharts?: (data: FirmChartsData) => ReactNode;
}

function AccuracyStats({ item, field, auditId }: { item: ScorecardItem; field: ScorecardField | null; auditId: number }) {
  const rankLabel = item.rankInterval
    ? `Rank ${formatRank(item.rank)} of ${field?.ranked ?? '?'}, 95% interval ${formatRank(item.rankInterval[0])} to ${formatRank(item.rankInterval[1])}`
    : `Rank ${formatRank(item.rank)}`;
  const excessLabel = `Excess error ${formatSigned(item.excessErrorShrunk, 2)} points, 95% interval ${formatInterval(item.excessErrorShrunkInterval, 2)}`;
  return (
    <div className="space-y-4">
      <StatGroup columns={3}>
        <Stat
          label="Rank"
          value={
            item.ranked ? (
              <span className="flex items-center gap-3">
                {formatRank(item.rank)}
                <IntervalBar estimate={item.rank} interval={item.rankInterval} domain={[0.5, (field?.ranked ?? 1) + 0.5]} label={rankLabel} />
              </span>
            ) : (
              'Not ranked'
            )
          }
          hint={item.ranked ? `95% interval ${formatInterval(item.rankInterval, 0)} of ${field?.ranked ?? '?'} ranked firms; overlapping intervals leave the order open` : item.reason}
        />
        <Stat
          label="Excess error, shrunk"
          value={
            item.excessErrorShrunk === null ? (
              '—'
            ) : (
              <span className="flex items-center gap-3">
                {formatSigned(item.excessErrorShrunk, 2)}
                <IntervalBar
                  estimate={item.excessErrorShrunk}
                  interval={item.excessErrorShrunkInterval}
                  domain={sharedDomain([item.excessErrorShrunk], [item.excessErrorShrunkInterval], [0])}
                  reference={0}
                  label={excessLabel}
                />
              </span>
            )
          }
          hint={`points; 95% interval ${formatInterval(item.excessErrorShrunkInterval, 2)}. Below 0: smaller misses than rivals in the same contests.`}
        />
        <Stat
          label="Polls used"
          value={item.polls}
          hint={`${item.contests} contests in ${item.elections} elections`}
        />
        <Stat
          label="Mean abs. error"
          value={`${formatNumber(item.meanAbsMarginError)} pts`}
          hint={`field: ${formatNumber(field?.fieldMeanAbsMarginError)} pts. Size of the average miss on the margin.`}
        />
        <Stat
          label="Mean signed error"
          value={`${formatSigned(item.meanSignedError)} pts`}
          hint={`95% interval ${item.meanSignedErrorInterval ? formatInterval(item.meanSignedErrorInterval) : 'not available (one contest)'}; field ${formatSigned(field?.fieldMeanSignedError)}. The firm’s lean.`}
        />
        <Stat
          label="Margin interval held"
          value={formatPercent(item.coverageRate)}
          hint={`of ${item.coverageN ?? '?'} polls; sampling error alone would give about ${formatPercent(field?.nominalCoverage ?? 0.95)}.`}
        />
      </StatGroup>
      <p className="text-sm text-ink-600">
        Winner called in {formatPercent(item.winnerCalledRate)} of {item.calls} calls
        {item.noCalls > 0 ? ` (${item.noCalls} tied poll${item.noCalls === 1 ? '' : 's'} made no call)` : ''}.{' '}
        <Link to={paths.auditRankings.href(auditId)} className="font-medium text-accent-700 underline">
          See the whole ranking
        </Link>
      </p>
    </div>
  );
}

function AuditDisclosureStat({ auditId, pollsterId }: { auditId: number; pollsterId: number }) {
  const scorecards = useScorecards(auditId);
  const item = scorecards.data?.items.find((i) => i.pollsterId === pollsterId);
  return <Stat label="Polls this audit uses" value={formatPercent(item?.disclosure ?? null)} hint="average over the polls in the ranking" />;
}

function DisclosureCard({ profile, auditId }: { profile: PollsterProfile; auditId: number | undefined }) {
  const items = profile.disclosureItems ?? {};
  const known = DISCLOSURE_ITEMS.filter((key) => items[key] !== undefined);
  return (
    <Card
      title="Disclosure completeness"
      description="What the firm published about its polls. Accuracy and disclosure are separate dimensions: this never enters the rank."
    >
      <StatGroup columns={2}>
        <Stat label="All its polls" value={formatPercent(profile.disclosure)} hint={`average over ${profile.pollCount} polls in the archive`} />
        {auditId !== undefined && <AuditDisclosureStat key={auditId} auditId={auditId} pollsterId={profile.id} />}
      </StatGroup>
      {known.length > 0 && (
        <table className="mt-4 w-full max-w-xl text-sm">
          <caption className="sr-only">Share of the firm’s polls that disclose each item</caption>
          <thead>
            <tr className="border-b border-ink-200 text-left text-ink-700">
              <th scope="col" className="py-1.5 font-semibold">Item</th>
              <th scope="col" className="py-1.5 text-right font-semibold">Polls that disclose it</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100">
            {known.map((key) => (
              <tr key={key}>
                <th scope="row" className="py-1.5 text-left font-normal text-ink-800">{DISCLOSURE_LABELS[key]}</th>
                <td className="py-1.5 text-right tabular-nums">{formatPercent(items[key] ?? null)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </Card>
  );
}

function NamesCard({ profile }: { profile: PollsterProfile }) {
  return (
    <Card title="Names and sponsors" description="Imports with any of these names are matched to this firm.">
      <div className="grid gap-6 md:grid-cols-2">
        <div>
          <h3 className="text-sm font-semibold text-ink-900">Aliases</h3>
          {profile.aliases.length ? (
            <ul className="mt-1 list-disc pl-5 text-sm text-ink-800">
              {profile.aliases.map((alias) => (
                <li key={alias}>{alias}</li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 text-sm text-ink-600">No other names on record.</p>
          )}
        </div>
        <div>
          <h3 className="text-sm font-semibold text-ink-900">Sponsors</h3>
          {profile.sponsors.length ? (
            <ul className="mt-1 space-y-0.5 text-sm text-ink-800">
              {profile.sponsors.map((sponsor) => (
                <li key={`${sponsor.name}-${sponsor.type}`}>
                  {sponsor.name} <span className="text-ink-500">({SPONSOR_TYPE_LABELS[sponsor.type] ?? sponsor.type})</span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 text-sm text-ink-600">No sponsor named on its polls.</p>
          )}
        </div>
      </div>
    </Card>
  );
}

function AuditAccuracy({ auditId, pollsterId, renderCharts, firmName }: { auditId: number; pollsterId: number; firmName: string; renderCharts?: FirmAccuracyPanelProps['renderCharts'] }) {
  const audit = useAudit(auditId);
  const scorecards = useScorecards(auditId);
  const firmPolls = useAuditPolls({ auditId, pollster: pollsterId });
  const fieldPolls = useAuditPolls({ auditId, used: true });

  if (audit.isError) return <Alert tone="danger" title="The audit could not be loaded">{describeError(audit.error)}</Alert>;
  if (audit.isPending) return <LoadingState label="Loading the audit…" />;
  const item = scorecards.data?.items.find((i) => i.pollsterId === pollsterId);

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3 text-sm text-ink-600">
        {audit.data.fictional && <FictionalDataLabel />}
        <span>
          Audit of {audit.data.elections.map((e) => e.name).join(', ')}; {audit.data.settings.windowDays}-day window,{' '}
          {audit.data.settings.finalOnly ? 'each firm’s final poll per contest' : 'every poll in the window'}.
        </span>
      </div>
      {audit.data.outOfDate && (
        <Alert tone="caution" title="This audit is out of date">
          The data changed after it was computed; a new audit would give different numbers.
        </Alert>
      )}
      <Card title="Accuracy in this audit" description="Every figure with its uncertainty; points are percentage points of the margin between the two reference options.">
        {scorecards.isPending ? (
          <LoadingState label="Loading the scorecard…" />
        ) : scorecards.isError ? (
          <Alert tone="danger">{describeError(scorecards.error)}</Alert>
        ) : item ? (
          <AccuracyStats item={item} field={scorecards.data.field} auditId={auditId} />
        ) : (
          <p className="text-ink-700">This firm has no polls that this audit uses.</p>
        )}
      </Card>
      {renderCharts &&
        (firmPolls.isError || fieldPolls.isError ? (
          <Alert tone="danger" title="The polls could not be loaded">{describeError(firmPolls.error ?? fieldPolls.error)}</Alert>
        ) : firmPolls.isPending || fieldPolls.isPending ? (
          <LoadingState label="Loading the firm’s polls…" />
        ) : (
          renderCharts({
            auditId,
            pollsterId,
            firmName,
            elections: audit.data.elections,
            firmPolls: firmPolls.data.items,
            fieldPolls: fieldPolls.data.items,
          })
        ))}
    </div>
  );
}

/**
 * A firm's record in one audit: its scorecard against the field, charts of its errors (drawn by
 * `renderCharts`), its disclosure completeness, and its aliases and sponsors.
 */
export function FirmAccuracyPanel({ pollsterId, auditId, onAuditChange, renderCharts }: FirmAccuracyPanelProps) {
  const audits = useAuditList();
  const profile = usePollsterProfile(pollsterId);
  const [chosen, setChosen] = useState<number | undefined>(undefined);
  const current = auditId ?? chosen ?? audits.data?.items[0]?.id;
  const firmName = profile.data?.name ?? `Pollster ${pollsterId}`;

  return (
    <div className="space-y-6">
      {audits.isError ? (
        <Alert tone="danger" title="The audits could not be loaded">{describeError(audits.error)}</Alert>
      ) : audits.isPending ? (
        <LoadingState label="Loading audits…" />
      ) : audits.data.items.length === 0 ? (
        <Alert tone="info" title="No audits yet">An analyst creates an audit on the Audits page; a firm’s accuracy is measured within one.</Alert>
      ) : (
        <Select
          label="Audit"
          fieldClassName="max-w-md"
          value={current ?? ''}
          onChange={(event) => {
            const id = Number(event.target.value);
            setChosen(id);
            onAuditChange?.(id);
          }}
        >
          {audits.data.items.map((a) => (
            <option key={a.id} value={a.id}>
              {a.name} ({formatDate(a.createdAt)})
            </option>
          ))}
        </Select>
      )}
      {current !== undefined && <AuditAccuracy key={current} auditId={current} pollsterId={pollsterId} firmName={firmName} renderCharts={renderCharts} />}
      {profile.isError ? (
        <Alert tone="danger" title="The firm’s profile could not be loaded">{describeError(profile.error)}</Alert>
      ) : profile.isPending ? (
        <LoadingState label="Loading the firm…" />
      ) : (
        <div className="grid gap-6 lg:grid-cols-2">
          <DisclosureCard profile={profile.data} auditId={current} />
          <NamesCard profile={profile.data} />
        </div>
      )}
    </div>
  );
}
