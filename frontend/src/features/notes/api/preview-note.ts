import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { notePreviewSchema, type NotePreview } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

export const previewNoteInputSchema = notePreviewSchema;

/** The server's rendering of Markdown (the one renderer), with out-of-date audits marked. */
export function previewNote(markdown: string, signal?: AbortSignal): Promise<NotePreview> {
  return apiClient.post<NotePreview>('/notes/preview', { markdown }, { signal });
}

export function notePreviewQueryOptions(markdown: string) {
  return queryOptions({
    queryKey: noteKeys.preview(markdown),
    queryFn: ({ signal }) => previewNote(markdown, signal),
    placeholderData: keepPreviousData,
    staleTime: 30_000,
  });
}

export function useNotePreview(markdown: string, enabled = true) {
  return useQuery({ ...notePreviewQueryOptions(markdown), enabled });
}
