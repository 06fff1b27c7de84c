import { Op } from 'sequelize';
import type { AppContext } from '../../http/context';
import { UserModel, type NoteModel } from '../../db/models';

/** Where a person reads or reviews a note in the app, and where the public reads it. */
export const noteLinks = (ctx: AppContext, note: Pick<NoteModel, 'id' | 'slug'>) => ({
  app: `${ctx.config.publicUrl}/notes/${note.id}`,
  public: `${ctx.config.publicUrl}/public/notes/${encodeURIComponent(note.slug)}`,
});

/** Sends one message; a mail failure is logged and never undoes the state change it reports. */
async function send(ctx: AppContext, to: string, subject: string, text: string) {
  try {
    await ctx.mailer.send({ to, subject, text });
  } catch (err) {
    ctx.logger.error({ err, to, subject }, 'note e-mail could not be sent');
  }
}

/** Every active reviewer and admin except the author is told a note waits for review (one message each). */
export async function mailSubmitted(ctx: AppContext, note: NoteModel, author: UserModel, version: number) {
  const reviewers = await UserModel.findAll({ where: { role: { [Op.in]: ['reviewer', 'admin'] }, disabled: false, id: { [Op.ne]: note.authorId } } });
  const link = noteLinks(ctx, note).app;
  for (const r of reviewers) {
    await send(ctx, r.email, `Review requested: “${note.title}”`,
      `${author.name} submitted the methodology note “${note.title}” (version ${version}) for review.\n\n` +
      `Read it and approve or return it with comments:\n${link}\n\n` +
      'A reviewer other than the author publishes it.\n');
  }
  return reviewers.length;
}

export async function mailReturned(ctx: AppContext, note: NoteModel, reviewer: UserModel, comments: string) {
  const author = await UserModel.findByPk(note.authorId);
  if (!author || author.disabled) return;
  await send(ctx, author.email, `Returned for changes: “${note.title}”`,
    `${reviewer.name} returned your methodology note “${note.title}” to draft with these comments:\n\n${comments}\n\n` +
    `Edit it and submit it again:\n${noteLinks(ctx, note).app}\n`);
}

export async function mailPublished(ctx: AppContext, note: NoteModel, reviewer: UserModel, comments: string | undefined) {
  const author = await UserModel.findByPk(note.authorId);
  if (!author || author.disabled) return;
  const links = noteLinks(ctx, note);
  await send(ctx, author.email, `Published: “${note.title}”`,
    `${reviewer.name} approved and published your methodology note “${note.title}”.\n\n` +
    (comments ? `Reviewer's comments:\n${comments}\n\n` : '') +
    `Public page (readable without signing in):\n${links.public}\n\nThe note in Veracast:\n${links.app}\n`);
}

export async function mailCorrected(ctx: AppContext, note: NoteModel, by: UserModel, notice: string) {
  if (by.id === note.authorId) return;
  const author = await UserModel.findByPk(note.authorId);
  if (!author || author.disabled) return;
  await send(ctx, author.email, `Correction published: “${note.title}”`,
    `${by.name} published a correction to your methodology note “${note.title}”:\n\n${notice}\n\nPublic page:\n${noteLinks(ctx, note).public}\n`);
}
