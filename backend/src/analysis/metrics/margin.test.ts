import { describe, expect, it } from 'vitest';
import { lean, shareErrors, signedMarginError, twoPartyShareError, winnerCalled } from './margin';
import { applyUndecided } from './undecided';
import { near } from './test-helpers';

// METHODS.md §1 check cases. [computed]: METHODS.md labels them computed with Debian
// bookworm's Python 3.11 (numpy 1.24.2, scipy 1.10.1) and cross-checked in R 4.2.2.
const cases = [
  {
    name: 'poll A 48, B 44, other 2, undecided 6; result 50.2/47.3/2.5',
    poll: { A: 48, B: 44, other: 2, undecided: 6 },
    result: { A: 50.2, B: 47.3 },
    raw: 1.1, // [computed] METHODS §1
    proportional: 1.355319, // [computed] METHODS §1
    twoParty: 0.686734, // [computed] METHODS §1
    called: true, // [computed] METHODS §1: "yes"
  },
  {
    name: 'poll 47/45, undecided 8; result 48.0/49.5',
    poll: { A: 47, B: 45, undecided: 8 },
    result: { A: 48.0, B: 49.5 },
    raw: 3.5, // [computed] METHODS §1
    proportional: 3.673913, // [computed] METHODS §1
    twoParty: 1.856187, // [computed] METHODS §1
    called: false, // [computed] METHODS §1: "no"
  },
  {
    name: 'poll 46/46, undecided 8; result 50.5/49.5',
    poll: { A: 46, B: 46, undecided: 8 },
    result: { A: 50.5, B: 49.5 },
    raw: -1, // [computed] METHODS §1
    proportional: -1, // [computed] METHODS §1
    twoParty: -0.5, // [computed] METHODS §1
    called: null, // [computed] METHODS §1: "no call"
  },
] as const;

describe('METHODS §1 check cases', () => {
  for (const c of cases) {
    it(c.name, () => {
      const { A: pA, B: pB } = c.poll;
      near(signedMarginError(pA, pB, c.result.A, c.result.B), c.raw);
      const prop = applyUndecided(c.poll, 'proportional', 'A', 'B');
      near(signedMarginError(prop.A ?? NaN, prop.B ?? NaN, c.result.A, c.result.B), c.proportional);
      near(twoPartyShareError(pA, pB, c.result.A, c.result.B), c.twoParty);
      // Winner called takes the certified winner first.
      const [w, r] = c.result.A >= c.result.B ? (['A', 'B'] as const) : (['B', 'A'] as const);
      expect(winnerCalled(c.poll[w], c.poll[r], c.result[w], c.result[r])).toBe(c.called);
    });
  }

  it('the two-party margin error is twice the two-party share error (METHODS §1)', () => {
    for (const c of cases) {
      const tp = applyUndecided(c.poll, 'two_party', 'A', 'B');
      const tr = applyUndecided(c.result, 'two_party', 'A', 'B');
      near(signedMarginError(tp.A ?? NaN, tp.B ?? NaN, tr.A ?? NaN, tr.B ?? NaN), 2 * c.twoParty);
    }
  });
});

describe('lean', () => {
  it('reads the sign, with float residue counted as 0', () => {
    expect(lean(1.1)).toBe('A');
    expect(lean(-1)).toBe('B');
    expect(lean(0)).toBe('none');
    // (47.3 − 44.1) − (50.2 − 47.0) is 0 in exact arithmetic but not in binary floating point.
    const residue = signedMarginError(47.3, 44.1, 50.2, 47.0);
    expect(residue).not.toBe(0);
    expect(lean(residue)).toBe('none');
  });
});

describe('winnerCalled', () => {
  it('is null for a certified tie and for a poll tie', () => {
    expect(winnerCalled(50, 45, 49, 49)).toBeNull();
    expect(winnerCalled(45, 45, 52, 48)).toBeNull();
  });
  it('compares signs, whichever way round the arguments are', () => {
    expect(winnerCalled(40, 45, 48, 52)).toBe(true);
    expect(winnerCalled(46, 45, 48, 52)).toBe(false);
  });
});

describe('shareErrors', () => {
  it('scores every option with a share on both sides, never undecided', () => {
    const errors = shareErrors({ A: 45, B: 41, C: 6, undecided: 8 }, { A: 49.0, B: 44.5, C: 6.5 });
    expect(Object.keys(errors)).toEqual(['A', 'B', 'C']);
    near(errors.A ?? NaN, -4); // [practice] 45 − 49.0, the definition p_i − V_i
    near(errors.C ?? NaN, -0.5); // [practice] 6 − 6.5
  });
  it('scores other only when both sides carry it', () => {
    expect(Object.keys(shareErrors({ A: 50, B: 45, other: 5 }, { A: 52, B: 48 }))).toEqual(['A', 'B']);
    expect(Object.keys(shareErrors({ A: 50, B: 45, other: 5 }, { A: 52, B: 44, other: 4 }))).toEqual([
      'A',
      'B',
      'other',
    ]);
  });
});
