import { describe, expect, it } from 'vitest';
import { MetricInputError } from '../errors';
import { computePollMetrics, preparePollContest, type PollMetrics } from './poll-metrics';
import { mtkAccuracy } from './mtk';
import { nEffFromStatedMoe } from './sampling';
import { buildContest, buildPoll, expectInputError, near } from './test-helpers';

const raw = { undecided: 'raw', designEffect: 1 } as const;
const proportional = { undecided: 'proportional', designEffect: 1 } as const;
const twoParty = { undecided: 'two_party', designEffect: 1 } as const;

const opt = (key: string, bloc: string | null, votes: number) => ({ key, bloc, votes });

describe('computePollMetrics on the METHODS §1 check cases', () => {
  it('poll A 48, B 44, other 2, undecided 6; result 50.2/47.3/2.5', () => {
    const contest = buildContest({ options: [opt('A', 'left', 502), opt('B', 'right', 473), opt('other', null, 25)] });
    const poll = buildPoll({ shares: { A: 48, B: 44, other: 2, undecided: 6 } });
    const r = computePollMetrics(poll, contest, raw);
    expect([r.refA, r.refB, r.refBasis]).toEqual(['A', 'B', 'top_two']);
    near(r.marginError, 1.1); // [computed] METHODS §1: raw e +1.100000
    near(r.absMarginError, 1.1);
    expect(r.lean).toBe('A');
    near(r.twoPartyShareError, 0.686734); // [computed] METHODS §1
    expect(r.winnerCalled).toBe(true); // [computed] METHODS §1: called yes
    expect(r.mosteller3Set).toEqual(['A', 'B', 'other']);
    expect(r.undecidedShare).toBe(6);
    const p = computePollMetrics(poll, contest, proportional);
    near(p.marginError, 1.355319); // [computed] METHODS §1: proportional e +1.355319
    near(p.twoPartyShareError, 0.686734); // [computed] METHODS §1, unchanged by the treatment
    const t = computePollMetrics(poll, contest, twoParty);
    near(t.marginError, 2 * 0.686734, 2e-6); // [computed] METHODS §1: two-party margin error = 2 × share error
    expect(t.mosteller3Set).toEqual(['A', 'B']);
  });

  it('poll 47/45, undecided 8; result 48.0/49.5 (A oriented by bloc, lost)', () => {
    const contest = buildContest({
      orientation: ['left', 'right'],
      options: [opt('A', 'left', 480), opt('B', 'right', 495), opt('C', null, 25)],
    });
    const poll = buildPoll({ shares: { A: 47, B: 45, undecided: 8 } });
    const r = computePollMetrics(poll, contest, raw);
    expect([r.refA, r.refB, r.refBasis, r.winner]).toEqual(['A', 'B', 'blocs', 'B']);
    near(r.marginError, 3.5); // [computed] METHODS §1
    near(r.twoPartyShareError, 1.856187); // [computed] METHODS §1
    expect(r.winnerCalled).toBe(false); // [computed] METHODS §1: called no
    near(computePollMetrics(poll, contest, proportional).marginError, 3.673913); // [computed] METHODS §1
  });

  it('poll 46/46, undecided 8; result 50.5/49.5 is no call', () => {
    const contest = buildContest({ options: [opt('A', 'left', 505), opt('B', 'right', 495)] });
    const poll = buildPoll({ shares: { A: 46, B: 46, undecided: 8 } });
    const r = computePollMetrics(poll, contest, raw);
    near(r.marginError, -1); // [computed] METHODS §1
    expect(r.lean).toBe('B');
    near(r.twoPartyShareError, -0.5); // [computed] METHODS §1
    expect(r.winnerCalled).toBeNull(); // [computed] METHODS §1: no call
    expect(r.notes.join(' ')).toMatch(/no call/);
    near(computePollMetrics(poll, contest, proportional).marginError, -1); // [computed] METHODS §1
  });
});

describe('computePollMetrics on the METHODS §2–4 check cases', () => {
  it('final 1948 Gallup poll: M3 4.7, M5 9.4', () => {
    // Inputs [published]: poll Dewey 49.5 / Truman 44.5 (Time, 8 Nov 1948); result Truman 49.5 / Dewey 45.1.
    const contest = buildContest({ options: [opt('Truman', 'D', 495), opt('Dewey', 'R', 451), opt('rest', null, 54)] });
    const r = computePollMetrics(buildPoll({ shares: { Dewey: 49.5, Truman: 44.5 } }), contest, raw);
    near(r.mosteller3, 4.7); // [computed] METHODS §2
    expect(r.mosteller3Set).toEqual(['Truman', 'Dewey']);
    near(r.mosteller5, 9.4); // [computed] METHODS §2
    expect(r.winnerCalled).toBe(false);
  });

  it('synthetic A 45, B 41, C 6, undecided 8 under raw and proportional', () => {
    const contest = buildContest({ options: [opt('A', null, 490), opt('B', null, 445), opt('C', null, 65)] });
    const poll = buildPoll({ shares: { A: 45, B: 41, C: 6, undecided: 8 } });
    const r = computePollMetrics(poll, contest, raw);
    near(r.mosteller3, 2.666667); // [computed] METHODS §2
    near(r.mosteller5, 0.5); // [computed] METHODS §2
    const p = computePollMetrics(poll, contest, proportional);
    near(p.mosteller3, 0.057971); // [computed] METHODS §2
    near(p.mosteller5, 0.152174); // [computed] METHODS §2
  });

  it('MTK: poll R 44, D 46, undecided 10, n 1000; result 48.0/50.0, the same under every treatment', () => {
    const contest = buildContest({
      orientation: ['r', 'd'],
      options: [opt('R', 'r', 480), opt('D', 'd', 500), opt('X', null, 20)],
    });
    const poll = buildPoll({ n: 1000, shares: { R: 44, D: 46, undecided: 10 } });
    for (const settings of [raw, proportional, twoParty]) {
      const r = computePollMetrics(poll, contest, settings);
      near(r.mtkA, -0.00363); // [computed] METHODS §3
      near(r.mtkSe, 0.066683); // [computed] METHODS §3
      near(r.mtkZ, -0.054433); // [computed] METHODS §3
      near(r.mtkP, 0.95659); // [computed] METHODS §3
    }
  });

  it('MTK: poll 40/52, n 800; result 47/49', () => {
    const contest = buildContest({ options: [opt('a', null, 470), opt('b', null, 490), opt('c', null, 40)], orientation: null });
    const r = computePollMetrics(buildPoll({ n: 800, shares: { a: 40, b: 52 } }), contest, raw);
    // Top two puts b first, so A here is b: the METHODS value with its sign flipped.
    expect(r.refA).toBe('b');
    near(r.mtkA, 0.220692); // [computed] METHODS §3: A = −0.220692 with a as A
    near(r.mtkSe, 0.074356); // [computed] METHODS §3
    near(r.mtkP, 0.002997); // [computed] METHODS §3
  });

  it('A′, B, B_w, χ², G² for result 30/40/30, poll 40/40/20, n 1000', () => {
    const contest = buildContest({ options: [opt('a', null, 300), opt('b', null, 400), opt('c', null, 300)] });
    const r = computePollMetrics(buildPoll({ n: 1000, shares: { a: 40, b: 40, c: 20 } }), contest, raw);
    near(r.aePrime?.a ?? NaN, 0.441833); // [computed] METHODS §4
    near(r.aePrime?.b ?? NaN, 0); // [computed] METHODS §4
    near(r.aePrime?.c ?? NaN, -0.538997); // [computed] METHODS §4
    near(r.aeB, 0.326943); // [computed] METHODS §4
    near(r.aeBw, 0.294249); // [computed] METHODS §4
    near(r.aeChi2, 66.666667); // [computed] METHODS §4, scipy.stats.chisquare
    near(r.aeG2, 67.959615); // [computed] METHODS §4, scipy.stats.power_divergence
    expect(r.aeDf).toBe(2);
    expect(r.aeChi2P).toBeLessThan(1e-10);
  });
});

describe('computePollMetrics sample sizes and coverage', () => {
  const contest = buildContest({ options: [opt('A', null, 502), opt('B', null, 473), opt('C', null, 25)] });

  it('uses the stated MOE for the intervals and n/designEffect for MTK', () => {
    const poll = buildPoll({ n: 1000, moe: 2.0 });
    const r = computePollMetrics(poll, contest, { undecided: 'raw', designEffect: 2 });
    expect(r.nEffBasis).toBe('stated_moe');
    near(r.nEff, nEffFromStatedMoe(2.0), 1e-9);
    expect(r.nDesign).toBe(500);
    const direct = mtkAccuracy({ pollA: 48, pollB: 44, resultA: 50.2, resultB: 47.3, n: 500 });
    near(r.mtkSe, direct.se, 1e-12);
  });

  it('falls back to n/designEffect for the intervals without a stated MOE', () => {
    const r = computePollMetrics(buildPoll({ n: 900, moe: null }), contest, { undecided: 'raw', designEffect: 1.5 });
    expect(r.nEffBasis).toBe('design_effect');
    near(r.nEff, 600, 1e-9);
  });

  it('checks coverage on the treated shares', () => {
    // Raw A 48 misses 50.2 only when the interval is narrow; proportional A 51.06 covers it.
    const poll = buildPoll({ n: 5000 });
    const r = computePollMetrics(poll, contest, raw);
    expect(r.shareCovered).toBe(false);
    expect(r.shareInterval?.[1]).toBeLessThan(50.2);
    const p = computePollMetrics(poll, contest, proportional);
    expect(p.shareCovered).toBe(true);
    expect(p.marginCovered).toBe(true);
  });

  it('reports days out from the fieldwork midpoint and end', () => {
    const r = computePollMetrics(buildPoll({ fieldworkStart: '2026-04-28', fieldworkEnd: '2026-05-01' }), contest, raw);
    // [computed] Python 3.11 datetime: date(2026,5,10) − date(2026,4,28) = 12 days, − date(2026,5,1) = 9 days.
    expect(r.daysOut).toBe(10.5);
    expect(r.daysOutEnd).toBe(9);
  });
});

describe('computePollMetrics: undefined metrics are null with a note, never NaN', () => {
  const hasNaN = (r: PollMetrics): boolean =>
    JSON.stringify(r, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? 'NaN!' : v)).includes('NaN!');

  it('a poll giving B 0: MTK and A′ are null', () => {
    const contest = buildContest({ options: [opt('A', null, 600), opt('B', null, 400)] });
    const r = computePollMetrics(buildPoll({ shares: { A: 60, B: 0, undecided: 40 } }), contest, raw);
    expect(r.mtkA).toBeNull();
    expect(r.mtkSe).toBeNull();
    expect(r.aePrime).toBeNull();
    expect(r.aeB).toBeNull();
    expect(r.aeMerges).toEqual(['B into A+B']);
    near(r.twoPartyShareError, 40); // [practice] 100·(60/60 − 60/100)
    expect(r.notes.some((n) => n.includes('MTK'))).toBe(true);
    expect(r.notes.some((n) => n.includes('A′ and B need'))).toBe(true);
    expect(hasNaN(r)).toBe(false);
  });

  it('pools an empty minor option and still scores A′', () => {
    const contest = buildContest({ options: [opt('A', null, 500), opt('B', null, 450), opt('C', null, 30), opt('D', null, 20)] });
    const r = computePollMetrics(buildPoll({ shares: { A: 50, B: 46, C: 4, D: 0 } }), contest, raw);
    expect(Object.keys(r.aePrime ?? {})).toEqual(['A', 'B', 'C+D']);
    expect(r.notes.some((n) => n.includes('pooled'))).toBe(true);
  });

  it('a bloc pair that is not the top two: M5 and winner called need the top two', () => {
    const contest = buildContest({
      orientation: ['L', 'R'],
      options: [opt('x', 'L', 300), opt('y', 'R', 280), opt('z', 'G', 420)],
    });
    const withZ = computePollMetrics(buildPoll({ shares: { x: 30, y: 28, z: 40 } }), contest, twoParty);
    expect(withZ.mosteller5).toBeNull();
    expect(withZ.winnerCalled).toBe(true);
    const withoutZ = computePollMetrics(buildPoll({ shares: { x: 50, y: 45 } }), contest, raw);
    expect(withoutZ.mosteller5).toBeNull();
    expect(withoutZ.winnerCalled).toBeNull();
    expect(withoutZ.notes.length).toBeGreaterThanOrEqual(2);
  });

  it('notes poll options without a certified result and fieldwork after election day', () => {
    const contest = buildContest();
    const r = computePollMetrics(
      buildPoll({ shares: { A: 48, B: 44, Q: 2, other: 2 }, fieldworkStart: '2026-05-09', fieldworkEnd: '2026-05-11' }),
      contest,
      raw,
    );
    expect(r.mosteller3Set).toEqual(['A', 'B']);
    expect(r.notes.some((n) => n.includes('"Q"'))).toBe(true);
    expect(r.notes.some((n) => n.includes('"other"'))).toBe(true);
    expect(r.notes.some((n) => n.includes('after election day'))).toBe(true);
  });

  it('throws naming shares.<key> when the poll has no share for A or B', () => {
    const contest = buildContest();
    expectInputError(() => computePollMetrics(buildPoll({ shares: { A: 48, C: 3 } }), contest, raw), 'shares.B');
    expectInputError(() => computePollMetrics(buildPoll({ shares: { B: 48, C: 3 } }), contest, raw), 'shares.A');
    expect(() => computePollMetrics(buildPoll({ shares: { A: 48 } }), contest, raw)).toThrow(MetricInputError);
  });
});

describe('preparePollContest', () => {
  // [practice] preparing a contest once for many polls must not change any metric.
  const contests = [
    buildContest({ options: [opt('A', 'left', 502), opt('B', 'right', 473), opt('other', null, 25)] }),
    buildContest({ orientation: ['left', 'right'], options: [opt('A', 'left', 480), opt('B', 'right', 495), opt('C', null, 25)] }),
    buildContest({ options: [opt('yes', null, 505), opt('no', null, 495)] }),
  ];
  const polls = [
    buildPoll({ shares: { A: 48, B: 44, other: 2, undecided: 6 } }),
    buildPoll({ shares: { A: 47, B: 45, undecided: 8 }, moe: 3.1 }),
    buildPoll({ shares: { A: 0, B: 45, C: 3, undecided: 2 } }),
    buildPoll({ shares: { yes: 46, no: 46, undecided: 8 } }),
  ];

  it('gives the same metrics as the contest itself, under every treatment', () => {
    for (const contest of contests) {
      const prepared = preparePollContest(contest);
      for (const poll of polls) {
        for (const settings of [raw, proportional, twoParty, { undecided: 'raw', designEffect: 1.8 } as const]) {
          let direct: PollMetrics | string;
          try {
            direct = computePollMetrics(poll, contest, settings);
          } catch (err) {
            direct = (err as Error).message;
          }
          let viaPrepared: PollMetrics | string;
          try {
            viaPrepared = computePollMetrics(poll, prepared, settings);
          } catch (err) {
            viaPrepared = (err as Error).message;
          }
          expect(viaPrepared).toStrictEqual(direct);
        }
      }
    }
  });

  it('refuses a contest as computePollMetrics does, naming the field', () => {
    const bad = buildContest({ options: [opt('A', null, 10)] });
    let direct: unknown;
    try {
      computePollMetrics(polls[0]!, bad, raw);
    } catch (err) {
      direct = err;
    }
    expect(direct).toBeInstanceOf(MetricInputError);
    expect(() => preparePollContest(bad)).toThrow((direct as Error).message);
  });

  it('never changes the contest it was given', () => {
    const contest = contests[0]!;
    const before = JSON.stringify(contest);
    const prepared = preparePollContest(contest);
    computePollMetrics(polls[0]!, prepared, twoParty);
    expect(JSON.stringify(contest)).toBe(before);
    expect(Object.isFrozen(Object.getOwnPropertySymbols(prepared).map((s) => (prepared as unknown as Record<symbol, unknown>)[s])[0])).toBe(true);
  });
});
