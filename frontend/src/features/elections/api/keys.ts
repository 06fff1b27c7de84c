export const electionKeys = {
  all: ['elections'] as const,
  lists: () => [...electionKeys.all, 'list'] as const,
  list: () => [...electionKeys.lists(), {}] as const,
  details: () => [...electionKeys.all, 'detail'] as const,
  detail: (key: string) => [...electionKeys.details(), key] as const,
};
