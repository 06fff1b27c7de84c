import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CSRF_HEADER, type ApiErrorBody, type CsrfResponse } from '@veracast/shared-types';
import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';
import { env } from '../../../lib/env';
import { contestKeys } from './keys';

export const SOURCE_DOCUMENT_TYPES = ['application/pdf', 'image/png', 'image/jpeg'] as const;
/** The server keeps source documents up to 20 MB. */
export const SOURCE_DOCUMENT_MAX_BYTES = 20 * 1024 * 1024;

export const sourceDocumentInputSchema = z.object({
  file: z
    .instanceof(File, { message: 'choose a file' })
    .refine((f) => (SOURCE_DOCUMENT_TYPES as readonly string[]).includes(f.type), 'the source document must be a PDF, PNG or JPEG')
    .refine((f) => f.size <= SOURCE_DOCUMENT_MAX_BYTES, 'the source document must be at most 20 MB'),
});

export function sourceDocumentUrl(contestKey: string): string {
  return `${env.apiBase}/contests/${encodeURIComponent(contestKey)}/source-document`;
}

async function csrfToken(): Promise<string | null> {
  const response = await fetch(`${env.apiBase}/auth/csrf`, { credentials: 'include', headers: { Accept: 'application/json' } });
  if (!response.ok) return null;
  const body = (await response.json()) as Partial<CsrfResponse>;
  return body.csrfToken ?? null;
}

async function errorOf(response: Response): Promise<ApiError> {
  const body = (await response.json().catch(() => null)) as ApiErrorBody | null;
  if (body?.error) return new ApiError(response.status, body.error.code, body.error.message, body.error.details);
  return new ApiError(response.status, 'http_error', `The upload failed (HTTP ${response.status}).`);
}

/** Attaches the official document a certified result came from (reviewer; PDF, PNG or JPEG). */
export async function uploadSourceDocument({ contestKey, file }: { contestKey: string; file: File }): Promise<void> {
  sourceDocumentInputSchema.parse({ file });
  const data = new FormData();
  data.append('file', file, file.name);
  const token = await csrfToken();
  let response: Response;
  try {
    response = await fetch(sourceDocumentUrl(contestKey), {
      method: 'POST',
      credentials: 'include',
      headers: { Accept: 'application/json', ...(token ? { [CSRF_HEADER]: token } : {}) },
      body: data,
    });
  } catch {
    throw new ApiError(0, 'network_error', 'The server could not be reached. Check the connection and try again.');
  }
  if (!response.ok) throw await errorOf(response);
}

export function useUploadSourceDocument() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadSourceDocument,
    onSuccess: (_data, { contestKey }) => queryClient.invalidateQueries({ queryKey: contestKeys.detail(contestKey) }),
  });
}
