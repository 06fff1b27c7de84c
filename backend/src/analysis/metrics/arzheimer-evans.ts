/**
 * Multi-option accuracy of Arzheimer & Evans (2014), *Political Analysis*
 * 22:31–44 (METHODS §4): A′ per option, B, B_w and the tests of no bias.
 */
import { mean, sum } from 'simple-statistics';
import { MetricInputError, requirePositive } from '../errors';
import { chiSquareUpperP } from '../distributions';
import { UNDECIDED, hasShare, requireNonNegativeShares, type Shares } from './shares';

/** A′ per category with B, B_w and the χ² and G² tests. */
export interface AeResult {
  /** Categories scored, in the order of the poll record. */
  categories: string[];
  /** A′_i = ln[(p_i/(1−p_i)) / (V_i/(1−V_i))], shares rescaled to sum to 1. */
  aPrime: Record<string, number>;
  /** SE(A′_i) = 1/√(n·p_i·(1−p_i)). */
  se: Record<string, number>;
  /** B = (1/k)·Σ|A′_i|, ≥ 0. No standard error is reported for B. */
  b: number;
  /** B_w = Σ V_i·|A′_i|, V rescaled over the categories, ≥ 0. */
  bw: number;
  /** Pearson χ² = Σ (O_i − E_i)²/E_i with O_i = n·p_i, E_i = n·V_i. */
  chi2: number;
  /** G² = 2·Σ O_i·ln(O_i/E_i). */
  g2: number;
  /** k − 1. */
  df: number;
  /** Upper-tail χ² p-value of `chi2` on `df`. */
  chi2P: number;
  /** Upper-tail χ² p-value of `g2` on `df`. */
  g2P: number;
}

/**
 * Arzheimer–Evans A′, B and B_w for one poll.
 *
 * Categories are the keys of `poll` other than `undecided` (Veracast leaves
 * undecided out: it is not an option voters could choose). Each needs a share
 * in `result`; result keys outside the categories are ignored. Both sides are
 * rescaled to sum to 1 over the categories, so any scale works (points,
 * proportions, counts) and raw and proportional treatments give the same A′. Every rescaled share
 * must be > 0: pool empty categories first with {@link mergeEmptyCategories}.
 * With two categories A′ of the first equals MTK's A.
 *
 * `n` is the number of respondents behind the categories (the sample size, or
 * n_eff, times the poll's combined share of the categories). With that choice
 * the SE of A′ for two categories equals MTK's SE.
 *
 * @param poll - poll shares, finite and ≥ 0 on any scale; never mutated.
 * @param result - certified shares, finite and ≥ 0 on any scale; never mutated.
 * @param n - respondents behind the categories, > 0.
 * @throws {MetricInputError} `poll.<key>`/`result.<key>` for a bad, missing or
 *   zero share; `poll` with fewer than 2 categories; `n` when not > 0.
 * @returns {@link AeResult}.
 * @example aeAccuracy({ a: 40, b: 40, c: 20 }, { a: 30, b: 40, c: 30 }, 1000)
 * // => { aPrime: { a: 0.441833…, b: 0, c: -0.538997… }, b: 0.326943…, bw: 0.294249…, chi2: 66.666…, g2: 67.959615…, df: 2, … }
 */
export function aeAccuracy(poll: Shares, result: Shares, n: number): AeResult {
  requireNonNegativeShares('poll', poll);
  requireNonNegativeShares('result', result);
  requirePositive('n', n);
  const categories = Object.keys(poll).filter((k) => k !== UNDECIDED);
  if (categories.length < 2) throw new MetricInputError('poll', 'must hold at least 2 categories besides undecided');
  for (const k of categories) {
    if (!((poll[k] ?? 0) > 0)) {
      throw new MetricInputError(`poll.${k}`, 'must be greater than 0 (pool empty categories with mergeEmptyCategories)');
    }
    if (!hasShare(result, k)) throw new MetricInputError(`result.${k}`, 'is missing: the result has no share for this category');
    if (!((result[k] ?? 0) > 0)) {
      throw new MetricInputError(`result.${k}`, 'must be greater than 0 (pool empty categories with mergeEmptyCategories)');
    }
  }
  const pollTotal = sum(categories.map((k) => poll[k] ?? 0));
  const resultTotal = sum(categories.map((k) => result[k] ?? 0));
  const p = categories.map((k) => (poll[k] ?? 0) / pollTotal);
  const v = categories.map((k) => (result[k] ?? 0) / resultTotal);

  const aPrime: Record<string, number> = {};
  const se: Record<string, number> = {};
  const absA: number[] = [];
  const weighted: number[] = [];
  const chiTerms: number[] = [];
  const gTerms: number[] = [];
  for (let i = 0; i < categories.length; i++) {
    const key = categories[i]!;
    const pi = p[i] ?? 0;
    const vi = v[i] ?? 0;
    const a = Math.log(pi / (1 - pi)) - Math.log(vi / (1 - vi));
    aPrime[key] = a;
    se[key] = 1 / Math.sqrt(n * pi * (1 - pi));
    absA.push(Math.abs(a));
    weighted.push(vi * Math.abs(a));
    const observed = n * pi;
    const expected = n * vi;
    chiTerms.push((observed - expected) ** 2 / expected);
    gTerms.push(observed * Math.log(observed / expected));
  }
  const df = categories.length - 1;
  const chi2 = sum(chiTerms);
  const g2 = 2 * sum(gTerms);
  return {
    categories,
    aPrime,
    se,
    b: mean(absA),
    bw: sum(weighted),
    chi2,
    g2,
    df,
    chi2P: chiSquareUpperP(chi2, df),
    g2P: chiSquareUpperP(g2, df),
  };
}

/** Records after pooling empty categories, with what was pooled. */
export interface MergedCategories {
  poll: Record<string, number>;
  result: Record<string, number>;
  /** One line per pooling done, e.g. `C+D` or `E into B+E`; empty when nothing was empty. */
  merges: string[];
}

/**
 * Pools empty categories so that A′ is defined (Arzheimer & Evans' advice to
 * merge categories with no observations).
 *
 * A category is empty when its poll share or its certified share is 0. All
 * empty categories are pooled into one, keyed by their keys joined with `+` in
 * code-unit order. If that pool is still empty on one side, it is folded into
 * the remaining category with the smallest certified share (ties by key),
 * whose key becomes `<key>+<pooled keys>`. The outcome can have fewer than 2
 * categories; {@link aeAccuracy} then refuses it.
 *
 * @param poll - poll shares (finite, ≥ 0, any scale) over the categories; `undecided` is refused.
 * @param result - certified shares (finite, ≥ 0) over exactly the same keys.
 * @throws {MetricInputError} `poll.<key>`/`result.<key>` for a bad or missing share;
 *   `poll.undecided` when present.
 * @returns new records and the list of merges; inputs are never mutated.
 * @example mergeEmptyCategories({ A: 50, B: 50, C: 0, D: 0 }, { A: 48, B: 50, C: 1, D: 1 })
 * // => { poll: { 'A+C+D': 50, B: 50 }, result: { 'A+C+D': 50, B: 50 }, merges: ['C+D into A+C+D'] }
 * // (the pool C+D is empty in the poll, so it joins A, the smallest certified share)
 */
export function mergeEmptyCategories(poll: Shares, result: Shares): MergedCategories {
  requireNonNegativeShares('poll', poll);
  requireNonNegativeShares('result', result);
  if (hasShare(poll, UNDECIDED)) throw new MetricInputError(`poll.${UNDECIDED}`, 'is not a category: leave it out');
  const keys = Object.keys(poll);
  for (const k of keys) {
    if (!hasShare(result, k)) throw new MetricInputError(`result.${k}`, 'is missing: the result has no share for this category');
  }
  for (const k of Object.keys(result)) {
    if (!hasShare(poll, k)) throw new MetricInputError(`poll.${k}`, 'is missing: poll and result must cover the same categories');
  }
  const isEmpty = (k: string): boolean => !((poll[k] ?? 0) > 0) || !((result[k] ?? 0) > 0);
  const empty = keys.filter(isEmpty).sort();
  if (empty.length === 0) return { poll: { ...poll }, result: { ...result }, merges: [] };

  const outPoll: Record<string, number> = {};
  const outResult: Record<string, number> = {};
  for (const k of keys) {
    if (!isEmpty(k)) {
      outPoll[k] = poll[k] ?? 0;
      outResult[k] = result[k] ?? 0;
    }
  }
  const poolKey = empty.join('+');
  const poolPoll = sum(empty.map((k) => poll[k] ?? 0));
  const poolResult = sum(empty.map((k) => result[k] ?? 0));
  if (poolPoll > 0 && poolResult > 0) {
    outPoll[poolKey] = poolPoll;
    outResult[poolKey] = poolResult;
    return { poll: outPoll, result: outResult, merges: [poolKey] };
  }
  const targets = Object.keys(outPoll).sort((a, b) => {
    const diff = (outResult[a] ?? 0) - (outResult[b] ?? 0);
    return diff !== 0 ? diff : a < b ? -1 : a > b ? 1 : 0;
  });
  const target = targets[0];
  if (target === undefined) return { poll: outPoll, result: outResult, merges: [] };
  const mergedKey = `${target}+${poolKey}`;
  const targetPoll = (outPoll[target] ?? 0) + poolPoll;
  const targetResult = (outResult[target] ?? 0) + poolResult;
  const finalPoll: Record<string, number> = {};
  const finalResult: Record<string, number> = {};
  for (const k of Object.keys(outPoll)) {
    const name = k === target ? mergedKey : k;
    finalPoll[name] = k === target ? targetPoll : (outPoll[k] ?? 0);
    finalResult[name] = k === target ? targetResult : (outResult[k] ?? 0);
  }
  return { poll: finalPoll, result: finalResult, merges: [`${poolKey} into ${mergedKey}`] };
}
