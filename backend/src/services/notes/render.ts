import type { Sequelize } from 'sequelize';
import type { Token } from 'markdown-it';
import type { NoteAuditRef } from '@veracast/shared-types';
import { loadAuditSnapshots, type AuditSnapshot } from './audit-data';
import { parseBlockSpec, type BlockSpec } from './blocks';
import { createNoteMarkdown } from './markdown';
import { sanitizeNoteHtml } from './sanitize';
import { blockErrorHtml, renderBlock, type ViewContext } from './views';

interface RenderEnv extends Record<PropertyKey, unknown> {
  ctx: ViewContext;
  problems: string[];
}

const md = createNoteMarkdown((body, env) => {
  const e = env as RenderEnv;
  const parsed = parseBlockSpec(body);
  if (!parsed.ok) {
    e.problems.push(parsed.error);
    return blockErrorHtml(parsed.error);
  }
  const out = renderBlock(parsed.spec, e.ctx);
  if (out.error) e.problems.push(out.error);
  return out.html;
});

/** The live blocks of a note's Markdown, in order, as written (parse errors included). */
export function findBlocks(markdown: string): ReturnType<typeof parseBlockSpec>[] {
  return md
    .parse(markdown, {})
    .filter((t: Token) => t.type === 'fence' && t.info.trim().split(/\s+/)[0] === 'veracast')
    .map((t: Token) => parseBlockSpec(t.content));
}

/** Audit ids named by the blocks, in order of first mention. */
export function citedAuditIds(markdown: string): number[] {
  const ids: number[] = [];
  for (const b of findBlocks(markdown)) if (b.ok && b.spec.audit !== null && !ids.includes(b.spec.audit)) ids.push(b.spec.audit);
  return ids;
}

export interface RenderedNote {
  html: string;
  /** Cited audits that exist, in order of first mention. */
  auditIds: number[];
  /** Audit id → the data hash stored with the audit. */
  dataHashes: Record<string, string>;
  audits: NoteAuditRef[];
  problems: string[];
  fictional: boolean;
}

/** Renders Markdown with already loaded audits (pure; used by tests and by {@link renderNote}). */
export function renderWithAudits(markdown: string, audits: ReadonlyMap<number, AuditSnapshot>, cited: readonly number[], markOutOfDate: boolean): { html: string; problems: string[] } {
  const env: RenderEnv = { ctx: { audits, cited, markOutOfDate }, problems: [] };
  const raw = md.render(markdown, env);
  return { html: sanitizeNoteHtml(raw), problems: env.problems };
}

/**
 * Renders a note's Markdown to sanitised HTML. Blocks read only the audits' stored results;
 * with `checkCurrent` (the editor's preview) each audit's inputs are hashed again so that blocks
 * of an out-of-date audit say so.
 */
export async function renderNote(sequelize: Sequelize, markdown: string, options: { checkCurrent?: boolean } = {}): Promise<RenderedNote> {
  const blocks = findBlocks(markdown).filter((b): b is { ok: true; spec: BlockSpec } => b.ok);
  const cited = citedAuditIds(markdown);
  const withPolls = new Set(blocks.filter((b) => b.spec.audit !== null && (b.spec.view === 'polls' || b.spec.view === 'breakdown')).map((b) => b.spec.audit!));
  const audits = await loadAuditSnapshots(sequelize, cited, { withPolls, checkCurrent: options.checkCurrent ?? false });
  const { html, problems } = renderWithAudits(markdown, audits, cited, options.checkCurrent ?? false);
  const found = cited.filter((id) => audits.has(id));
  return {
    html,
    auditIds: found,
    dataHashes: Object.fromEntries(found.map((id) => [String(id), audits.get(id)!.dataHash])),
    audits: cited.map((id) => {
      const a = audits.get(id);
      return a
        ? { id, name: a.name, dataHash: a.dataHash, exists: true, outOfDate: a.currentHash === null ? null : a.currentHash !== a.dataHash }
        : { id, name: null, dataHash: null, exists: false, outOfDate: null };
    }),
    problems,
    fictional: [...audits.values()].some((a) => a.elections.some((e) => e.fictional)),
  };
}
