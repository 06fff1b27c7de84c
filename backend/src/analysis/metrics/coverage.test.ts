import { describe, expect, it } from 'vitest';
import { marginCovered, shareCovered } from './coverage';
import { near } from './test-helpers';

describe('shareCovered', () => {
  // Half-width at p 0.5, n 1000 is 3.0990 points: [computed] METHODS §5 share MOE 0.030990.
  it('holds a certified share just inside the interval and misses one just outside', () => {
    const inside = shareCovered(50, 53.09, 1000);
    expect(inside.covered).toBe(true);
    near(inside.upper - 50, 3.099, 1e-4);
    expect(shareCovered(50, 53.11, 1000).covered).toBe(false);
    expect(shareCovered(50, 46.91, 1000).covered).toBe(true);
    expect(shareCovered(50, 46.89, 1000).covered).toBe(false);
  });
  it('uses the effective sample size it is given', () => {
    expect(shareCovered(50, 53.5, 1000).covered).toBe(false);
    expect(shareCovered(50, 53.5, 600).covered).toBe(true); // ±4.0008 points: [computed] METHODS §5, p 0.50 n 600
  });
});

describe('marginCovered', () => {
  // Margin half-width at (0.5, 0.5, 1000) is 6.1980 points: [computed] METHODS §5 margin MOE 0.061980.
  it('uses the multinomial margin interval, about twice the share MOE', () => {
    const c = marginCovered(50, 50, 51.5, 45.4, 1000);
    expect(c.covered).toBe(true); // certified margin 6.1 < 6.198
    near(c.upper, 6.198, 1e-4);
    near(c.lower, -6.198, 1e-4);
    expect(marginCovered(50, 50, 53.15, 46.9, 1000).covered).toBe(false); // 6.25 > 6.198
  });
  it('for (0.48, 0.45, 1000) the half-width is 5.9742 points', () => {
    const c = marginCovered(48, 45, 50, 46, 1000);
    near(c.upper - 3, 5.9742, 1e-4); // [computed] METHODS §5 margin MOE 0.059742
  });
});
