import { useMutation } from '@tanstack/react-query';
import { passwordResetConfirmSchema } from '@veracast/shared-types';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

export const passwordResetConfirmInputSchema = passwordResetConfirmSchema;
export type PasswordResetConfirmInput = z.infer<typeof passwordResetConfirmInputSchema>;

export async function confirmPasswordReset(input: PasswordResetConfirmInput): Promise<void> {
  await apiClient.post<void>('/auth/password-reset/confirm', passwordResetConfirmInputSchema.parse(input));
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
