/** Small assertion helpers for the metrics tests (not a test file itself). */
import { expect } from 'vitest';
import { MetricInputError } from '../errors';

/** Asserts |actual − expected| ≤ tol (METHODS.md's default tolerance is 1e-6 absolute). */
export function near(actual: number | null | undefined, expected: number, tol = 1e-6): void {
  expect(typeof actual).toBe('number');
  const diff = Math.abs((actual as number) - expected);
  if (!(diff <= tol)) {
    expect.fail(`expected ${String(actual)} to be within ${tol} of ${expected} (off by ${diff})`);
  }
}

/** Asserts that `run` throws a MetricInputError naming `parameter`. */
export function expectInputError(run: () => unknown, parameter: string): void {
  let caught: unknown = null;
  try {
    run();
  } catch (error) {
    caught = error;
  }
  expect(caught, `expected a MetricInputError naming ${parameter}`).toBeInstanceOf(MetricInputError);
  expect((caught as MetricInputError).parameter).toBe(parameter);
}

/** Deep-freezes a plain value so that any write by the code under test throws. */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const inner of Object.values(value)) deepFreeze(inner);
    Object.freeze(value);
  }
  return value;
}

/** A contest option for tests. */
export interface TestOption {
  key: string;
  bloc: string | null;
  votes: number;
}

/** Builds a contest input for `computePollMetrics`; overrides replace whole fields. */
export function buildContest(
  overrides: Partial<{ options: TestOption[]; orientation: [string, string] | null; electionDate: string }> = {},
): { options: TestOption[]; orientation: [string, string] | null; electionDate: string } {
  return {
    options: [
      { key: 'A', bloc: 'left', votes: 502 },
      { key: 'B', bloc: 'right', votes: 473 },
      { key: 'C', bloc: null, votes: 25 },
    ],
    orientation: null,
    electionDate: '2026-05-10',
    ...overrides,
  };
}

/** Builds a poll input for `computePollMetrics`; overrides replace whole fields. */
export function buildPoll(
  overrides: Partial<{
    n: number;
    moe: number | null;
    fieldworkStart: string;
    fieldworkEnd: string;
    shares: Record<string, number>;
  }> = {},
): { n: number; moe: number | null; fieldworkStart: string; fieldworkEnd: string; shares: Record<string, number> } {
  return {
    n: 1000,
    moe: null,
    fieldworkStart: '2026-04-28',
    fieldworkEnd: '2026-05-01',
    shares: { A: 48, B: 44, other: 2, undecided: 6 },
    ...overrides,
  };
}
