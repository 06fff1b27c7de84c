import { Router } from 'express';
import { Op } from 'sequelize';
import { invitationAcceptSchema, invitationCreateSchema } from '@veracast/shared-types';
import { InvitationModel, UserModel } from '../../db/models';
import { hashPassword, randomToken, sha256 } from '../../services/crypto';
import { currentUser, requireRole } from '../../http/auth';
import { conflict, gone, notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { presentInvitation, presentUser } from '../../http/presenters';
import { sendList } from '../../http/csv';
import type { AppContext } from '../../http/context';

const INVITE_DAYS = 7;
const tokenParam = (t: unknown) => (typeof t === 'string' && /^[A-Za-z0-9_-]{20,200}$/.test(t) ? t : null);

export function invitationsRouter(ctx: AppContext) {
  const router = Router();

  router.post('/', requireRole('admin'), async (req, res) => {
    const body = parse(invitationCreateSchema, req.body);
    if (await UserModel.findOne({ where: { email: body.email } })) {
      throw conflict('user_exists', `${body.email} already has an account`);
    }
    const token = randomToken();
    const admin = currentUser(req);
    const invitation = await InvitationModel.create({
      email: body.email,
      role: body.role,
      tokenHash: sha256(token),
      expiresAt: new Date(Date.now() + INVITE_DAYS * 86400_000),
      acceptedAt: null,
      invitedById: admin.id,
    });
    await ctx.mailer.send({
      to: body.email,
      subject: 'You are invited to Veracast',
      text: `${admin.name} invited you to Veracast as ${body.role}.\n\nVeracast is where the team audits pre-election polls against certified results.\n\nChoose your name and password here (the link works once, for ${INVITE_DAYS} days):\n${ctx.config.publicUrl}/invite/${token}\n`,
    });
    res.status(201).json(presentInvitation(invitation, admin.email));
  });

  router.get('/', requireRole('admin'), async (req, res) => {
    const rows = await InvitationModel.findAll({ order: [['createdAt', 'DESC']], limit: 500 });
    const inviters = new Map((await UserModel.findAll({ attributes: ['id', 'email'] })).map((u) => [u.id, u.email]));
    sendList(req, res, rows.map((i) => presentInvitation(i, i.invitedById ? (inviters.get(i.invitedById) ?? null) : null)), { filename: 'invitations' });
  });

  async function findOpen(token: string | null, lock?: { transaction: import('sequelize').Transaction }) {
    if (!token) throw notFound('Invitation');
    const invitation = await InvitationModel.findOne({
      where: { tokenHash: sha256(token) },
      ...(lock ? { transaction: lock.transaction, lock: lock.transaction.LOCK.UPDATE } : {}),
    });
    if (!invitation) throw notFound('Invitation');
    if (invitation.acceptedAt) throw gone('This invitation has already been used');
    if (invitation.expiresAt.getTime() < Date.now()) throw gone('This invitation has expired; ask an admin for a new one');
    return invitation;
  }

  router.get('/:token', async (req, res) => {
    const invitation = await findOpen(tokenParam(req.params.token));
    res.json({ email: invitation.email, role: invitation.role, expiresAt: invitation.expiresAt.toISOString() });
  });

  router.post('/accept', async (req, res) => {
    const body = parse(invitationAcceptSchema, req.body);
    const passwordHash = await hashPassword(body.password);
    const user = await ctx.sequelize.transaction(async (transaction) => {
      const invitation = await findOpen(tokenParam(body.token), { transaction });
      if (await UserModel.findOne({ where: { email: invitation.email }, transaction })) {
        throw conflict('user_exists', `${invitation.email} already has an account`);
      }
      await invitation.update({ acceptedAt: new Date() }, { transaction });
      // Other open invitations for the same address are spent too.
      await InvitationModel.update({ acceptedAt: new Date() }, { where: { email: invitation.email, acceptedAt: null, id: { [Op.ne]: invitation.id } }, transaction });
      return UserModel.create({ email: invitation.email, name: body.name, role: invitation.role, passwordHash }, { transaction });
    });
    res.status(201).json({ user: presentUser(user) });
  });

  return router;
}
