/**
 * The single degenerate-input policy of the statistics core.
 *
 * Every function in `backend/src/analysis/` validates its inputs and throws a
 * `MetricInputError` naming the offending parameter and the rule it broke,
 * instead of returning NaN or Infinity. Callers (audits, routes) catch it and
 * turn it into a per-poll "not computable" reason or an HTTP 400/422.
 */
export class MetricInputError extends Error {
  override readonly name = 'MetricInputError';
  constructor(
    /** The parameter (or field) that broke the rule, e.g. `n` or `shares.A`. */
    readonly parameter: string,
    /** The rule it broke, in plain words, e.g. `must be a positive integer`. */
    readonly rule: string,
  ) {
    super(`${parameter} ${rule}`);
  }
}

/** Throws unless `x` is a finite number. */
export function requireFinite(parameter: string, x: number): void {
  if (typeof x !== 'number' || !Number.isFinite(x)) {
    throw new MetricInputError(parameter, 'must be a finite number');
  }
}

/** Throws unless `x` is finite and strictly positive. */
export function requirePositive(parameter: string, x: number): void {
  requireFinite(parameter, x);
  if (x <= 0) throw new MetricInputError(parameter, 'must be greater than 0');
}

/** Throws unless `x` is a proportion strictly between 0 and 1. */
export function requireOpenProportion(parameter: string, x: number): void {
  requireFinite(parameter, x);
  if (x <= 0 || x >= 1) throw new MetricInputError(parameter, 'must be strictly between 0 and 1');
}

/** Throws unless `xs` has at least `min` finite entries. */
export function requireSample(parameter: string, xs: readonly number[], min: number): void {
  if (!Array.isArray(xs) || xs.length < min) {
    throw new MetricInputError(parameter, `must hold at least ${min} value${min === 1 ? '' : 's'}`);
  }
  // An entry's name is built only when it fails (samples can be long and checked often).
  for (let i = 0; i < xs.length; i++) if (!Number.isFinite(xs[i])) requireFinite(`${parameter}[${i}]`, xs[i]!);
}
