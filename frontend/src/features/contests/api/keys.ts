import type { UndecidedTreatment } from '@veracast/shared-types';

export const contestKeys = {
  all: ['contests'] as const,
  details: () => [...contestKeys.all, 'detail'] as const,
  detail: (key: string) => [...contestKeys.details(), key] as const,
  polls: (key: string, undecided: UndecidedTreatment) => [...contestKeys.detail(key), 'polls', { undecided }] as const,
};
