import { Op } from 'sequelize';
import type { NoteDetail, NoteReviewDto, NoteSummary, NoteVersionDto, NoteVersionSummary } from '@veracast/shared-types';
import { NoteReviewModel, NoteVersionModel, UserModel, type NoteModel } from '../../db/models';

const iso = (d: Date | null | undefined) => (d ? new Date(d).toISOString() : null);
const names = async (ids: readonly (number | null)[]) => {
  const wanted = [...new Set(ids.filter((i): i is number => i !== null))];
  const users = wanted.length ? await UserModel.findAll({ attributes: ['id', 'name'], where: { id: { [Op.in]: wanted } } }) : [];
  return new Map(users.map((u) => [u.id, u.name]));
};

/** Summaries of notes, with author names and version numbers, in one pass. */
export async function presentNoteSummaries(notes: readonly NoteModel[]): Promise<NoteSummary[]> {
  if (!notes.length) return [];
  const authors = await names(notes.map((n) => n.authorId));
  const versions = await NoteVersionModel.findAll({ attributes: ['id', 'noteId', 'number'], where: { noteId: { [Op.in]: notes.map((n) => n.id) } } });
  const numberOf = new Map(versions.map((v) => [v.id, v.number]));
  const count = new Map<number, number>();
  for (const v of versions) count.set(v.noteId, (count.get(v.noteId) ?? 0) + 1);
  return notes.map((n) => ({
    id: n.id, slug: n.slug, title: n.title, state: n.state, author: { id: n.authorId, name: authors.get(n.authorId) ?? 'Unknown' },
    electionKey: n.electionKey, versionCount: count.get(n.id) ?? 0,
    currentVersion: n.currentVersionId ? numberOf.get(n.currentVersionId) ?? null : null,
    publishedVersion: n.publishedVersionId ? numberOf.get(n.publishedVersionId) ?? null : null,
    publishedAt: iso(n.publishedAt), createdAt: iso(n.createdAt) ?? '', updatedAt: iso(n.updatedAt) ?? '',
  }));
}

export async function presentVersions(versions: readonly NoteVersionModel[]): Promise<NoteVersionSummary[]> {
  const who = await names(versions.map((v) => v.createdById));
  return versions.map((v) => ({
    number: v.number, title: v.title, isCorrection: Boolean(v.isCorrection), correctionNotice: v.correctionNotice ?? null,
    createdBy: v.createdById ? who.get(v.createdById) ?? null : null, createdAt: iso(v.createdAt) ?? '',
    auditIds: JSON.parse(v.auditIds) as number[], dataHashes: JSON.parse(v.dataHashes) as Record<string, string>,
  }));
}

export async function presentVersion(v: NoteVersionModel): Promise<NoteVersionDto> {
  const [summary] = await presentVersions([v]);
  return { ...summary!, markdown: v.markdown, html: v.renderedHtml };
}

export async function presentReviews(noteId: number): Promise<NoteReviewDto[]> {
  const reviews = await NoteReviewModel.findAll({ where: { noteId }, order: [['id', 'ASC']] });
  const who = await names(reviews.map((r) => r.reviewerId));
  const versions = await NoteVersionModel.findAll({ attributes: ['id', 'number'], where: { noteId } });
  const numberOf = new Map(versions.map((v) => [v.id, v.number]));
  return reviews.map((r) => ({
    id: r.id, versionNumber: numberOf.get(r.versionId) ?? null, reviewer: r.reviewerId ? who.get(r.reviewerId) ?? null : null,
    decision: r.decision, comments: r.comments, createdAt: iso(r.createdAt) ?? '',
  }));
}

export type { NoteDetail };
