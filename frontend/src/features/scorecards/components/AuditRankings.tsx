import type { AuditDto } from '@veracast/shared-types';
import { Alert, Card, LoadingState, Stat, StatGroup, buttonClasses } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import type { ScorecardFilters } from '../api/filters';
import { scorecardsCsvHref, useScorecards } from '../api/get-scorecards';
import { formatNumber, formatPercent } from '../../../lib/format';
import { RankingCaution } from './RankingCaution';
import { RANKING_COLUMN_NOTES, RankingTable } from './RankingTable';
import { RankingFilters } from './RankingFilters';

export interface AuditRankingsProps {
  audit: AuditDto;
  filters: ScorecardFilters;
  onFiltersChange: (filters: ScorecardFilters) => void;
}

/** Filters, field summary, cautions and the ranking table of one audit. */
export function AuditRankings({ audit, filters, onFiltersChange }: AuditRankingsProps) {
  const scorecards = useScorecards(audit.id, filters);
  const minPolls = filters.minPolls ?? audit.settings.minPolls;
  const field = scorecards.data?.field ?? null;
  const updating = scorecards.isFetching && scorecards.isPlaceholderData;

  return (
    <div className="space-y-6">
      <Card title="Filters" description="Choose which polls the ranking is computed from; the ranking is recomputed on those polls alone.">
        <RankingFilters
          elections={audit.elections.map((e) => ({ key: e.key, name: e.name }))}
          value={filters}
          onChange={onFiltersChange}
          auditMinPolls={audit.settings.minPolls}
          status={updating ? 'Recomputing the ranking…' : scorecards.data ? `${scorecards.data.items.length} firms listed.` : null}
        />
      </Card>

      {scorecards.isPending ? (
        <LoadingState label="Computing the ranking…" />
      ) : scorecards.isError ? (
        <Alert tone="danger" title="The ranking could not be loaded">
          {describeError(scorecards.error)}
        </Alert>
      ) : (
        <>
          {field && (
            <StatGroup columns={4}>
              <Stat label="Polls used" value={field.polls} hint={`${field.pollsters} firms, ${field.contests} contests`} />
              <Stat label="Ranked firms" value={field.ranked} hint={`at least ${field.minPolls} polls and a rival in some contest`} />
              <Stat label="Field mean abs. error" value={`${formatNumber(field.fieldMeanAbsMarginError)} pts`} hint="size of the average miss on the margin" />
              <Stat
                label="Margin interval held"
                value={formatPercent(field.fieldCoverageRate)}
                hint={`against a nominal ${formatPercent(field.nominalCoverage)} from sampling alone`}
              />
            </StatGroup>
          )}
          <RankingCaution field={field} minPolls={minPolls} />
          {field?.shrinkage.note && <Alert tone="info">{field.shrinkage.note}</Alert>}
          <Card
            title="Ranking"
            description="Ranked by excess error, shrunk toward 0 for firms with few polls. Each bar is a 95% interval on a scale shared by its column."
            actions={
              <a href={scorecardsCsvHref(audit.id, filters)} download className={buttonClasses({ variant: 'secondary', size: 'sm' })}>
                Download ranking CSV
              </a>
            }
          >
            <div aria-busy={updating || undefined} className={updating ? 'opacity-60' : undefined}>
              <RankingTable auditId={audit.id} items={scorecards.data.items} />
            </div>
          </Card>
          <Card title="What the columns measure" headingLevel={2}>
            <dl className="grid gap-x-6 gap-y-2 text-sm md:grid-cols-2">
              {RANKING_COLUMN_NOTES.map((note) => (
                <div key={note.term}>
                  <dt className="font-medium text-ink-900">{note.term}</dt>
                  <dd className="text-ink-700">{note.text}</dd>
                </div>
              ))}
            </dl>
          </Card>
        </>
      )}
    </div>
  );
}
