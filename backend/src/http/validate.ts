import type { z } from 'zod';
import { validationFailed } from './errors';

export interface FieldProblem {
  field: string;
  message: string;
}

/** Parses `data` with `schema`; on failure throws a 400 naming every bad field and its rule. */
export function parse<S extends z.ZodType>(schema: S, data: unknown, where = 'body'): z.infer<S> {
  const result = schema.safeParse(data);
  if (result.success) return result.data;
  const problems: FieldProblem[] = result.error.issues.map((i) => ({
    field: i.path.length ? i.path.join('.') : where,
    message: i.message,
  }));
  throw validationFailed(problems, problems.map((p) => `${p.field}: ${p.message}`).join('; '));
}
