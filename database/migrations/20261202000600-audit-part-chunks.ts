import type { Migration } from '../src/migrator';

/**
 * Audits store their per-poll rows as parts too (kind 'polls', part_key = election key, numbered
 * chunks of at most a few thousand polls), and every part may be stored gzip-compressed
 * (`encoding` 'gzip'; 'json' = plain UTF-8 JSON, as parts written before). A frozen audit is
 * written once and read whole per election, so a few compressed chunks replace 100,000 rows of
 * `audit_polls` (about 8 MB instead of 46 MB at that size). `audit_polls` stays for audits stored
 * before; readers fall back to it.
 */
export const up: Migration['up'] = async ({ context: q }) => {
  await q.sequelize.query(`ALTER TABLE audit_parts
    MODIFY kind ENUM('scorecards', 'shared_error', 'polls') NOT NULL,
    ADD COLUMN chunk SMALLINT UNSIGNED NOT NULL DEFAULT 0 AFTER part_key,
    ADD COLUMN encoding ENUM('json', 'gzip') NOT NULL DEFAULT 'json' AFTER chunk,
    MODIFY payload LONGBLOB NOT NULL,
    DROP PRIMARY KEY,
    ADD PRIMARY KEY (audit_id, kind, part_key, chunk)`);
};

export const down: Migration['down'] = async ({ context: q }) => {
  const [rows] = await q.sequelize.query("SELECT COUNT(*) AS n FROM audit_parts WHERE kind = 'polls' OR encoding = 'gzip' OR chunk > 0");
  const n = Number((rows as { n: number | bigint }[])[0]?.n ?? 0);
  // Going back would lose audits stored in the new form: refuse rather than delete them.
  if (n > 0) throw new Error(`cannot undo 20261202000600-audit-part-chunks: ${n} audit part(s) are stored as chunks or compressed`);
  await q.sequelize.query(`ALTER TABLE audit_parts
    DROP PRIMARY KEY,
    DROP COLUMN chunk,
    DROP COLUMN encoding,
    MODIFY payload LONGTEXT NOT NULL,
    MODIFY kind ENUM('scorecards', 'shared_error') NOT NULL,
    ADD PRIMARY KEY (audit_id, kind, part_key)`);
};
