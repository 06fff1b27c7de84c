/**
 * Undecided treatments (METHODS §1). A setting of every audit: errors made
 * under different treatments are never compared.
 */
import { MetricInputError } from '../errors';
import { UNDECIDED, requireKey, requireShare, requireShares, type Shares } from './shares';

/** `raw` (as published), `proportional` (rescaled over decided) or `two_party` (A and B only). */
export type UndecidedTreatment = 'raw' | 'proportional' | 'two_party';

/** Every treatment, in the order the settings list them. */
export const UNDECIDED_TREATMENTS: readonly UndecidedTreatment[] = ['raw', 'proportional', 'two_party'];

/** Throws unless `treatment` is one of {@link UNDECIDED_TREATMENTS}. */
export function requireTreatment(parameter: string, treatment: UndecidedTreatment): void {
  if (!UNDECIDED_TREATMENTS.includes(treatment)) {
    throw new MetricInputError(parameter, `must be one of ${UNDECIDED_TREATMENTS.join(', ')}`);
  }
}

/**
 * Applies an undecided treatment to shares in points.
 *
 * - `raw`: a copy of the shares as published, `undecided` included.
 * - `proportional`: every named option (every key but `undecided`, `other`
 *   included) becomes p_i · 100/(100 − u), u the undecided share in points
 *   (0 when absent); `undecided` is dropped from the result. This is METHODS'
 *   p_i/(1 − u): shares that did not sum to 100 before still do not after.
 *   A margin is scaled by 100/(100 − u); ratios such as p_A/p_B do not change.
 * - `two_party`: only A and B, as 100·p_A/(p_A + p_B) and 100·p_B/(p_A + p_B).
 *   Apply it to certified shares too, so both sides are two-party.
 *
 * @param shares - points in [0, 100] keyed by option key; never mutated.
 * @param treatment - `raw` | `proportional` | `two_party`.
 * @param refA - key of A, a non-empty string other than `undecided`.
 * @param refB - key of B, different from `refA`.
 * @throws {MetricInputError} `shares.<key>` for a bad share, or for a missing A/B
 *   under `two_party`; `shares.undecided` when it is 100 under `proportional`;
 *   `shares` when A and B are both 0 under `two_party`; `treatment`; `refA`/`refB`.
 * @returns a new record in points.
 * @example applyUndecided({ A: 47, B: 45, undecided: 8 }, 'proportional', 'A', 'B')
 * // => { A: 51.086956…, B: 48.913043… }
 */
export function applyUndecided(
  shares: Shares,
  treatment: UndecidedTreatment,
  refA: string,
  refB: string,
): Record<string, number> {
  requireShares('shares', shares);
  requireTreatment('treatment', treatment);
  requireKey('refA', refA);
  requireKey('refB', refB);
  if (refA === UNDECIDED) throw new MetricInputError('refA', `must not be "${UNDECIDED}"`);
  if (refB === UNDECIDED) throw new MetricInputError('refB', `must not be "${UNDECIDED}"`);
  if (refA === refB) throw new MetricInputError('refB', 'must differ from refA');

  if (treatment === 'raw') return { ...shares };

  if (treatment === 'proportional') {
    const u = Object.hasOwn(shares, UNDECIDED) ? (shares[UNDECIDED] ?? 0) : 0;
    if (u >= 100) {
      throw new MetricInputError(`shares.${UNDECIDED}`, 'must be below 100 points to reallocate it');
    }
    const factor = 100 / (100 - u);
    const out: Record<string, number> = {};
    for (const [key, value] of Object.entries(shares)) {
      if (key !== UNDECIDED) out[key] = value * factor;
    }
    return out;
  }

  const a = requireShare('shares', shares, refA);
  const b = requireShare('shares', shares, refB);
  const ab = a + b;
  if (!(ab > 0)) throw new MetricInputError('shares', `must give ${refA} and ${refB} a positive combined share`);
  return { [refA]: (100 * a) / ab, [refB]: (100 * b) / ab };
}
