import { z } from 'zod';
import { roleSchema } from './roles';

export const PASSWORD_MIN = 12;
export const passwordSchema = z
  .string()
  .min(PASSWORD_MIN, `password must be at least ${PASSWORD_MIN} characters`)
  .max(256, 'password must be at most 256 characters');
export const emailSchema = z.string().trim().toLowerCase().email('email must be a valid e-mail address').max(254);

export const loginRequestSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'password is required').max(256),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type User = z.infer<typeof userSchema>;

/** `POST /auth/login` and `GET /auth/me` answer `{ user }`. */
export interface MeResponse {
  user: User;
}
/** `GET /auth/csrf` answers the token to send back as `X-CSRF-Token`. */
export interface CsrfResponse {
  csrfToken: string;
}

export const passwordResetRequestSchema = z.object({ email: emailSchema });
export const passwordResetConfirmSchema = z.object({
  token: z.string().min(20, 'token is missing or malformed').max(200),
  password: passwordSchema,
});

export const invitationCreateSchema = z.object({ email: emailSchema, role: roleSchema });
export type InvitationCreate = z.infer<typeof invitationCreateSchema>;
export const invitationAcceptSchema = z.object({
  token: z.string().min(20, 'token is missing or malformed').max(200),
  name: z.string().trim().min(1, 'name is required').max(120, 'name must be at most 120 characters'),
  password: passwordSchema,
});
export type InvitationAccept = z.infer<typeof invitationAcceptSchema>;
export interface Invitation {
  id: number;
  email: string;
  role: z.infer<typeof roleSchema>;
  expiresAt: string;
  acceptedAt: string | null;
  invitedBy: string | null;
  createdAt: string;
}
/** `GET /invitations/:token` (public): what the acceptance form shows. */
export interface InvitationPreview {
  email: string;
  role: z.infer<typeof roleSchema>;
  expiresAt: string;
}

export const userUpdateSchema = z
  .object({ role: roleSchema.optional(), disabled: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.disabled !== undefined, { message: 'give role or disabled' });
export type UserUpdate = z.infer<typeof userUpdateSchema>;

export const apiTokenCreateSchema = z.object({
  name: z.string().trim().min(1, 'name is required').max(100, 'name must be at most 100 characters'),
});
export interface ApiToken {
  id: number;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}
/** `POST /api-tokens` answers the secret once. */
export interface ApiTokenCreated {
  id: number;
  name: string;
  token: string;
}

export interface MailMessage {
  id: number;
  from: string;
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
}
