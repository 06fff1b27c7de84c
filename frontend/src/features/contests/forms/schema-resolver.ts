import { toNestErrors } from '@hookform/resolvers';
import type { FieldError, FieldValues, Resolver } from 'react-hook-form';
import type { z } from 'zod';

/**
 * A react-hook-form resolver that validates with a server schema although the form holds its
 * values in another shape (rows of an array where the server wants a record keyed by option, text
 * where it wants numbers). `toInput` converts the form values; `fieldOf` names the form field that
 * shows an issue found at a path of the server's input.
 */
export function schemaResolver<Form extends FieldValues, Schema extends z.ZodType>(
  schema: Schema,
  toInput: (values: Form) => unknown,
  fieldOf: (path: readonly PropertyKey[], values: Form) => string = (path) => path.map(String).join('.'),
): Resolver<Form> {
  return (values, _context, options) => {
    const result = schema.safeParse(toInput(values));
    if (result.success) return { values, errors: {} };
    const flat: Record<string, FieldError> = {};
    for (const issue of result.error.issues) {
      const name = fieldOf(issue.path, values) || 'root';
      flat[name] ??= { type: issue.code, message: messageOf(issue) };
    }
    return { values: {}, errors: toNestErrors<Form>(flat, options) };
  };
}

/** zod's own wording for a value of the wrong type is written for programmers; say it plainly. */
function messageOf(issue: z.core.$ZodIssue): string {
  if (issue.code !== 'invalid_type') return issue.message;
  if (issue.expected === 'number') return 'enter a number';
  if (issue.expected === 'string' || issue.expected === 'boolean') return 'is required';
  // e.g. `int`: the schema's own message ("votes must be whole numbers") says it best.
  return issue.message;
}

/** '' → null; any other text → a number (NaN stays NaN so that the schema rejects it). */
export function numberOrNull(text: string): number | null {
  const trimmed = text.trim();
  return trimmed === '' ? null : Number(trimmed.replace(',', '.'));
}

export function textOrNull(text: string): string | null {
  const trimmed = text.trim();
  return trimmed === '' ? null : trimmed;
}
