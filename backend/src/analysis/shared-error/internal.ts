/**
 * Small helpers shared by the shared-error modules: input checks in the style of
 * `../errors.ts`, a locale-free key order, and grouping in that key order.
 * Nothing here is exported from `index.ts`.
 */
import { mean } from 'simple-statistics';
import { MetricInputError, requireFinite } from '../errors';
import { groupBy as groupInOrder } from '../group-by';

/** Throws unless `key` is a non-empty string. */
export function requireKey(parameter: string, key: unknown): asserts key is string {
  if (typeof key !== 'string' || key.length === 0) {
    throw new MetricInputError(parameter, 'must be a non-empty string');
  }
}

/** Throws unless `b` has exactly as many entries as `a` (named `aName`). */
export function requireSameLength(
  parameter: string,
  b: readonly unknown[],
  aName: string,
  a: readonly unknown[],
): void {
  if (!Array.isArray(b) || b.length !== a.length) {
    throw new MetricInputError(parameter, `must have the same length as ${aName}`);
  }
}

/** Throws unless `x` is an integer ≥ `min`. */
export function requireInteger(parameter: string, x: number, min: number): void {
  requireFinite(parameter, x);
  if (!Number.isInteger(x) || x < min) {
    throw new MetricInputError(parameter, `must be an integer of at least ${min}`);
  }
}

/** Throws `MetricInputError(parameter, 'has zero variance')` when every value is identical. */
export function requireSpread(parameter: string, xs: readonly number[]): void {
  const first = xs[0];
  if (first === undefined || xs.every((x) => x === first)) {
    throw new MetricInputError(parameter, 'has zero variance');
  }
}

/** True when every value is identical (or there are none). */
export function allEqual(xs: readonly number[]): boolean {
  const first = xs[0];
  return first === undefined || xs.every((x) => x === first);
}

/**
 * Orders keys by UTF-16 code units, so the order never depends on the machine's
 * locale (unlike `localeCompare`).
 */
export function compareKeys(a: string, b: string): number {
  if (a < b) return -1;
  if (a > b) return 1;
  return 0;
}

/** Groups items by a key; groups are returned in key order (`compareKeys`). */
export function groupBy<T>(items: readonly T[], keyOf: (item: T) => string): Map<string, T[]> {
  return new Map([...groupInOrder(items, keyOf).entries()].sort(([a], [b]) => compareKeys(a, b)));
}

/** Arithmetic mean with a compensated sum (simple-statistics `mean`, n denominator). */
export function meanOf(xs: readonly number[]): number {
  return mean(xs);
}

/** Σ(x − x̄)², two-pass (mean first, then squared deviations). */
export function sumSquaredDeviations(xs: readonly number[]): number {
  if (xs.length === 0) return 0;
  const m = mean(xs);
  let s = 0;
  for (const x of xs) s += (x - m) * (x - m);
  return s;
}
