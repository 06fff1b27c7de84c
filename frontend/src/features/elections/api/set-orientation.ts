import { useMutation, useQueryClient } from '@tanstack/react-query';
import { orientationSchema, type ElectionDto } from '@veracast/shared-types';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

export const setOrientationInputSchema = orientationSchema;
export type SetOrientationInput = z.infer<typeof setOrientationInputSchema>;

/** Sets the election's orientation blocs (reviewer); the change is logged by the server. */
export function setOrientation({ key, blocs }: { key: string; blocs: SetOrientationInput }): Promise<ElectionDto> {
  return apiClient.put<ElectionDto>(`/elections/${encodeURIComponent(key)}/orientation`, setOrientationInputSchema.parse(blocs));
}

export function useSetOrientation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: setOrientation,
    // Orientation changes every contest's reference pair, so contest pages refetch as well.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
