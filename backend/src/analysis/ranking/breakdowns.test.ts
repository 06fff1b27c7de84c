import { describe, expect, it } from 'vitest';
import { breakdowns, DAYS_OUT_BINS, SAMPLE_SIZE_BINS, samplingFunnel, UNDECIDED_BINS } from './breakdowns';
import { deepFreeze, expectInputError } from './testHelpers';

interface P {
  signedError: number;
  absMarginError: number;
  daysOut: number | null;
  mode: string | null;
}
const p = (signedError: number, daysOut: number | null, mode: string | null): P => ({
  signedError,
  absMarginError: Math.abs(signedError),
  daysOut,
  mode,
});

const POLLS = deepFreeze([
  p(1, 2, 'phone'),
  p(-3, 3.5, 'online'),
  p(2, 5, 'online'),
  p(4, 7.5, 'ivr'),
  p(0.5, 30, 'phone'),
  p(-1, null, null),
  p(2, -1, 'online'),
]);

describe('breakdowns', () => {
  it('bins by a numeric key with half-open bins and t intervals', () => {
    const r = breakdowns(POLLS, { kind: 'numeric', key: (x) => x.daysOut, bins: DAYS_OUT_BINS });
    expect(r.bins.map((b) => [b.label, b.n])).toEqual([
      ['0–3', 2], // 2 and 3.5 (3.5 < 4)
      ['4–7', 2], // 5 and 7.5
      ['8–14', 0],
      ['15–21', 0],
      ['22+', 1],
    ]);
    expect(r.excluded).toBe(2); // a null key and −1 days (in no bin)
    const first = r.bins[0];
    // [practice] hand: signed 1, −3 → mean −1, s = √8, SE = 2; t_{0.975,1} = 12.706205
    // ([computed] scipy.stats.t.ppf(0.975, 1), scipy 1.10.1) → −1 ± 25.412409
    expect(first?.meanSigned).toBe(-1);
    expect(first?.meanAbs).toBe(2);
    expect(first?.lo as number).toBeCloseTo(-26.412409, 5);
    expect(first?.hi as number).toBeCloseTo(24.412409, 5);
    // [practice] hand: |e| 1, 3 → mean 2, SE 1 → 2 ± 12.706205
    expect(first?.absInterval?.[0] as number).toBeCloseTo(-10.706205, 5);
    // n = 1 → no interval; n = 0 → no means
    expect(r.bins[4]).toMatchObject({ n: 1, meanSigned: 0.5, lo: null, hi: null, absInterval: null });
    expect(r.bins[2]).toMatchObject({ n: 0, meanAbs: null, meanSigned: null, lo: null });
  });

  it('groups by a categorical key: listed order first, then the others sorted', () => {
    const r = breakdowns(POLLS, { kind: 'categorical', key: (x) => x.mode, order: ['phone', 'face'] });
    expect(r.bins.map((b) => [b.label, b.n])).toEqual([
      ['phone', 2],
      ['face', 0],
      ['ivr', 1],
      ['online', 3],
    ]);
    expect(r.excluded).toBe(1);
    // [practice] hand: online signed −3, 2, 2 → mean 1/3; |e| 3, 2, 2 → 7/3
    expect(r.bins[3]?.meanSigned).toBeCloseTo(1 / 3, 12);
    expect(r.bins[3]?.meanAbs).toBeCloseTo(7 / 3, 12);
  });

  it('offers the standard sample-size and undecided bins', () => {
    expect(SAMPLE_SIZE_BINS.map((b) => b.label)).toEqual(['<500', '500–999', '1000–1999', '2000+']);
    expect(UNDECIDED_BINS.map((b) => [b.min, b.max])).toEqual([[0, 5], [5, 10], [10, 15], [15, Infinity]]);
    const r = breakdowns([p(1, 0, null), p(2, 0, null)], {
      kind: 'numeric',
      key: (x) => (x.signedError === 1 ? 499.5 : 1000),
      bins: SAMPLE_SIZE_BINS,
    });
    expect(r.bins.map((b) => b.n)).toEqual([1, 0, 1, 0]);
  });

  it('throws MetricInputError on degenerate input', () => {
    const key = (x: P): number | null => x.daysOut;
    expectInputError(() => breakdowns(null as unknown as P[], { kind: 'numeric', key, bins: DAYS_OUT_BINS }), 'polls');
    expectInputError(() => breakdowns([p(Number.NaN, 1, null)], { kind: 'numeric', key, bins: DAYS_OUT_BINS }), 'polls[0].signedError');
    expectInputError(
      () => breakdowns([{ signedError: 1, absMarginError: -1, daysOut: 1, mode: null }], { kind: 'numeric', key, bins: DAYS_OUT_BINS }),
      'polls[0].absMarginError',
    );
    expectInputError(() => breakdowns(POLLS, { kind: 'numeric', key, bins: [] }), 'spec.bins');
    expectInputError(() => breakdowns(POLLS, { kind: 'numeric', key, bins: [{ label: 'x', min: 3, max: 3 }] }), 'spec.bins[0].max');
    expectInputError(
      () => breakdowns(POLLS, { kind: 'numeric', key, bins: [{ label: 'a', min: 0, max: 5 }, { label: 'b', min: 4, max: 9 }] }),
      'spec.bins[1]',
    );
    expectInputError(() => breakdowns([p(1, Number.NaN, null)], { kind: 'numeric', key, bins: DAYS_OUT_BINS }), 'polls[0].key');
    expectInputError(() => breakdowns([p(1, 1, '')], { kind: 'categorical', key: (x) => x.mode }), 'polls[0].key');
    expectInputError(() => breakdowns(POLLS, { kind: 'categorical', key: (x) => x.mode, order: ['a', 'a'] }), 'spec.order[1]');
    expectInputError(() => breakdowns(POLLS, { kind: 'nope', key } as unknown as { kind: 'numeric'; key: typeof key; bins: [] }), 'spec.kind');
    expectInputError(() => breakdowns(POLLS, null as unknown as { kind: 'categorical'; key: (x: P) => string | null }), 'spec');
  });
});

describe('samplingFunnel', () => {
  it('gives the half-normal mean of the 50/50 margin error', () => {
    const [pt] = samplingFunnel(deepFreeze([1000]));
    // [practice] hand: SE = 100/√1000 = 3.162278 pts; E|X| = SE·√(2/π) = 2.523133;
    // [computed] scipy.stats.halfnorm.mean(scale=3.162278) = 2.523133 (reference.json samplingFunnel)
    expect(pt?.marginSe).toBeCloseTo(3.162278, 6);
    expect(pt?.expectedAbsMarginError).toBeCloseTo(2.523133, 6);
    // [computed] METHODS §5: margin MOE at (0.5, 0.5, 1000) = 0.061980 → 6.1980 pts
    expect(pt?.marginMoe95).toBeCloseTo(6.198, 3);
  });

  it('shrinks as 1/√n and grows with a design effect', () => {
    const [a, b] = samplingFunnel([400, 1600]);
    expect((a?.expectedAbsMarginError as number) / (b?.expectedAbsMarginError as number)).toBeCloseTo(2, 12);
    const [d] = samplingFunnel([1000], { deff: 2 });
    expect(d?.nEff).toBe(500);
    expect(d?.marginSe).toBeCloseTo(100 / Math.sqrt(500), 12);
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => samplingFunnel([]), 'nValues');
    expectInputError(() => samplingFunnel([100, 0]), 'nValues[1]');
    expectInputError(() => samplingFunnel([Number.NaN]), 'nValues[0]');
    expectInputError(() => samplingFunnel([100], { deff: 0 }), 'options.deff');
  });
});
