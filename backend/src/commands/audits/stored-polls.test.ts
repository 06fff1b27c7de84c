import { describe, expect, it } from 'vitest';
import type { AuditPollDto } from '@veracast/shared-types';
import { decodeAuditPoll, decodePollChunk, encodePollChunk, STORED_FIELDS } from './stored-polls';

// [practice] a poll row with every kind of field value an audit stores (numbers, nulls, booleans, a note list, a quote and a backslash in text).
const poll: AuditPollDto = {
  pollKey: "p-o'hara\\1", contestKey: 'c1', electionKey: 'e1', pollsterId: 7, pollster: 'Firm "Q" — Ünïcode', inWindow: true, isFinal: false,
  fieldworkEnd: '2030-05-01', sampleSize: 1001, population: 'lv', mode: 'online', sponsorType: null, disclosure: 0.7,
  refA: 'a', refB: 'b', refBasis: 'blocs', marginError: -1.3355198080315347, absMarginError: 1.3355198080315347, lean: 'B',
  mosteller3: 4.333333333333334, mosteller5: 0.1 + 0.2, mtkA: -0.0016217061081018336, mtkSe: 0.05, mtkP: 0.97, aeB: null, aeBw: null,
  winnerCalled: true, shareCovered: false, marginCovered: null, daysOut: 62.5, daysOutEnd: 60, undecidedShare: 13, twoPartyShareError: -0.04,
  nEff: 1984.224597465973, pollA: 41, pollB: 33, resultA: 47.52686392580028, resultB: 38.19134411776874, notes: ['one note', 'and "another"'], error: null,
};
const other: AuditPollDto = {
  ...poll, pollKey: 'p2', marginError: null, absMarginError: null, winnerCalled: null, inWindow: false, isFinal: true, notes: [], error: 'contest c1 has no result yet',
};

describe('stored chunks of poll rows (binary, audit-polls/3)', () => {
  it('round-trip every AuditPollDto field exactly, in order, and drop detail', () => {
    const back = decodePollChunk(encodePollChunk([{ ...poll, detail: null }, other]));
    expect(back).toStrictEqual([poll, other]);
    expect(Object.keys(back[0]!)).toEqual([...STORED_FIELDS]);
    // [practice] a float64 column keeps every bit of a double.
    expect(Object.is(back[0]!.mosteller5, 0.1 + 0.2)).toBe(true);
  });

  it('keep what JSON would keep and no more: −0 as 0, non-finite numbers as null', () => {
    const odd = { ...poll, marginError: -0, mtkA: Number.NaN, nEff: Number.POSITIVE_INFINITY };
    const [back] = decodePollChunk(encodePollChunk([odd]));
    expect(Object.is(back!.marginError, 0)).toBe(true);
    expect([back!.mtkA, back!.nEff]).toEqual([null, null]);
    expect(back).toStrictEqual(JSON.parse(JSON.stringify(odd)));
  });

  it('hold an empty chunk and a chunk of 2,000 rows', () => {
    expect(decodePollChunk(encodePollChunk([]))).toEqual([]);
    const many = Array.from({ length: 2000 }, (_, i) => ({ ...poll, pollKey: `p${i}`, marginError: i / 7 }));
    const back = decodePollChunk(encodePollChunk(many));
    expect(back.map((r) => r.marginError)).toEqual(many.map((r) => r.marginError));
  });

  it('refuse a block cut short', () => {
    const bytes = encodePollChunk([poll, other]);
    expect(() => decodePollChunk(bytes.subarray(0, bytes.length - 3))).toThrow(/cut short/);
  });
});

describe('poll rows stored by earlier audits', () => {
  it('reads JSON chunks (audit-polls/2) by the field names they store', () => {
    const text = JSON.stringify({ format: 'audit-polls/2', fields: ['marginError', 'pollKey'], rows: [[1.5, 'x']] });
    expect(decodePollChunk(Buffer.from(text))).toStrictEqual([{ marginError: 1.5, pollKey: 'x' }]);
    expect(() => decodePollChunk(Buffer.from('{"rows":[]}'))).toThrow(/audit-polls\/3.*audit-polls\/2/);
  });

  it('reads audit_polls rows in the tagged-array form', () => {
    const text = JSON.stringify(['audit-poll/1', ...STORED_FIELDS.map((f) => poll[f])]);
    expect(decodeAuditPoll(text)).toStrictEqual(poll);
  });

  it('reads audit_polls rows in the object form', () => {
    const old = JSON.stringify({ ...poll, detail: { winner: 'a' } });
    expect(decodeAuditPoll(old)).toStrictEqual(JSON.parse(old));
  });
});
