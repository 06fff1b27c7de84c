export const mailKeys = {
  all: ['mailbox'] as const,
  lists: () => [...mailKeys.all, 'list'] as const,
  list: () => [...mailKeys.lists(), {}] as const,
  details: () => [...mailKeys.all, 'detail'] as const,
  detail: (id: number) => [...mailKeys.details(), id] as const,
};
