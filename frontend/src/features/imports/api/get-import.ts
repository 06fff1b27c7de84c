import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ImportRecord, ImportRowError } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { importKeys } from './keys';

export type ImportRecordDetail = ImportRecord & { errors: ImportRowError[] };

export const importIdSchema = z.coerce.number().int().positive();

export function getImport(id: number, signal?: AbortSignal): Promise<ImportRecordDetail> {
  return apiClient.get<ImportRecordDetail>(`/imports/${id}`, { signal });
}

export function importQueryOptions(id: number) {
  return queryOptions({
    queryKey: importKeys.detail(id),
    queryFn: ({ signal }) => getImport(id, signal),
  });
}

export function useImportRecord(id: number) {
  return useQuery(importQueryOptions(id));
}
