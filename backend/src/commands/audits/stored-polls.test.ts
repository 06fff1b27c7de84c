import { describe, expect, it } from 'vitest';
import type { AuditPollDto } from '@veracast/shared-types';
import { decodeAuditPoll, encodeAuditPoll } from './stored-polls';
import { checkStatementSize, MAX_STATEMENT_BYTES, sqlText } from './parts';

// [practice] a poll row with every kind of field value an audit stores (numbers, nulls, booleans, a note list, a quote and a backslash in text).
const poll: AuditPollDto = {
  pollKey: "p-o'hara\\1", contestKey: 'c1', electionKey: 'e1', pollsterId: 7, pollster: 'Firm "Q"', inWindow: true, isFinal: false,
  fieldworkEnd: '2030-05-01', sampleSize: 1001, population: 'lv', mode: 'online', sponsorType: null, disclosure: 0.7,
  refA: 'a', refB: 'b', refBasis: 'blocs', marginError: -1.3355198080315347, absMarginError: 1.3355198080315347, lean: 'B',
  mosteller3: 4.333333333333334, mosteller5: 0.1 + 0.2, mtkA: -0.0016217061081018336, mtkSe: 0.05, mtkP: 0.97, aeB: null, aeBw: null,
  winnerCalled: true, shareCovered: false, marginCovered: null, daysOut: 62.5, daysOutEnd: 60, undecidedShare: 13, twoPartyShareError: -0.04,
  nEff: 1984.224597465973, pollA: 41, pollB: 33, resultA: 47.52686392580028, resultB: 38.19134411776874, notes: ['one note', 'and "another"'], error: null,
};

describe('stored poll rows', () => {
  it('round-trips every AuditPollDto field exactly and drops detail', () => {
    const withDetail = { ...poll, detail: null };
    const back = decodeAuditPoll(encodeAuditPoll(withDetail));
    expect(back).toStrictEqual(poll);
    expect(Object.keys(back)).not.toContain('detail');
    // [practice] JSON keeps the shortest round-trip form of a double: the same bits come back.
    expect(Object.is(back.mosteller5, 0.1 + 0.2)).toBe(true);
  });

  it('stores no field names', () => {
    expect(encodeAuditPoll(poll)).not.toContain('marginError');
    expect(encodeAuditPoll(poll).length).toBeLessThan(JSON.stringify(poll).length * 0.75);
  });

  it('still reads rows stored as objects by earlier audits', () => {
    const old = JSON.stringify({ ...poll, detail: { winner: 'a' } });
    expect(decodeAuditPoll(old)).toStrictEqual(JSON.parse(old));
  });
});

describe('statement text', () => {
  it('quotes a backslash, a quote and NUL; leaves other text as it is', () => {
    expect(sqlText("it's")).toBe("'it\\'s'");
    expect(sqlText('a\\b')).toBe("'a\\\\b'");
    expect(sqlText('x\0y')).toBe("'x\\0y'");
    expect(sqlText('"q"\n')).toBe("'\"q\"\n'");
  });

  it('refuses a statement over the limit, counting UTF-8 bytes', () => {
    const ascii = 'x'.repeat(MAX_STATEMENT_BYTES);
    expect(checkStatementSize(ascii, 'it')).toBe(ascii);
    // 'é' is 2 bytes in UTF-8: fewer characters than the limit, more bytes.
    expect(() => checkStatementSize('é'.repeat(MAX_STATEMENT_BYTES / 2 + 1), 'The test part')).toThrow(/The test part is too large/);
  });
});
