import type { NoteListFilters } from './list-notes';

/** Query keys of the notes feature: entity, then list with filters or detail with the id. */
export const noteKeys = {
  all: ['notes'] as const,
  lists: () => [...noteKeys.all, 'list'] as const,
  list: (filters: NoteListFilters) => [...noteKeys.lists(), filters] as const,
  details: () => [...noteKeys.all, 'detail'] as const,
  detail: (id: number) => [...noteKeys.details(), id] as const,
  versions: (id: number) => [...noteKeys.detail(id), 'versions'] as const,
  version: (id: number, n: number) => [...noteKeys.versions(id), n] as const,
  preview: (markdown: string) => [...noteKeys.all, 'preview', markdown] as const,
  auditChoices: () => [...noteKeys.all, 'audit-choices'] as const,
  publicNotes: () => [...noteKeys.all, 'public'] as const,
  publicNote: (slug: string) => [...noteKeys.publicNotes(), slug] as const,
};
