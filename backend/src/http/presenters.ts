import type { ApiToken, Invitation, MailMessage, User } from '@veracast/shared-types';
import type { ApiTokenModel, InvitationModel, MailMessageModel, UserModel } from '../db/models';

const iso = (d: Date | null | undefined) => (d ? new Date(d).toISOString() : null);

export const presentUser = (u: UserModel): User => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  disabled: Boolean(u.disabled),
  createdAt: iso(u.createdAt) ?? '',
});

export const presentApiToken = (t: ApiTokenModel): ApiToken => ({
  id: t.id,
  name: t.name,
  prefix: t.prefix,
  createdAt: iso(t.createdAt) ?? '',
  lastUsedAt: iso(t.lastUsedAt),
  revokedAt: iso(t.revokedAt),
});

export const presentInvitation = (i: InvitationModel, invitedBy: string | null = null): Invitation => ({
  id: i.id,
  email: i.email,
  role: i.role,
  expiresAt: iso(i.expiresAt) ?? '',
  acceptedAt: iso(i.acceptedAt),
  invitedBy,
  createdAt: iso(i.createdAt) ?? '',
});

export const presentMail = (m: MailMessageModel): MailMessage => ({
  id: m.id,
  from: m.fromAddress,
  to: m.toAddress,
  subject: m.subject,
  text: m.textBody,
  receivedAt: iso(m.receivedAt) ?? '',
});
