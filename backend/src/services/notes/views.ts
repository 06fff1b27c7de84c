import katex from 'katex';
import { PARTISAN_SPONSOR_TYPES, type AuditPollDto } from '@veracast/shared-types';
import { auditBreakdowns } from '../../commands/audits/breakdowns';
import { usedPolls } from '../../commands/audits/compute';
import type { Breakdown } from '../../analysis/ranking';
import type { AuditSnapshot } from './audit-data';
import type { BlockSpec } from './blocks';
import { intervalChartSvg } from './chart';
import { escapeHtml as h, interval, isoDate, num, pct, pts, pValue, signedPts, yesNo } from './format';
import { METHOD_ENTRIES, UNDECIDED_EXPLANATIONS } from './methods-catalogue';

export interface ViewContext {
  audits: ReadonlyMap<number, AuditSnapshot>;
  /** Every audit the note's blocks name, in order of first mention (for the methods view). */
  cited: readonly number[];
  /** Show an "out of date" caution inside blocks whose audit's data changed (editor preview). */
  markOutOfDate: boolean;
}

export class BlockError extends Error {}

/** Headline metrics: audit-wide (stored headline) or, with `election:`, that election's stored shared-error analysis. */
export const HEADLINE_METRICS = ['meanAbsMarginError', 'meanSignedError', 'marginCoverage', 'shareCoverage', 'winnerCalledRate', 'pollsUsed'] as const;
export const ELECTION_HEADLINE_METRICS = ['meanSignedError', 'clusteredSe', 'icc', 'polls', 'contests'] as const;
export const BREAKDOWN_KEYS = ['days-out', 'population', 'mode', 'sponsor', 'undecided', 'sample-size'] as const;

const table = (caption: string, head: readonly string[], rows: readonly (readonly string[])[], numericFrom = 1) =>
  `<table><caption>${h(caption)}</caption><thead><tr>${head.map((c, i) => `<th${i >= numericFrom ? ' class="vc-num"' : ''}>${h(c)}</th>`).join('')}</tr></thead>` +
  `<tbody>${rows.map((r) => `<tr>${r.map((c, i) => `<td${i >= numericFrom ? ' class="vc-num"' : ''}>${h(c)}</td>`).join('')}</tr>`).join('')}</tbody></table>`;

const source = (a: AuditSnapshot) =>
  `<p class="vc-source">Source: audit #${a.id} “${h(a.name)}”, computed ${isoDate(a.createdAt)}, data hash <code>${h(a.dataHash)}</code>.</p>`;

const fictionalLabel = (a: AuditSnapshot) => (a.elections.some((e) => e.fictional) ? '<p class="vc-fictional"><strong>Fictional demo data.</strong></p>' : '');

function figure(kind: string, title: string, a: AuditSnapshot, body: string, ctx: ViewContext): string {
  const stale = ctx.markOutOfDate && a.currentHash !== null && a.currentHash !== a.dataHash
    ? `<p class="vc-out-of-date"><strong>Out of date:</strong> the archive changed after audit #${a.id} was computed (stored hash <code>${h(a.dataHash.slice(0, 12))}</code>, now <code>${h(a.currentHash.slice(0, 12))}</code>). The figures below are the audit’s stored numbers; cite a re-run to show current data.</p>`
    : '';
  return `<figure class="vc-block vc-block-${kind}"><figcaption>${h(title)}</figcaption>${stale}${fictionalLabel(a)}${body}${source(a)}</figure>`;
}

function pickElection(a: AuditSnapshot, wanted: string | null): string {
  if (wanted) {
    if (!a.settings.electionKeys.includes(wanted)) throw new BlockError(`audit #${a.id} does not cover election "${wanted}"; it covers ${a.settings.electionKeys.join(', ')}`);
    return wanted;
  }
  if (a.settings.electionKeys.length > 1) throw new BlockError(`audit #${a.id} covers several elections; add "election: <key>" (one of ${a.settings.electionKeys.join(', ')})`);
  return a.settings.electionKeys[0]!;
}

function headlineView(spec: BlockSpec, a: AuditSnapshot, ctx: ViewContext): string {
  const metric = spec.metric ?? 'meanAbsMarginError';
  let value: string;
  let text: string;
  if (spec.election) {
    const key = pickElection(a, spec.election);
    const se = a.sharedError[key];
    if (!se) throw new BlockError(`audit #${a.id} stored no shared-error analysis for "${key}"`);
    switch (metric) {
      case 'meanSignedError': value = `${signedPts(se.meanSignedError)} pts`; text = `mean signed margin error in ${key}, 95% interval ${interval(se.ciLow !== null && se.ciHigh !== null ? [se.ciLow, se.ciHigh] : null)} pts (contests as clusters), over ${se.polls} polls`; break;
      case 'clusteredSe': value = `${pts(se.clusteredSe)} pts`; text = `standard error of the mean signed error in ${key}, clustered by contest`; break;
      case 'icc': value = num(se.icc, 2); text = `intraclass correlation of poll errors within contests in ${key}`; break;
      case 'polls': value = String(se.polls); text = `polls analysed for shared error in ${key}`; break;
      case 'contests': value = String(se.contests); text = `contests analysed for shared error in ${key}`; break;
      default: throw new BlockError(`unknown metric "${metric}" for an election headline; use one of ${ELECTION_HEADLINE_METRICS.join(', ')}`);
    }
  } else {
    const hl = a.headline;
    switch (metric) {
      case 'meanAbsMarginError': value = `${pts(hl.meanAbsMarginError)} pts`; text = `mean absolute margin error over ${hl.pollsUsed} polls`; break;
      case 'meanSignedError': value = `${signedPts(hl.meanSignedError)} pts`; text = `mean signed margin error${hl.signedDirection ? ` (${hl.signedDirection})` : ''}, 95% interval ${interval(hl.meanSignedErrorInterval)} pts, over ${hl.pollsUsed} polls`; break;
      case 'marginCoverage': value = pct(hl.marginCoverage); text = 'of polls whose 95% interval for the margin held the certified margin (nominal 95%)'; break;
      case 'shareCoverage': value = pct(hl.shareCoverage); text = 'of polls whose stated interval held the certified share (nominal 95%)'; break;
      case 'winnerCalledRate': value = pct(hl.winnerCalledRate); text = `of ${hl.calls} polls with a leader named the certified winner (${hl.noCalls} tied polls are no call)`; break;
      case 'pollsUsed': value = String(hl.pollsUsed); text = `polls used of ${hl.pollsTotal} in the audit’s elections`; break;
      default: throw new BlockError(`unknown metric "${metric}"; use one of ${HEADLINE_METRICS.join(', ')}, or with "election:" one of ${ELECTION_HEADLINE_METRICS.join(', ')}`);
    }
  }
  return figure('headline', `Headline figure — audit #${a.id}`, a, `<p class="vc-headline"><strong class="vc-figure">${h(value)}</strong> <span>${h(text)}</span></p>`, ctx);
}

function pollsView(spec: BlockSpec, a: AuditSnapshot, ctx: ViewContext): string {
  let polls: AuditPollDto[] = usedPolls(a.polls ?? [], a.settings);
  if (spec.election) polls = polls.filter((p) => p.electionKey === pickElection(a, spec.election));
  const limit = spec.limit ?? 50;
  const shown = polls.slice(0, limit);
  const rows = shown.map((p) => [
    p.pollKey, p.pollster, p.contestKey, p.fieldworkEnd, String(p.sampleSize), signedPts(p.marginError), pts(p.absMarginError),
    p.mtkA === null ? '—' : `${num(p.mtkA)} ± ${num(p.mtkSe === null ? null : 1.959964 * p.mtkSe)}`, yesNo(p.winnerCalled), yesNo(p.marginCovered), p.daysOut === null ? '—' : String(p.daysOut),
  ]);
  const note = `<p class="vc-note-line">${shown.length} of ${polls.length} polls the audit uses (in the ${a.settings.windowDays}-day window${a.settings.finalOnly ? ', each firm’s final poll per contest' : ''}). Errors in points; A is Martin–Traugott–Kennedy’s accuracy with its 95% half-width.</p>`;
  return figure('polls', `Per-poll errors — audit #${a.id}`, a,
    note + table('Per-poll errors', ['Poll', 'Pollster', 'Contest', 'Fieldwork end', 'n', 'Margin error', '|Error|', 'A ± 95%', 'Winner called', 'Margin covered', 'Days out'], rows, 4), ctx);
}

function scorecardView(_spec: BlockSpec, a: AuditSnapshot, ctx: ViewContext): string {
  const items = [...(a.scorecards?.items ?? [])].sort((x, y) => (x.rank ?? Infinity) - (y.rank ?? Infinity) || x.pollster.localeCompare(y.pollster));
  if (!items.length) throw new BlockError(`audit #${a.id} stored no scorecards (no poll was usable)`);
  const rows = items.map((s) => [
    s.pollster, String(s.polls), String(s.contests), pts(s.meanAbsMarginError), `${signedPts(s.meanSignedError)} (${interval(s.meanSignedErrorInterval)})`, pts(s.rmse),
    pct(s.winnerCalledRate), pct(s.coverageRate), `${signedPts(s.excessErrorShrunk)} (${interval(s.excessErrorShrunkInterval ?? s.excessErrorInterval)})`,
    s.ranked && s.rank !== null ? `${num(s.rank, 1)} (${s.rankInterval ? `${s.rankInterval[0]}–${s.rankInterval[1]}` : '—'})` : `not ranked${s.reason ? `: ${s.reason}` : ''}`,
  ]);
  const chart = intervalChartSvg(
    items.map((s) => ({ label: s.pollster, value: s.excessErrorShrunk, lo: (s.excessErrorShrunkInterval ?? s.excessErrorInterval)?.[0] ?? null, hi: (s.excessErrorShrunkInterval ?? s.excessErrorInterval)?.[1] ?? null })),
    { label: `Contest-adjusted excess error by pollster, audit ${a.id}`, axisLabel: 'Excess absolute margin error, points (below 0: more accurate than rivals)' },
  );
  const explain = `<p class="vc-note-line">The chart shows each firm’s contest-adjusted excess error, shrunk toward zero for firms with few polls, with its 95% bootstrap interval; the table below carries the same figures. Firms with fewer than ${a.settings.minPolls} polls are not ranked. Ranks come with their intervals: overlapping intervals mean the order is not settled.</p>`;
  return figure('scorecard', `Pollster scorecards — audit #${a.id}`, a,
    explain + chart + table('Pollster scorecards', ['Pollster', 'Polls', 'Contests', 'Mean |error|', 'Mean signed (95%)', 'RMSE', 'Winner called', 'Coverage', 'Excess, shrunk (95%)', 'Rank (interval)'], rows), ctx);
}

function breakdownView(spec: BlockSpec, a: AuditSnapshot, ctx: ViewContext): string {
  const by = spec.by ?? 'days-out';
  if (!(BREAKDOWN_KEYS as readonly string[]).includes(by)) throw new BlockError(`unknown breakdown "${by}"; use one of ${BREAKDOWN_KEYS.join(', ')}`);
  const b = auditBreakdowns(a.polls ?? [], a.settings, [...PARTISAN_SPONSOR_TYPES]);
  const pick: Record<string, Breakdown | null> = {
    'days-out': b.daysOut.bins, population: b.population, mode: b.mode, sponsor: b.sponsor, undecided: b.undecided, 'sample-size': b.sampleSize.bins,
  };
  const bd = pick[by];
  if (!bd) throw new BlockError(`audit #${a.id} has too few usable polls for a breakdown by ${by}`);
  const bins = bd.bins.filter((x) => x.n > 0);
  const label = by.replace('-', ' ');
  const chart = intervalChartSvg(bins.map((x) => ({ label: `${x.label} (n=${x.n})`, value: x.meanSigned, lo: x.lo, hi: x.hi })), {
    label: `Mean signed margin error by ${label}, audit ${a.id}`, axisLabel: 'Mean signed margin error, points (95% t interval)',
  });
  const rows = bins.map((x) => [x.label, String(x.n), pts(x.meanAbs), signedPts(x.meanSigned), interval(x.lo !== null && x.hi !== null ? [x.lo, x.hi] : null)]);
  const explain = `<p class="vc-note-line">Mean signed margin error of the polls in each group, with a 95% t interval; ${by === 'days-out' ? 'every computable poll is included, to show late movement' : 'over the polls the audit uses'}${bd.excluded ? `; ${bd.excluded} poll(s) fell in no group` : ''}.</p>`;
  return figure('breakdown', `Error by ${label} — audit #${a.id}`, a, explain + chart + table(`Error by ${label}`, [label[0]!.toUpperCase() + label.slice(1), 'Polls', 'Mean |error|', 'Mean signed', '95% interval'], rows), ctx);
}

function sharedErrorView(spec: BlockSpec, a: AuditSnapshot, ctx: ViewContext): string {
  const key = pickElection(a, spec.election);
  const se = a.sharedError[key];
  if (!se) throw new BlockError(`audit #${a.id} stored no shared-error analysis for "${key}"`);
  const summary = table(`Shared error in ${key}`, ['Measure', 'Value'], [
    ['Polls / contests', `${se.polls} / ${se.contests}`],
    ['Mean signed margin error (pts)', signedPts(se.meanSignedError)],
    ['95% interval, contests as clusters (pts)', interval(se.ciLow !== null && se.ciHigh !== null ? [se.ciLow, se.ciHigh] : null)],
    ['Clustered standard error (pts)', pts(se.clusteredSe)],
    ['t (df), p', se.t === null ? '—' : `${num(se.t, 2)} (${se.df ?? '—'}), p ${pValue(se.p)}`],
    ['Intraclass correlation within contests', num(se.icc, 2)],
    ['Shapiro–Wilk W, p (normality of errors)', se.shapiroW === null ? '—' : `${num(se.shapiroW)}, p ${pValue(se.shapiroP)}`],
  ]);
  const detail = se.contestsDetail.length
    ? table('Per contest: the miss of the poll average and the interval it should have carried', ['Contest', 'Polls', 'Mean error', 'Naive SE', 'Adjusted SE', 'Effective polls'],
      se.contestsDetail.map((c) => [c.contestKey, String(c.k), signedPts(c.meanError), pts(c.naiveSe), pts(c.adjustedSe), num(c.nEff, 1)]))
    : '';
  const warnings = se.warnings?.length ? `<ul class="vc-warnings">${se.warnings.map((w) => `<li>${h(w)}</li>`).join('')}</ul>` : '';
  return figure('shared-error', `Shared error — ${key}, audit #${a.id}`, a, summary + detail + warnings, ctx);
}

const tex = (source: string) => katex.renderToString(source, { throwOnError: false, displayMode: false, output: 'htmlAndMathml', strict: 'ignore' });

function methodsView(spec: BlockSpec, ctx: ViewContext): string {
  const ids = spec.audit !== null ? [spec.audit] : ctx.cited;
  const audits = ids.map((id) => ctx.audits.get(id)).filter((a): a is AuditSnapshot => a !== undefined);
  if (!audits.length) throw new BlockError(spec.audit !== null ? `audit #${spec.audit} does not exist` : 'the note cites no audit yet: add a block with "audit: <number>"');
  const settings = table('Settings and data of the cited audits', ['Audit', 'Elections', 'Window', 'Final poll only', 'Undecided', 'Min. polls to rank', 'Design effect', 'Computed', 'Core version', 'Data hash'],
    audits.map((a) => [`#${a.id} ${a.name}`, a.settings.electionKeys.join(', '), `${a.settings.windowDays} days`, yesNo(a.settings.finalOnly), UNDECIDED_EXPLANATIONS[a.settings.undecided],
      String(a.settings.minPolls), String(a.settings.designEffect), isoDate(a.createdAt), a.coreVersion, a.dataHash]), 99);
  const formulas = `<dl class="vc-methods">${METHOD_ENTRIES.map((m) => `<dt>${h(m.name)}</dt><dd><span class="vc-formula">${tex(m.tex)}</span> ${h(m.explanation)} <cite>${h(m.source)}</cite></dd>`).join('')}</dl>`;
  const stale = ctx.markOutOfDate ? audits.filter((a) => a.currentHash !== null && a.currentHash !== a.dataHash) : [];
  const staleNote = stale.length ? `<p class="vc-out-of-date"><strong>Out of date:</strong> the archive changed after audit${stale.length > 1 ? 's' : ''} ${stale.map((a) => `#${a.id}`).join(', ')} ${stale.length > 1 ? 'were' : 'was'} computed.</p>` : '';
  const fictional = audits.some((a) => a.elections.some((e) => e.fictional)) ? '<p class="vc-fictional"><strong>Fictional demo data.</strong></p>' : '';
  return `<section class="vc-block vc-block-methods"><h2>Methods appendix</h2>${staleNote}${fictional}${settings}<h3>Formulas and sources</h3>${formulas}</section>`;
}

/** Renders one block from stored audit data; a problem becomes a visible error box, never a crash. */
export function renderBlock(spec: BlockSpec, ctx: ViewContext): { html: string; error: string | null } {
  try {
    if (spec.view === 'methods') return { html: methodsView(spec, ctx), error: null };
    const a = ctx.audits.get(spec.audit!);
    if (!a) throw new BlockError(`audit #${spec.audit} does not exist`);
    const html = {
      headline: headlineView, polls: pollsView, scorecard: scorecardView, breakdown: breakdownView, 'shared-error': sharedErrorView,
    }[spec.view](spec, a, ctx);
    return { html, error: null };
  } catch (err) {
    if (!(err instanceof BlockError)) throw err;
    return { html: blockErrorHtml(err.message), error: err.message };
  }
}

export const blockErrorHtml = (message: string) => `<div class="vc-block-error" role="note"><strong>Block not shown:</strong> ${h(message)}</div>`;
