export const breakdownKeys = {
  all: ['breakdowns'] as const,
  details: () => [...breakdownKeys.all, 'detail'] as const,
  detail: (auditId: number) => [...breakdownKeys.details(), auditId] as const,
};
