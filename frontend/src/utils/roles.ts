import { ROLES, type Role } from '@veracast/shared-types';

export const ROLE_LABELS: Record<Role, string> = {
  viewer: 'Viewer',
  analyst: 'Analyst',
  reviewer: 'Reviewer',
  admin: 'Admin',
};

/** What each role adds, in a phrase (SPEC §2). */
export const ROLE_SUMMARIES: Record<Role, string> = {
  viewer: 'reads elections, polls, audits and notes',
  analyst: 'also imports data, creates audits and writes notes',
  reviewer: 'also certifies results and approves notes',
  admin: 'also manages users, invitations and tokens',
};

export const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));
