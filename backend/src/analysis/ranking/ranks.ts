/**
 * Average ranks ("fractional ranking").
 */
import { requireFinite } from '../errors';
import { requireArray } from './validate';

/**
 * Ranks of `values` with ties sharing the average of the ranks they span.
 *
 * Rank 1 is the SMALLEST value (for errors: the most accurate). Values tied
 * over sorted positions i..j (1-based) all get (i + j) / 2, so the ranks always
 * sum to k(k + 1)/2. This is the convention of `scipy.stats.rankdata(method='average')`
 * and of R's `rank(ties.method = "average")`. Ties are exact equality of numbers.
 *
 * @param values finite numbers, at least one; not mutated.
 * @throws MetricInputError `values` when empty, not an array, or any entry is not finite.
 * @returns ranks aligned with `values`, each in [1, k] and a multiple of 0.5.
 * @example
 * averageRanks([3.2, 1.0, 3.2, 0.4]); // → [3.5, 2, 3.5, 1]
 */
export function averageRanks(values: readonly number[]): number[] {
  requireArray('values', values, 1);
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i])) requireFinite(`values[${i}]`, values[i]!);
  const order = values.map((_, i) => i).sort((a, b) => (values[a] as number) - (values[b] as number) || a - b);
  const ranks = new Array<number>(values.length);
  let start = 0;
  while (start < order.length) {
    const v = values[order[start] as number] as number;
    let end = start + 1;
    while (end < order.length && values[order[end] as number] === v) end += 1;
    // Sorted positions start+1 .. end (1-based) share their average.
    const shared = (start + 1 + end) / 2;
    for (let i = start; i < end; i += 1) ranks[order[i] as number] = shared;
    start = end;
  }
  return ranks;
}
