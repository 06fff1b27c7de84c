/**
 * Query keys of this feature. They sit under their own root so that another screen caching the
 * same endpoints in a different shape can never collide with them.
 */
export const sharedErrorKeys = {
  all: ['shared-error'] as const,
  audits: () => [...sharedErrorKeys.all, 'audits'] as const,
  auditList: () => [...sharedErrorKeys.audits(), 'list', {}] as const,
  auditDetail: (auditId: number) => [...sharedErrorKeys.audits(), 'detail', auditId] as const,
  analyses: () => [...sharedErrorKeys.all, 'analysis'] as const,
  analysis: (auditId: number, electionKey: string) => [...sharedErrorKeys.analyses(), auditId, electionKey] as const,
  polls: (auditId: number, electionKey: string) => [...sharedErrorKeys.all, 'polls', auditId, { electionKey, used: true }] as const,
  history: (auditId: number) => [...sharedErrorKeys.all, 'history', auditId] as const,
};
