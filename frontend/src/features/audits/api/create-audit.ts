import { useMutation, useQueryClient } from '@tanstack/react-query';
import { auditCreateSchema, type AuditCreate, type AuditDto } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { auditKeys } from './keys';

export const createAuditInputSchema = auditCreateSchema;
export type CreateAuditInput = AuditCreate;

export function createAudit(input: CreateAuditInput): Promise<AuditDto> {
  return apiClient.post<AuditDto>('/audits', createAuditInputSchema.parse(input));
}

export function useCreateAudit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAudit,
    onSuccess: async (audit) => {
      queryClient.setQueryData(auditKeys.detail(audit.id), audit);
      await queryClient.invalidateQueries({ queryKey: auditKeys.lists() });
    },
  });
}
