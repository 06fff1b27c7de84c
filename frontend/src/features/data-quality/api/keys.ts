export const qualityKeys = {
  all: ['data-quality'] as const,
  lists: () => [...qualityKeys.all, 'list'] as const,
  list: (filters: { election?: string }) => [...qualityKeys.lists(), filters] as const,
};
