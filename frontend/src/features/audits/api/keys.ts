export const auditKeys = {
  all: ['audits'] as const,
  lists: () => [...auditKeys.all, 'list'] as const,
  list: () => [...auditKeys.lists(), {}] as const,
  details: () => [...auditKeys.all, 'detail'] as const,
  detail: (id: number) => [...auditKeys.details(), id] as const,
  polls: (id: number, filters: Record<string, string | number | boolean | undefined> = {}) => [...auditKeys.detail(id), 'polls', filters] as const,
  /** The elections offered when creating an audit. */
  electionChoices: () => [...auditKeys.all, 'election-choices'] as const,
};
