import { Router } from 'express';
import { z } from 'zod';
import { requireRole } from '../../http/auth';
import { parse } from '../../http/validate';
import { sendList } from '../../http/csv';
import { loadContests, loadElections, loadPolls } from '../../queries/archive';
import { qualityIssues } from '../../queries/quality';
import type { AppContext } from '../../http/context';

const query = z.object({ election: z.string().max(100).optional(), format: z.enum(['json', 'csv']).optional() });

export function qualityRouter(ctx: AppContext) {
  const router = Router();
  router.get('/', requireRole('viewer'), async (req, res) => {
    const q = parse(query, req.query, 'query');
    const elections = await loadElections(ctx.sequelize, q.election ? { keys: [q.election] } : {});
    const contests = await loadContests(ctx.sequelize, { electionIds: elections.map((e) => e.id) });
    const polls = await loadPolls(ctx.sequelize, { contestIds: contests.map((c) => c.id) });
    const items = qualityIssues(elections, contests, polls);
    sendList(req, res, req.query.format === 'csv' ? items.map((i) => ({ ...i, pollKeys: i.pollKeys.join(' ') })) : items, { filename: 'data-quality' });
  });
  return router;
}
