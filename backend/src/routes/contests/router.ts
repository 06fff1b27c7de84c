import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { contestInputSchema, resultInputSchema, roleAtLeast, UNDECIDED_TREATMENTS, type ChangeLogEntryDto } from '@veracast/shared-types';
import { ChangeLogModel, ContestModel, ElectionModel, OptionModel, PollModel, UserModel } from '../../db/models';
import { currentUser, requireRole } from '../../http/auth';
import { badRequest, conflict, forbidden, notFound, validationFailed } from '../../http/errors';
import { parse } from '../../http/validate';
import { sendList } from '../../http/csv';
import { loadContests, loadElections, loadPolls } from '../../queries/archive';
import { presentContest, presentPoll } from '../../queries/presenters';
import { computeAuditPolls } from '../../commands/audits/compute';
import type { AppContext } from '../../http/context';

const pollsQuery = z.object({
  undecided: z.enum(UNDECIDED_TREATMENTS).default('raw'),
  format: z.enum(['json', 'csv']).optional(),
});

export function contestsRouter(ctx: AppContext) {
  const router = Router();
  const s = ctx.sequelize;
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: Math.min(ctx.config.UPLOAD_MAX_MB, 20) * 1024 * 1024, files: 1 } });

  async function load(key: string) {
    const [contest] = await loadContests(s, { keys: [key] });
    if (!contest) throw notFound('Contest');
    const [election] = await loadElections(s, { ids: [contest.electionId] });
    const siblings = await loadContests(s, { electionIds: [contest.electionId] });
    return { contest, election: election!, siblings };
  }

  router.post('/', requireRole('analyst'), async (req, res) => {
    const body = parse(contestInputSchema, req.body);
    const election = await ElectionModel.findOne({ where: { key: body.electionKey } });
    if (!election) throw validationFailed([{ field: 'electionKey', message: `election ${body.electionKey} is unknown` }], `electionKey: election ${body.electionKey} is unknown`);
    if (await ContestModel.findOne({ where: { key: body.key } })) throw conflict('duplicate', `Contest ${body.key} exists already`);
    const keys = body.options.map((o) => o.key);
    if (new Set(keys).size !== keys.length) throw validationFailed([{ field: 'options', message: 'option keys must be unique' }], 'options: option keys must be unique');
    if (keys.some((k) => k === 'undecided')) throw validationFailed([{ field: 'options', message: 'undecided is reserved for poll data' }], 'options: undecided is reserved for poll data');
    await s.transaction(async (transaction) => {
      const contest = await ContestModel.create({ electionId: election.id, key: body.key, name: body.name, kind: body.kind, electorate: body.electorate ?? null, rejectedBallots: body.rejectedBallots ?? null }, { transaction });
      await OptionModel.bulkCreate(body.options.map((o) => ({ contestId: contest.id, key: o.key, name: o.name, bloc: o.bloc || null, votes: null })), { transaction });
    });
    const { contest, election: e, siblings } = await load(body.key);
    res.status(201).json(presentContest(contest, e, siblings, 0));
  });

  router.get('/:key', requireRole('viewer'), async (req, res) => {
    const { contest, election, siblings } = await load(String(req.params.key));
    const pollCount = await PollModel.count({ where: { contestId: contest.id } });
    const log = await ChangeLogModel.findAll({ where: { entity: 'result', entityKey: contest.key }, order: [['id', 'DESC']] });
    const users = new Map((await UserModel.findAll({ attributes: ['id', 'email'] })).map((u) => [u.id, u.email]));
    const history: ChangeLogEntryDto[] = log.map((l) => ({
      id: l.id, entity: l.entity, entityKey: l.entityKey, action: l.action, user: l.userId ? (users.get(l.userId) ?? null) : null, reason: l.reason,
      before: l.beforeValue ? JSON.parse(l.beforeValue) : null, after: l.afterValue ? JSON.parse(l.afterValue) : null, createdAt: new Date(l.createdAt).toISOString(),
    }));
    res.json({ ...presentContest(contest, election, siblings, pollCount), history, hasSourceDocument: Boolean((await ContestModel.findByPk(contest.id, { attributes: ['sourceDocName'] }))?.sourceDocName) });
  });

  /** Polls of the contest with their metrics under the chosen undecided treatment (live, not frozen). */
  router.get('/:key/polls', requireRole('viewer'), async (req, res) => {
    const q = parse(pollsQuery, req.query, 'query');
    const { contest, election, siblings } = await load(String(req.params.key));
    const polls = await loadPolls(s, { contestIds: [contest.id] });
    const metrics = computeAuditPolls(
      { elections: [election], contests: siblings, polls, dataHash: '' },
      { name: 'live', electionKeys: [election.key], windowDays: 21, finalOnly: true, undecided: q.undecided, minPolls: 5, designEffect: 1 },
    );
    const byKey = new Map(metrics.map((m) => [m.pollKey, m]));
    const items = polls.map((p) => ({ ...presentPoll(p, contest, election), metrics: byKey.get(p.key) ?? null }));
    if (q.format === 'csv') {
      sendList(req, res, items.map((i) => ({ pollKey: i.key, pollster: i.pollster, fieldworkStart: i.fieldworkStart, fieldworkEnd: i.fieldworkEnd, publishedOn: i.publishedOn, sampleSize: i.sampleSize, population: i.population, mode: i.mode, moe: i.moe, shares: Object.entries(i.shares).map(([k, v]) => `${k}=${v}`).join(' '), marginError: i.metrics?.marginError, absMarginError: i.metrics?.absMarginError })), { filename: `${contest.key}-polls` });
      return;
    }
    sendList(req, res, items, { filename: `${contest.key}-polls` });
  });

  /**
   * Enters or changes a result. Provisional results: analyst. Certifying, or changing a certified
   * result: reviewer, with a source; changing a certified result also needs a reason. Every such
   * change lands in the append-only change log with before and after values.
   */
  router.put('/:key/result', requireRole('analyst'), async (req, res) => {
    const body = parse(resultInputSchema, req.body);
    const user = currentUser(req);
    const model = await ContestModel.findOne({ where: { key: String(req.params.key) } });
    if (!model) throw notFound('Contest');
    const wasCertified = model.resultStatus === 'certified';
    if ((body.status === 'certified' || wasCertified) && !roleAtLeast(user.role, 'reviewer')) {
      throw forbidden(wasCertified ? 'This result is certified; changing it needs the reviewer role' : 'Marking a result certified needs the reviewer role');
    }
    if (wasCertified && !body.reason) throw validationFailed([{ field: 'reason', message: 'changing a certified result needs a reason' }], 'reason: changing a certified result needs a reason');
    const options = await OptionModel.findAll({ where: { contestId: model.id } });
    const unknown = Object.keys(body.votes).filter((k) => !options.some((o) => o.key === k));
    if (unknown.length) throw validationFailed(unknown.map((k) => ({ field: `votes.${k}`, message: `${k} is not an option of this contest` })), `votes: ${unknown.join(', ')} not options of this contest`);
    const before = { status: model.resultStatus, certifiedOn: model.certifiedOn, sourceUrl: model.sourceUrl, certifyingBody: model.certifyingBody, votes: Object.fromEntries(options.map((o) => [o.key, o.votes])) };
    const after = { status: body.status, certifiedOn: body.certifiedOn ?? null, sourceUrl: body.sourceUrl ?? null, certifyingBody: body.certifyingBody ?? null, votes: { ...before.votes, ...body.votes } };
    if (JSON.stringify(before) === JSON.stringify(after)) throw badRequest('Nothing changed');
    await s.transaction(async (transaction) => {
      await model.update({ resultStatus: body.status, certifiedOn: body.certifiedOn ?? null, sourceUrl: body.sourceUrl ?? null, certifyingBody: body.certifyingBody ?? null }, { transaction });
      for (const o of options) if (body.votes[o.key] !== undefined) await o.update({ votes: body.votes[o.key]! }, { transaction });
      const action = wasCertified ? 'change_certified' : body.status === 'certified' ? 'certify' : 'edit_provisional';
      await ChangeLogModel.create({ entity: 'result', entityKey: model.key, action, userId: user.id, reason: body.reason ?? null, beforeValue: JSON.stringify(before), afterValue: JSON.stringify(after) }, { transaction });
    });
    const { contest, election, siblings } = await load(model.key);
    res.json(presentContest(contest, election, siblings, await PollModel.count({ where: { contestId: contest.id } })));
  });

  router.post('/:key/source-document', requireRole('reviewer'), upload.single('file'), async (req, res) => {
    const model = await ContestModel.findOne({ where: { key: String(req.params.key) } });
    if (!model) throw notFound('Contest');
    if (!req.file) throw validationFailed([{ field: 'file', message: 'file is required' }], 'file: file is required');
    if (!/^(application\/pdf|image\/(png|jpeg))$/.test(req.file.mimetype)) throw validationFailed([{ field: 'file', message: 'the source document must be a PDF, PNG or JPEG' }], 'file: the source document must be a PDF, PNG or JPEG');
    await s.transaction(async (transaction) => {
      await model.update({ sourceDoc: req.file!.buffer, sourceDocName: req.file!.originalname.slice(0, 200) }, { transaction });
      await ChangeLogModel.create({ entity: 'result', entityKey: model.key, action: 'attach_source', userId: currentUser(req).id, reason: null, beforeValue: null, afterValue: JSON.stringify({ sourceDocument: req.file!.originalname }) }, { transaction });
    });
    res.status(201).json({ name: model.sourceDocName });
  });

  router.get('/:key/source-document', requireRole('viewer'), async (req, res) => {
    const model = await ContestModel.findOne({ where: { key: String(req.params.key) } });
    if (!model?.sourceDoc) throw notFound('Source document');
    const name = (model.sourceDocName ?? 'source').replace(/[^A-Za-z0-9_.-]/g, '_');
    res.type(name.endsWith('.pdf') ? 'application/pdf' : name.match(/\.png$/) ? 'image/png' : 'image/jpeg');
    res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.send(model.sourceDoc);
  });

  return router;
}
