import { Router } from 'express';
import { z } from 'zod';
import { pollInputSchema, RESERVED_OPTION_KEYS, UNDECIDED_TREATMENTS, type PollInput } from '@veracast/shared-types';
import { ContestModel, PollModel, PollShareModel, PollsterModel, SponsorModel } from '../../db/models';
import { requireRole } from '../../http/auth';
import { conflict, notFound, validationFailed } from '../../http/errors';
import { parse } from '../../http/validate';
import { sendList } from '../../http/csv';
import { loadContests, loadElections, loadPolls } from '../../queries/archive';
import { presentContest, presentPoll } from '../../queries/presenters';
import { computeAuditPolls } from '../../commands/audits/compute';
import type { AppContext } from '../../http/context';

const listQuery = z.object({
  contest: z.string().max(100).optional(),
  election: z.string().max(100).optional(),
  pollster: z.coerce.number().int().positive().optional(),
  format: z.enum(['json', 'csv']).optional(),
});

export function pollsRouter(ctx: AppContext) {
  const router = Router();
  const s = ctx.sequelize;

  router.get('/', requireRole('viewer'), async (req, res) => {
    const q = parse(listQuery, req.query, 'query');
    const elections = await loadElections(s, q.election ? { keys: [q.election] } : {});
    const contests = await loadContests(s, q.contest ? { keys: [q.contest] } : { electionIds: elections.map((e) => e.id) });
    const polls = await loadPolls(s, { contestIds: contests.map((c) => c.id), ...(q.pollster ? { pollsterId: q.pollster } : {}) });
    const contestById = new Map(contests.map((c) => [c.id, c]));
    const allElections = q.contest ? await loadElections(s, { ids: [...new Set(contests.map((c) => c.electionId))] }) : elections;
    const electionById = new Map(allElections.map((e) => [e.id, e]));
    const items = polls.map((p) => presentPoll(p, contestById.get(p.contestId)!, electionById.get(contestById.get(p.contestId)!.electionId)!));
    if (q.format === 'csv') {
      sendList(req, res, items.map((p) => ({ ...p, shares: Object.entries(p.shares).map(([k, v]) => `${k}=${v}`).join(' '), disclosure: p.disclosure.completeness })), { filename: 'polls' });
    } else sendList(req, res, items, { filename: 'polls' });
  });

  /** A poll with the inputs its metrics came from and its metrics under each undecided treatment. */
  router.get('/:key', requireRole('viewer'), async (req, res) => {
    const [poll] = await loadPolls(s, { keys: [String(req.params.key)] });
    if (!poll) throw notFound('Poll');
    const [contest] = await loadContests(s, { ids: [poll.contestId] });
    const [election] = await loadElections(s, { ids: [contest!.electionId] });
    const siblings = await loadContests(s, { electionIds: [election!.id] });
    const inputs = { elections: [election!], contests: siblings, polls: [poll], dataHash: '' };
    const metrics = Object.fromEntries(
      UNDECIDED_TREATMENTS.map((t) => [t, computeAuditPolls(inputs, { name: 'live', electionKeys: [election!.key], windowDays: 21, finalOnly: false, undecided: t, minPolls: 5, designEffect: 1 })[0] ?? null]),
    );
    const pollCount = await PollModel.count({ where: { contestId: contest!.id } });
    res.json({ ...presentPoll(poll, contest!, election!), contest: presentContest(contest!, election!, siblings, pollCount), metrics });
  });

  async function writePoll(body: PollInput, existing: PollModel | null) {
    const contest = await ContestModel.findOne({ where: { key: body.contestKey } });
    if (!contest) throw validationFailed([{ field: 'contestKey', message: `contest ${body.contestKey} is unknown` }], `contestKey: contest ${body.contestKey} is unknown`);
    const [election] = await loadElections(s, { ids: [contest.electionId] });
    const problems: { field: string; message: string }[] = [];
    if (body.fieldworkEnd > election!.date) problems.push({ field: 'fieldworkEnd', message: `fieldwork end is after election day ${election!.date}` });
    if (body.publishedOn > election!.date) problems.push({ field: 'publishedOn', message: `publication is after election day ${election!.date}` });
    if (body.publishedOn < body.fieldworkEnd) problems.push({ field: 'publishedOn', message: 'publication is before fieldwork ended' });
    const [c] = await loadContests(s, { ids: [contest.id] });
    for (const k of Object.keys(body.shares)) {
      if (!c!.options.some((o) => o.key === k) && !(RESERVED_OPTION_KEYS as readonly string[]).includes(k)) problems.push({ field: `shares.${k}`, message: `${k} is not an option of contest ${contest.key} (nor undecided/other)` });
    }
    if (!(await PollsterModel.findByPk(body.pollsterId))) problems.push({ field: 'pollsterId', message: 'pollster is unknown' });
    if (problems.length) throw validationFailed(problems, problems.map((p) => `${p.field}: ${p.message}`).join('; '));
    let sponsorId: number | null = null;
    if (body.sponsor) {
      const [sponsor] = await SponsorModel.findOrCreate({ where: { name: body.sponsor }, defaults: { name: body.sponsor, type: body.sponsorType ?? 'unknown' } });
      if (body.sponsorType && sponsor.type !== body.sponsorType) await sponsor.update({ type: body.sponsorType });
      sponsorId = sponsor.id;
    }
    const values = {
      key: body.key, pollsterId: body.pollsterId, sponsorId, contestId: contest.id, fieldworkStart: body.fieldworkStart, fieldworkEnd: body.fieldworkEnd,
      publishedOn: body.publishedOn, sampleSize: body.sampleSize, population: body.population, mode: body.mode, moe: body.moe ?? null, studyKey: body.studyKey ?? null,
      isHeadline: body.isHeadline, tracking: body.tracking, sourceUrl: body.sourceUrl ?? null, questionWording: body.questionWording,
      weightingStatement: body.weightingStatement, tablesUrl: body.tablesUrl ?? null, importId: null,
    };
    await s.transaction(async (transaction) => {
      const poll = existing ? await existing.update(values, { transaction }) : await PollModel.create(values, { transaction });
      await PollShareModel.destroy({ where: { pollId: poll.id }, transaction });
      await PollShareModel.bulkCreate(Object.entries(body.shares).map(([optionKey, share]) => ({ pollId: poll.id, optionKey, share })), { transaction });
    });
  }

  router.post('/', requireRole('analyst'), async (req, res) => {
    const body = parse(pollInputSchema, req.body);
    if (await PollModel.findOne({ where: { key: body.key } })) throw conflict('duplicate', `Poll ${body.key} exists already`);
    await writePoll(body, null);
    const [poll] = await loadPolls(s, { keys: [body.key] });
    const [contest] = await loadContests(s, { ids: [poll!.contestId] });
    const [election] = await loadElections(s, { ids: [contest!.electionId] });
    res.status(201).json(presentPoll(poll!, contest!, election!));
  });

  router.put('/:key', requireRole('analyst'), async (req, res) => {
    const existing = await PollModel.findOne({ where: { key: String(req.params.key) } });
    if (!existing) throw notFound('Poll');
    const body = parse(pollInputSchema, { ...req.body, key: existing.key });
    await writePoll(body, existing);
    const [poll] = await loadPolls(s, { keys: [existing.key] });
    const [contest] = await loadContests(s, { ids: [poll!.contestId] });
    const [election] = await loadElections(s, { ids: [contest!.electionId] });
    res.json(presentPoll(poll!, contest!, election!));
  });

  return router;
}
