import { describe, expect, it } from 'vitest';
import { neutraliseCsvCell, recordsToCsv, toCsv } from './csv';

describe('neutraliseCsvCell', () => {
  it('prefixes an apostrophe to text a spreadsheet would run as a formula', () => {
    // [practice] OWASP "CSV injection": cells starting with = + - @ tab or CR are formulas
    expect(neutraliseCsvCell('=HYPERLINK("x")')).toBe(`'=HYPERLINK("x")`);
    expect(neutraliseCsvCell('=SUM(A1)')).toBe("'=SUM(A1)");
    expect(neutraliseCsvCell('+1 swing')).toBe("'+1 swing");
    expect(neutraliseCsvCell('-2 pts')).toBe("'-2 pts");
    expect(neutraliseCsvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(neutraliseCsvCell('\tcmd')).toBe("'\tcmd");
    expect(neutraliseCsvCell('\rcmd')).toBe("'\rcmd");
  });

  it('leaves numbers (negative ones too), booleans and plain text alone', () => {
    expect(neutraliseCsvCell(-1.5)).toBe(-1.5);
    expect(neutraliseCsvCell(true)).toBe(true);
    expect(neutraliseCsvCell(false)).toBe(false);
    expect(neutraliseCsvCell('Likely voters')).toBe('Likely voters');
  });

  it('blanks anything missing or not finite', () => {
    expect(neutraliseCsvCell(null)).toBeNull();
    expect(neutraliseCsvCell(undefined)).toBeNull();
    expect(neutraliseCsvCell(Number.NaN)).toBeNull();
    expect(neutraliseCsvCell(Number.POSITIVE_INFINITY)).toBeNull();
  });

  it('joins a list and neutralises the joined text', () => {
    expect(neutraliseCsvCell(['a', 'b'])).toBe('a | b');
    expect(neutraliseCsvCell(['-x', 'y'])).toBe("'-x | y");
  });
});

describe('toCsv', () => {
  it('writes a header and one line per row with CRLF line ends', () => {
    const rows = [
      { lower: -1, count: 2 },
      { lower: 0, count: 5 },
    ];
    const text = toCsv(rows, [
      { header: 'lower', value: (r) => r.lower },
      { header: 'count', value: (r) => r.count },
    ]);
    expect(text).toBe('lower,count\r\n-1,2\r\n0,5');
  });

  it('neutralises text cells, quotes commas and quotes, and leaves a missing value empty', () => {
    const rows = [
      { firm: '=Cedar Research', r: -0.35 },
      { firm: 'Birch, Surveys', r: null },
      { firm: 'say "hi"', r: 1 },
    ];
    const csv = toCsv(rows, [
      { header: 'firm', value: (x) => x.firm },
      { header: 'r', value: (x) => x.r },
    ]);
    expect(csv).toBe('firm,r\r\n\'=Cedar Research,-0.35\r\n"Birch, Surveys",\r\n"say ""hi""",1');
  });

  it('writes the header alone when there are no rows', () => {
    expect(toCsv([] as { n: number }[], [{ header: 'n', value: (r) => r.n }, { header: 'absError', value: () => 0 }])).toBe('n,absError');
  });
});

describe('recordsToCsv', () => {
  it('takes the columns from the first record, quoting and neutralising every text cell', () => {
    const text = recordsToCsv([
      { group: 'Halloway & Finch, Ltd', polls: 3, meanSignedError: -0.25 },
      { group: '=cmd|"/c calc"', polls: 1, meanSignedError: null },
    ]);
    const lines = text.split('\r\n');
    expect(lines[0]).toBe('group,polls,meanSignedError');
    expect(lines[1]).toBe('"Halloway & Finch, Ltd",3,-0.25');
    expect(lines[2]).toBe(`"'=cmd|""/c calc""",1,`);
  });

  it('keeps the given column order and writes a header even without rows', () => {
    expect(recordsToCsv([{ b: 1, a: 2 }], ['a', 'b']).split('\r\n')).toEqual(['a,b', '2,1']);
    expect(recordsToCsv([], ['n', 'absError'])).toBe('n,absError');
  });
});
