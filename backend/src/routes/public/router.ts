import { Router, type Request } from 'express';
import { Op } from 'sequelize';
import type { PublicNote, PublicNoteSummary } from '@veracast/shared-types';
import { NoteModel, NoteVersionModel } from '../../db/models';
import { notFound, validationFailed } from '../../http/errors';
import { sendList } from '../../http/csv';
import type { AppContext } from '../../http/context';
import { loadAuditSnapshots } from '../../services/notes/audit-data';
import { NOTE_CAUTIONS } from '../../services/notes/cautions';
import { writeNotePdf } from '../../services/notes/pdf';

const iso = (d: Date | null | undefined) => new Date(d ?? 0).toISOString();

/**
 * Pages anyone may read without signing in: published notes only, each as its frozen published
 * version. Nothing else leaves here: no drafts, no review comments, no names or e-mail addresses,
 * and of the audits only what the note cites (name, data hash, core version, date).
 */
export function publicRouter(ctx: AppContext) {
  const router = Router();

  async function findPublished(req: Request) {
    const slug = String(req.params.slug ?? '');
    if (!/^[a-z0-9-]{1,120}$/.test(slug)) throw validationFailed([{ field: 'slug', message: 'slug must be lowercase letters, digits and hyphens' }], 'slug must be lowercase letters, digits and hyphens');
    const note = await NoteModel.findOne({ where: { slug, state: 'published' } });
    const version = note?.publishedVersionId ? await NoteVersionModel.findByPk(note.publishedVersionId) : null;
    if (!note || !version) throw notFound('Published note');
    return { note, version };
  }

  async function present(note: NoteModel, version: NoteVersionModel): Promise<PublicNote> {
    const ids = JSON.parse(version.auditIds) as number[];
    const audits = await loadAuditSnapshots(ctx.sequelize, ids);
    const corrections = await NoteVersionModel.findAll({
      attributes: ['number', 'correctionNotice', 'createdAt'],
      where: { noteId: note.id, isCorrection: true, number: { [Op.lte]: version.number } },
      order: [['number', 'ASC']],
    });
    const stored = JSON.parse(version.dataHashes) as Record<string, string>;
    return {
      slug: note.slug, title: version.title, publishedAt: iso(note.publishedAt), updatedAt: iso(version.createdAt), corrected: corrections.length > 0,
      version: version.number, html: version.renderedHtml,
      audits: ids.flatMap((id) => {
        const a = audits.get(id);
        return a ? [{ id, name: a.name, dataHash: stored[String(id)] ?? a.dataHash, coreVersion: a.coreVersion, createdAt: a.createdAt }] : [];
      }),
      corrections: corrections.map((c) => ({ version: c.number, date: iso(c.createdAt), notice: c.correctionNotice ?? '' })),
      cautions: [...NOTE_CAUTIONS],
      fictional: [...audits.values()].some((a) => a.elections.some((e) => e.fictional)),
      pdfPath: `/api/v1/public/notes/${note.slug}/pdf`,
    };
  }

  router.get('/notes', async (req, res) => {
    const notes = await NoteModel.findAll({ where: { state: 'published' }, order: [['publishedAt', 'DESC']], limit: 1000 });
    const versions = await NoteVersionModel.findAll({
      attributes: ['id', 'noteId', 'title', 'isCorrection', 'createdAt'],
      where: { noteId: { [Op.in]: notes.map((n) => n.id).concat([0]) } },
    });
    const items: PublicNoteSummary[] = notes.flatMap((n) => {
      const published = versions.find((v) => v.id === n.publishedVersionId);
      if (!published) return [];
      return [{ slug: n.slug, title: published.title, publishedAt: iso(n.publishedAt), updatedAt: iso(published.createdAt), corrected: versions.some((v) => v.noteId === n.id && v.isCorrection) }];
    });
    sendList(req, res, items, { filename: 'published-notes' });
  });

  router.get('/notes/:slug', async (req, res) => {
    const { note, version } = await findPublished(req);
    res.json(await present(note, version));
  });

  router.get('/notes/:slug/pdf', async (req, res) => {
    const { note, version } = await findPublished(req);
    const p = await present(note, version);
    const pdf = await writeNotePdf({
      title: p.title, html: p.html, publishedAt: p.publishedAt, updatedAt: p.updatedAt, version: p.version,
      publicUrl: `${ctx.config.publicUrl}/public/notes/${p.slug}`, audits: p.audits, corrections: p.corrections, cautions: p.cautions, fictional: p.fictional,
    });
    res.type('application/pdf').setHeader('Content-Disposition', `attachment; filename="${p.slug}-v${p.version}.pdf"`);
    res.send(pdf);
  });

  return router;
}
