import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import type { ContestRow, ElectionRow, PollRow } from '../../queries/archive';
import { computeAuditPolls, scorecardsFor, sharedErrorsFor, usedPolls } from './compute';
import { encodePollChunk } from './stored-polls';
import { POLLS_PER_CHUNK, type PartText } from './parts';

/**
 * One thread's share of an audit: whole elections, with their contests and polls. Elections are
 * independent in every per-poll metric (window, final poll per firm and contest) and in the
 * shared-error analysis, so slices are computed apart and give what the whole would.
 */
export interface AuditSlice {
  settings: AuditSettings;
  elections: ElectionRow[];
  contests: ContestRow[];
  /** The slice's polls, in the audit's poll order (fieldwork end, then key). */
  polls: PollRow[];
}

/** The per-poll rows of a slice and what the rest of the audit needs from them. */
export interface SliceOutcome {
  items: AuditPollDto[];
  /** The used polls (see `usedPolls`), in the audit's poll order. */
  used: AuditPollDto[];
  total: number;
  notComputable: number;
}

export function computeSlice(slice: AuditSlice): SliceOutcome {
  const items = computeAuditPolls({ elections: slice.elections, contests: slice.contests, polls: slice.polls, dataHash: '' }, slice.settings, { detail: false });
  const used = usedPolls(items, slice.settings);
  let notComputable = 0;
  for (const item of items) if (item.error !== null) notComputable++;
  return { items, used, total: items.length, notComputable };
}

/** The used polls of several slices, in the audit's poll order (fieldwork end, then poll key). */
export function mergeUsed(parts: readonly { used: readonly AuditPollDto[] }[]): AuditPollDto[] {
  const all = parts.flatMap((p) => p.used);
  return all.sort((a, b) => compare(a.fieldworkEnd, b.fieldworkEnd) || compare(a.pollKey, b.pollKey));
}

const compare = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/** The poll rows of each of the slice's elections in stored chunks (contest key, then poll key), each built when asked for. */
export function* pollChunkParts(outcome: SliceOutcome, electionKeys: readonly string[]): Generator<PartText> {
  const byElection = new Map<string, AuditPollDto[]>(electionKeys.map((k) => [k, []]));
  for (const i of outcome.items) byElection.get(i.electionKey)?.push(i);
  for (const [electionKey, polls] of byElection) {
    polls.sort((a, b) => compare(a.contestKey, b.contestKey) || compare(a.pollKey, b.pollKey));
    for (let start = 0, chunk = 0; start < polls.length; start += POLLS_PER_CHUNK, chunk++) {
      yield { kind: 'polls', partKey: electionKey, chunk, content: encodePollChunk(polls.slice(start, start + POLLS_PER_CHUNK)) };
    }
  }
}

/**
 * The shared-error analysis of each of `electionKeys` as a stored part, each computed when asked
 * for. `used` are the used polls of those elections (or more), in the audit's poll order.
 */
export function* sharedErrorParts(used: readonly AuditPollDto[], settings: AuditSettings, electionKeys: readonly string[]): Generator<PartText> {
  let n = 0;
  for (const analysis of sharedErrorsFor(used, settings, electionKeys)) {
    yield { kind: 'shared_error', partKey: electionKeys[n++]!, chunk: 0, content: JSON.stringify(analysis) };
  }
}

/** The scorecards as a stored part; `used` are every used poll of the audit, in the audit's poll order. */
export function scorecardsPart(used: readonly AuditPollDto[], settings: AuditSettings, seed: number): PartText {
  return { kind: 'scorecards', partKey: '', chunk: 0, content: JSON.stringify(scorecardsFor(used, settings, seed)) };
}

/**
 * Splits the audit's elections into groups whose poll counts come near the given weights (one
 * group per weight, possibly empty): largest elections first, each to the group furthest below
 * its target. Each group keeps the elections' order and takes their contests.
 */
export function splitElections(
  elections: readonly ElectionRow[],
  contests: readonly ContestRow[],
  pollsPerContest: ReadonlyMap<number, number>,
  weights: readonly number[],
): { elections: ElectionRow[]; contests: ContestRow[] }[] {
  const count = new Map<number, number>(elections.map((e) => [e.id, 0]));
  for (const c of contests) count.set(c.electionId, (count.get(c.electionId) ?? 0) + (pollsPerContest.get(c.id) ?? 0));
  const total = [...count.values()].reduce((a, b) => a + b, 0);
  const totalWeight = weights.reduce((a, b) => a + b, 0);
  const target = weights.map((w) => (total * w) / totalWeight);
  const filled = weights.map(() => 0);
  const groupOf = new Map<number, number>();
  const byCount = [...elections].sort((a, b) => count.get(b.id)! - count.get(a.id)! || compare(a.key, b.key));
  for (const e of byCount) {
    let best = 0;
    for (let k = 1; k < weights.length; k++) if (target[k]! - filled[k]! > target[best]! - filled[best]!) best = k;
    groupOf.set(e.id, best);
    filled[best]! += count.get(e.id)!;
  }
  const groups = weights.map(() => ({ elections: [] as ElectionRow[], contests: [] as ContestRow[] }));
  for (const e of elections) groups[groupOf.get(e.id)!]!.elections.push(e);
  for (const c of contests) {
    const k = groupOf.get(c.electionId);
    if (k !== undefined) groups[k]!.contests.push(c);
  }
  return groups;
}
