import { z } from 'zod';

/** Roles in increasing order of power (SPEC §2). */
export const ROLES = ['viewer', 'analyst', 'reviewer', 'admin'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

/** True when `role` has at least the power of `minimum`. */
export function roleAtLeast(role: Role, minimum: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(minimum);
}
