import { useMutation } from '@tanstack/react-query';
import { passwordResetRequestSchema } from '@veracast/shared-types';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

export const passwordResetRequestInputSchema = passwordResetRequestSchema;
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestInputSchema>;

/** Asks for a reset link; the server answers 202 whether or not the address has an account. */
export async function requestPasswordReset(input: PasswordResetRequestInput): Promise<void> {
  await apiClient.post<void>('/auth/password-reset/request', passwordResetRequestInputSchema.parse(input));
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
