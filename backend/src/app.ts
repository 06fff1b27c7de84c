import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import express, { Router, type Express } from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import { pinoHttp } from 'pino-http';
import { API_PREFIX } from '@veracast/shared-types';
import type { AppContext } from './http/context';
import { authenticate, csrfProtection } from './http/auth';
import { errorHandler } from './http/error-handler';
import { notFound } from './http/errors';
import { authRouter } from './routes/auth/router';
import { invitationsRouter } from './routes/invitations/router';
import { usersRouter } from './routes/users/router';
import { apiTokensRouter } from './routes/api-tokens/router';
import { mailboxRouter } from './routes/mailbox/router';
import { healthRouter } from './routes/health/router';
import { importsRouter } from './routes/imports/router';
import { auditsRouter } from './routes/audits/router';
import { notesRouter } from './routes/notes/router';
import { publicRouter } from './routes/public/router';
import { electionsRouter } from './routes/elections/router';
import { contestsRouter } from './routes/contests/router';
import { pollsRouter } from './routes/polls/router';
import { pollstersRouter } from './routes/pollsters/router';
import { qualityRouter } from './routes/quality/router';
import { openApiDocument } from './openapi';

const defaultDist = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../frontend/dist');

/** Builds the Express app; the server and the tests both call this. */
export function createApp(ctx: AppContext): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  app.use(pinoHttp({ logger: ctx.logger, autoLogging: { ignore: (req) => !req.url?.startsWith('/api/') } }));
  app.use(express.json({ limit: '2mb' }));
  app.use(cookieParser());

  const api = Router();
  api.use('/health', healthRouter(ctx));
  api.get('/openapi.json', (_req, res) => res.json(openApiDocument()));
  api.use(authenticate(ctx));
  api.use(csrfProtection(ctx));
  api.use('/auth', authRouter(ctx));
  api.use('/invitations', invitationsRouter(ctx));
  api.use('/users', usersRouter(ctx));
  api.use('/api-tokens', apiTokensRouter());
  api.use('/admin/mailbox', mailboxRouter());
  api.use('/imports', importsRouter(ctx));
  api.use('/audits', auditsRouter(ctx));
  api.use('/notes', notesRouter(ctx));
  // Published notes, readable without signing in (no role check).
  api.use('/public', publicRouter(ctx));
  api.use('/elections', electionsRouter(ctx));
  api.use('/contests', contestsRouter(ctx));
  api.use('/polls', pollsRouter(ctx));
  api.use('/pollsters', pollstersRouter(ctx));
  api.use('/quality', qualityRouter(ctx));
  api.use((_req, _res, next) => next(notFound('API route')));
  app.use(API_PREFIX, api);

  const dist = ctx.config.FRONTEND_DIST ?? defaultDist;
  if (fs.existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(dist, 'index.html')));
  }

  app.use(errorHandler(ctx.logger, ctx.config.UPLOAD_MAX_MB));
  return app;
}
