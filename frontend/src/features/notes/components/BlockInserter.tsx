import { NOTE_BLOCK_VIEWS, type NoteBlockView } from '@veracast/shared-types';
import { useState } from 'react';
import { Alert, Button, Select } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { useAuditChoices } from '../api/list-audit-choices';

const VIEW_LABELS: Record<NoteBlockView, string> = {
  headline: 'Headline figure',
  polls: 'Per-poll table',
  scorecard: 'Pollster scorecards (chart and table)',
  breakdown: 'Error breakdown (chart and table)',
  'shared-error': 'Shared-error summary',
  methods: 'Methods appendix (all cited audits)',
};
const METRICS = ['meanAbsMarginError', 'meanSignedError', 'marginCoverage', 'shareCoverage', 'winnerCalledRate', 'pollsUsed'] as const;
const BREAKDOWNS = ['days-out', 'population', 'mode', 'sponsor', 'undecided', 'sample-size'] as const;

/** Writes the text of a live block (the fenced `veracast` syntax the server renders). */
export function blockText(view: NoteBlockView, options: { audit?: number | null; election?: string; metric?: string; by?: string }): string {
  const lines = ['```veracast'];
  if (options.audit) lines.push(`audit: ${options.audit}`);
  lines.push(`view: ${view}`);
  if (options.election) lines.push(`election: ${options.election}`);
  if (view === 'headline' && options.metric) lines.push(`metric: ${options.metric}`);
  if (view === 'breakdown' && options.by) lines.push(`by: ${options.by}`);
  lines.push('```');
  return `\n${lines.join('\n')}\n`;
}

/** Lists the audits and views; inserts a block at the cursor. */
export function BlockInserter({ onInsert }: { onInsert: (text: string) => void }) {
  const audits = useAuditChoices();
  const [auditId, setAuditId] = useState<number | null>(null);
  const [view, setView] = useState<NoteBlockView>('headline');
  const [election, setElection] = useState('');
  const [metric, setMetric] = useState<string>('meanAbsMarginError');
  const [by, setBy] = useState<string>('days-out');
  const audit = audits.data?.items.find((a) => a.id === auditId) ?? null;
  const needsElection = view === 'shared-error' && (audit?.settings.electionKeys.length ?? 0) > 1;

  if (audits.isError) return <Alert tone="danger">{describeError(audits.error)}</Alert>;
  return (
    <fieldset className="space-y-3 rounded-lg border border-ink-200 bg-white p-4">
      <legend className="px-1 text-sm font-semibold text-ink-900">Insert a live block</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <Select label="Audit" value={auditId ?? ''} onChange={(e) => { setAuditId(e.target.value ? Number(e.target.value) : null); setElection(''); }} disabled={audits.isPending}>
          <option value="">{audits.isPending ? 'Loading audits…' : 'Choose an audit'}</option>
          {audits.data?.items.map((a) => (
            <option key={a.id} value={a.id}>
              #{a.id} {a.name}
            </option>
          ))}
        </Select>
        <Select label="View" value={view} onChange={(e) => setView(e.target.value as NoteBlockView)}>
          {NOTE_BLOCK_VIEWS.map((v) => (
            <option key={v} value={v}>
              {VIEW_LABELS[v]}
            </option>
          ))}
        </Select>
        {audit && ['polls', 'shared-error', 'headline'].includes(view) && audit.settings.electionKeys.length > 0 && (
          <Select label={needsElection ? 'Election' : 'Election (optional)'} value={election} onChange={(e) => setElection(e.target.value)}>
            <option value="">{needsElection ? 'Choose an election' : 'All of the audit’s elections'}</option>
            {audit.settings.electionKeys.map((k) => (
              <option key={k} value={k}>
                {k}
              </option>
            ))}
          </Select>
        )}
        {view === 'headline' && !election && (
          <Select label="Figure" value={metric} onChange={(e) => setMetric(e.target.value)}>
            {METRICS.map((m) => (
              <option key={m} value={m}>
                {m}
              </option>
            ))}
          </Select>
        )}
        {view === 'breakdown' && (
          <Select label="Break down by" value={by} onChange={(e) => setBy(e.target.value)}>
            {BREAKDOWNS.map((b) => (
              <option key={b} value={b}>
                {b}
              </option>
            ))}
          </Select>
        )}
      </div>
      <Button
        variant="secondary"
        size="sm"
        disabled={(view !== 'methods' && !auditId) || (needsElection && !election)}
        onClick={() => onInsert(blockText(view, { audit: auditId, election: election || undefined, metric: view === 'headline' && !election ? metric : undefined, by }))}
      >
        Insert block
      </Button>
    </fieldset>
  );
}
