import type { NextFunction, Request, Response } from 'express';
import jwt from 'jsonwebtoken';
import { roleAtLeast, type Role } from '@veracast/shared-types';
import type {} from './types';
import { ApiTokenModel, UserModel } from '../db/models';
import { hmac, safeEqual, sha256 } from '../services/crypto';
import { csrfInvalid, forbidden, unauthorized } from './errors';
import type { AppContext } from './context';

export const SESSION_COOKIE = 'veracast_session';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

interface SessionClaims {
  sub: string;
  sid: string;
}

export function signSession(ctx: AppContext, userId: number, sessionId: string): string {
  return jwt.sign({ sid: sessionId }, ctx.config.JWT_SECRET, {
    subject: String(userId),
    expiresIn: Math.round(ctx.config.SESSION_HOURS * 3600),
    algorithm: 'HS256',
  });
}

export function sessionCookieOptions(ctx: AppContext) {
  return {
    httpOnly: true,
    sameSite: 'strict' as const,
    secure: ctx.config.COOKIE_SECURE,
    path: '/',
    maxAge: ctx.config.SESSION_HOURS * 3600 * 1000,
  };
}

/** The CSRF token of a session: an HMAC of its id, so nothing needs storing. */
export const csrfTokenFor = (ctx: AppContext, sessionId: string) => hmac(ctx.config.JWT_SECRET, `csrf:${sessionId}`);

/**
 * Resolves who is calling: a personal API token (`Authorization: Bearer …`) or the session
 * cookie. Loads the user on every request so that role changes and disabling apply at once.
 */
export function authenticate(ctx: AppContext) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const header = req.get('authorization');
    if (header) {
      const match = /^Bearer\s+(\S+)$/i.exec(header);
      if (!match?.[1]) return next(unauthorized('Authorization header must be "Bearer <token>"'));
      const token = await ApiTokenModel.findOne({ where: { tokenHash: sha256(match[1]), revokedAt: null } });
      const user = token ? await UserModel.findByPk(token.userId) : null;
      if (!token || !user || user.disabled) return next(unauthorized('The API token is unknown, revoked or its owner is disabled'));
      if (!token.lastUsedAt || Date.now() - token.lastUsedAt.getTime() > 60_000) {
        await token.update({ lastUsedAt: new Date() });
      }
      req.auth = { user, via: 'token' };
      return next();
    }
    const raw: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof raw === 'string' && raw) {
      let claims: SessionClaims | undefined;
      try {
        claims = jwt.verify(raw, ctx.config.JWT_SECRET, { algorithms: ['HS256'] }) as SessionClaims;
      } catch {
        claims = undefined;
      }
      if (claims) {
        const user = await UserModel.findByPk(Number(claims.sub));
        if (user && !user.disabled) req.auth = { user, via: 'cookie', sessionId: claims.sid };
      }
    }
    next();
  };
}

/** Unsafe requests authenticated by the cookie must carry the session's CSRF token. */
export function csrfProtection(ctx: AppContext) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method) || req.auth?.via !== 'cookie' || !req.auth.sessionId) return next();
    const sent = req.get('x-csrf-token') ?? '';
    if (!safeEqual(sent, csrfTokenFor(ctx, req.auth.sessionId))) return next(csrfInvalid());
    next();
  };
}

/** The one role check every protected route goes through. */
export function requireRole(minimum: Role) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.auth) return next(unauthorized());
    if (!roleAtLeast(req.auth.user.role, minimum)) {
      return next(forbidden(`This needs the ${minimum} role or above; you are ${req.auth.user.role}`));
    }
    next();
  };
}

export const requireSignedIn = requireRole('viewer');

/** The signed-in user; only for handlers behind requireRole. */
export function currentUser(req: Request): UserModel {
  if (!req.auth) throw unauthorized();
  return req.auth.user;
}
