import type { Migration } from '../src/migrator';

/**
 * Audits record how their data hash was made (`hash_scheme`, see backend commands/audits/inputs.ts):
 * 1 for every audit stored before (one SHA-256 over all input rows), 2 from now on (each
 * election's polls hashed apart, then combined). The out-of-date check recomputes the hash with
 * the audit's own scheme, so earlier audits keep their hash and their status.
 */
export const up: Migration['up'] = async ({ context: q }) => {
  await q.sequelize.query('ALTER TABLE audits ADD COLUMN hash_scheme TINYINT UNSIGNED NOT NULL DEFAULT 1 AFTER data_hash');
};

export const down: Migration['down'] = async ({ context: q }) => {
  const [rows] = await q.sequelize.query('SELECT COUNT(*) AS n FROM audits WHERE hash_scheme <> 1');
  const n = Number((rows as { n: number | bigint }[])[0]?.n ?? 0);
  // Going back would leave these audits with a hash nothing recomputes: refuse rather than lose them.
  if (n > 0) throw new Error(`cannot undo 20261202000700-audit-hash-scheme: ${n} audit(s) use hash scheme 2`);
  await q.sequelize.query('ALTER TABLE audits DROP COLUMN hash_scheme');
};
