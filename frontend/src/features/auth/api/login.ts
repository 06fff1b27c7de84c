import { useMutation, useQueryClient } from '@tanstack/react-query';
import { loginRequestSchema, type LoginRequest, type MeResponse, type User } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { meQueryOptions } from './get-me';

export const loginInputSchema = loginRequestSchema;
export type LoginInput = LoginRequest;

export async function login(input: LoginInput): Promise<User> {
  const { user } = await apiClient.post<MeResponse>('/auth/login', loginInputSchema.parse(input));
  return user;
}

export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (user) => {
      // A new session gets a new CSRF token.
      apiClient.resetCsrfToken();
      queryClient.setQueryData(meQueryOptions().queryKey, user);
    },
  });
}
