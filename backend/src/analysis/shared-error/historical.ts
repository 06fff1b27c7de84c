/**
 * The interval that past misses of final poll averages support for a new final poll average,
 * and whether a race is too close to call by that standard.
 */
import { quantileSorted } from 'simple-statistics';
import { MetricInputError, requireFinite, requireSample } from '../errors';
import { Z95 } from '../distributions';
import { meanOf } from './internal';

/** Result of {@link historicalAverageInterval}. All in points. */
export interface HistoricalAverageInterval {
  /** Past contests used. */
  readonly n: number;
  /** Mean signed miss (average margin − certified margin): a lean of past averages. */
  readonly meanMiss: number;
  /** Root-mean-square miss √(Σ miss²/n) (around 0, n denominator). */
  readonly rmse: number;
  /** z₀.₉₇₅ · RMSE: the 95% half-width if misses were normal with mean 0 and SD = RMSE. */
  readonly rmseHalfWidth: number;
  /** Empirical 95th percentile of |miss| (linear interpolation between order statistics). */
  readonly empiricalHalfWidth: number;
  /** The larger of the two half-widths: the interval Veracast shows, ± halfWidth. */
  readonly halfWidth: number;
  /** True when n < 20: the empirical percentile is then little more than the largest miss. */
  readonly fewContests: boolean;
}

/**
 * The ± interval, in points, that history supports for a final poll average.
 *
 * From the per-contest misses m_c = (final poll average margin − certified margin) of past
 * contests: RMSE = √(Σm_c²/n); the normal-theory half-width z₀.₉₇₅·RMSE (z = 1.959964) treats
 * misses as N(0, RMSE²), so a lean of past averages widens it rather than being ignored; the
 * empirical half-width is the 95th percentile of |m_c| (simple-statistics `quantileSorted`,
 * linear interpolation between order statistics: R type 7, numpy's default), which needs no
 * normality but is crude with few contests. Veracast reports both and uses the larger, so
 * fat tails in past misses are not hidden by the normal formula.
 *
 * @param pastMisses per-contest misses of past final poll averages (points), at least 2, finite.
 * @throws MetricInputError naming `pastMisses` (fewer than 2 values, not finite).
 * @returns mean miss, RMSE, both half-widths ≥ 0 and the one used.
 * @example
 * historicalAverageInterval([1, -2, 3, -4]) // → rmse 2.738613, rmseHalfWidth 5.367582,
 * //   empiricalHalfWidth 3.85, halfWidth 5.367582
 */
export function historicalAverageInterval(pastMisses: readonly number[]): HistoricalAverageInterval {
  requireSample('pastMisses', pastMisses, 2);
  const n = pastMisses.length;
  const rmse = Math.sqrt(meanOf(pastMisses.map((m) => m * m)));
  const rmseHalfWidth = Z95 * rmse;
  const absSorted = pastMisses.map((m) => Math.abs(m)).sort((a, b) => a - b);
  const empiricalHalfWidth = quantileSorted(absSorted, 0.95);
  return {
    n,
    meanMiss: meanOf(pastMisses),
    rmse,
    rmseHalfWidth,
    empiricalHalfWidth,
    halfWidth: Math.max(rmseHalfWidth, empiricalHalfWidth),
    fewContests: n < 20,
  };
}

/**
 * Whether a final poll average is too close to call given the historical interval: true when
 * the interval margin ± halfWidth reaches 0, i.e. |averageMargin| ≤ halfWidth.
 *
 * @param averageMargin the final poll average margin A − B (points), finite.
 * @param interval a {@link HistoricalAverageInterval} (its `halfWidth` is used) or a half-width
 *   in points, finite and ≥ 0.
 * @throws MetricInputError naming `averageMargin` or `interval` (not finite, negative).
 * @returns true when the leader is within the interval of a tie.
 * @example
 * tooCloseToCall(4.2, 5.367582) // → true;  tooCloseToCall(-6, 5.367582) // → false
 */
export function tooCloseToCall(
  averageMargin: number,
  interval: Pick<HistoricalAverageInterval, 'halfWidth'> | number,
): boolean {
  requireFinite('averageMargin', averageMargin);
  const halfWidth = typeof interval === 'number' ? interval : interval.halfWidth;
  requireFinite('interval', halfWidth);
  if (halfWidth < 0) throw new MetricInputError('interval', 'must be at least 0');
  return Math.abs(averageMargin) <= halfWidth;
}
