import { describe, expect, it } from 'vitest';
import { certifiedShares, referencePair } from './reference-pair';
import { near } from './test-helpers';

const opt = (key: string, bloc: string | null, votes: number) => ({ key, bloc, votes });

describe('referencePair (SPEC §4)', () => {
  it('uses the orientation blocs when both stand, even when A lost', () => {
    const pair = referencePair({
      orientation: ['L', 'R'],
      options: [opt('x', 'R', 520), opt('y', 'L', 480), opt('z', null, 30)],
    });
    expect(pair).toEqual({ refA: 'y', refB: 'x', basis: 'blocs', winner: 'x', runnerUp: 'y' });
  });

  it("takes a bloc's strongest option when several share it", () => {
    const pair = referencePair({
      orientation: ['L', 'R'],
      options: [opt('l1', 'L', 100), opt('l2', 'L', 300), opt('r1', 'R', 250), opt('r2', 'R', 90)],
    });
    expect([pair.refA, pair.refB, pair.basis]).toEqual(['l2', 'r1', 'blocs']);
  });

  it('falls back to the certified top two, winner first, when a bloc is absent', () => {
    const pair = referencePair({
      orientation: ['L', 'R'],
      options: [opt('a', 'L', 300), opt('b', 'G', 450), opt('c', null, 100)],
    });
    expect(pair).toEqual({ refA: 'b', refB: 'a', basis: 'top_two', winner: 'b', runnerUp: 'a' });
  });

  it('uses the top two without orientation', () => {
    expect(referencePair({ orientation: null, options: [opt('a', 'L', 1), opt('b', 'R', 2)] }).refA).toBe('b');
  });

  it('breaks ties in votes by option key in code-unit order', () => {
    const tied = referencePair({ orientation: null, options: [opt('m', null, 50), opt('k', null, 50), opt('z', null, 10)] });
    expect([tied.winner, tied.runnerUp]).toEqual(['k', 'm']);
    const blocTie = referencePair({
      orientation: ['L', 'R'],
      options: [opt('lb', 'L', 40), opt('la', 'L', 40), opt('r', 'R', 20)],
    });
    expect(blocTie.refA).toBe('la');
    // Upper case sorts before lower case in code-unit order.
    expect(referencePair({ orientation: null, options: [opt('a', null, 5), opt('B', null, 5)] }).winner).toBe('B');
  });
});

describe('certifiedShares', () => {
  it('is votes over the sum of all options, in points', () => {
    const s = certifiedShares([opt('a', null, 502), opt('b', null, 473), opt('c', null, 25)]);
    near(s.a ?? NaN, 50.2, 1e-12); // [practice] 100·502/1000
    near(s.b ?? NaN, 47.3, 1e-12);
    near(s.c ?? NaN, 2.5, 1e-12);
  });
  it('allows options with 0 votes', () => {
    expect(certifiedShares([opt('a', null, 10), opt('b', null, 0)])).toEqual({ a: 100, b: 0 });
  });
});
