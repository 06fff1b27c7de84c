/**
 * Share records and the conventions every per-poll metric shares.
 *
 * A share record maps option keys to shares in **points** (0–100). Poll records
 * may carry the reserved keys `undecided` (don't know, refused, no answer) and
 * `other`; certified records come from {@link certifiedShares} and never carry
 * `undecided`.
 */
import { MetricInputError, requireFinite } from '../errors';

/** Reserved poll key for don't know / refused / no answer. */
export const UNDECIDED = 'undecided';
/** Reserved poll key for every option the poll does not name. */
export const OTHER = 'other';

/** Shares in points (0–100) keyed by option key. */
export type Shares = Readonly<Record<string, number>>;

/**
 * Differences smaller than this many points are floating-point residue of
 * subtracting shares published to one decimal, and count as exactly 0 when a
 * sign is read (lean, a tie in the poll, a certified tie).
 */
export const TIE_TOLERANCE_PTS = 1e-9;

/**
 * Own-property test that ignores keys inherited from `Object.prototype`.
 * Never throws: anything that is not an object has no shares.
 */
export function hasShare(shares: Shares, key: string): boolean {
  return shares !== null && typeof shares === 'object' && Object.hasOwn(shares, key);
}

/**
 * Throws unless `shares` is a plain record whose every value is a finite number
 * of points in [0, 100]. The parameter named in the error is `<parameter>.<key>`.
 */
export function requireShares(parameter: string, shares: Shares): void {
  if (shares === null || typeof shares !== 'object' || Array.isArray(shares)) {
    throw new MetricInputError(parameter, 'must be an object of shares in points keyed by option key');
  }
  for (const key in shares) {
    if (!Object.hasOwn(shares, key)) continue;
    const value = shares[key];
    // The parameter's name is built only for a value that fails (this runs for every share of every poll).
    if (!(typeof value === 'number' && value >= 0 && value <= 100)) requirePoints(`${parameter}.${key}`, value as number);
  }
}

/**
 * Throws unless `shares` is a plain record of finite values ≥ 0 on any scale
 * (for metrics that rescale the shares to sum to 1 themselves).
 */
export function requireNonNegativeShares(parameter: string, shares: Shares): void {
  if (shares === null || typeof shares !== 'object' || Array.isArray(shares)) {
    throw new MetricInputError(parameter, 'must be an object of shares keyed by option key');
  }
  for (const key in shares) {
    if (!Object.hasOwn(shares, key)) continue;
    const value = shares[key];
    if (typeof value === 'number' && Number.isFinite(value) && value >= 0) continue;
    requireFinite(`${parameter}.${key}`, value as number);
    throw new MetricInputError(`${parameter}.${key}`, 'must be 0 or more');
  }
}

/** Throws unless `x` is a finite number of points in [0, 100]. */
export function requirePoints(parameter: string, x: number): void {
  requireFinite(parameter, x);
  if (x < 0 || x > 100) throw new MetricInputError(parameter, 'must be between 0 and 100 points');
}

/** Returns `shares[key]`, or throws a `MetricInputError` naming `<parameter>.<key>` when it is absent. */
export function requireShare(parameter: string, shares: Shares, key: string): number {
  const value = hasShare(shares, key) ? shares[key] : undefined;
  if (value === undefined) {
    throw new MetricInputError(`${parameter}.${key}`, 'is missing: the record has no share for this option');
  }
  return value;
}

/** Throws unless `key` is a non-empty string. */
export function requireKey(parameter: string, key: string): void {
  if (typeof key !== 'string' || key === '') {
    throw new MetricInputError(parameter, 'must be a non-empty option key');
  }
}

/**
 * The scored set shared by Mosteller's measure 3, the per-option share errors
 * and Arzheimer–Evans' A′: every key other than `undecided` that has a share in
 * both `poll` and `result`. `other` is scored only when both records carry it.
 * Ordered by certified share, largest first, ties by key in code-unit order.
 *
 * @param poll - poll shares (points); validated.
 * @param result - certified shares (points); validated.
 * @throws {MetricInputError} `poll` when no option has a share on both sides.
 * @returns the option keys, never empty.
 * @example scoredSet({ A: 45, B: 41, undecided: 14 }, { A: 51, B: 49 }) // => ['A', 'B']
 */
export function scoredSet(poll: Shares, result: Shares): string[] {
  requireShares('poll', poll);
  requireShares('result', result);
  const keys = Object.keys(poll).filter((k) => k !== UNDECIDED && hasShare(result, k));
  if (keys.length === 0) {
    throw new MetricInputError('poll', 'must share at least one option (other than undecided) with the result');
  }
  return keys.sort((a, b) => {
    const diff = (result[b] ?? 0) - (result[a] ?? 0);
    if (diff !== 0) return diff;
    return a < b ? -1 : a > b ? 1 : 0;
  });
}
