import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PublicNote } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

/** The `:slug` of a public note. */
export const publicNoteSlugSchema = z.string().regex(/^[a-z0-9-]{1,120}$/);

export function getPublicNote(slug: string, signal?: AbortSignal) {
  return apiClient.get<PublicNote>(`/public/notes/${encodeURIComponent(slug)}`, { signal });
}

export function publicNoteQueryOptions(slug: string) {
  return queryOptions({ queryKey: noteKeys.publicNote(slug), queryFn: ({ signal }) => getPublicNote(slug, signal) });
}

export const usePublicNote = (slug: string) => useQuery(publicNoteQueryOptions(slug));
