import { Router } from 'express';
import { QueryTypes } from 'sequelize';
import { pollsterInputSchema, type PollsterDto, type SponsorType } from '@veracast/shared-types';
import { PollsterAliasModel, PollsterModel } from '../../db/models';
import { requireRole } from '../../http/auth';
import { conflict, notFound } from '../../http/errors';
import { parse } from '../../http/validate';
import { sendList } from '../../http/csv';
import { idParam } from '../../http/params';
import { normalizeName } from '../../commands/imports/csv';
import { disclosureOf, loadContests, loadElections, loadPolls } from '../../queries/archive';
import { presentPoll } from '../../queries/presenters';
import type { AppContext } from '../../http/context';

export function pollstersRouter(ctx: AppContext) {
  const router = Router();
  const s = ctx.sequelize;

  async function present(ids?: number[]): Promise<PollsterDto[]> {
    const firms = await PollsterModel.findAll({ ...(ids ? { where: { id: ids } } : {}), order: [['name', 'ASC']] });
    const aliases = await PollsterAliasModel.findAll(ids ? { where: { pollsterId: ids } } : {});
    const stats = await s.query<{ pollster_id: number; polls: number; contests: number; elections: number; modes: string | null }>(
      `SELECT p.pollster_id, COUNT(*) AS polls, COUNT(DISTINCT p.contest_id) AS contests, COUNT(DISTINCT c.election_id) AS elections, GROUP_CONCAT(DISTINCT p.mode) AS modes
       FROM polls p JOIN contests c ON c.id = p.contest_id ${ids ? 'WHERE p.pollster_id IN (:ids)' : ''} GROUP BY p.pollster_id`,
      { replacements: { ids }, type: QueryTypes.SELECT },
    );
    const sponsors = await s.query<{ pollster_id: number; name: string; type: SponsorType }>(
      `SELECT DISTINCT p.pollster_id, sp.name, sp.type FROM polls p JOIN sponsors sp ON sp.id = p.sponsor_id ${ids ? 'WHERE p.pollster_id IN (:ids)' : ''}`,
      { replacements: { ids }, type: QueryTypes.SELECT },
    );
    const disclosure = await s.query<{ pollster_id: number; d: number }>(
      `SELECT pollster_id, AVG((sponsor_id IS NOT NULL) + 1 + 1 + 1 + (sample_size > 0) + 1 + (moe IS NOT NULL) + weighting_statement + question_wording + (tables_url IS NOT NULL)) / 10 AS d
       FROM polls ${ids ? 'WHERE pollster_id IN (:ids)' : ''} GROUP BY pollster_id`,
      { replacements: { ids }, type: QueryTypes.SELECT },
    );
    const st = new Map(stats.map((r) => [Number(r.pollster_id), r]));
    const dc = new Map(disclosure.map((r) => [Number(r.pollster_id), Number(r.d)]));
    return firms.map((f) => ({
      id: f.id, name: f.name, notes: f.notes ?? null, aliases: aliases.filter((a) => a.pollsterId === f.id).map((a) => a.alias).sort(),
      pollCount: Number(st.get(f.id)?.polls ?? 0), contestCount: Number(st.get(f.id)?.contests ?? 0), electionCount: Number(st.get(f.id)?.elections ?? 0),
      modes: (st.get(f.id)?.modes ?? '').split(',').filter(Boolean).sort(),
      sponsors: sponsors.filter((x) => Number(x.pollster_id) === f.id).map((x) => ({ name: x.name, type: x.type })),
      disclosure: dc.get(f.id) ?? null,
    }));
  }

  router.get('/', requireRole('viewer'), async (req, res) => {
    const items = await present();
    sendList(req, res, items.map((i) => (req.query.format === 'csv' ? { ...i, aliases: i.aliases.join('; '), sponsors: i.sponsors.map((x) => x.name).join('; '), modes: i.modes.join(' ') } : i)), { filename: 'pollsters' });
  });

  router.get('/:id', requireRole('viewer'), async (req, res) => {
    const id = idParam(req.params.id);
    const [firm] = await present([id]);
    if (!firm) throw notFound('Pollster');
    const polls = await loadPolls(s, { pollsterId: id });
    const contests = await loadContests(s, { ids: [...new Set(polls.map((p) => p.contestId))] });
    const elections = await loadElections(s, { ids: [...new Set(contests.map((c) => c.electionId))] });
    const cById = new Map(contests.map((c) => [c.id, c]));
    const eById = new Map(elections.map((e) => [e.id, e]));
    res.json({
      ...firm,
      polls: polls.map((p) => { const c = cById.get(p.contestId)!; return presentPoll(p, c, eById.get(c.electionId)!); }),
      disclosureItems: polls.length ? Object.fromEntries(Object.keys(disclosureOf(polls[0]!).items).map((k) => [k, polls.filter((p) => (disclosureOf(p).items as Record<string, boolean>)[k]).length / polls.length])) : {},
    });
  });

  async function saveAliases(pollsterId: number, aliases: string[]) {
    for (const alias of aliases) {
      const norm = normalizeName(alias);
      const clash = await PollsterAliasModel.findOne({ where: { normalized: norm } });
      if (clash && clash.pollsterId !== pollsterId) throw conflict('alias_taken', `The alias "${alias}" already belongs to another firm`);
      if (!clash) await PollsterAliasModel.create({ pollsterId, alias, normalized: norm });
    }
  }

  router.post('/', requireRole('analyst'), async (req, res) => {
    const body = parse(pollsterInputSchema, req.body);
    if (await PollsterModel.findOne({ where: { name: body.name } })) throw conflict('duplicate', `Pollster ${body.name} exists already`);
    const firm = await PollsterModel.create({ name: body.name, notes: body.notes ?? null });
    await saveAliases(firm.id, body.aliases);
    res.status(201).json((await present([firm.id]))[0]);
  });

  router.patch('/:id', requireRole('analyst'), async (req, res) => {
    const id = idParam(req.params.id);
    const firm = await PollsterModel.findByPk(id);
    if (!firm) throw notFound('Pollster');
    const body = parse(pollsterInputSchema.partial(), req.body);
    if (body.name && body.name !== firm.name) await firm.update({ name: body.name });
    if (body.notes !== undefined) await firm.update({ notes: body.notes });
    // Aliases are replaced only when the request names them (the schema's default would be []).
    if (Array.isArray((req.body as { aliases?: unknown })?.aliases) && body.aliases) {
      await PollsterAliasModel.destroy({ where: { pollsterId: id } });
      await saveAliases(id, body.aliases);
    }
    res.json((await present([id]))[0]);
  });

  return router;
}
