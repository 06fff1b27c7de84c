export const pollKeys = {
  all: ['polls'] as const,
  details: () => [...pollKeys.all, 'detail'] as const,
  detail: (pollKey: string) => [...pollKeys.details(), pollKey] as const,
};
