import { describe, expect, it } from 'vitest';
import type { AuditPollDto } from '@veracast/shared-types';
import type { ContestRow, ElectionRow } from '../../queries/archive';
import { mergeUsed, splitElections } from './slice';

const election = (id: number): ElectionRow => ({
  id, key: `e${id}`, name: `E${id}`, date: '2030-05-05', jurisdiction: 'X', blocA: null, blocB: null, blackoutStart: null, blackoutEnd: null, fictional: true,
});
const contest = (id: number, electionId: number): ContestRow => ({
  id, key: `c${id}`, name: `C${id}`, kind: 'candidate', electionId, status: 'certified', certifiedOn: null, certifyingBody: null, sourceUrl: null,
  rejectedBallots: null, electorate: null, options: [],
});

describe('splitElections', () => {
  // [practice] slices are whole elections, every election in exactly one, near the weights.
  const elections = [1, 2, 3, 4, 5].map(election);
  const contests = [contest(11, 1), contest(12, 1), contest(21, 2), contest(31, 3), contest(41, 4), contest(51, 5)];
  const counts = new Map([[11, 300], [12, 100], [21, 300], [31, 200], [41, 100], [51, 0]]);

  it('keeps each election whole and every contest with its election', () => {
    const groups = splitElections(elections, contests, counts, [1, 1]);
    expect(groups.flatMap((g) => g.elections.map((e) => e.id)).sort()).toEqual([1, 2, 3, 4, 5]);
    for (const g of groups) {
      const ids = new Set(g.elections.map((e) => e.id));
      expect(g.contests.every((c) => ids.has(c.electionId))).toBe(true);
    }
    expect(groups.flatMap((g) => g.contests).length).toBe(contests.length);
  });

  it('comes near the weights: 1000 polls split 1:1 and 3:1', () => {
    const polls = (g: { contests: ContestRow[] }) => g.contests.reduce((a, c) => a + (counts.get(c.id) ?? 0), 0);
    expect(splitElections(elections, contests, counts, [1, 1]).map(polls)).toEqual([500, 500]);
    // Greedy, largest election first: 400 and 300 to the first (target 750), 200 to the second,
    // then 100 where the shortfall is larger (a tie, 50 each: the first).
    expect(splitElections(elections, contests, counts, [3, 1]).map(polls)).toEqual([800, 200]);
  });

  it('leaves a group empty when there are fewer elections than groups', () => {
    const groups = splitElections([election(1)], [contest(11, 1)], counts, [1.3, 0.7, 1]);
    expect(groups.map((g) => g.elections.length)).toEqual([1, 0, 0]);
  });
});

describe('mergeUsed', () => {
  it('puts used polls back in the audit order: fieldwork end, then poll key (code units)', () => {
    const row = (pollKey: string, fieldworkEnd: string) => ({ pollKey, fieldworkEnd }) as AuditPollDto;
    const merged = mergeUsed([{ used: [row('b', '2030-01-02'), row('a_', '2030-01-03')] }, { used: [row('a', '2030-01-02'), row('a9', '2030-01-03')] }]);
    expect(merged.map((r) => r.pollKey)).toEqual(['a', 'b', 'a9', 'a_']);
  });
});
