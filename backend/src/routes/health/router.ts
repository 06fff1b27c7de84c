import { Router } from 'express';
import type { AppContext } from '../../http/context';
import { VERSION } from '../../version';

export function healthRouter(ctx: AppContext) {
  const router = Router();
  router.get('/', async (_req, res) => {
    let up = true;
    try {
      await ctx.sequelize.query('SELECT 1');
    } catch {
      up = false;
    }
    res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down', version: VERSION });
  });
  return router;
}
