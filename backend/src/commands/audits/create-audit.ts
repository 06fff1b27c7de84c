import { QueryTypes, type Sequelize } from 'sequelize';
import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { CORE_VERSION } from '../../analysis/version';
import { unprocessable } from '../../http/errors';
import { computeAuditPolls, headline, scorecardsFor, seedOf, sharedErrorFor } from './compute';
import { loadAuditInputs } from './inputs';
import { chunk } from '../imports/common';

/**
 * Creates a frozen audit: reads the chosen elections set-based, computes every poll's metrics,
 * the headline, the scorecards (seeded from the data hash) and the shared-error analysis per
 * election, and stores them with the settings, the data hash and the core's version.
 */
export async function createAudit(sequelize: Sequelize, name: string, settings: AuditSettings, userId: number | null, rerunOf: number | null = null) {
  const inputs = await loadAuditInputs(sequelize, settings.electionKeys);
  const missing = settings.electionKeys.filter((k) => !inputs.elections.some((e) => e.key === k));
  if (missing.length) throw unprocessable('unknown_election', `Unknown election${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`, [{ field: 'electionKeys', message: `unknown: ${missing.join(', ')}` }]);
  const items = computeAuditPolls(inputs, settings);
  const summary = { headline: headline(items, settings, inputs.elections, inputs.contests) };
  const scorecards = scorecardsFor(items, settings, seedOf(inputs.dataHash));
  const sharedError = Object.fromEntries(inputs.elections.map((e) => [e.key, sharedErrorFor(items, settings, e.key)]));

  return sequelize.transaction(async (transaction) => {
    const [id] = await sequelize.query(
      `INSERT INTO audits (name, settings, data_hash, core_version, poll_count, summary, scorecards, shared_error, rerun_of_id, created_by_id)
       VALUES (:name, :settings, :hash, :core, :count, :summary, :scorecards, :sharedError, :rerunOf, :userId)`,
      {
        replacements: {
          name, settings: JSON.stringify(settings), hash: inputs.dataHash, core: CORE_VERSION, count: items.length, summary: JSON.stringify(summary),
          scorecards: JSON.stringify(scorecards), sharedError: JSON.stringify(sharedError), rerunOf, userId,
        },
        type: QueryTypes.INSERT,
        transaction,
      },
    );
    const auditId = Number(id);
    const esc = (v: string) => sequelize.escape(v);
    for (const part of chunk(items, 2000)) {
      await sequelize.query(
        `INSERT INTO audit_polls (audit_id, poll_key, election_key, contest_key, pollster_id, in_window, is_final, abs_margin_error, metrics) VALUES ${part
          .map((i) => `(${auditId},${esc(i.pollKey)},${esc(i.electionKey)},${esc(i.contestKey)},${i.pollsterId},${i.inWindow ? 1 : 0},${i.isFinal ? 1 : 0},${i.absMarginError ?? 'NULL'},${esc(JSON.stringify(i))})`)
          .join(',')}`,
        { transaction },
      );
    }
    return { id: auditId, dataHash: inputs.dataHash, pollCount: items.length };
  });
}

export async function loadAuditPolls(sequelize: Sequelize, auditId: number, electionKey?: string): Promise<AuditPollDto[]> {
  const rows = await sequelize.query<{ metrics: string }>(
    `SELECT metrics FROM audit_polls WHERE audit_id = :auditId ${electionKey ? 'AND election_key = :electionKey' : ''} ORDER BY election_key, contest_key, poll_key`,
    { replacements: { auditId, electionKey }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => JSON.parse(r.metrics) as AuditPollDto);
}
