import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import type { ContestRow, ElectionRow, PollRow } from '../../queries/archive';
import { combineHash, electionPollDigests, hashInputs, hashSchemeOf } from './inputs';

// [practice] an audit's data hash: SHA-256 (FIPS 180-4, Node's crypto) over canonical JSON lines.
// The references below restate each scheme line by line, one hash update per line, the plainest
// way; the code under test batches lines and, in scheme 2, hashes each election apart.

const election = (id: number, key: string): ElectionRow => ({
  id, key, name: key, date: '2030-05-05', jurisdiction: 'X', blocA: 'RED', blocB: 'BLUE', blackoutStart: null, blackoutEnd: null, fictional: true,
});
const contest = (id: number, key: string, electionId: number): ContestRow => ({
  id, key, name: key, kind: 'candidate', electionId, status: 'certified', certifiedOn: null, certifyingBody: null, sourceUrl: null, rejectedBallots: null,
  electorate: null, options: [{ key: 'red', name: 'Red', bloc: 'RED', votes: 510 }, { key: 'blue', name: 'Blue', bloc: 'BLUE', votes: 490 }],
});
const poll = (id: number, key: string, contestId: number, shares: Record<string, number>): PollRow => ({
  id, key, pollsterId: 1 + (id % 3), pollster: 'Firm', sponsor: null, sponsorType: id % 2 ? 'media' : null, contestId, fieldworkStart: '2030-04-20',
  fieldworkEnd: '2030-04-2' + String(id % 8 + 1), publishedOn: '2030-04-29', sampleSize: 800 + id, population: 'lv', mode: 'online', moe: id % 4 ? 3.1 : null,
  studyKey: null, isHeadline: id % 5 !== 0, tracking: false, sourceUrl: null, questionWording: true, weightingStatement: id % 2 === 0, tablesUrl: null, shares,
});

const elections = [election(2, 'zeta-2030'), election(1, 'alpha-2030'), election(3, 'empty-2031')];
const contests = [contest(20, 'z-1', 2), contest(10, 'a-1', 1), contest(11, 'a-2', 1)];
// Enough polls for several batches of lines, in no particular order, keys with quotes and non-ASCII.
const polls: PollRow[] = Array.from({ length: 900 }, (_, i) =>
  poll(i + 1, i % 7 === 0 ? `p-"${900 - i}"-é` : `p-${(i * 7919) % 900}`, [20, 10, 11][i % 3]!, i % 2 ? { red: 48.5, blue: 44, undecided: 7.5 } : { undecided: 9, blue: 45, red: 46 }),
);

const sha = () => createHash('sha256');
const byKey = <T extends { key: string }>(xs: readonly T[]) => [...xs].sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
function headerLines(h: ReturnType<typeof sha>, es: readonly ElectionRow[], cs: readonly ContestRow[]) {
  for (const e of byKey(es)) h.update(JSON.stringify(['E', e.key, e.date, e.blocA, e.blocB]) + '\n');
  for (const c of byKey(cs)) {
    const options = [...c.options].sort((a, b) => (a.key < b.key ? -1 : 1)).map((o) => [o.key, o.bloc, o.votes]);
    h.update(JSON.stringify(['C', c.key, es.find((e) => e.id === c.electionId)?.key, c.status, options]) + '\n');
  }
}
function pollLines(h: ReturnType<typeof sha>, cs: readonly ContestRow[], ps: readonly PollRow[]) {
  for (const p of byKey(ps)) {
    const shares = Object.keys(p.shares).sort().map((k) => [k, p.shares[k]]);
    h.update(JSON.stringify(['P', p.key, p.pollsterId, cs.find((c) => c.id === p.contestId)?.key, p.fieldworkStart, p.fieldworkEnd, p.publishedOn, p.sampleSize,
      p.population, p.mode, p.moe, p.isHeadline, p.sponsorType, p.weightingStatement, p.questionWording, p.tablesUrl, shares]) + '\n');
  }
}
function reference1() {
  const h = sha();
  headerLines(h, elections, contests);
  pollLines(h, contests, polls);
  return h.digest('hex');
}
function reference2() {
  const h = sha();
  headerLines(h, elections, contests);
  for (const e of byKey(elections)) {
    const d = sha();
    pollLines(d, contests, polls.filter((p) => contests.find((c) => c.id === p.contestId)?.electionId === e.id));
    h.update(JSON.stringify(['D', e.key, d.digest('hex')]) + '\n');
  }
  return h.digest('hex');
}

describe('hashInputs', () => {
  it('scheme 1 is SHA-256 over the election, contest and poll lines, each kind in key order', () => {
    expect(hashInputs(elections, contests, polls, 1)).toBe(reference1());
  });

  it('scheme 2 puts each election\'s poll digest after the election and contest lines', () => {
    expect(hashInputs(elections, contests, polls, 2)).toBe(reference2());
    expect(hashInputs(elections, contests, polls)).toBe(reference2());
    expect(reference2()).not.toBe(reference1());
    // An election without polls has the digest of nothing.
    expect(electionPollDigests([elections[2]!], contests, [])).toEqual({ 'empty-2031': createHash('sha256').digest('hex') });
  });

  it('scheme 2 from digests made apart (as the audit threads make them) is the hash of the whole', () => {
    const inA = (p: PollRow) => p.contestId === 20;
    const apart = {
      ...electionPollDigests([elections[0]!], [contests[0]!], polls.filter(inA)),
      ...electionPollDigests([elections[1]!, elections[2]!], contests.slice(1), polls.filter((p) => !inA(p))),
    };
    expect(combineHash(elections, contests, apart)).toBe(hashInputs(elections, contests, polls, 2));
    expect(() => combineHash(elections, contests, { 'zeta-2030': apart['zeta-2030']! })).toThrow(/no poll digest for election alpha-2030/);
  });

  it('changes with any share, and in scheme 2 only the digest of that poll\'s election', () => {
    const changed = polls.map((p, i) => (i === 4 ? { ...p, shares: { ...p.shares, red: p.shares.red! + 0.5 } } : p));
    for (const scheme of [1, 2] as const) expect(hashInputs(elections, contests, changed, scheme)).not.toBe(hashInputs(elections, contests, polls, scheme));
    const before = electionPollDigests(elections, contests, polls);
    const after = electionPollDigests(elections, contests, changed);
    const electionOfPoll4 = elections.find((e) => e.id === contests.find((c) => c.id === polls[4]!.contestId)!.electionId)!.key;
    expect(Object.keys(before).filter((k) => before[k] !== after[k])).toEqual([electionOfPoll4]);
  });

  it('takes a stored scheme as 1 or 2 and refuses any other', () => {
    expect(hashSchemeOf(1)).toBe(1);
    expect(hashSchemeOf('2')).toBe(2);
    expect(() => hashSchemeOf(3)).toThrow(/unknown audit hash scheme 3/);
  });
});
