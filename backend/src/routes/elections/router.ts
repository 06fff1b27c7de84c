import { Router } from 'express';
import { QueryTypes } from 'sequelize';
import { electionInputSchema, orientationSchema } from '@veracast/shared-types';
import { ChangeLogModel, ElectionModel } from '../../db/models';
import { currentUser, requireRole } from '../../http/auth';
import { conflict, notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { sendList } from '../../http/csv';
import { loadContests, loadElections, loadPolls } from '../../queries/archive';
import { presentContest, presentElection } from '../../queries/presenters';
import { qualityIssues } from '../../queries/quality';
import type { AppContext } from '../../http/context';

export async function pollCountsByContest(ctx: AppContext, contestIds?: number[]) {
  if (contestIds && !contestIds.length) return new Map<number, number>();
  const rows = await ctx.sequelize.query<{ contest_id: number; n: number }>(
    `SELECT contest_id, COUNT(*) AS n FROM polls ${contestIds ? 'WHERE contest_id IN (:ids)' : ''} GROUP BY contest_id`,
    { replacements: { ids: contestIds }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [Number(r.contest_id), Number(r.n)]));
}

export function electionsRouter(ctx: AppContext) {
  const router = Router();
  const s = ctx.sequelize;

  router.get('/', requireRole('viewer'), async (req, res) => {
    const elections = await loadElections(s);
    const contests = await loadContests(s, { electionIds: elections.map((e) => e.id) });
    const counts = await pollCountsByContest(ctx);
    sendList(req, res, elections.map((e) => presentElection(e, contests, counts)), { filename: 'elections' });
  });

  router.post('/', requireRole('analyst'), async (req, res) => {
    const body = parse(electionInputSchema, req.body);
    if (await ElectionModel.findOne({ where: { key: body.key } })) throw conflict('duplicate', `Election ${body.key} exists already`);
    await ElectionModel.create({ key: body.key, name: body.name, electionDate: body.date, jurisdiction: body.jurisdiction, blackoutStart: body.blackoutStart ?? null, blackoutEnd: body.blackoutEnd ?? null });
    const [e] = await loadElections(s, { keys: [body.key] });
    res.status(201).json(presentElection(e!, [], new Map()));
  });

  router.get('/:key', requireRole('viewer'), async (req, res) => {
    const [e] = await loadElections(s, { keys: [String(req.params.key)] });
    if (!e) throw notFound('Election');
    const contests = await loadContests(s, { electionIds: [e.id] });
    const counts = await pollCountsByContest(ctx, contests.map((c) => c.id));
    const polls = await loadPolls(s, { contestIds: contests.map((c) => c.id) });
    res.json({
      ...presentElection(e, contests, counts),
      contests: contests.map((c) => presentContest(c, e, contests, counts.get(c.id) ?? 0)),
      quality: qualityIssues([e], contests, polls),
    });
  });

  router.patch('/:key', requireRole('analyst'), async (req, res) => {
    const election = await ElectionModel.findOne({ where: { key: String(req.params.key) } });
    if (!election) throw notFound('Election');
    const body = parse(electionInputSchema.partial().omit({ key: true }), req.body);
    await election.update({
      ...(body.name ? { name: body.name } : {}), ...(body.date ? { electionDate: body.date } : {}), ...(body.jurisdiction ? { jurisdiction: body.jurisdiction } : {}),
      ...(body.blackoutStart !== undefined ? { blackoutStart: body.blackoutStart } : {}), ...(body.blackoutEnd !== undefined ? { blackoutEnd: body.blackoutEnd } : {}),
    });
    const [e] = await loadElections(s, { keys: [election.key] });
    const contests = await loadContests(s, { electionIds: [e!.id] });
    res.json(presentElection(e!, contests, await pollCountsByContest(ctx, contests.map((c) => c.id))));
  });

  /** A reviewer sets the election's orientation blocs (SPEC §2, §4); logged in the change log. */
  router.put('/:key/orientation', requireRole('reviewer'), async (req, res) => {
    const election = await ElectionModel.findOne({ where: { key: String(req.params.key) } });
    if (!election) throw notFound('Election');
    const body = parse(orientationSchema, req.body);
    const contests = await loadContests(s, { electionIds: [election.id] });
    const blocs = new Set(contests.flatMap((c) => c.options.map((o) => o.bloc)).filter(Boolean));
    const unknown = [body.blocA, body.blocB].filter((b) => !blocs.has(b));
    if (unknown.length) {
      const { validationFailed } = await import('../../http/errors');
      throw validationFailed(unknown.map((b) => ({ field: b === body.blocA ? 'blocA' : 'blocB', message: `bloc ${b} stands in no contest of this election` })), `bloc ${unknown.join(', ')} stands in no contest of this election`);
    }
    await s.transaction(async (transaction) => {
      const before = { blocA: election.blocA, blocB: election.blocB };
      await election.update({ blocA: body.blocA, blocB: body.blocB }, { transaction });
      await ChangeLogModel.create({ entity: 'election', entityKey: election.key, action: 'set_orientation', userId: currentUser(req).id, reason: null, beforeValue: JSON.stringify(before), afterValue: JSON.stringify(body) }, { transaction });
    });
    const [e] = await loadElections(s, { keys: [election.key] });
    res.json(presentElection(e!, contests, await pollCountsByContest(ctx, contests.map((c) => c.id))));
  });

  return router;
}
