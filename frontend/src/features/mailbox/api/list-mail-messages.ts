import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListResponse, MailMessage } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { mailKeys } from './keys';

export function listMailMessages(signal?: AbortSignal): Promise<ListResponse<MailMessage>> {
  return apiClient.get<ListResponse<MailMessage>>('/admin/mailbox', { signal });
}

export function mailMessagesQueryOptions() {
  return queryOptions({
    queryKey: mailKeys.list(),
    queryFn: ({ signal }) => listMailMessages(signal),
  });
}

export function useMailMessages() {
  return useQuery(mailMessagesQueryOptions());
}
