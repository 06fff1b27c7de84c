import { describe, expect, it } from 'vitest';
import { csvCell, toCsv } from './chart-export';

describe('csvCell', () => {
  it('neutralises text a spreadsheet would run as a formula', () => {
    // [practice] OWASP CSV injection guidance: prefix = + - @ with an apostrophe
    expect(csvCell('=SUM(A1)')).toBe("'=SUM(A1)");
    expect(csvCell('+1')).toBe("'+1");
    expect(csvCell('-2')).toBe("'-2");
    expect(csvCell('@cmd')).toBe("'@cmd");
  });

  it('leaves numbers as numbers, negative ones included', () => {
    expect(csvCell(-1.25)).toBe('-1.25');
    expect(csvCell(Number.NaN)).toBe('');
    expect(csvCell(null)).toBe('');
  });

  it('quotes cells with commas, quotes or line breaks', () => {
    expect(csvCell('Birch, Hale & Co')).toBe('"Birch, Hale & Co"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
  });
});

describe('toCsv', () => {
  it('writes a header and one line per row', () => {
    const text = toCsv(
      [
        { header: 'lower', value: (r: { lower: number; count: number }) => r.lower },
        { header: 'count', value: (r) => r.count },
      ],
      [
        { lower: -1, count: 2 },
        { lower: 0, count: 5 },
      ],
    );
    expect(text).toBe('lower,count\r\n-1,2\r\n0,5\r\n');
  });
});
