import { describe, expect, it } from 'vitest';
import { binValues, chooseBinWidth } from './histogram';

describe('binValues', () => {
  it('counts values into half-open bins on multiples of the width', () => {
    // [practice] bins are [lower, upper): 1.0 belongs to 1–2, not 0–1; −0.5 to −1–0
    const bins = binValues([-0.5, 0.2, 0.9, 1.0, 1.99, 3.5], 1);
    expect(bins.map((b) => [b.lower, b.upper, b.count])).toEqual([
      [-1, 0, 1],
      [0, 1, 2],
      [1, 2, 2],
      [2, 3, 0],
      [3, 4, 1],
    ]);
  });

  it('keeps every value: the counts add up to the finite inputs', () => {
    const values = [-7.25, -3.1, -3.1, 0, 0.01, 2.5, 2.5, 9.75, Number.NaN];
    const bins = binValues(values, 2.5);
    // [practice] the NaN is skipped, the 8 finite values are all counted
    expect(bins.reduce((sum, b) => sum + b.count, 0)).toBe(8);
    expect(bins[0]!.lower).toBe(-7.5);
    // [practice] 9.75 falls in [7.5, 10), the last bin
    expect(bins.at(-1)).toEqual({ lower: 7.5, upper: 10, count: 1 });
  });

  it('prints decimal edges without floating-point noise', () => {
    const bins = binValues([0.1, 0.25, 0.35], 0.1);
    expect(bins.map((b) => b.lower)).toEqual([0.1, 0.2, 0.3]);
  });

  it('returns no bins for no values and refuses a width that is not positive', () => {
    expect(binValues([])).toEqual([]);
    expect(() => binValues([1, 2], 0)).toThrow(RangeError);
  });
});

describe('chooseBinWidth', () => {
  it('picks a nice width giving about √n bins', () => {
    const values = Array.from({ length: 100 }, (_, i) => -10 + (20 * i) / 99);
    // [practice] √100 = 10 target bins over a range of 20 → width 2
    expect(chooseBinWidth(values)).toBe(2);
  });

  it('asks for at least five bins when there are few values', () => {
    // [practice] 4 values → target max(5, 2) = 5 bins over a range of 4 → width 1
    expect(chooseBinWidth([0, 1, 2, 4])).toBe(1);
  });

  it('falls back to 1 point when all values are equal', () => {
    expect(chooseBinWidth([3, 3, 3])).toBe(1);
  });
});
