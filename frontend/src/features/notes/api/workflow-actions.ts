import { useMutation, useQueryClient } from '@tanstack/react-query';
import { noteCorrectionSchema, notePublishSchema, noteReturnSchema, type NoteCorrection, type NoteDetail } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

export const returnNoteInputSchema = noteReturnSchema;
export const publishNoteInputSchema = notePublishSchema;
export const correctNoteInputSchema = noteCorrectionSchema;

export const submitNote = (id: number) => apiClient.post<NoteDetail>(`/notes/${id}/submit`);
export const returnNote = (id: number, comments: string) => apiClient.post<NoteDetail>(`/notes/${id}/return`, { comments });
export const publishNote = (id: number, comments?: string) => apiClient.post<NoteDetail>(`/notes/${id}/publish`, comments ? { comments } : {});
export const correctNote = (id: number, input: NoteCorrection) => apiClient.post<NoteDetail>(`/notes/${id}/corrections`, input);

/** After any state change: the detail comes back from the server; lists, versions and public pages refetch. */
function useNoteAction<Input>(id: number, action: (input: Input) => Promise<NoteDetail>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: action,
    onSuccess: (note) => {
      queryClient.setQueryData(noteKeys.detail(id), note);
      void queryClient.invalidateQueries({ queryKey: noteKeys.versions(id) });
      void queryClient.invalidateQueries({ queryKey: noteKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: noteKeys.publicNotes() });
    },
  });
}

export const useSubmitNote = (id: number) => useNoteAction<void>(id, () => submitNote(id));
export const useReturnNote = (id: number) => useNoteAction<string>(id, (comments) => returnNote(id, comments));
export const usePublishNote = (id: number) => useNoteAction<string | undefined>(id, (comments) => publishNote(id, comments));
export const useCorrectNote = (id: number) => useNoteAction<NoteCorrection>(id, (input) => correctNote(id, input));
