/**
 * Test helpers for the shared-error tests (not exported from index.ts): tolerance checks,
 * the degenerate-input assertion, a deep "no NaN or Infinity" check, a seeded normal generator
 * and the reader of the committed reference file.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import seedrandom from 'seedrandom';
import { expect } from 'vitest';
import { MetricInputError } from '../errors';

/** Asserts |actual − expected| ≤ tol (default 1e-6, METHODS' tolerance). */
export function expectClose(actual: number | null | undefined, expected: number, tol = 1e-6): void {
  expect(actual).not.toBeNull();
  expect(actual).toBeDefined();
  const diff = Math.abs((actual as number) - expected);
  if (!(diff <= tol)) {
    throw new Error(`expected ${String(actual)} to be within ${tol} of ${expected} (off by ${diff})`);
  }
}

/** Asserts that `f` throws a MetricInputError naming `parameter`. */
export function expectInputError(f: () => unknown, parameter: string): void {
  let caught: unknown;
  try {
    f();
  } catch (e) {
    caught = e;
  }
  expect(caught).toBeInstanceOf(MetricInputError);
  expect((caught as MetricInputError).parameter).toBe(parameter);
}

/** Paths (like `a.b[2].c`) of every NaN or ±Infinity number inside a value. */
export function nonFinitePaths(value: unknown, path = '$'): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value)) return value.flatMap((v, i) => nonFinitePaths(v, `${path}[${i}]`));
  if (value !== null && typeof value === 'object') {
    return Object.entries(value).flatMap(([k, v]) => nonFinitePaths(v, `${path}.${k}`));
  }
  return [];
}

/** Deep-freezes arrays and plain objects, so a function that mutates its input throws. */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const v of Object.values(value)) deepFreeze(v);
    Object.freeze(value);
  }
  return value;
}

/** A seeded standard-normal generator (seedrandom's ARC4 uniforms, Box–Muller). */
export function seededNormal(seed: string): () => number {
  const uniform = seedrandom(seed);
  return () => {
    let u = 0;
    while (u === 0) u = uniform();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
}

/** A seeded uniform generator on [0, 1). */
export function seededUniform(seed: string): () => number {
  return seedrandom(seed);
}

/** Sample variance with the n − 1 denominator. */
export function sampleVar(xs: readonly number[]): number {
  const m = xs.reduce((a, b) => a + b, 0) / xs.length;
  return xs.reduce((a, b) => a + (b - m) * (b - m), 0) / (xs.length - 1);
}

/** The committed reference file written by reference-data/shared-error/make_reference.py. */
export function readReference<T>(): T {
  const url = new URL('../../../../reference-data/shared-error/reference.json', import.meta.url);
  return JSON.parse(readFileSync(fileURLToPath(url), 'utf8')) as T;
}
