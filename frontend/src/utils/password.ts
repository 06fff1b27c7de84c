import { passwordSchema, PASSWORD_MIN } from '@veracast/shared-types';
import { z } from 'zod';

export const PASSWORD_HINT = `At least ${PASSWORD_MIN} characters. A few unrelated words make a strong one.`;

/** For `.refine(passwordsMatch, PASSWORD_MISMATCH)` on a form with a password typed twice. */
export function passwordsMatch(value: { password: string; confirmPassword: string }): boolean {
  return value.password === value.confirmPassword;
}
export const PASSWORD_MISMATCH = { message: 'The two passwords are not the same', path: ['confirmPassword'] };

/** A new password typed twice. */
export const newPasswordFieldsSchema = z
  .object({ password: passwordSchema, confirmPassword: z.string() })
  .refine(passwordsMatch, PASSWORD_MISMATCH);
