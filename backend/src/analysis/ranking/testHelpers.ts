/** Test-only helpers for the ranking tests (not exported from index.ts). */
import { expect } from 'vitest';
import { MetricInputError } from '../errors';

/** Freezes an object graph so any mutation by the code under test throws. */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const v of Object.values(value as object)) deepFreeze(v);
  }
  return value;
}

/** Asserts that `fn` throws a MetricInputError naming `parameter`. */
export function expectInputError(fn: () => unknown, parameter: string): void {
  let caught: unknown;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  expect(caught, `expected a MetricInputError for ${parameter}`).toBeInstanceOf(MetricInputError);
  expect((caught as MetricInputError).parameter).toBe(parameter);
}
