import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NoteDetail } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

/** The `:noteId` route parameter. */
export const noteIdSchema = z.coerce.number().int().positive();

export function getNote(id: number, signal?: AbortSignal): Promise<NoteDetail> {
  return apiClient.get<NoteDetail>(`/notes/${id}`, { signal });
}

export function noteQueryOptions(id: number) {
  return queryOptions({ queryKey: noteKeys.detail(id), queryFn: ({ signal }) => getNote(id, signal) });
}

export function useNote(id: number) {
  return useQuery(noteQueryOptions(id));
}
