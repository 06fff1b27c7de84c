import type { AuditHeadline, AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { computePollMetrics, preparePollContest, type PollContestInput } from '../../analysis/metrics';
import { MetricInputError } from '../../analysis/errors';
import { clusteredMean, computeScorecards, type ScorecardPoll } from '../../analysis/ranking';
import { computeSharedError, type SharedErrorPoll } from '../../analysis/shared-error';
import { disclosureCompleteness, orientationOf, type ContestRow, type ElectionRow, type PollRow } from '../../queries/archive';
import type { AuditInputs } from './inputs';

const mean = (xs: readonly number[]) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : null);
const rate = (xs: readonly (boolean | null)[]) => {
  const known = xs.filter((x): x is boolean => x !== null);
  return known.length ? known.filter(Boolean).length / known.length : null;
};

/** Options of {@link computeAuditPolls}. */
export interface AuditPollOptions {
  /**
   * Also compute each poll's `detail` (the rest of the per-poll metrics, for a poll's own page).
   * Default true; audits store no detail (their poll rows keep only the AuditPollDto fields).
   */
  detail?: boolean;
}

/** What every poll of one contest shares: keys, window, and the contest as the metrics read it. */
interface ContestContext {
  contestKey: string;
  electionKey: string;
  electionDate: string;
  windowStart: string;
  hasResult: boolean;
  metricsContest: Parameters<typeof computePollMetrics>[1];
}

/**
 * The contest prepared once for all its polls; a contest the core refuses stays as it is, so that
 * each of its polls fails with the core's own message.
 */
function prepared(contest: PollContestInput): PollContestInput {
  try {
    return preparePollContest(contest);
  } catch (err) {
    if (err instanceof MetricInputError) return contest;
    throw err;
  }
}

/** Every poll of the audit's elections with its metrics and the inWindow / isFinal flags. */
export function computeAuditPolls(inputs: AuditInputs, settings: AuditSettings, options: AuditPollOptions = {}): AuditPollDto[] {
  const withDetail = options.detail ?? true;
  const electionById = new Map(inputs.elections.map((e) => [e.id, e]));
  const orientation = new Map(inputs.elections.map((e) => [e.id, orientationOf(e, inputs.contests)]));
  const windowStart = new Map(inputs.elections.map((e) => [e.id, shiftDays(e.date, -settings.windowDays)]));
  const contexts = new Map<number, ContestContext>();
  for (const contest of inputs.contests) {
    const election = electionById.get(contest.electionId);
    if (!election) continue;
    const o = orientation.get(election.id)!;
    contexts.set(contest.id, {
      contestKey: contest.key, electionKey: election.key, electionDate: election.date, windowStart: windowStart.get(election.id)!,
      hasResult: contest.options.some((x) => (x.votes ?? 0) > 0),
      metricsContest: prepared({
        options: contest.options.map((x) => ({ key: x.key, bloc: x.bloc, votes: x.votes ?? 0 })),
        orientation: o.blocA && o.blocB ? [o.blocA, o.blocB] : null, electionDate: election.date,
      }),
    });
  }
  const metricSettings = { undecided: settings.undecided, designEffect: settings.designEffect };
  const items: AuditPollDto[] = new Array<AuditPollDto>(inputs.polls.length);
  for (let n = 0; n < inputs.polls.length; n++) {
    const p = inputs.polls[n]!;
    const c = contexts.get(p.contestId)!;
    const inWindow = p.fieldworkEnd >= c.windowStart && p.fieldworkEnd <= c.electionDate;
    const disclosure = disclosureCompleteness(p);
    if (!c.hasResult) {
      items[n] = failedItem(p, c, inWindow, disclosure, `contest ${c.contestKey} has no result yet`, withDetail);
      continue;
    }
    try {
      const m = computePollMetrics(
        { n: p.sampleSize, moe: p.moe, fieldworkStart: p.fieldworkStart, fieldworkEnd: p.fieldworkEnd, shares: p.shares },
        c.metricsContest,
        metricSettings,
      );
      // One object literal, fields always in this order: every item has the same shape.
      const item: AuditPollDto = {
        pollKey: p.key, contestKey: c.contestKey, electionKey: c.electionKey, pollsterId: p.pollsterId, pollster: p.pollster,
        inWindow, isFinal: false, fieldworkEnd: p.fieldworkEnd, sampleSize: p.sampleSize, population: p.population, mode: p.mode,
        sponsorType: p.sponsorType, disclosure,
        refA: m.refA, refB: m.refB, refBasis: m.refBasis, marginError: m.marginError, absMarginError: m.absMarginError, lean: m.lean,
        mosteller3: m.mosteller3, mosteller5: m.mosteller5, mtkA: m.mtkA, mtkSe: m.mtkSe, mtkP: m.mtkP, aeB: m.aeB, aeBw: m.aeBw,
        winnerCalled: m.winnerCalled, shareCovered: m.shareCovered, marginCovered: m.marginCovered, daysOut: m.daysOut, daysOutEnd: m.daysOutEnd,
        undecidedShare: m.undecidedShare, twoPartyShareError: m.twoPartyShareError, nEff: m.nEff, pollA: m.pollA, pollB: m.pollB,
        resultA: m.resultA, resultB: m.resultB, notes: m.notes, error: null,
      };
      if (withDetail) {
        item.detail = {
          treatment: m.treatment, winner: m.winner, runnerUp: m.runnerUp, shareErrors: m.shareErrors, mosteller3Set: m.mosteller3Set,
          mtkZ: m.mtkZ, mtkLower: m.mtkLower, mtkUpper: m.mtkUpper, aePrime: m.aePrime, aeSe: m.aeSe, aeChi2: m.aeChi2, aeG2: m.aeG2,
          aeDf: m.aeDf, aeChi2P: m.aeChi2P, aeG2P: m.aeG2P, aeMerges: m.aeMerges, shareInterval: m.shareInterval,
          marginInterval: m.marginInterval, nEffBasis: m.nEffBasis, nDesign: m.nDesign,
        };
      }
      items[n] = item;
    } catch (err) {
      if (!(err instanceof MetricInputError)) throw err;
      items[n] = failedItem(p, c, inWindow, disclosure, err.message, withDetail);
    }
  }
  markFinal(items, inputs.polls);
  return items;
}

/** A poll whose metrics could not be computed: every metric null, with the reason. */
function failedItem(p: PollRow, c: ContestContext, inWindow: boolean, disclosure: number, error: string, withDetail: boolean): AuditPollDto {
  const item: AuditPollDto = {
    pollKey: p.key, contestKey: c.contestKey, electionKey: c.electionKey, pollsterId: p.pollsterId, pollster: p.pollster,
    inWindow, isFinal: false, fieldworkEnd: p.fieldworkEnd, sampleSize: p.sampleSize, population: p.population, mode: p.mode,
    sponsorType: p.sponsorType, disclosure,
    refA: null, refB: null, refBasis: null, marginError: null, absMarginError: null, lean: null, mosteller3: null, mosteller5: null, mtkA: null,
    mtkSe: null, mtkP: null, aeB: null, aeBw: null, winnerCalled: null, shareCovered: null, marginCovered: null, daysOut: null, daysOutEnd: null,
    undecidedShare: null, twoPartyShareError: null, nEff: null, pollA: null, pollB: null, resultA: null, resultB: null, notes: [], error,
  };
  if (withDetail) item.detail = null;
  return item;
}

/**
 * A firm's final poll per contest (SPEC §5): among its headline polls in the window, the latest
 * fieldwork end, then the latest publication date, then the greatest poll key.
 * `polls[i]` is the poll of `items[i]`.
 */
function markFinal(items: AuditPollDto[], polls: readonly PollRow[]) {
  const best = new Map<string, number>();
  for (let i = 0; i < items.length; i++) {
    const it = items[i]!;
    const p = polls[i]!;
    if (!it.inWindow || !p.isHeadline) continue;
    const k = `${it.pollsterId}\u0000${it.contestKey}`;
    const cur = best.get(k);
    if (cur === undefined) {
      best.set(k, i);
      continue;
    }
    const q = polls[cur]!;
    const later = p.fieldworkEnd !== q.fieldworkEnd ? p.fieldworkEnd > q.fieldworkEnd : p.publishedOn !== q.publishedOn ? p.publishedOn > q.publishedOn : p.key > q.key;
    if (later) best.set(k, i);
  }
  for (const i of best.values()) items[i]!.isFinal = true;
}

/** The polls the scorecards and analyses use: in the window, final when the audit says so, computable. */
export const usedPolls = (items: readonly AuditPollDto[], settings: Pick<AuditSettings, 'finalOnly'>) =>
  items.filter((i) => i.inWindow && (!settings.finalOnly || i.isFinal) && i.error === null && i.marginError !== null);

export function headline(items: readonly AuditPollDto[], settings: AuditSettings, elections: readonly ElectionRow[], contests: readonly ContestRow[]): AuditHeadline {
  return headlineOfUsed(usedPolls(items, settings), { pollsTotal: items.length, notComputable: items.filter((i) => i.error !== null).length }, elections, contests);
}

/**
 * The headline from the used polls (in the audit's poll order) and two counts over every poll;
 * the same as {@link headline} over the items they come from.
 */
export function headlineOfUsed(
  used: readonly AuditPollDto[],
  counts: { pollsTotal: number; notComputable: number },
  elections: readonly ElectionRow[],
  contests: readonly ContestRow[],
): AuditHeadline {
  const oriented = used.filter((i) => i.refBasis === 'blocs');
  let interval: [number, number] | null = null;
  let meanSigned: number | null = mean(oriented.map((i) => i.marginError!));
  if (oriented.length >= 2 && new Set(oriented.map((i) => i.contestKey)).size >= 2) {
    try {
      const cm = clusteredMean(oriented.map((i) => i.marginError!), oriented.map((i) => i.contestKey));
      meanSigned = cm.mean;
      interval = [cm.interval[0], cm.interval[1]];
    } catch (err) {
      if (!(err instanceof MetricInputError)) throw err;
    }
  }
  let direction: string | null = null;
  if (meanSigned !== null && elections.length) {
    const blocs = new Set(elections.map((e) => { const o = orientationOf(e, contests); return `${o.blocA} over ${o.blocB}`; }));
    const pair = blocs.size === 1 ? [...blocs][0]! : 'bloc A over bloc B (each election its own pair)';
    const [a, b] = pair.split(' over ');
    direction = meanSigned > 0 ? `polls overstated ${a} against ${b}` : meanSigned < 0 ? `polls understated ${a} against ${b}` : 'no net lean';
  }
  const calls = used.filter((i) => i.winnerCalled !== null);
  return {
    pollsUsed: used.length, pollsTotal: counts.pollsTotal, meanAbsMarginError: mean(used.map((i) => i.absMarginError!)), meanSignedError: meanSigned,
    meanSignedErrorInterval: interval, signedDirection: direction, marginCoverage: rate(used.map((i) => i.marginCovered)),
    shareCoverage: rate(used.map((i) => i.shareCovered)), winnerCalledRate: rate(used.map((i) => i.winnerCalled)), calls: calls.length,
    noCalls: used.length - calls.length, notComputable: counts.notComputable,
  };
}

export const seedOf = (dataHash: string) => parseInt(dataHash.slice(0, 8), 16);

export function scorecardsFor(items: readonly AuditPollDto[], settings: AuditSettings, seed: number) {
  const polls: ScorecardPoll[] = usedPolls(items, settings).map((i) => ({
    pollKey: i.pollKey, pollster: i.pollsterId, pollsterName: i.pollster, contestKey: i.contestKey, electionKey: i.electionKey,
    signedError: i.marginError!, absMarginError: i.absMarginError!, winnerCalled: i.winnerCalled, marginCovered: i.marginCovered,
    shareCovered: i.shareCovered, disclosure: i.disclosure,
  }));
  if (!polls.length) return { items: [], field: null };
  return computeScorecards(polls, { minPolls: settings.minPolls, seed, draws: 1000 });
}

/** Margin sampling variance in points² from the poll's effective n (one multinomial sample). */
const marginVariance = (pA: number, pB: number, nEff: number) => (10_000 * (pA / 100 + pB / 100 - ((pA - pB) / 100) ** 2)) / nEff;

/** The shared-error analysis of one election (see {@link sharedErrorsFor} for every election at once). */
export function sharedErrorFor(items: readonly AuditPollDto[], settings: AuditSettings, electionKey: string) {
  return sharedErrorOf(usedPolls(items, settings).filter((i) => i.electionKey === electionKey), electionKey);
}

/**
 * The shared-error analysis of each of `electionKeys`, in that order, selecting the used polls
 * once and grouping them by election (the same result as `sharedErrorFor` per election).
 */
export function* sharedErrorsFor(items: readonly AuditPollDto[], settings: AuditSettings, electionKeys: readonly string[]) {
  const byElection = new Map<string, AuditPollDto[]>(electionKeys.map((k) => [k, []]));
  for (const i of usedPolls(items, settings)) byElection.get(i.electionKey)?.push(i);
  for (const key of electionKeys) yield sharedErrorOf(byElection.get(key) ?? [], key);
}

function sharedErrorOf(used: readonly AuditPollDto[], electionKey: string) {
  const oriented = used.filter((i) => i.refBasis === 'blocs' && i.nEff && i.pollA !== null && i.pollB !== null);
  const polls: SharedErrorPoll[] = oriented.map((i) => ({
    pollKey: i.pollKey, contestKey: i.contestKey, firm: i.pollster, signedError: i.marginError!,
    samplingVariance: marginVariance(i.pollA!, i.pollB!, i.nEff!), certifiedMargin: i.resultA! - i.resultB!,
  }));
  const analysis = computeSharedError({ polls });
  const excluded = used.length - oriented.length;
  return {
    electionKey,
    excludedNotOriented: excluded,
    ...analysis,
    warnings: [
      ...analysis.warnings,
      ...(excluded ? [`${excluded} poll(s) were left out: their contests do not have both of the election's orientation blocs (e.g. referendum questions), so their errors cannot be signed consistently.`] : []),
    ],
  };
}

function shiftDays(iso: string, days: number): string {
  const d = new Date(`${iso}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}
