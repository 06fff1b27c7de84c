import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ImportRecord, ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { env } from '../../../lib/env';
import { importKeys } from './keys';

export function listImports(signal?: AbortSignal): Promise<ListResponse<ImportRecord>> {
  return apiClient.get<ListResponse<ImportRecord>>('/imports', { signal });
}

export function importsQueryOptions() {
  return queryOptions({
    queryKey: importKeys.list(),
    queryFn: ({ signal }) => listImports(signal),
  });
}

export function useImports() {
  return useQuery(importsQueryOptions());
}

/** The row errors of one import as a CSV file (row, column, code, message). */
export function importErrorsCsvUrl(id: number): string {
  return `${env.apiBase}/imports/${id}/errors?format=csv`;
}
