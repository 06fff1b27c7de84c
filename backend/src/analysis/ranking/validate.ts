/**
 * Input checks shared by the ranking modules. Each throws a `MetricInputError`
 * naming the offending parameter, following the core's single degenerate-input
 * policy (see `../errors.ts`). Internal: not exported from `index.ts`.
 */
import { MetricInputError, requireFinite } from '../errors';
import type { PollsterId } from './types';

/** Throws unless `xs` is an array with at least `min` entries. */
export function requireArray(parameter: string, xs: unknown, min: number): void {
  if (!Array.isArray(xs)) throw new MetricInputError(parameter, 'must be an array');
  if (xs.length < min) {
    throw new MetricInputError(parameter, `must hold at least ${min} entr${min === 1 ? 'y' : 'ies'}`);
  }
}

/** Throws unless `x` is a pollster id: a non-empty string or a finite number. */
export function requirePollsterId(parameter: string, x: unknown): asserts x is PollsterId {
  if (typeof x === 'string' ? x.length === 0 : typeof x !== 'number' || !Number.isFinite(x)) {
    throw new MetricInputError(parameter, 'must be a non-empty string or a finite number');
  }
}

/** Throws unless `x` is a non-empty string. */
export function requireKey(parameter: string, x: unknown): asserts x is string {
  if (typeof x !== 'string' || x.length === 0) {
    throw new MetricInputError(parameter, 'must be a non-empty string');
  }
}

/** Throws unless `x` is finite and >= 0. */
export function requireNonNegative(parameter: string, x: number): void {
  requireFinite(parameter, x);
  if (x < 0) throw new MetricInputError(parameter, 'must be 0 or greater');
}

/** Throws unless `x` is an integer >= `min`. */
export function requireInteger(parameter: string, x: number, min: number): void {
  if (typeof x !== 'number' || !Number.isInteger(x) || x < min) {
    throw new MetricInputError(parameter, `must be an integer of at least ${min}`);
  }
}

/** Throws unless `x` is a confidence level strictly between 0 and 1. */
export function requireLevel(parameter: string, x: number): void {
  requireFinite(parameter, x);
  if (x <= 0 || x >= 1) throw new MetricInputError(parameter, 'must be strictly between 0 and 1');
}

/** Throws unless `x` is a seed: a finite number or a string. */
export function requireSeed(parameter: string, x: unknown): asserts x is number | string {
  if (typeof x === 'string') return;
  if (typeof x !== 'number' || !Number.isFinite(x)) {
    throw new MetricInputError(parameter, 'must be a finite number or a string');
  }
}
