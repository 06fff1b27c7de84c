import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CSRF_HEADER, type ApiErrorBody, type CsrfResponse, type ImportSummary } from '@veracast/shared-types';
import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';
import { env } from '../../../lib/env';
import { UPLOAD_LIMIT_BYTES, UPLOAD_LIMIT_MB } from '../parse-file';
import { importKeys } from './keys';

export const sendImportInputSchema = z.object({
  kind: z.enum(['results', 'polls']),
  file: z.instanceof(Blob).refine((f) => f.size <= UPLOAD_LIMIT_BYTES, `the file must be at most ${UPLOAD_LIMIT_MB} MB`),
  fileName: z.string().min(1),
  dryRun: z.boolean(),
  validOnly: z.boolean(),
  layout: z.enum(['long', 'wide']).optional(),
  columnMap: z.record(z.string(), z.string()).optional(),
  optionMap: z.record(z.string(), z.string()).optional(),
  pollsterMap: z.record(z.string(), z.number().int().positive()).optional(),
  reason: z.string().trim().max(1000).optional(),
});
export type SendImportInput = z.infer<typeof sendImportInputSchema>;

export type UploadProgress = { phase: 'uploading'; loaded: number; total: number } | { phase: 'processing' };

/** The URL of one import request, its switches in the query string. */
export function importUrl(input: Pick<SendImportInput, 'kind' | 'dryRun' | 'validOnly' | 'layout'>): string {
  const params = new URLSearchParams();
  if (input.dryRun) params.set('dryRun', 'true');
  if (input.validOnly) params.set('validOnly', 'true');
  if (input.kind === 'polls' && input.layout) params.set('layout', input.layout);
  const query = params.toString();
  return `${env.apiBase}/imports/${input.kind}${query ? `?${query}` : ''}`;
}

export function importFormData(input: SendImportInput): FormData {
  const data = new FormData();
  if (input.columnMap && Object.keys(input.columnMap).length) data.append('columnMap', JSON.stringify(input.columnMap));
  if (input.optionMap && Object.keys(input.optionMap).length) data.append('optionMap', JSON.stringify(input.optionMap));
  if (input.pollsterMap && Object.keys(input.pollsterMap).length) data.append('pollsterMap', JSON.stringify(input.pollsterMap));
  if (input.reason) data.append('reason', input.reason);
  // Text fields first: the server reads them before the file.
  data.append('file', input.file, input.fileName);
  return data;
}

function isSummary(body: unknown): body is ImportSummary {
  return typeof body === 'object' && body !== null && 'importId' in body && 'errors' in body && Array.isArray((body as ImportSummary).errors);
}

/** Turns the server's answer into a summary (201, or 422 with row errors) or an ApiError. */
export function readImportAnswer(status: number, text: string): ImportSummary {
  let body: unknown;
  try {
    body = text ? (JSON.parse(text) as unknown) : undefined;
  } catch {
    body = undefined;
  }
  if ((status === 201 || status === 200 || status === 422) && isSummary(body)) return body;
  const error = (body as Partial<ApiErrorBody> | undefined)?.error;
  if (error && typeof error.code === 'string') throw new ApiError(status, error.code, error.message, error.details);
  if (status === 413) throw new ApiError(413, 'payload_too_large', `The file is larger than the ${UPLOAD_LIMIT_MB} MB upload limit.`);
  throw new ApiError(status, 'http_error', `The import failed (HTTP ${status}).`);
}

async function csrfToken(): Promise<string | null> {
  try {
    const response = await fetch(`${env.apiBase}/auth/csrf`, { credentials: 'include', headers: { Accept: 'application/json' } });
    if (!response.ok) return null;
    return ((await response.json()) as Partial<CsrfResponse>).csrfToken ?? null;
  } catch {
    return null;
  }
}

function post(url: string, data: FormData, token: string | null, onProgress: (p: UploadProgress) => void, signal?: AbortSignal) {
  return new Promise<{ status: number; text: string }>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    if (token) xhr.setRequestHeader(CSRF_HEADER, token);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress({ phase: 'uploading', loaded: event.loaded, total: event.total });
    };
    xhr.upload.onload = () => onProgress({ phase: 'processing' });
    xhr.onload = () => resolve({ status: xhr.status, text: xhr.responseText });
    xhr.onerror = () => reject(new ApiError(0, 'network_error', 'The server could not be reached. Check the connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    if (signal) {
      if (signal.aborted) {
        xhr.abort();
        return;
      }
      signal.addEventListener('abort', () => xhr.abort(), { once: true });
    }
    xhr.send(data);
  });
}

/**
 * Sends a CSV to the import endpoint with XMLHttpRequest, so that the upload reports its progress
 * (fetch cannot). A file with row errors answers 422 with the same summary: it is returned, not
 * thrown. File-level problems (missing columns, not UTF-8, respondent-level data, too large) throw
 * ApiError with the server's message.
 */
export async function sendImport(input: SendImportInput, onProgress: (p: UploadProgress) => void = () => {}, signal?: AbortSignal): Promise<ImportSummary> {
  const valid = sendImportInputSchema.parse(input);
  const url = importUrl(valid);
  let answer = await post(url, importFormData(valid), await csrfToken(), onProgress, signal);
  if (answer.status === 403 && answer.text.includes('csrf_invalid')) {
    answer = await post(url, importFormData(valid), await csrfToken(), onProgress, signal);
  }
  return readImportAnswer(answer.status, answer.text);
}

export function useSendImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ input, onProgress, signal }: { input: SendImportInput; onProgress?: (p: UploadProgress) => void; signal?: AbortSignal }) =>
      sendImport(input, onProgress, signal),
    onSettled: async (summary) => {
      // A committed import changes elections, contests, polls, firms and checks everywhere.
      if (summary?.status === 'committed') await queryClient.invalidateQueries();
      else await queryClient.invalidateQueries({ queryKey: importKeys.lists() });
    },
  });
}
