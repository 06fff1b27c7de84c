import { NOTE_BLOCK_VIEWS, type NoteBlockView } from '@veracast/shared-types';

/**
 * A live block as written in a note: a fenced code block whose info string is `veracast` and
 * whose body holds `key: value` lines, e.g.
 *
 * ```veracast
 * audit: 12
 * view: scorecard
 * ```
 */
export interface BlockSpec {
  view: NoteBlockView;
  /** Required for every view except `methods` (which then covers every audit the note cites). */
  audit: number | null;
  election: string | null;
  metric: string | null;
  limit: number | null;
  by: string | null;
}

export type BlockParse = { ok: true; spec: BlockSpec } | { ok: false; error: string };

export const BLOCK_INFO = 'veracast';
const KEYS = ['audit', 'view', 'election', 'metric', 'limit', 'by'] as const;
type Key = (typeof KEYS)[number];

/** Reads a block body; every problem is a sentence an author can act on. */
export function parseBlockSpec(body: string): BlockParse {
  const values = new Map<Key, string>();
  for (const [i, raw] of body.split(/\r?\n/).entries()) {
    const line = raw.trim();
    if (!line || line.startsWith('#')) continue;
    const m = /^([A-Za-z-]+)\s*:\s*(.*)$/.exec(line);
    if (!m) return { ok: false, error: `line ${i + 1} ("${line.slice(0, 60)}") is not "key: value"` };
    const key = m[1]!.toLowerCase();
    if (!(KEYS as readonly string[]).includes(key)) return { ok: false, error: `unknown key "${key}"; use ${KEYS.join(', ')}` };
    if (values.has(key as Key)) return { ok: false, error: `"${key}" is given twice` };
    values.set(key as Key, m[2]!.trim());
  }
  const view = values.get('view');
  if (!view) return { ok: false, error: `"view" is missing; use one of ${NOTE_BLOCK_VIEWS.join(', ')}` };
  if (!(NOTE_BLOCK_VIEWS as readonly string[]).includes(view)) return { ok: false, error: `unknown view "${view}"; use one of ${NOTE_BLOCK_VIEWS.join(', ')}` };
  const auditText = values.get('audit');
  let audit: number | null = null;
  if (auditText !== undefined) {
    if (!/^#?[1-9][0-9]{0,9}$/.test(auditText)) return { ok: false, error: `audit "${auditText}" is not an audit number` };
    audit = Number(auditText.replace('#', ''));
  } else if (view !== 'methods') return { ok: false, error: '"audit" is missing: name the audit by its number, e.g. "audit: 12"' };
  const limitText = values.get('limit');
  let limit: number | null = null;
  if (limitText !== undefined) {
    if (view !== 'polls') return { ok: false, error: '"limit" applies to the polls view only' };
    if (!/^[1-9][0-9]{0,3}$/.test(limitText) || Number(limitText) > 500) return { ok: false, error: `limit "${limitText}" must be a whole number from 1 to 500` };
    limit = Number(limitText);
  }
  const metric = values.get('metric') ?? null;
  if (metric !== null && view !== 'headline') return { ok: false, error: '"metric" applies to the headline view only' };
  const by = values.get('by') ?? null;
  if (by !== null && view !== 'breakdown') return { ok: false, error: '"by" applies to the breakdown view only' };
  const election = values.get('election') ?? null;
  if (election !== null && !/^[a-z0-9][a-z0-9_-]{0,99}$/.test(election)) return { ok: false, error: `election "${election}" is not an election key` };
  return { ok: true, spec: { view: view as NoteBlockView, audit, election, metric, limit, by } };
}
