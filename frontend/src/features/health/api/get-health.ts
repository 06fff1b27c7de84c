import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HealthResponse } from '@veracast/shared-types';
import { apiClient, isApiError } from '../../../lib/api-client';
import { healthKeys } from './keys';

/** The service's state. A 503 still carries a health body, which is returned rather than thrown. */
export async function getHealth(signal?: AbortSignal): Promise<HealthResponse> {
  try {
    return await apiClient.get<HealthResponse>('/health', { signal });
  } catch (error) {
    if (isApiError(error) && error.status === 503 && isHealthBody(error.details)) return error.details;
    throw error;
  }
}

function isHealthBody(value: unknown): value is HealthResponse {
  return typeof value === 'object' && value !== null && 'status' in value && 'database' in value;
}

export function healthQueryOptions() {
  return queryOptions({
    queryKey: healthKeys.detail(),
    queryFn: ({ signal }) => getHealth(signal),
    refetchInterval: 60_000,
  });
}

export function useHealth() {
  return useQuery(healthQueryOptions());
}
