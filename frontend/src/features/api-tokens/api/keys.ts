export const apiTokenKeys = {
  all: ['api-tokens'] as const,
  lists: () => [...apiTokenKeys.all, 'list'] as const,
  list: () => [...apiTokenKeys.lists(), {}] as const,
};
