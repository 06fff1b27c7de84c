import { Router } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { loginRequestSchema, passwordResetConfirmSchema, passwordResetRequestSchema } from '@veracast/shared-types';
import { Op } from 'sequelize';
import { PasswordResetModel, UserModel } from '../../db/models';
import { dummyVerify, hashPassword, randomToken, sha256, verifyPassword } from '../../services/crypto';
import { SESSION_COOKIE, csrfTokenFor, currentUser, requireSignedIn, sessionCookieOptions, signSession } from '../../http/auth';
import { gone, invalidCredentials, tooManyRequests } from '../../http/errors';
import { parse } from '../../http/validate';
import { presentUser } from '../../http/presenters';
import type { AppContext } from '../../http/context';

const RESET_HOURS = 2;

export function authRouter(ctx: AppContext) {
  const router = Router();

  // Failed sign-ins per address and e-mail; successful ones do not count.
  const loginLimiter = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: ctx.config.LOGIN_MAX_FAILURES,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String((req.body as { email?: unknown })?.email ?? '').toLowerCase()}`,
    handler: (_req, _res, next) => next(tooManyRequests('Too many failed sign-in attempts; wait 15 minutes and try again')),
  });

  router.post('/login', loginLimiter, async (req, res) => {
    const body = parse(loginRequestSchema, req.body);
    const user = await UserModel.findOne({ where: { email: body.email } });
    const ok = user && !user.disabled ? await verifyPassword(user.passwordHash, body.password) : await dummyVerify(body.password);
    if (!ok || !user) throw invalidCredentials();
    const sessionId = randomToken(16);
    res.cookie(SESSION_COOKIE, signSession(ctx, user.id, sessionId), sessionCookieOptions(ctx));
    res.json({ user: presentUser(user), csrfToken: csrfTokenFor(ctx, sessionId) });
  });

  router.post('/logout', (_req, res) => {
    res.clearCookie(SESSION_COOKIE, { ...sessionCookieOptions(ctx), maxAge: undefined });
    res.status(204).end();
  });

  router.get('/me', requireSignedIn, (req, res) => {
    res.json({ user: presentUser(currentUser(req)) });
  });

  router.get('/csrf', requireSignedIn, (req, res) => {
    const sessionId = req.auth?.sessionId;
    // Token callers are exempt from CSRF; they get an empty token.
    res.json({ csrfToken: sessionId ? csrfTokenFor(ctx, sessionId) : '' });
  });

  router.post('/password-reset/request', async (req, res) => {
    const { email } = parse(passwordResetRequestSchema, req.body);
    const user = await UserModel.findOne({ where: { email } });
    if (user && !user.disabled) {
      const token = randomToken();
      await PasswordResetModel.create({ userId: user.id, tokenHash: sha256(token), expiresAt: new Date(Date.now() + RESET_HOURS * 3600_000), usedAt: null });
      await ctx.mailer.send({
        to: user.email,
        subject: 'Reset your Veracast password',
        text: `Someone asked to reset the password of your Veracast account (${user.email}).\n\nSet a new password here (the link works once, for ${RESET_HOURS} hours):\n${ctx.config.publicUrl}/reset-password/${token}\n\nIf it was not you, ignore this message; your password stays as it is.`,
      });
    }
    // Same answer whether or not the address is known.
    res.status(202).json({ message: 'If the address belongs to an account, a reset link is on its way' });
  });

  router.post('/password-reset/confirm', async (req, res) => {
    const { token, password } = parse(passwordResetConfirmSchema, req.body);
    const hash = await hashPassword(password);
    await ctx.sequelize.transaction(async (transaction) => {
      const reset = await PasswordResetModel.findOne({
        where: { tokenHash: sha256(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
        lock: transaction.LOCK.UPDATE,
        transaction,
      });
      if (!reset) throw gone('This reset link is unknown, already used or expired; ask for a new one');
      await reset.update({ usedAt: new Date() }, { transaction });
      await UserModel.update({ passwordHash: hash }, { where: { id: reset.userId }, transaction });
    });
    res.status(204).end();
  });

  return router;
}
