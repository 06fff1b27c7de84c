import { validationFailed } from './errors';

/** A positive integer route parameter, or a 400 naming it. */
export function idParam(value: unknown, name = 'id'): number {
  const n = typeof value === 'string' && /^[1-9][0-9]{0,9}$/.test(value) ? Number(value) : NaN;
  if (!Number.isSafeInteger(n)) throw validationFailed([{ field: name, message: `${name} must be a positive integer` }], `${name} must be a positive integer`);
  return n;
}
