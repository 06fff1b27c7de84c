import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { NOTE_STATES, type ListResponse, type NoteSummary } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

/** Filters of the notes list, as read from the page's search parameters. */
export const noteListFiltersSchema = z.object({
  state: z.enum(NOTE_STATES).optional().catch(undefined),
  author: z.coerce.number().int().positive().optional().catch(undefined),
  election: z.string().min(1).max(100).optional().catch(undefined),
});
export type NoteListFilters = z.infer<typeof noteListFiltersSchema>;

export function listNotes(filters: NoteListFilters, signal?: AbortSignal): Promise<ListResponse<NoteSummary>> {
  return apiClient.get<ListResponse<NoteSummary>>('/notes', { query: filters, signal });
}

export function notesQueryOptions(filters: NoteListFilters = {}) {
  return queryOptions({
    queryKey: noteKeys.list(filters),
    queryFn: ({ signal }) => listNotes(filters, signal),
    placeholderData: keepPreviousData,
  });
}

export function useNotes(filters: NoteListFilters = {}) {
  return useQuery(notesQueryOptions(filters));
}
