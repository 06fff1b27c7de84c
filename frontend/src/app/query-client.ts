import { QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from '../lib/api-client';

export interface AppQueryClientOptions {
  /** Called when a query answers 401: the session has ended. */
  onUnauthorized?: () => void;
}

function isClientError(error: unknown): boolean {
  return isApiError(error) && error.status >= 400 && error.status < 500;
}

export function createAppQueryClient({ onUnauthorized }: AppQueryClientOptions = {}): QueryClient {
  return new QueryClient({
    queryCache: new QueryCache({
      onError: (error) => {
        if (isApiError(error) && error.status === 401) onUnauthorized?.();
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // A 4xx answer will not change by asking again; network and server failures may.
        retry: (failureCount, error) => !isClientError(error) && failureCount < 2,
      },
      mutations: { retry: false },
    },
  });
}
