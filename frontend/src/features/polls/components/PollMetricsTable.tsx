import { UNDECIDED_TREATMENTS, type UndecidedTreatment } from '@veracast/shared-types';
import type { ReactNode } from 'react';
import { cn } from '../../../lib/cn';
import type { PollDetail, PollTreatmentMetrics } from '../api/get-poll';
import { fixed, signed, yesNo } from '../format';

const TREATMENT_NAMES: Record<UndecidedTreatment, string> = {
  raw: 'Raw',
  proportional: 'Proportional',
  two_party: 'Two-party',
};

type Metrics = PollTreatmentMetrics;

interface MetricRow {
  label: string;
  /** Anchor of the formula on the methods page. */
  anchor: string;
  /** What the row holds, when the formula's own line would not say it. */
  about?: string;
  /** What the cell shows for one treatment. */
  show: (m: Metrics) => ReactNode;
}

const isNumber = (value: number | null | undefined): value is number => typeof value === 'number' && Number.isFinite(value);

const interval = (range: [number, number] | null | undefined, digits = 2) =>
  range ? `${signed(range[0], digits)} to ${signed(range[1], digits)}` : null;

const INPUT_ROWS: MetricRow[] = [
  {
    label: 'Reference pair (A vs B)',
    anchor: 'reference-pair',
    show: (m) => (m.refA && m.refB ? `${m.refA} vs ${m.refB}${m.refBasis === 'top_two' ? ' (certified top two)' : m.refBasis === 'blocs' ? ' (by bloc)' : ''}` : '—'),
  },
  { label: 'Poll share of A, p_A (pts)', anchor: 'undecided-treatment', about: 'A’s share in the poll after this undecided treatment.', show: (m) => fixed(m.pollA) },
  { label: 'Poll share of B, p_B (pts)', anchor: 'undecided-treatment', about: 'B’s share in the poll after this undecided treatment.', show: (m) => fixed(m.pollB) },
  { label: 'Certified share of A, V_A (pts)', anchor: 'margin-error', about: 'A’s votes over all options’ votes (over A + B only under two-party).', show: (m) => fixed(m.resultA) },
  { label: 'Certified share of B, V_B (pts)', anchor: 'margin-error', about: 'B’s votes over all options’ votes (over A + B only under two-party).', show: (m) => fixed(m.resultB) },
  {
    label: 'Effective sample size, n_eff',
    anchor: 'effective-n',
    show: (m) =>
      m.nEff === undefined || m.nEff === null
        ? '—'
        : `${fixed(m.nEff, 0)}${m.nEffBasis === 'stated_moe' ? ' (from the stated MOE)' : m.nEffBasis === 'design_effect' ? ' (n ÷ design effect)' : ''}`,
  },
  { label: 'Undecided share (pts, as published)', anchor: 'undecided-treatment', about: 'Respondents who named no option, as the poll published them.', show: (m) => fixed(m.undecidedShare, 1) },
  {
    label: 'Days out (midpoint; end)',
    anchor: 'days-out',
    show: (m) => (m.daysOut === undefined || m.daysOut === null ? '—' : `${fixed(m.daysOut, 1)}; ${fixed(m.daysOutEnd, 0)}`),
  },
];

const METRIC_ROWS: MetricRow[] = [
  { label: 'Signed margin error (pts)', anchor: 'margin-error', show: (m) => signed(m.marginError) },
  { label: 'Absolute margin error (pts)', anchor: 'abs-margin-error', show: (m) => fixed(m.absMarginError) },
  { label: 'Lean', anchor: 'lean', show: (m) => m.lean ?? '—' },
  { label: 'Two-party share error (pts)', anchor: 'two-party-share-error', show: (m) => signed(m.twoPartyShareError) },
  {
    label: 'Mosteller’s measure 3 (pts)',
    anchor: 'mosteller-3',
    show: (m) => (
      <>
        {fixed(m.mosteller3)}
        {m.mosteller3Set && m.mosteller3Set.length > 0 && <span className="block text-xs text-ink-600">over {m.mosteller3Set.join(', ')}</span>}
      </>
    ),
  },
  { label: 'Mosteller’s measure 5 (pts)', anchor: 'mosteller-5', show: (m) => fixed(m.mosteller5) },
  {
    label: 'Predictive accuracy A',
    anchor: 'mtk-a',
    show: (m) => (
      <>
        {signed(m.mtkA, 3)}
        {m.mtkSe !== undefined && m.mtkSe !== null && (
          <span className="block text-xs text-ink-600">
            SE {fixed(m.mtkSe, 3)}
            {m.mtkZ !== undefined && m.mtkZ !== null && `, z ${signed(m.mtkZ, 2)}`}
            {m.mtkP !== undefined && m.mtkP !== null && `, p ${fixed(m.mtkP, 3)}`}
            {isNumber(m.mtkLower) && isNumber(m.mtkUpper) && `, 95% ${interval([m.mtkLower, m.mtkUpper], 3)}`}
          </span>
        )}
      </>
    ),
  },
  {
    label: 'Multi-option accuracy B; B_w',
    anchor: 'multi-option-b',
    show: (m) => (
      <>
        {fixed(m.aeB, 3)}; {fixed(m.aeBw, 3)}
        {m.aeChi2 !== undefined && m.aeChi2 !== null && (
          <span className="block text-xs text-ink-600">
            χ² {fixed(m.aeChi2, 2)}
            {m.aeDf !== undefined && m.aeDf !== null && ` on ${m.aeDf} df`}
            {m.aeChi2P !== undefined && m.aeChi2P !== null && `, p ${fixed(m.aeChi2P, 3)}`}
          </span>
        )}
      </>
    ),
  },
  { label: 'Winner called', anchor: 'winner-called', show: (m) => (m.error ? '—' : yesNo(m.winnerCalled, 'No call (tied poll)')) },
  {
    label: 'Certified share of A inside the poll’s 95% interval',
    anchor: 'coverage',
    show: (m) => (
      <>
        {yesNo(m.shareCovered)}
        {m.shareInterval && <span className="block text-xs text-ink-600">interval {fixed(m.shareInterval[0])} to {fixed(m.shareInterval[1])} pts</span>}
      </>
    ),
  },
  {
    label: 'Certified margin inside the poll’s 95% margin interval',
    anchor: 'coverage',
    show: (m) => (
      <>
        {yesNo(m.marginCovered)}
        {m.marginInterval && <span className="block text-xs text-ink-600">interval {interval(m.marginInterval)} pts</span>}
      </>
    ),
  },
];

export interface PollMetricsTableProps {
  poll: PollDetail;
  /** The treatment the reader came from (an audit's setting), marked in the table. */
  highlight?: UndecidedTreatment;
  /** What a metric measures and a link to its formula, by methods-page anchor. */
  explain: (anchor: string, about?: string) => ReactNode;
}

function Section({ title, rows, treatments, metrics, highlight, explain }: {
  title: string;
  rows: MetricRow[];
  treatments: readonly UndecidedTreatment[];
  metrics: PollDetail['metrics'];
  highlight?: UndecidedTreatment;
  explain: (anchor: string, about?: string) => ReactNode;
}) {
  return (
    <>
      <tr className="bg-ink-50">
        <th scope="colgroup" colSpan={treatments.length + 1} className="px-3 py-2 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
          {title}
        </th>
      </tr>
      {rows.map((row) => (
        <tr key={row.label}>
          <th scope="row" className="px-3 py-2 text-left align-top font-normal">
            <span className="block font-medium text-ink-900">{row.label}</span>
            <span className="block text-xs text-ink-600">{explain(row.anchor, row.about)}</span>
          </th>
          {treatments.map((t) => {
            const m = metrics[t];
            return (
              <td key={t} className={cn('px-3 py-2 text-right align-top tabular-nums', t === highlight && 'bg-accent-50')}>
                {m ? row.show(m) : '—'}
              </td>
            );
          })}
        </tr>
      ))}
    </>
  );
}

/**
 * Every metric of the poll under each undecided treatment, under the inputs it came from, each
 * with a line saying what it measures and a link to its formula.
 */
export function PollMetricsTable({ poll, highlight, explain }: PollMetricsTableProps) {
  const treatments = UNDECIDED_TREATMENTS.filter((t) => t in poll.metrics);
  // A note that holds under every treatment is said once.
  const byLine = new Map<string, UndecidedTreatment[]>();
  for (const t of treatments) {
    const m = poll.metrics[t];
    for (const line of [m?.error, ...(m?.notes ?? [])]) {
      if (line) byLine.set(line, [...(byLine.get(line) ?? []), t]);
    }
  }
  const notes = [...byLine].map(([line, where]) => ({
    line,
    where: where.length === treatments.length ? 'Every treatment' : where.map((t) => TREATMENT_NAMES[t]).join(', '),
  }));
  if (treatments.length === 0) return <p className="text-ink-600">No metrics: the contest has no result to compare with yet.</p>;
  return (
    <div className="space-y-4">
      <div className="overflow-x-auto rounded-lg border border-ink-200">
        <table className="min-w-full divide-y divide-ink-200 text-sm">
          <caption className="sr-only">Metrics of the poll and their inputs under each undecided treatment</caption>
          <thead className="bg-ink-100">
            <tr>
              <th scope="col" className="px-3 py-2 text-left font-semibold">
                Metric
              </th>
              {treatments.map((t) => (
                <th key={t} scope="col" className={cn('px-3 py-2 text-right font-semibold', t === highlight && 'bg-accent-100')}>
                  {TREATMENT_NAMES[t]}
                  {t === highlight && <span className="block text-xs font-normal">the audit’s treatment</span>}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100">
            <Section title="Inputs" rows={INPUT_ROWS} treatments={treatments} metrics={poll.metrics} highlight={highlight} explain={explain} />
            <Section title="Metrics" rows={METRIC_ROWS} treatments={treatments} metrics={poll.metrics} highlight={highlight} explain={explain} />
          </tbody>
        </table>
      </div>
      {notes.length > 0 && (
        <div className="space-y-2 text-sm">
          <h3 className="font-semibold text-ink-900">Notes</h3>
          <ul className="list-disc space-y-1 pl-5 text-ink-700">
            {notes.map(({ line, where }) => (
              <li key={line}>
                <span className="font-medium">{where}:</span> {line}
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
