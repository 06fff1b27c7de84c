import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noteUpdateSchema, type NoteDetail, type NoteUpdate } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

export const updateNoteInputSchema = noteUpdateSchema;

/** Saves a draft: the server keeps a new version when the title or text changed. */
export function updateNote(id: number, input: NoteUpdate): Promise<NoteDetail> {
  return apiClient.put<NoteDetail>(`/notes/${id}`, input);
}

export function useUpdateNote(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: NoteUpdate) => updateNote(id, input),
    onSuccess: (note) => {
      queryClient.setQueryData(noteKeys.detail(id), note);
      void queryClient.invalidateQueries({ queryKey: noteKeys.versions(id) });
      void queryClient.invalidateQueries({ queryKey: noteKeys.lists() });
    },
  });
}
