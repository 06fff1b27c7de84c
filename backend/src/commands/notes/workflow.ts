import type { Sequelize, Transaction } from 'sequelize';
import { roleAtLeast } from '@veracast/shared-types';
import { NoteModel, NoteReviewModel, NoteVersionModel, type UserModel } from '../../db/models';
import { conflict, forbidden } from '../../http/errors';
import type { AppContext } from '../../http/context';
import { renderNote } from '../../services/notes/render';
import { uniqueSlug } from './slug';
import { mailCorrected, mailPublished, mailReturned, mailSubmitted } from './notify';

const wrongState = (note: NoteModel, action: string, needed: string) =>
  conflict('wrong_state', `This note is ${note.state.replace('_', ' ')}; it can be ${action} only when it is ${needed}`);

/** Who may do what with a note (SPEC §2): the one place these rules live. */
export const notePermissions = (note: NoteModel, user: UserModel) => {
  const isAuthor = note.authorId === user.id;
  const reviewer = roleAtLeast(user.role, 'reviewer');
  return {
    isAuthor,
    edit: note.state === 'draft' && roleAtLeast(user.role, 'analyst') && (isAuthor || user.role === 'admin'),
    submit: note.state === 'draft' && isAuthor && roleAtLeast(user.role, 'analyst'),
    review: note.state === 'in_review' && reviewer && !isAuthor,
    correct: note.state === 'published' && roleAtLeast(user.role, 'analyst') && (isAuthor || reviewer),
  };
};

async function appendVersion(
  note: NoteModel,
  user: UserModel,
  content: { title: string; markdown: string },
  rendered: Awaited<ReturnType<typeof renderNote>>,
  correction: string | null,
  transaction: Transaction,
) {
  const last = (await NoteVersionModel.max<number, NoteVersionModel>('number', { where: { noteId: note.id }, transaction })) ?? 0;
  return NoteVersionModel.create(
    {
      noteId: note.id, number: last + 1, title: content.title, markdown: content.markdown, renderedHtml: rendered.html,
      auditIds: JSON.stringify(rendered.auditIds), dataHashes: JSON.stringify(rendered.dataHashes),
      isCorrection: correction !== null, correctionNotice: correction, createdById: user.id,
    },
    { transaction },
  );
}

/** Creates a draft note with its first version. */
export async function createNote(sequelize: Sequelize, user: UserModel, input: { title: string; markdown: string; electionKey?: string | null | undefined }) {
  const rendered = await renderNote(sequelize, input.markdown);
  return sequelize.transaction(async (transaction) => {
    const note = await NoteModel.create({ slug: await uniqueSlug(input.title, transaction), title: input.title, authorId: user.id, electionKey: input.electionKey ?? null }, { transaction });
    const version = await appendVersion(note, user, input, rendered, null, transaction);
    await note.update({ currentVersionId: version.id }, { transaction });
    return note;
  });
}

/**
 * Saves a draft as a new version (the author or an admin). Saving text identical to the current
 * version keeps the version list as it is.
 */
export async function saveNote(sequelize: Sequelize, note: NoteModel, user: UserModel, input: { title: string; markdown: string; electionKey?: string | null | undefined }) {
  const can = notePermissions(note, user);
  if (note.state !== 'draft') throw note.state === 'published'
    ? conflict('note_published', 'A published note cannot be edited; publish a correction instead')
    : wrongState(note, 'edited', 'a draft (a reviewer returns it to draft)');
  if (!can.edit) throw forbidden('Only the note’s author or an admin can edit it');
  const current = note.currentVersionId ? await NoteVersionModel.findByPk(note.currentVersionId) : null;
  const electionKey = input.electionKey === undefined ? note.electionKey : input.electionKey;
  if (current && current.title === input.title && current.markdown === input.markdown) {
    if (electionKey !== note.electionKey) await note.update({ electionKey });
    return { note, created: false };
  }
  const rendered = await renderNote(sequelize, input.markdown);
  await sequelize.transaction(async (transaction) => {
    const version = await appendVersion(note, user, input, rendered, null, transaction);
    await note.update({ title: input.title, electionKey, currentVersionId: version.id }, { transaction });
  });
  return { note, created: true };
}

export async function submitNote(ctx: AppContext, note: NoteModel, user: UserModel) {
  if (note.authorId !== user.id) throw forbidden('Only the note’s author can submit it for review');
  if (note.state !== 'draft') throw wrongState(note, 'submitted', 'a draft');
  await note.update({ state: 'in_review' });
  const version = await NoteVersionModel.findByPk(note.currentVersionId!);
  const notified = await mailSubmitted(ctx, note, user, version?.number ?? 0);
  return { note, notified };
}

function assertReviewer(note: NoteModel, user: UserModel, action: string) {
  if (!roleAtLeast(user.role, 'reviewer')) throw forbidden(`This needs the reviewer role or above; you are ${user.role}`);
  if (note.authorId === user.id) throw forbidden(`You wrote this note, so you cannot ${action} it: another reviewer must`);
  if (note.state !== 'in_review') throw wrongState(note, action === 'return' ? 'returned' : 'published', 'in review');
}

export async function returnNote(ctx: AppContext, note: NoteModel, user: UserModel, comments: string) {
  assertReviewer(note, user, 'return');
  await ctx.sequelize.transaction(async (transaction) => {
    await NoteReviewModel.create({ noteId: note.id, versionId: note.currentVersionId!, reviewerId: user.id, decision: 'returned', comments }, { transaction });
    await note.update({ state: 'draft' }, { transaction });
  });
  await mailReturned(ctx, note, user, comments);
  return note;
}

/** Approves and publishes the version under review: its stored HTML is what the public page and PDF show. */
export async function publishNote(ctx: AppContext, note: NoteModel, user: UserModel, comments: string | undefined) {
  assertReviewer(note, user, 'publish');
  await ctx.sequelize.transaction(async (transaction) => {
    await NoteReviewModel.create({ noteId: note.id, versionId: note.currentVersionId!, reviewerId: user.id, decision: 'approved', comments: comments || null }, { transaction });
    await note.update({ state: 'published', publishedVersionId: note.currentVersionId, publishedAt: note.publishedAt ?? new Date() }, { transaction });
  });
  await mailPublished(ctx, note, user, comments);
  return note;
}

/**
 * A correction to a published note: a new version, published at once with a visible notice and
 * date. The author (analyst or above) or any reviewer or admin may issue one; nothing earlier is
 * changed, so the public page lists every correction.
 */
export async function correctNote(ctx: AppContext, note: NoteModel, user: UserModel, input: { markdown: string; notice: string; title?: string | undefined }) {
  if (note.state !== 'published') throw wrongState(note, 'corrected', 'published (edit a draft instead)');
  if (!notePermissions(note, user).correct) throw forbidden('Only the note’s author or a reviewer can publish a correction');
  const title = input.title ?? note.title;
  const rendered = await renderNote(ctx.sequelize, input.markdown);
  await ctx.sequelize.transaction(async (transaction) => {
    const version = await appendVersion(note, user, { title, markdown: input.markdown }, rendered, input.notice, transaction);
    await note.update({ title, currentVersionId: version.id, publishedVersionId: version.id }, { transaction });
  });
  await mailCorrected(ctx, note, user, input.notice);
  return note;
}
