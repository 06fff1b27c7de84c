import { describe, expect, it } from 'vitest';
import { applyUndecided } from './undecided';
import { near } from './test-helpers';

const poll = { A: 48, B: 44, other: 2, undecided: 6 };

describe('applyUndecided (METHODS §1)', () => {
  it('raw returns a copy as published', () => {
    const out = applyUndecided(poll, 'raw', 'A', 'B');
    expect(out).toEqual(poll);
    expect(out).not.toBe(poll);
  });

  it('proportional divides every named option by 1 − u and drops undecided', () => {
    const out = applyUndecided(poll, 'proportional', 'A', 'B');
    expect(Object.keys(out)).toEqual(['A', 'B', 'other']);
    near(out.A ?? NaN, 48 / 0.94, 1e-12); // [practice] METHODS §1 table: p_i/(1 − u)
    near(out.other ?? NaN, 2 / 0.94, 1e-12);
    near((out.A ?? 0) + (out.B ?? 0) + (out.other ?? 0), 100, 1e-12);
  });

  it('proportional without an undecided key changes nothing', () => {
    expect(applyUndecided({ A: 50, B: 47 }, 'proportional', 'A', 'B')).toEqual({ A: 50, B: 47 });
  });

  it('two_party keeps A and B only, rescaled to 100', () => {
    const out = applyUndecided(poll, 'two_party', 'A', 'B');
    expect(Object.keys(out).sort()).toEqual(['A', 'B']);
    near(out.A ?? NaN, (100 * 48) / 92, 1e-12); // [practice] METHODS §1 table: q = p_A/(p_A + p_B)
    near((out.A ?? 0) + (out.B ?? 0), 100, 1e-12);
  });
});
