import { createHash } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { loadContests, loadElections, loadPolls, type ContestRow, type ElectionRow, type PollRow } from '../../queries/archive';

export interface AuditInputs {
  elections: ElectionRow[];
  contests: ContestRow[];
  polls: PollRow[];
  /** SHA-256 over every input row an audit reads, in a canonical order (see {@link hashInputs}). */
  dataHash: string;
}

/**
 * How an audit's data hash is made (stored with each audit as `hash_scheme`, so that an audit is
 * always checked against its own scheme):
 * - 1: SHA-256 over one JSON line per election, contest (with its options) and poll (with its
 *   shares), each kind in key order;
 * - 2: the same election and contest lines, then one line per election (key order) holding the
 *   SHA-256 of its polls' lines (as in scheme 1, in poll-key order). Each election's polls are
 *   hashed apart, so threads that read different elections hash them at the same time.
 */
export type HashScheme = 1 | 2;
/** The scheme new audits use. */
export const HASH_SCHEME: HashScheme = 2;

/** An audit's stored `hash_scheme` as a {@link HashScheme}; an unknown one is refused rather than guessed. */
export function hashSchemeOf(stored: number | string): HashScheme {
  const n = Number(stored);
  if (n === 1 || n === 2) return n;
  throw new Error(`unknown audit hash scheme ${String(stored)}`);
}

/** Loads, set-based, everything an audit of these elections reads, and hashes it with `scheme`. */
export async function loadAuditInputs(sequelize: Sequelize, electionKeys: readonly string[], scheme: HashScheme = HASH_SCHEME): Promise<AuditInputs> {
  const elections = await loadElections(sequelize, { keys: [...electionKeys] });
  const contests = await loadContests(sequelize, { electionIds: elections.map((e) => e.id) });
  const polls = await loadPolls(sequelize, { contestIds: contests.map((c) => c.id) });
  return { elections, contests, polls, dataHash: hashInputs(elections, contests, polls, scheme) };
}

const byKey = <T extends { key: string }>(xs: readonly T[]) => [...xs].sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));

/** The data hash of these rows under `scheme` (see {@link HashScheme}). */
export function hashInputs(elections: readonly ElectionRow[], contests: readonly ContestRow[], polls: readonly PollRow[], scheme: HashScheme = HASH_SCHEME): string {
  if (scheme === 2) return combineHash(elections, contests, electionPollDigests(elections, contests, polls));
  const h = headerHash(elections, contests);
  updatePolls(h, contests, polls);
  return h.digest('hex');
}

/**
 * Scheme 2's digest of each election's polls (the elections given; an election without polls has
 * the digest of nothing). `contests` must hold every contest of those polls.
 */
export function electionPollDigests(elections: readonly ElectionRow[], contests: readonly ContestRow[], polls: readonly PollRow[]): Record<string, string> {
  const electionOf = new Map(contests.map((c) => [c.id, c.electionId]));
  const byElection = new Map<number, PollRow[]>(elections.map((e) => [e.id, []]));
  for (const p of polls) byElection.get(electionOf.get(p.contestId) ?? -1)?.push(p);
  const digests: Record<string, string> = {};
  for (const e of elections) {
    const h = createHash('sha256');
    updatePolls(h, contests, byElection.get(e.id)!);
    digests[e.key] = h.digest('hex');
  }
  return digests;
}

/** Scheme 2's data hash from the election and contest rows and every election's poll digest. */
export function combineHash(elections: readonly ElectionRow[], contests: readonly ContestRow[], digests: Readonly<Record<string, string>>): string {
  const h = headerHash(elections, contests);
  for (const e of byKey(elections)) {
    const digest = digests[e.key];
    if (digest === undefined) throw new Error(`no poll digest for election ${e.key}`);
    h.update(`${JSON.stringify(['D', e.key, digest])}\n`);
  }
  return h.digest('hex');
}

function headerHash(elections: readonly ElectionRow[], contests: readonly ContestRow[]) {
  const h = createHash('sha256');
  const electionKey = new Map(elections.map((e) => [e.id, e.key]));
  for (const e of byKey(elections)) h.update(JSON.stringify(['E', e.key, e.date, e.blocA, e.blocB]) + '\n');
  for (const c of byKey(contests)) {
    const options = [...c.options].sort((a, b) => (a.key < b.key ? -1 : 1)).map((o) => [o.key, o.bloc, o.votes]);
    h.update(JSON.stringify(['C', c.key, electionKey.get(c.electionId), c.status, options]) + '\n');
  }
  return h;
}

/** Adds one line per poll, in key order; lines go to the hash in batches (the same digest, fewer calls). */
function updatePolls(h: ReturnType<typeof createHash>, contests: readonly ContestRow[], polls: readonly PollRow[]) {
  const contestKey = new Map(contests.map((c) => [c.id, c.key]));
  let batch = '';
  for (const p of byKey(polls)) {
    const shares = Object.keys(p.shares).sort().map((k) => [k, p.shares[k]]);
    batch += JSON.stringify(['P', p.key, p.pollsterId, contestKey.get(p.contestId), p.fieldworkStart, p.fieldworkEnd, p.publishedOn, p.sampleSize,
      p.population, p.mode, p.moe, p.isHeadline, p.sponsorType, p.weightingStatement, p.questionWording, p.tablesUrl, shares]) + '\n';
    if (batch.length >= 1 << 16) {
      h.update(batch);
      batch = '';
    }
  }
  if (batch) h.update(batch);
}
