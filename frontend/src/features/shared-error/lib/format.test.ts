import { describe, expect, it } from 'vitest';
import { contestLabel, electionShortLabel, fmtHalfWidth, fmtInterval, fmtNumber, fmtP, fmtPEquals, fmtPercent, fmtSigned } from './format';

describe('number formatting never prints NaN', () => {
  it('answers null for missing and non-finite values', () => {
    for (const bad of [null, undefined, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) {
      expect(fmtNumber(bad)).toBeNull();
      expect(fmtSigned(bad)).toBeNull();
      expect(fmtP(bad)).toBeNull();
      expect(fmtPercent(bad)).toBeNull();
      expect(fmtHalfWidth(bad)).toBeNull();
      expect(fmtInterval(bad, 1)).toBeNull();
      expect(fmtInterval(1, bad)).toBeNull();
    }
  });

  it('uses a typographic minus and always shows the sign of a signed figure', () => {
    // [practice] signs written out so direction never rests on colour; U+2212 is the minus sign
    expect(fmtSigned(-3.4178)).toBe('\u22123.4');
    expect(fmtSigned(2.05, 1)).toBe('+2.1');
    expect(fmtNumber(-0.5, 0)).toBe('\u22121');
    expect(fmtInterval(-5.49, -1.34)).toBe('\u22125.5 to \u22121.3');
  });

  it('never shows a negative zero', () => {
    // [practice] −0.04 rounds to 0.0 at one decimal, which has no direction
    expect(fmtSigned(-0.04)).toBe('0.0');
    expect(fmtNumber(-0.0004, 2)).toBe('0.00');
  });

  it('writes small p-values as a bound', () => {
    // [practice] three decimals; below 0.001 reported as a bound
    expect(fmtP(0.00047)).toBe('< 0.001');
    expect(fmtP(0.0046980250455712635)).toBe('0.005');
    expect(fmtPEquals(0.0136)).toBe('p = 0.014');
    expect(fmtPEquals(0.0002)).toBe('p < 0.001');
  });

  it('formats shares and half-widths', () => {
    expect(fmtPercent(0.4127)).toBe('41%');
    expect(fmtHalfWidth(6.6538)).toBe('±6.7');
    expect(fmtHalfWidth(-1)).toBeNull();
  });
});

describe('labels', () => {
  it('drops the election key from a contest key', () => {
    expect(contestLabel('almerand-2022-general-national', 'almerand-2022-general')).toBe('national');
    expect(contestLabel('other-contest', 'almerand-2022-general')).toBe('other-contest');
    expect(contestLabel('almerand-2022-general-', 'almerand-2022-general')).toBe('almerand-2022-general-');
  });

  it('shortens an election key to its year and kind, or falls back to the name', () => {
    expect(electionShortLabel('almerand-2020-referendum', 'Water referendum')).toBe('2020 referendum');
    expect(electionShortLabel('almerand-2022-general', 'x')).toBe('2022 general');
    expect(electionShortLabel('spring-vote', 'Spring vote')).toBe('Spring vote');
  });
});
