export const pollsterKeys = {
  all: ['pollsters'] as const,
  lists: () => [...pollsterKeys.all, 'list'] as const,
  list: () => [...pollsterKeys.lists(), {}] as const,
  details: () => [...pollsterKeys.all, 'detail'] as const,
  detail: (id: number) => [...pollsterKeys.details(), id] as const,
};
