import { describe, expect, it } from 'vitest';
import { mosteller3, mosteller5 } from './mosteller';
import { applyUndecided } from './undecided';
import { near } from './test-helpers';

describe("Mosteller's measures (METHODS §2)", () => {
  it('final 1948 Gallup poll', () => {
    // Inputs [published]: Dewey 49.5 / Truman 44.5 (Time, 8 Nov 1948); result Truman 49.5 / Dewey 45.1.
    const poll = { Dewey: 49.5, Truman: 44.5 };
    const result = { Truman: 49.5, Dewey: 45.1 };
    const m3 = mosteller3(poll, result);
    near(m3.value, 4.7); // [computed] METHODS §2: M3 over the two = 4.7
    expect(m3.scored).toEqual(['Truman', 'Dewey']);
    near(mosteller5(poll.Truman, poll.Dewey, result.Truman, result.Dewey), 9.4); // [computed] METHODS §2: M5 = 9.4
  });

  it('synthetic poll A 45, B 41, C 6, undecided 8; result 49.0 / 44.5 / 6.5', () => {
    const poll = { A: 45, B: 41, C: 6, undecided: 8 };
    const result = { A: 49.0, B: 44.5, C: 6.5 };
    const raw = mosteller3(poll, result);
    near(raw.value, 2.666667); // [computed] METHODS §2: raw M3 (A,B,C)
    expect(raw.scored).toEqual(['A', 'B', 'C']);
    near(mosteller5(poll.A, poll.B, result.A, result.B), 0.5); // [computed] METHODS §2: raw M5
    const prop = applyUndecided(poll, 'proportional', 'A', 'B');
    near(mosteller3(prop, result).value, 0.057971); // [computed] METHODS §2: proportional M3
    near(mosteller5(prop.A ?? NaN, prop.B ?? NaN, result.A, result.B), 0.152174); // [computed] METHODS §2: proportional M5
  });

  it('counts other only when both sides have it, and undecided never', () => {
    expect(mosteller3({ A: 50, B: 40, other: 4, undecided: 6 }, { A: 51, B: 45 }).scored).toEqual(['A', 'B']);
    const withOther = mosteller3({ A: 50, B: 40, other: 4, undecided: 6 }, { A: 51, B: 45, other: 4 });
    expect(withOther.scored).toEqual(['A', 'B', 'other']);
    near(withOther.value, 2); // [practice] (|50−51| + |40−45| + |4−4|)/3 by the definition
  });
});
