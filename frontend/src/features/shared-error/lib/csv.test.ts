import { describe, expect, it } from 'vitest';
import { neutraliseCell, safeFilename, toCsv } from './csv';

describe('neutraliseCell', () => {
  it('prefixes text a spreadsheet would run as a formula', () => {
    // [practice: OWASP CSV injection] = + - @ tab and carriage return start a formula
    expect(neutraliseCell('=HYPERLINK("x")')).toBe('\'=HYPERLINK("x")');
    expect(neutraliseCell('+1')).toBe("'+1");
    expect(neutraliseCell('-2')).toBe("'-2");
    expect(neutraliseCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(neutraliseCell('\tx')).toBe("'\tx");
    expect(neutraliseCell('Alder Polling')).toBe('Alder Polling');
  });

  it('keeps real numbers as numbers and blanks anything missing or not finite', () => {
    expect(neutraliseCell(-3.4)).toBe(-3.4);
    expect(neutraliseCell(Number.NaN)).toBeNull();
    expect(neutraliseCell(undefined)).toBeNull();
    expect(neutraliseCell(false)).toBe(false);
  });
});

describe('toCsv', () => {
  it('writes a header and one line per row with CRLF endings', () => {
    const rows = [
      { firm: '=Cedar Research', r: -0.35 },
      { firm: 'Birch, Surveys', r: null },
    ];
    const csv = toCsv(rows, [
      { header: 'firm', value: (x) => x.firm },
      { header: 'r', value: (x) => x.r },
    ]);
    expect(csv).toBe('firm,r\r\n\'=Cedar Research,-0.35\r\n"Birch, Surveys",');
  });
});

describe('safeFilename', () => {
  it('keeps letters, digits, dot, dash and underscore', () => {
    expect(safeFilename('audit 3/almerand-2022 general')).toBe('audit-3-almerand-2022-general');
    expect(safeFilename('///')).toBe('export');
  });
});
