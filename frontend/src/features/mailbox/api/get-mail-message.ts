import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailMessage } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { mailKeys } from './keys';

/** The `:messageId` route parameter: a positive integer. */
export const mailMessageIdSchema = z.coerce.number().int().positive();

export function getMailMessage(id: number, signal?: AbortSignal): Promise<MailMessage> {
  return apiClient.get<MailMessage>(`/admin/mailbox/${id}`, { signal });
}

export function mailMessageQueryOptions(id: number) {
  return queryOptions({
    queryKey: mailKeys.detail(id),
    queryFn: ({ signal }) => getMailMessage(id, signal),
    staleTime: Infinity,
  });
}

export function useMailMessage(id: number) {
  return useQuery(mailMessageQueryOptions(id));
}
