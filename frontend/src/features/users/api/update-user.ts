import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userUpdateSchema, type MeResponse, type User, type UserUpdate } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { userKeys } from './keys';

export const updateUserInputSchema = userUpdateSchema;
export type UpdateUserInput = { id: number; changes: UserUpdate };

export async function updateUser({ id, changes }: UpdateUserInput): Promise<User> {
  const { user } = await apiClient.patch<MeResponse>(`/users/${id}`, updateUserInputSchema.parse(changes));
  return user;
}

export function useUpdateUser(options: { onUpdated?: (user: User) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: async (user) => {
      await queryClient.invalidateQueries({ queryKey: userKeys.lists() });
      options.onUpdated?.(user);
    },
  });
}
