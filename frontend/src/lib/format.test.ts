import { describe, expect, it } from 'vitest';
import { formatInteger, formatInterval, formatNumber, formatPercent, formatPoints, formatRank, formatSigned } from './format';

// [practice] house style: a true minus sign (U+2212), an em dash for a missing value
describe('number formats', () => {
  it('rounds, writes a true minus sign and never a negative zero', () => {
    expect(formatNumber(3.14159)).toBe('3.1');
    expect(formatNumber(-1.25, 2)).toBe('\u22121.25');
    expect(formatNumber(-0.04)).toBe('0.0');
    expect(formatNumber(Number.NaN)).toBe('—');
  });

  it('signs a figure explicitly, except zero', () => {
    expect(formatSigned(1.23)).toBe('+1.2');
    expect(formatSigned(-0.44)).toBe('\u22120.4');
    expect(formatSigned(0.01)).toBe('0.0');
    expect(formatSigned(null)).toBe('—');
  });

  it('writes shares as percentages, intervals as ranges and tied ranks as halves', () => {
    expect(formatPercent(0.8412)).toBe('84%');
    expect(formatPercent(0.7)).toBe('70%');
    expect(formatPercent(undefined)).toBe('—');
    expect(formatInterval([-1.63, 0.4])).toBe('\u22121.6 to 0.4');
    expect(formatInterval(null)).toBe('—');
    expect(formatRank(2.5)).toBe('2.5');
    expect(formatRank(3)).toBe('3');
  });

  it('groups thousands in counts and writes points with one decimal', () => {
    expect(formatInteger(1234567)).toBe('1,234,567');
    expect(formatInteger(null)).toBe('—');
    expect(formatPoints(37.84)).toBe('37.8');
    expect(formatPoints(40)).toBe('40.0');
    expect(formatPoints(Number.POSITIVE_INFINITY)).toBe('—');
  });
});
