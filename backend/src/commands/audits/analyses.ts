/**
 * An audit's analyses — the scorecards and each election's shared-error analysis — are views of
 * its frozen per-poll rows: computed from them alone (in the audit's poll order, seeded from the
 * data hash), they are the same whenever they are computed. `createAudit` commits the audit (rows,
 * settings, hash, core version, headline) and stores the analyses right after, in a transaction
 * of their own; readers call `ensureAnalyses` first, which waits for that, and when the analyses
 * are missing (the process stopped in between) computes them from the stored rows and stores them.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import type { AuditSettings } from '@veracast/shared-types';
import { CORE_VERSION } from '../../analysis/version';
import { conflict, notFound } from '../../http/errors';
import { withConnection } from '../../db/raw';
import { seedOf, usedPolls } from './compute';
import { loadStoredPolls, PartWriter } from './parts';
import { mergeUsed, scorecardsPart, sharedErrorParts } from './slice';

/** Analyses this process is storing for audits it has just created. */
const storing = new Map<number, Promise<void>>();
/** Analyses this process is computing for audits that lacked them. */
const recomputing = new Map<number, Promise<void>>();

/** Records that this process is storing an audit's analyses (`done` never rejects). */
export function trackAnalyses(auditId: number, done: Promise<void>) {
  storing.set(auditId, done);
  void done.finally(() => storing.delete(auditId));
}

async function hasAnalyses(sequelize: Sequelize, auditId: number): Promise<boolean> {
  const [row] = await sequelize.query<{ parts: number; legacy: number }>(
    `SELECT (SELECT COUNT(*) FROM audit_parts WHERE audit_id = :auditId AND kind = 'scorecards') AS parts,
            (SELECT COUNT(*) FROM audits WHERE id = :auditId AND scorecards IS NOT NULL) AS legacy`,
    { replacements: { auditId }, type: QueryTypes.SELECT },
  );
  return Number(row?.parts) > 0 || Number(row?.legacy) > 0;
}

/** Waits until the audit's analyses are stored, computing them from its stored rows if they are missing. */
export async function ensureAnalyses(sequelize: Sequelize, auditId: number): Promise<void> {
  const own = storing.get(auditId);
  if (own) await own;
  if (await hasAnalyses(sequelize, auditId)) return;
  let running = recomputing.get(auditId);
  if (!running) {
    running = storeFromRows(sequelize, auditId).finally(() => recomputing.delete(auditId));
    recomputing.set(auditId, running);
  }
  await running;
}

/**
 * Computes the analyses from the audit's stored per-poll rows, as `createAudit` does, and stores
 * them (a part another process stored meanwhile is kept). Refused when the audit's rows were
 * computed by another version of the metrics core: its analyses must come from the same one.
 */
async function storeFromRows(sequelize: Sequelize, auditId: number): Promise<void> {
  const [audit] = await sequelize.query<{ settings: string; data_hash: string; core_version: string }>(
    'SELECT settings, data_hash, core_version FROM audits WHERE id = :auditId', { replacements: { auditId }, type: QueryTypes.SELECT },
  );
  if (!audit) throw notFound('Audit');
  if (audit.core_version !== CORE_VERSION) {
    throw conflict('analyses_missing', `This audit's scorecards and analyses were not stored, and its per-poll metrics come from core ${audit.core_version} (this is ${CORE_VERSION}): re-run the audit.`);
  }
  const settings = JSON.parse(audit.settings) as AuditSettings;
  const used = mergeUsed([{ used: usedPolls(await loadStoredPolls(sequelize, auditId), settings) }]);
  await sequelize.transaction((transaction) =>
    withConnection(sequelize, transaction, async (c) => {
      const writer = new PartWriter(c, auditId, { keepExisting: true });
      writer.addText(scorecardsPart(used, settings, seedOf(audit.data_hash)));
      for (const part of sharedErrorParts(used, settings, settings.electionKeys)) writer.addText(part);
      await writer.finish();
    }),
  );
}
