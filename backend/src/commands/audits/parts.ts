import { QueryTypes, type Sequelize } from 'sequelize';

/**
 * An audit's large stored results live in `audit_parts` (migration 20261202000500), one row per
 * part: the scorecards (kind 'scorecards', part key '') and each election's shared-error analysis
 * (kind 'shared_error', part key = election key). Audits stored before that table kept them in
 * `audits.scorecards` / `audits.shared_error`; the readers here fall back to those columns.
 */
export type AuditPartKind = 'scorecards' | 'shared_error';

/**
 * The largest statement an audit sends. MariaDB connector 3.0.2 fails intermittently on
 * statements over 16 MiB; this keeps a margin below that.
 */
export const MAX_STATEMENT_BYTES = 15 * 1024 * 1024;

/** Throws a plain error, before anything is sent, when a statement would be too large. */
export function checkStatementSize(sql: string, what: string): string {
  const bytes = Buffer.byteLength(sql);
  if (bytes > MAX_STATEMENT_BYTES) {
    throw new Error(`${what} is too large to store in one statement (${(bytes / 1024 / 1024).toFixed(1)} MiB; at most ${MAX_STATEMENT_BYTES / 1024 / 1024} MiB)`);
  }
  return sql;
}

/**
 * A string as a quoted SQL literal. Only the backslash, the quote and NUL need escaping inside
 * single quotes (a raw newline or double quote is literal text there); JSON text has no other
 * control characters, so this escapes far less than a general escape and sends fewer bytes.
 */
export function sqlText(v: string): string {
  return `'${v.replace(/[\\'\0]/g, (c) => (c === '\0' ? '\\0' : `\\${c}`))}'`;
}

/** The INSERT of one part (its payload is already JSON). */
export function auditPartInsert(auditId: number, kind: AuditPartKind, partKey: string, payload: string): string {
  const sql = `INSERT INTO audit_parts (audit_id, kind, part_key, payload) VALUES (${auditId}, ${sqlText(kind)}, ${sqlText(partKey)}, ${sqlText(payload)})`;
  return checkStatementSize(sql, kind === 'scorecards' ? 'The scorecards' : `The shared-error analysis of ${partKey}`);
}

/** The audit's stored scorecards (JSON text), or null when it stored none. */
export async function loadStoredScorecards(sequelize: Sequelize, auditId: number): Promise<string | null> {
  const [part] = await sequelize.query<{ payload: string }>(
    "SELECT payload FROM audit_parts WHERE audit_id = :auditId AND kind = 'scorecards' AND part_key = ''",
    { replacements: { auditId }, type: QueryTypes.SELECT },
  );
  if (part) return part.payload;
  const [legacy] = await sequelize.query<{ scorecards: string | null }>('SELECT scorecards FROM audits WHERE id = :auditId', {
    replacements: { auditId }, type: QueryTypes.SELECT,
  });
  return legacy?.scorecards ?? null;
}

/**
 * The audit's stored shared-error analyses by election key: the ones named by `electionKeys`,
 * or every one when it is omitted. An election the audit has no analysis for is absent.
 */
export async function loadStoredSharedErrors<T = unknown>(sequelize: Sequelize, auditId: number, electionKeys?: readonly string[]): Promise<Record<string, T>> {
  if (electionKeys && !electionKeys.length) return {};
  const parts = await sequelize.query<{ part_key: string; payload: string }>(
    `SELECT part_key, payload FROM audit_parts WHERE audit_id = :auditId AND kind = 'shared_error' ${electionKeys ? 'AND part_key IN (:electionKeys)' : ''} ORDER BY part_key`,
    { replacements: { auditId, electionKeys: electionKeys ? [...electionKeys] : undefined }, type: QueryTypes.SELECT },
  );
  const out: Record<string, T> = {};
  if (parts.length) {
    for (const p of parts) out[p.part_key] = JSON.parse(p.payload) as T;
    return out;
  }
  // An audit stored before audit_parts: either all its analyses are in parts, or none are.
  const hasParts = await sequelize.query<{ n: number }>('SELECT 1 AS n FROM audit_parts WHERE audit_id = :auditId LIMIT 1', {
    replacements: { auditId }, type: QueryTypes.SELECT,
  });
  if (hasParts.length) return out;
  const [legacy] = await sequelize.query<{ shared_error: string | null }>('SELECT shared_error FROM audits WHERE id = :auditId', {
    replacements: { auditId }, type: QueryTypes.SELECT,
  });
  const all = JSON.parse(legacy?.shared_error ?? '{}') as Record<string, T>;
  if (!electionKeys) return all;
  for (const k of electionKeys) if (Object.prototype.hasOwnProperty.call(all, k)) out[k] = all[k]!;
  return out;
}
