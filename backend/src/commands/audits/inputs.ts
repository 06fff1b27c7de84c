import { createHash } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { loadContests, loadElections, loadPolls, type ContestRow, type ElectionRow, type PollRow } from '../../queries/archive';

export interface AuditInputs {
  elections: ElectionRow[];
  contests: ContestRow[];
  polls: PollRow[];
  /** SHA-256 over every input row an audit reads, in a canonical order. */
  dataHash: string;
}

/** Loads, set-based, everything an audit of these elections reads, and hashes it. */
export async function loadAuditInputs(sequelize: Sequelize, electionKeys: readonly string[]): Promise<AuditInputs> {
  const elections = await loadElections(sequelize, { keys: [...electionKeys] });
  const contests = await loadContests(sequelize, { electionIds: elections.map((e) => e.id) });
  const polls = await loadPolls(sequelize, { contestIds: contests.map((c) => c.id) });
  return { elections, contests, polls, dataHash: hashInputs(elections, contests, polls) };
}

export function hashInputs(elections: readonly ElectionRow[], contests: readonly ContestRow[], polls: readonly PollRow[]): string {
  const h = createHash('sha256');
  const byKey = <T extends { key: string }>(xs: readonly T[]) => [...xs].sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
  const contestKey = new Map(contests.map((c) => [c.id, c.key]));
  const electionKey = new Map(elections.map((e) => [e.id, e.key]));
  for (const e of byKey(elections)) h.update(JSON.stringify(['E', e.key, e.date, e.blocA, e.blocB]) + '\n');
  for (const c of byKey(contests)) {
    const options = [...c.options].sort((a, b) => (a.key < b.key ? -1 : 1)).map((o) => [o.key, o.bloc, o.votes]);
    h.update(JSON.stringify(['C', c.key, electionKey.get(c.electionId), c.status, options]) + '\n');
  }
  for (const p of byKey(polls)) {
    const shares = Object.keys(p.shares).sort().map((k) => [k, p.shares[k]]);
    h.update(JSON.stringify(['P', p.key, p.pollsterId, contestKey.get(p.contestId), p.fieldworkStart, p.fieldworkEnd, p.publishedOn, p.sampleSize,
      p.population, p.mode, p.moe, p.isHeadline, p.sponsorType, p.weightingStatement, p.questionWording, p.tablesUrl, shares]) + '\n');
  }
  return h.digest('hex');
}
