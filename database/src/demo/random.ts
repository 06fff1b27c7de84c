/**
 * Seeded randomness for the demo scenario and the benchmark archive.
 *
 * Every draw comes from seedrandom's ARC4 generator (seedrandom 3.0.5), which yields the same
 * sequence for the same seed string on every platform. Normal draws use the Box–Muller transform;
 * it needs `Math.log`, `Math.sqrt`, `Math.cos` and `Math.sin`, which V8 implements in its own
 * portable code (an fdlibm port), so Node gives the same bits on every machine.
 *
 * Each part of the generator takes its own stream (`createRng(seed + '/results/' + key)` and so
 * on), so changing how many draws one part makes never shifts the numbers of another part.
 */
import seedrandom from 'seedrandom';

export interface Rng {
  /** Uniform on [0, 1). */
  next(): number;
  /** Uniform on [lo, hi). */
  uniform(lo: number, hi: number): number;
  /** Uniform integer on lo..hi, both ends included. */
  int(lo: number, hi: number): number;
  /** Normal draw with the given mean and standard deviation. */
  normal(mean?: number, sd?: number): number;
  /** True with probability p. */
  chance(p: number): boolean;
  /** One item, each equally likely. Throws on an empty list. */
  pick<T>(items: readonly T[]): T;
  /** One item with probability proportional to its weight (weights ≥ 0, at least one > 0). */
  weighted<T>(items: readonly T[], weights: readonly number[]): T;
}

export function createRng(seed: string): Rng {
  const prng = seedrandom(seed);
  let spare: number | undefined;

  const next = (): number => prng();

  const standardNormal = (): number => {
    if (spare !== undefined) {
      const z = spare;
      spare = undefined;
      return z;
    }
    const u1 = 1 - prng(); // (0, 1]: keeps log finite
    const u2 = prng();
    const r = Math.sqrt(-2 * Math.log(u1));
    const angle = 2 * Math.PI * u2;
    spare = r * Math.sin(angle);
    return r * Math.cos(angle);
  };

  const pick = <T>(items: readonly T[]): T => {
    if (items.length === 0) throw new RangeError('pick: empty list');
    return items[Math.floor(prng() * items.length)] as T;
  };

  const weighted = <T>(items: readonly T[], weights: readonly number[]): T => {
    if (items.length === 0 || items.length !== weights.length) {
      throw new RangeError('weighted: items and weights must be non-empty and of equal length');
    }
    let total = 0;
    for (const w of weights) total += w;
    if (!(total > 0)) throw new RangeError('weighted: weights must sum to a positive number');
    let target = prng() * total;
    for (let i = 0; i < items.length; i += 1) {
      target -= weights[i] as number;
      if (target < 0) return items[i] as T;
    }
    return items[items.length - 1] as T;
  };

  return {
    next,
    uniform: (lo, hi) => lo + (hi - lo) * prng(),
    int: (lo, hi) => lo + Math.floor(prng() * (hi - lo + 1)),
    normal: (mean = 0, sd = 1) => mean + sd * standardNormal(),
    chance: (p) => prng() < p,
    pick,
    weighted,
  };
}

/**
 * Splits an integer total into integer parts proportional to `weights` (largest-remainder
 * method), so the parts always add up to `total` exactly. Ties go to the earlier item.
 */
export function apportion(total: number, weights: readonly number[]): number[] {
  let sum = 0;
  for (const w of weights) sum += w;
  if (weights.length === 0 || !(sum > 0)) return weights.map(() => 0);
  const exact = weights.map((w) => (total * w) / sum);
  const parts = exact.map((x) => Math.floor(x));
  let left = total - parts.reduce((a, b) => a + b, 0);
  const order = exact
    .map((x, i) => ({ i, rem: x - Math.floor(x) }))
    .sort((a, b) => b.rem - a.rem || a.i - b.i);
  for (let k = 0; left > 0; k = (k + 1) % order.length, left -= 1) {
    const slot = order[k];
    if (slot) parts[slot.i] = (parts[slot.i] ?? 0) + 1;
  }
  return parts;
}
