import { QueryTypes, type Sequelize } from 'sequelize';
import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { CORE_VERSION } from '../../analysis/version';
import { unprocessable } from '../../http/errors';
import { computeAuditPolls, headline, scorecardsFor, seedOf, sharedErrorsFor } from './compute';
import { loadAuditInputs } from './inputs';
import { withConnection } from '../../db/raw';
import { encodePollChunk } from './stored-polls';
import { loadStoredPolls, POLLS_PER_CHUNK, storeParts, type PartText } from './parts';

/**
 * Creates a frozen audit: reads the chosen elections set-based, computes every poll's metrics,
 * the headline, the scorecards (seeded from the data hash) and the shared-error analysis per
 * election, and stores them with the settings, the data hash and the core's version, in one
 * transaction.
 *
 * Storage (see parts.ts): the audit row (settings, headline), then compressed parts — each
 * election's poll rows in chunks, the scorecards, each election's shared-error analysis. Parts are
 * produced one at a time; each is compressed on the thread pool and written while the next one is
 * computed, so the server's writes and the compression overlap the analyses.
 */
export async function createAudit(sequelize: Sequelize, name: string, settings: AuditSettings, userId: number | null, rerunOf: number | null = null) {
  const { items, summary, elections, dataHash, seed } = await computeAudit(sequelize, settings);

  return sequelize.transaction(async (transaction) => {
    const [id] = await sequelize.query(
      `INSERT INTO audits (name, settings, data_hash, core_version, poll_count, summary, scorecards, shared_error, rerun_of_id, created_by_id)
       VALUES (:name, :settings, :hash, :core, :count, :summary, NULL, NULL, :rerunOf, :userId)`,
      {
        replacements: { name, settings: JSON.stringify(settings), hash: dataHash, core: CORE_VERSION, count: items.length, summary, rerunOf, userId },
        type: QueryTypes.INSERT,
        transaction,
      },
    );
    const auditId = Number(id);
    await withConnection(sequelize, transaction, (c) => storeParts(c, auditId, auditParts(items, settings, elections, seed)));
    return { id: auditId, dataHash, pollCount: items.length };
  });
}

/**
 * Reads the inputs and computes the per-poll rows (without detail) and the headline. The inputs
 * are released on return.
 */
async function computeAudit(sequelize: Sequelize, settings: AuditSettings) {
  const inputs = await loadAuditInputs(sequelize, settings.electionKeys);
  const missing = settings.electionKeys.filter((k) => !inputs.elections.some((e) => e.key === k));
  if (missing.length) throw unprocessable('unknown_election', `Unknown election${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`, [{ field: 'electionKeys', message: `unknown: ${missing.join(', ')}` }]);
  const items = computeAuditPolls(inputs, settings, { detail: false });
  const summary = JSON.stringify({ headline: headline(items, settings, inputs.elections, inputs.contests) });
  return { items, summary, elections: inputs.elections.map((e) => e.key), dataHash: inputs.dataHash, seed: seedOf(inputs.dataHash) };
}

/**
 * Every part of the audit, each computed only when asked for: the poll rows of each election in
 * chunks (contest key, then poll key), then the scorecards, then each election's shared-error
 * analysis.
 */
function* auditParts(items: readonly AuditPollDto[], settings: AuditSettings, elections: readonly string[], seed: number): Generator<PartText> {
  const byElection = new Map<string, AuditPollDto[]>(elections.map((k) => [k, []]));
  for (const i of items) byElection.get(i.electionKey)?.push(i);
  for (const [electionKey, polls] of byElection) {
    polls.sort((a, b) => compare(a.contestKey, b.contestKey) || compare(a.pollKey, b.pollKey));
    for (let start = 0, chunk = 0; start < polls.length; start += POLLS_PER_CHUNK, chunk++) {
      yield { kind: 'polls', partKey: electionKey, chunk, json: encodePollChunk(polls.slice(start, start + POLLS_PER_CHUNK)) };
    }
  }
  yield { kind: 'scorecards', partKey: '', chunk: 0, json: JSON.stringify(scorecardsFor(items, settings, seed)) };
  let n = 0;
  for (const analysis of sharedErrorsFor(items, settings, elections)) {
    yield { kind: 'shared_error', partKey: elections[n++]!, chunk: 0, json: JSON.stringify(analysis) };
  }
}

const compare = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/** The audit's per-poll rows (of one election when `electionKey` is given), by election, contest and poll key. */
export function loadAuditPolls(sequelize: Sequelize, auditId: number, electionKey?: string): Promise<AuditPollDto[]> {
  return loadStoredPolls(sequelize, auditId, electionKey);
}
