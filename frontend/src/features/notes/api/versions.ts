import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListResponse, NoteVersionDto, NoteVersionSummary } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

export function listNoteVersions(id: number, signal?: AbortSignal) {
  return apiClient.get<ListResponse<NoteVersionSummary>>(`/notes/${id}/versions`, { signal });
}

export function noteVersionsQueryOptions(id: number) {
  return queryOptions({ queryKey: noteKeys.versions(id), queryFn: ({ signal }) => listNoteVersions(id, signal) });
}

export const useNoteVersions = (id: number) => useQuery(noteVersionsQueryOptions(id));

export function getNoteVersion(id: number, n: number, signal?: AbortSignal) {
  return apiClient.get<NoteVersionDto>(`/notes/${id}/versions/${n}`, { signal });
}

/** A version never changes once written, so it is cached for good. */
export function noteVersionQueryOptions(id: number, n: number) {
  return queryOptions({ queryKey: noteKeys.version(id, n), queryFn: ({ signal }) => getNoteVersion(id, n, signal), staleTime: Infinity });
}

export const useNoteVersion = (id: number, n: number | null) => useQuery({ ...noteVersionQueryOptions(id, n ?? 0), enabled: n !== null });
