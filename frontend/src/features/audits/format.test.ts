import { describe, expect, it } from 'vitest';
import { formatPoints, formatRate, formatSignedPoints, parseShownNumber } from './format';

describe('audit number formats', () => {
  it('writes signed points with a plus or a true minus sign', () => {
    expect(formatSignedPoints(1.1)).toBe('+1.10');
    expect(formatSignedPoints(-0.5)).toBe('\u22120.50');
    // [practice] a value that rounds to zero shows no sign
    expect(formatSignedPoints(-0.001)).toBe('0.00');
    expect(formatSignedPoints(null)).toBe('—');
  });

  it('writes rates as percentages', () => {
    expect(formatRate(0.8148148)).toBe('81.5%');
    expect(formatRate(null)).toBe('—');
  });

  it('reads back what it writes', () => {
    expect(parseShownNumber(formatSignedPoints(-3.25))).toBe(-3.25);
    expect(parseShownNumber(formatPoints(12.5))).toBe(12.5);
  });
});
