import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noteCreateSchema, type NoteCreate, type NoteDetail } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

export const createNoteInputSchema = noteCreateSchema;

export function createNote(input: NoteCreate): Promise<NoteDetail> {
  return apiClient.post<NoteDetail>('/notes', input);
}

export function useCreateNote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createNote,
    onSuccess: (note) => {
      queryClient.setQueryData(noteKeys.detail(note.id), note);
      void queryClient.invalidateQueries({ queryKey: noteKeys.lists() });
    },
  });
}
