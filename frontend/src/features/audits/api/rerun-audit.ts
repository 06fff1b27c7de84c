import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AuditDto } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { auditIdSchema } from './get-audit';
import { auditKeys } from './keys';

/** Computes a new audit with the same settings on the current data; the old one stays as it was. */
export function rerunAudit(id: number): Promise<AuditDto> {
  return apiClient.post<AuditDto>(`/audits/${auditIdSchema.parse(id)}/rerun`);
}

export function useRerunAudit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: rerunAudit,
    onSuccess: async (audit) => {
      queryClient.setQueryData(auditKeys.detail(audit.id), audit);
      await queryClient.invalidateQueries({ queryKey: auditKeys.lists() });
    },
  });
}
