import { Router, type Request } from 'express';
import { Op, type WhereOptions } from 'sequelize';
import {
  noteCorrectionSchema, noteCreateSchema, noteListQuerySchema, notePreviewSchema, notePublishSchema, noteReturnSchema, noteUpdateSchema,
  roleAtLeast, type NoteAuditRef, type NoteDetail, type NotePreview,
} from '@veracast/shared-types';
import { NoteModel, NoteVersionModel, type UserModel } from '../../db/models';
import { currentUser, requireRole } from '../../http/auth';
import { notFound } from '../../http/errors';
import { idParam } from '../../http/params';
import { parse } from '../../http/validate';
import { sendList } from '../../http/csv';
import type { AppContext } from '../../http/context';
import { correctNote, createNote, notePermissions, publishNote, returnNote, saveNote, submitNote } from '../../commands/notes/workflow';
import { loadAuditSnapshots } from '../../services/notes/audit-data';
import { renderNote } from '../../services/notes/render';
import { presentNoteSummaries, presentReviews, presentVersion, presentVersions } from './presenters';

/** Viewers read notes in review or published; analysts and above read drafts too (SPEC §2). */
const visibleStates = (user: UserModel) => (roleAtLeast(user.role, 'analyst') ? ['draft', 'in_review', 'published'] : ['in_review', 'published']);

export function notesRouter(ctx: AppContext) {
  const router = Router();

  async function findNote(req: Request): Promise<NoteModel> {
    const note = await NoteModel.findByPk(idParam(req.params.id));
    if (!note || !visibleStates(currentUser(req)).includes(note.state)) throw notFound('Note');
    return note;
  }

  async function auditRefs(ids: readonly number[]): Promise<NoteAuditRef[]> {
    const audits = await loadAuditSnapshots(ctx.sequelize, ids, { checkCurrent: true });
    return ids.map((id) => {
      const a = audits.get(id);
      return a ? { id, name: a.name, dataHash: a.dataHash, exists: true, outOfDate: a.currentHash !== a.dataHash } : { id, name: null, dataHash: null, exists: false, outOfDate: null };
    });
  }

  async function detail(note: NoteModel, user: UserModel): Promise<NoteDetail> {
    const [summary] = await presentNoteSummaries([note]);
    const version = note.currentVersionId ? await NoteVersionModel.findByPk(note.currentVersionId) : null;
    const current = version ? await presentVersion(version) : null;
    const { isAuthor: _isAuthor, ...can } = notePermissions(note, user);
    return {
      ...summary!, current, reviews: await presentReviews(note.id), audits: current ? await auditRefs(current.auditIds) : [], can,
      publicPath: note.state === 'published' ? `/public/notes/${encodeURIComponent(note.slug)}` : null,
    };
  }

  router.get('/', requireRole('viewer'), async (req, res) => {
    const q = parse(noteListQuerySchema, req.query, 'query');
    const states = visibleStates(currentUser(req)).filter((s) => !q.state || s === q.state);
    const where: WhereOptions<NoteModel> = { state: { [Op.in]: states } };
    if (q.author) Object.assign(where, { authorId: q.author });
    if (q.election) Object.assign(where, { electionKey: q.election });
    const notes = await NoteModel.findAll({ where, order: [['updatedAt', 'DESC'], ['id', 'DESC']], limit: 1000 });
    const items = await presentNoteSummaries(notes);
    sendList(req, res, items.map((i) => (req.query.format === 'csv' ? { ...i, author: i.author.name } : i)), {
      filename: 'notes', columns: req.query.format === 'csv' ? ['id', 'slug', 'title', 'state', 'author', 'electionKey', 'versionCount', 'currentVersion', 'publishedVersion', 'publishedAt', 'createdAt', 'updatedAt'] : undefined,
    });
  });

  router.post('/', requireRole('analyst'), async (req, res) => {
    const body = parse(noteCreateSchema, req.body);
    const note = await createNote(ctx.sequelize, currentUser(req), body);
    res.status(201).json(await detail(note, currentUser(req)));
  });

  router.post('/preview', requireRole('analyst'), async (req, res) => {
    const body = parse(notePreviewSchema, req.body);
    const r = await renderNote(ctx.sequelize, body.markdown, { checkCurrent: true });
    const out: NotePreview = { html: r.html, audits: r.audits, problems: r.problems };
    res.json(out);
  });

  router.get('/:id', requireRole('viewer'), async (req, res) => {
    res.json(await detail(await findNote(req), currentUser(req)));
  });

  router.put('/:id', requireRole('analyst'), async (req, res) => {
    const note = await findNote(req);
    const body = parse(noteUpdateSchema, req.body);
    const { created } = await saveNote(ctx.sequelize, note, currentUser(req), body);
    res.status(created ? 201 : 200).json(await detail(note, currentUser(req)));
  });

  router.get('/:id/versions', requireRole('viewer'), async (req, res) => {
    const note = await findNote(req);
    const versions = await NoteVersionModel.findAll({ where: { noteId: note.id }, order: [['number', 'ASC']] });
    const items = await presentVersions(versions);
    sendList(req, res, req.query.format === 'csv' ? items.map((i) => ({ ...i, dataHashes: Object.values(i.dataHashes).join(' ') })) : items, { filename: `note-${note.id}-versions` });
  });

  router.get('/:id/versions/:n', requireRole('viewer'), async (req, res) => {
    const note = await findNote(req);
    const version = await NoteVersionModel.findOne({ where: { noteId: note.id, number: idParam(req.params.n, 'n') } });
    if (!version) throw notFound('Version');
    res.json(await presentVersion(version));
  });

  router.post('/:id/submit', requireRole('analyst'), async (req, res) => {
    const note = await findNote(req);
    const { notified } = await submitNote(ctx, note, currentUser(req));
    res.json({ ...(await detail(note, currentUser(req))), notified });
  });

  router.post('/:id/return', requireRole('reviewer'), async (req, res) => {
    const note = await findNote(req);
    const body = parse(noteReturnSchema, req.body);
    await returnNote(ctx, note, currentUser(req), body.comments);
    res.json(await detail(note, currentUser(req)));
  });

  router.post('/:id/publish', requireRole('reviewer'), async (req, res) => {
    const note = await findNote(req);
    const body = parse(notePublishSchema, req.body ?? {});
    await publishNote(ctx, note, currentUser(req), body.comments);
    res.json(await detail(note, currentUser(req)));
  });

  router.post('/:id/corrections', requireRole('analyst'), async (req, res) => {
    const note = await findNote(req);
    const body = parse(noteCorrectionSchema, req.body);
    await correctNote(ctx, note, currentUser(req), body);
    res.status(201).json(await detail(note, currentUser(req)));
  });

  return router;
}
