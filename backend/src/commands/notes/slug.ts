import { Op, type Transaction } from 'sequelize';
import { NoteModel } from '../../db/models';

/** A URL-safe slug from a title: lowercase ASCII letters and digits joined by single hyphens. */
export function slugify(title: string): string {
  const base = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/, '');
  return base || 'note';
}

/** The slug, or the slug with the smallest free `-n` suffix. */
export async function uniqueSlug(title: string, transaction?: Transaction): Promise<string> {
  const base = slugify(title);
  const taken = new Set(
    (await NoteModel.findAll({ attributes: ['slug'], where: { slug: { [Op.or]: [base, { [Op.like]: `${base}-%` }] } }, transaction })).map((n) => n.slug),
  );
  if (!taken.has(base)) return base;
  for (let i = 2; ; i++) if (!taken.has(`${base}-${i}`)) return `${base}-${i}`;
}
