/**
 * Normality diagnostics for poll errors, shown beside a Q–Q plot: Shapiro–Wilk (Royston),
 * Jarque–Bera and Anderson–Darling, plus the Q–Q points themselves.
 *
 * Errors of polls in one contest are not independent, so these p-values are descriptive:
 * they say whether the pooled errors look normal, not a formal test on independent draws.
 */
import { mean, sampleVariance, sumNthPowerDeviations } from 'simple-statistics';
import { MetricInputError, requireSample } from '../errors';
import { chiSquareUpperP, phi, phiInv } from '../distributions';
import { requireSpread } from './internal';

/** Smallest and largest sample handled by the normality functions. */
export const NORMALITY_MIN_N = 3;
/** Largest n for which Royston's Shapiro–Wilk approximation is valid. */
export const SHAPIRO_MAX_N = 5000;

function validateSample(x: readonly number[]): void {
  requireSample('x', x, NORMALITY_MIN_N);
  requireSpread('x', x);
}

/** Polynomial c₀ + c₁t + c₂t² + … by Horner's rule. */
function poly(c: readonly number[], t: number): number {
  let r = 0;
  for (let i = c.length - 1; i >= 0; i--) r = r * t + (c[i] as number);
  return r;
}

// Coefficients of Royston (1995), Applied Statistics 44:547–551, algorithm AS R94.
const SW_A1 = [0, 0.221157, -0.147981, -2.07119, 4.434685, -2.706056];
const SW_A2 = [0, 0.042981, -0.293762, -1.752461, 5.682633, -3.582633];
const SW_SMALL_MEAN = [0.544, -0.39978, 0.025054, -6.714e-4];
const SW_SMALL_LOGSD = [1.3822, -0.77857, 0.062767, -0.0020322];
const SW_LARGE_MEAN = [-1.5861, -0.31082, -0.083751, 0.0038915];
const SW_LARGE_LOGSD = [-0.4803, -0.082676, 0.0030302];
const SW_SMALL_GAMMA = [-2.273, 0.459];

/** Result of {@link shapiroWilk}. */
export interface ShapiroWilkResult {
  readonly n: number;
  /** W in (0, 1]; values near 1 are consistent with normality. */
  readonly w: number;
  /** Royston's approximate p-value (upper tail of the normalising transform), in [0, 1]. */
  readonly p: number;
}

/**
 * Royston's coefficients a_i for the smallest ⌊n/2⌋ order statistics (positive numbers; the
 * full vector is antisymmetric, −a_i for the i-th smallest and +a_i for the i-th largest).
 */
function shapiroCoefficients(n: number): number[] {
  const half = Math.floor(n / 2);
  if (n === 3) return [Math.SQRT1_2];
  const m: number[] = [];
  for (let i = 1; i <= half; i++) m.push(phiInv((i - 0.375) / (n + 0.25)));
  const summ2 = 2 * m.reduce((s, v) => s + v * v, 0);
  const ssumm2 = Math.sqrt(summ2);
  const rsn = 1 / Math.sqrt(n);
  const m1 = m[0] as number;
  const a1 = poly(SW_A1, rsn) - m1 / ssumm2;
  const a = m.map((v) => -v);
  let first: number;
  let fac: number;
  if (n > 5) {
    const m2 = m[1] as number;
    const a2 = -m2 / ssumm2 + poly(SW_A2, rsn);
    fac = Math.sqrt((summ2 - 2 * m1 * m1 - 2 * m2 * m2) / (1 - 2 * a1 * a1 - 2 * a2 * a2));
    a[1] = a2;
    first = 2;
  } else {
    fac = Math.sqrt((summ2 - 2 * m1 * m1) / (1 - 2 * a1 * a1));
    first = 1;
  }
  a[0] = a1;
  for (let i = first; i < half; i++) a[i] = (a[i] as number) / fac;
  return a;
}

/**
 * Shapiro–Wilk W test of normality by Royston's algorithm (AS R94, 1995).
 *
 * W = (Σ a_i x_(i))² / Σ(x − x̄)² with Royston's polynomial approximations to the coefficients
 * (computed as a squared correlation for accuracy near 1). p-value: for n = 3 the exact
 * p = (6/π)(asin √W − asin √¾); for 4 ≤ n ≤ 11, −ln(γ − ln(1 − W)) with γ = −2.273 + 0.459n is
 * taken as normal with mean and log-SD cubic in n; for n ≥ 12, ln(1 − W) is taken as normal
 * with mean cubic and log-SD quadratic in ln n; p is the upper tail. When 4 ≤ n ≤ 11 and
 * ln(1 − W) ≥ γ the approximation has no tail left and p = 1e-99, as in AS R94. Agrees with
 * R `shapiro.test` and `scipy.stats.shapiro` (which computes in single precision, so it agrees
 * to about 1e-6).
 *
 * @param x finite values, 3 ≤ n ≤ 5000, not all equal (unsorted is fine; not mutated).
 * @throws MetricInputError naming `x` (fewer than 3 or more than 5000 values, not finite,
 *   zero variance).
 * @returns n, W in (0, 1], p in [0, 1].
 * @example
 * shapiroWilk([-2.1, -0.8, 0.3, 1.2, 2.5, 0.0, 0.7, -1.5, 3.9, 1.1, -0.4, 5.2])
 * // → w 0.948575, p 0.616248
 */
export function shapiroWilk(x: readonly number[]): ShapiroWilkResult {
  validateSample(x);
  const n = x.length;
  if (n > SHAPIRO_MAX_N) throw new MetricInputError('x', `must hold at most ${SHAPIRO_MAX_N} values`);
  const sorted = [...x].sort((p, q) => p - q);
  const a = shapiroCoefficients(n);
  const coef = sorted.map((_, i) => {
    const mirror = n - 1 - i;
    if (i === mirror) return 0;
    const ai = a[Math.min(i, mirror)] as number;
    return i < mirror ? -ai : ai;
  });
  const range = (sorted[n - 1] as number) - (sorted[0] as number);
  const meanCoef = mean(coef);
  const meanScaled = mean(sorted.map((v) => v / range));
  let ssa = 0;
  let ssx = 0;
  let sax = 0;
  for (let i = 0; i < n; i++) {
    const da = (coef[i] as number) - meanCoef;
    const dx = (sorted[i] as number) / range - meanScaled;
    ssa += da * da;
    ssx += dx * dx;
    sax += da * dx;
  }
  const root = Math.sqrt(ssa * ssx);
  const oneMinusW = Math.max(0, ((root - sax) * (root + sax)) / (ssa * ssx));
  const w = 1 - oneMinusW;
  return { n, w, p: shapiroP(n, w, oneMinusW) };
}

function shapiroP(n: number, w: number, oneMinusW: number): number {
  if (n === 3) {
    const p = (6 / Math.PI) * (Math.asin(Math.sqrt(w)) - Math.PI / 3);
    return Math.min(1, Math.max(0, p));
  }
  if (oneMinusW <= 0) return 1;
  let y = Math.log(oneMinusW);
  let mu: number;
  let sd: number;
  if (n <= 11) {
    const gamma = poly(SW_SMALL_GAMMA, n);
    if (y >= gamma) return 1e-99;
    y = -Math.log(gamma - y);
    mu = poly(SW_SMALL_MEAN, n);
    sd = Math.exp(poly(SW_SMALL_LOGSD, n));
  } else {
    const ln = Math.log(n);
    mu = poly(SW_LARGE_MEAN, ln);
    sd = Math.exp(poly(SW_LARGE_LOGSD, ln));
  }
  return phi(-(y - mu) / sd);
}

/** Result of {@link jarqueBera}. */
export interface JarqueBeraResult {
  readonly n: number;
  /** JB = n/6 · [S² + (K − 3)²/4] ≥ 0. */
  readonly statistic: number;
  /** Upper-tail χ² p-value on 2 df (asymptotic; poor for small n). */
  readonly p: number;
  /** Biased sample skewness S = m₃/m₂^{3/2} (moments with n denominators). */
  readonly skewness: number;
  /** Biased sample kurtosis K = m₄/m₂² (not excess; 3 for a normal). */
  readonly kurtosis: number;
}

/**
 * Jarque–Bera test of normality from skewness and kurtosis (Jarque & Bera 1987,
 * *International Statistical Review* 55:163–172).
 *
 * m_r = Σ(x − x̄)^r / n (simple-statistics `sumNthPowerDeviations` over n), S = m₃/m₂^{3/2},
 * K = m₄/m₂², JB = n/6·[S² + (K − 3)²/4], p = P(χ²₂ > JB), as `scipy.stats.jarque_bera`.
 *
 * @param x finite values, at least 3, not all equal.
 * @throws MetricInputError naming `x` (fewer than 3, not finite, zero variance).
 * @returns JB ≥ 0, p in [0, 1], biased skewness and kurtosis.
 * @example
 * jarqueBera([-2.1, -0.8, 0.3, 1.2, 2.5, 0.0, 0.7, -1.5, 3.9, 1.1, -0.4, 5.2])
 * // → statistic 0.974540, p 0.614301, skewness 0.677907, kurtosis 2.667061
 */
export function jarqueBera(x: readonly number[]): JarqueBeraResult {
  validateSample(x);
  const n = x.length;
  const m2 = sumNthPowerDeviations(x, 2) / n;
  const m3 = sumNthPowerDeviations(x, 3) / n;
  const m4 = sumNthPowerDeviations(x, 4) / n;
  const skewness = m3 / Math.pow(m2, 1.5);
  const kurtosis = m4 / (m2 * m2);
  const statistic = (n / 6) * (skewness * skewness + ((kurtosis - 3) * (kurtosis - 3)) / 4);
  return { n, statistic, p: chiSquareUpperP(statistic, 2), skewness, kurtosis };
}

const HALF_LOG_2PI = 0.5 * Math.log(2 * Math.PI);

/** ln Φ(z), accurate in the far lower tail where Φ(z) underflows. */
function logPhi(z: number): number {
  if (z > -30) return Math.log(phi(z));
  const z2 = z * z;
  return -z2 / 2 - Math.log(-z) - HALF_LOG_2PI + Math.log(1 - 1 / z2 + 3 / (z2 * z2) - 15 / (z2 * z2 * z2));
}

/** Result of {@link andersonDarling}. */
export interface AndersonDarlingResult {
  readonly n: number;
  /** A² with mean and SD estimated from the data (SD with n − 1), ≥ 0. */
  readonly statistic: number;
  /** A²·(1 + 0.75/n + 2.25/n²), the small-sample adjustment the p-value uses. */
  readonly adjusted: number;
  /** p-value from the piecewise formulas for the adjusted statistic, in [0, 1]. */
  readonly p: number;
}

/**
 * Anderson–Darling test of normality with estimated mean and variance.
 *
 * w_(i) = (x_(i) − x̄)/s (s with n − 1), A² = −n − (1/n)Σ(2i − 1)[ln Φ(w_(i)) + ln(1 − Φ(w_(n+1−i)))],
 * A*² = A²(1 + 0.75/n + 2.25/n²); p from the piecewise exponential-quadratic formulas of
 * D'Agostino & Stephens (1986, *Goodness-of-Fit Techniques*, Table 4.9):
 *   A*² < 0.2: 1 − exp(−13.436 + 101.14A*² − 223.73A*⁴);  < 0.34: 1 − exp(−8.318 + 42.796A*² − 59.938A*⁴);
 *   < 0.6: exp(0.9177 − 4.279A*² − 1.38A*⁴);  ≤ 13: exp(1.2937 − 5.709A*² + 0.0186A*⁴);  else 0.
 * Same statistic and p as statsmodels `normal_ad` (which returns the unadjusted A²).
 *
 * @param x finite values, at least 3, not all equal.
 * @throws MetricInputError naming `x` (fewer than 3, not finite, zero variance).
 * @returns A² ≥ 0, adjusted A², p in [0, 1].
 * @example
 * andersonDarling([-2.1, -0.8, 0.3, 1.2, 2.5, 0.0, 0.7, -1.5, 3.9, 1.1, -0.4, 5.2])
 * // → statistic 0.288705, adjusted 0.311260, p 0.552589
 */
export function andersonDarling(x: readonly number[]): AndersonDarlingResult {
  validateSample(x);
  const n = x.length;
  const xbar = mean(x);
  const s = Math.sqrt(sampleVariance(x));
  const w = [...x].sort((p, q) => p - q).map((v) => (v - xbar) / s);
  let acc = 0;
  for (let i = 0; i < n; i++) {
    const lower = logPhi(w[i] as number);
    const upper = logPhi(-(w[n - 1 - i] as number));
    acc += (2 * (i + 1) - 1) * (lower + upper);
  }
  const statistic = Math.max(0, -n - acc / n);
  const adjusted = statistic * (1 + 0.75 / n + 2.25 / (n * n));
  return { n, statistic, adjusted, p: andersonDarlingP(adjusted) };
}

function andersonDarlingP(a: number): number {
  const a2 = a * a;
  let p: number;
  if (a < 0.2) p = 1 - Math.exp(-13.436 + 101.14 * a - 223.73 * a2);
  else if (a < 0.34) p = 1 - Math.exp(-8.318 + 42.796 * a - 59.938 * a2);
  else if (a < 0.6) p = Math.exp(0.9177 - 4.279 * a - 1.38 * a2);
  else if (a <= 13) p = Math.exp(1.2937 - 5.709 * a + 0.0186 * a2);
  else p = 0;
  return Math.min(1, Math.max(0, p));
}

/** One point of a normal Q–Q plot. */
export interface QqPoint {
  /** Theoretical standard normal quantile Φ⁻¹((i − 0.375)/(n + 0.25)) (Blom). */
  readonly theoretical: number;
  /** The i-th smallest value standardised: (x_(i) − x̄)/s, s with n − 1. */
  readonly sample: number;
  /** The i-th smallest value itself (points). */
  readonly value: number;
}

/**
 * Points of a normal Q–Q plot: sorted standardised values against normal quantiles.
 *
 * Plotting positions are Blom's (i − 0.375)/(n + 0.25), the ones Royston's Shapiro–Wilk uses
 * for its expected normal order statistics, so the plot and W describe the same comparison.
 * Standardised with the mean and the n − 1 standard deviation; points near the line y = x
 * look normal.
 *
 * @param x finite values, at least 3, not all equal.
 * @throws MetricInputError naming `x` (fewer than 3, not finite, zero variance).
 * @returns n points in increasing order of both coordinates.
 * @example
 * qqPoints([1, 2, 3]) // → theoretical −0.869424, 0, 0.869424; sample −1, 0, 1
 */
export function qqPoints(x: readonly number[]): QqPoint[] {
  validateSample(x);
  const n = x.length;
  const xbar = mean(x);
  const s = Math.sqrt(sampleVariance(x));
  return [...x]
    .sort((p, q) => p - q)
    .map((value, i) => ({
      theoretical: phiInv((i + 1 - 0.375) / (n + 0.25)),
      sample: (value - xbar) / s,
      value,
    }));
}
