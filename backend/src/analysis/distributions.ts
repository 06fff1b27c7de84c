/**
 * Distribution functions used by the statistics core, taken from the maintained
 * @stdlib packages (never written by hand). Thin wrappers give them plain names.
 */
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import tCdf from '@stdlib/stats-base-dists-t-cdf';
import tQuantile from '@stdlib/stats-base-dists-t-quantile';
import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import fCdf from '@stdlib/stats-base-dists-f-cdf';

/** Standard normal CDF Φ(x). */
export const phi = (x: number): number => normalCdf(x, 0, 1);
/** Standard normal quantile Φ⁻¹(p). */
export const phiInv = (p: number): number => normalQuantile(p, 0, 1);
/** z = Φ⁻¹(0.975) ≈ 1.959964, the two-sided 95% normal critical value. */
export const Z95 = phiInv(0.975);
/** Two-sided p-value of a standard normal statistic. */
export const normalTwoSidedP = (z: number): number => 2 * (1 - phi(Math.abs(z)));
/** Student t CDF with `df` degrees of freedom. */
export const studentTCdf = (t: number, df: number): number => tCdf(t, df);
/** Student t quantile. */
export const studentTQuantile = (p: number, df: number): number => tQuantile(p, df);
/** Two-sided p-value of a t statistic on `df` degrees of freedom. */
export const tTwoSidedP = (t: number, df: number): number => 2 * (1 - tCdf(Math.abs(t), df));
/** Upper-tail p-value of a χ² statistic on `df` degrees of freedom. */
export const chiSquareUpperP = (x: number, df: number): number => 1 - chisquareCdf(x, df);
/** Upper-tail p-value of an F statistic on (d1, d2) degrees of freedom. */
export const fUpperP = (x: number, d1: number, d2: number): number => 1 - fCdf(x, d1, d2);
