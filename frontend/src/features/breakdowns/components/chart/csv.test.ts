import { describe, expect, it } from 'vitest';
import { neutraliseCsvCell, toCsv } from './csv';

describe('neutraliseCsvCell', () => {
  it('prefixes an apostrophe to text a spreadsheet would run as a formula', () => {
    // [practice] OWASP "CSV injection": cells starting with = + - @ tab or CR are formulas
    expect(neutraliseCsvCell('=HYPERLINK("x")')).toBe(`'=HYPERLINK("x")`);
    expect(neutraliseCsvCell('+1 swing')).toBe("'+1 swing");
    expect(neutraliseCsvCell('-2 pts')).toBe("'-2 pts");
    expect(neutraliseCsvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(neutraliseCsvCell('\tcmd')).toBe("'\tcmd");
  });

  it('leaves numbers (negative ones too), booleans and plain text alone', () => {
    expect(neutraliseCsvCell(-1.5)).toBe(-1.5);
    expect(neutraliseCsvCell(true)).toBe(true);
    expect(neutraliseCsvCell('Likely voters')).toBe('Likely voters');
    expect(neutraliseCsvCell(null)).toBeNull();
    expect(neutraliseCsvCell(Number.NaN)).toBeNull();
  });
});

describe('toCsv', () => {
  it('writes a header, quotes cells with commas or quotes, and neutralises every text cell', () => {
    const text = toCsv([
      { group: 'Halloway & Finch, Ltd', polls: 3, meanSignedError: -0.25 },
      { group: '=cmd|"/c calc"', polls: 1, meanSignedError: null },
    ]);
    const lines = text.split('\r\n');
    expect(lines[0]).toBe('group,polls,meanSignedError');
    expect(lines[1]).toBe('"Halloway & Finch, Ltd",3,-0.25');
    expect(lines[2]).toBe(`"'=cmd|""/c calc""",1,`);
  });

  it('keeps the given column order and writes a header even without rows', () => {
    expect(toCsv([{ b: 1, a: 2 }], ['a', 'b']).split('\r\n')).toEqual(['a,b', '2,1']);
    expect(toCsv([], ['n', 'absError'])).toBe('n,absError');
  });
});
