import { describe, expect, it } from 'vitest';
import type { AuditPollDto } from '@veracast/shared-types';
import { decodeAuditPoll, decodePollChunk, encodePollChunk, STORED_FIELDS } from './stored-polls';

// [practice] a poll row with every kind of field value an audit stores (numbers, nulls, booleans, a note list, a quote and a backslash in text).
const poll: AuditPollDto = {
  pollKey: "p-o'hara\\1", contestKey: 'c1', electionKey: 'e1', pollsterId: 7, pollster: 'Firm "Q"', inWindow: true, isFinal: false,
  fieldworkEnd: '2030-05-01', sampleSize: 1001, population: 'lv', mode: 'online', sponsorType: null, disclosure: 0.7,
  refA: 'a', refB: 'b', refBasis: 'blocs', marginError: -1.3355198080315347, absMarginError: 1.3355198080315347, lean: 'B',
  mosteller3: 4.333333333333334, mosteller5: 0.1 + 0.2, mtkA: -0.0016217061081018336, mtkSe: 0.05, mtkP: 0.97, aeB: null, aeBw: null,
  winnerCalled: true, shareCovered: false, marginCovered: null, daysOut: 62.5, daysOutEnd: 60, undecidedShare: 13, twoPartyShareError: -0.04,
  nEff: 1984.224597465973, pollA: 41, pollB: 33, resultA: 47.52686392580028, resultB: 38.19134411776874, notes: ['one note', 'and "another"'], error: null,
};
const other: AuditPollDto = { ...poll, pollKey: 'p2', marginError: null, absMarginError: null, notes: [], error: 'contest c1 has no result yet' };

describe('stored chunks of poll rows', () => {
  it('round-trip every AuditPollDto field exactly, in order, and drop detail', () => {
    const back = decodePollChunk(encodePollChunk([{ ...poll, detail: null }, other]));
    expect(back).toStrictEqual([poll, other]);
    expect(Object.keys(back[0]!)).not.toContain('detail');
    // [practice] JSON keeps the shortest round-trip form of a double: the same bits come back.
    expect(Object.is(back[0]!.mosteller5, 0.1 + 0.2)).toBe(true);
  });

  it('name the fields once per chunk, not per row', () => {
    const text = encodePollChunk([poll, other, poll]);
    expect(text.match(/"marginError"/g)).toHaveLength(1);
    expect(text.length).toBeLessThan(JSON.stringify([poll, other, poll]).length * 0.75);
  });

  it('read rows by the field names the chunk stores, whatever their order', () => {
    const text = JSON.stringify({ format: 'audit-polls/2', fields: ['marginError', 'pollKey'], rows: [[1.5, 'x']] });
    expect(decodePollChunk(text)).toStrictEqual([{ marginError: 1.5, pollKey: 'x' }]);
  });

  it('refuse text in another format, saying which format they expect', () => {
    expect(() => decodePollChunk('{"rows":[]}')).toThrow(/audit-polls\/2/);
  });
});

describe('poll rows stored by earlier audits (audit_polls.metrics)', () => {
  it('reads the tagged-array form', () => {
    const text = JSON.stringify(['audit-poll/1', ...STORED_FIELDS.map((f) => poll[f])]);
    expect(decodeAuditPoll(text)).toStrictEqual(poll);
  });

  it('reads the object form', () => {
    const old = JSON.stringify({ ...poll, detail: { winner: 'a' } });
    expect(decodeAuditPoll(old)).toStrictEqual(JSON.parse(old));
  });
});
