import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { CORE_VERSION } from '../../analysis/version';
import { unprocessable } from '../../http/errors';
import { computeAuditPolls, headline, scorecardsFor, seedOf, sharedErrorsFor } from './compute';
import { loadAuditInputs } from './inputs';
import { decodeAuditPoll, encodeAuditPoll } from './stored-polls';
import { auditPartInsert, checkStatementSize, sqlText } from './parts';

/** Rows of one `INSERT INTO audit_polls` stop growing past this many characters (at most 3 bytes each: well below 16 MiB). */
const POLL_CHUNK_CHARS = 2 * 1024 * 1024;

/**
 * Creates a frozen audit: reads the chosen elections set-based, computes every poll's metrics,
 * the headline, the scorecards (seeded from the data hash) and the shared-error analysis per
 * election, and stores them with the settings, the data hash and the core's version.
 *
 * Storage: the audit row (settings, headline), one `audit_parts` row for the scorecards and one
 * per election for its shared-error analysis (each its own INSERT), and the per-poll rows in
 * INSERTs of about 2 MiB: no statement comes near the connector's 16 MiB limit. Statements are
 * built lazily (one chunk or one analysis at a time, so their text is never all alive at once),
 * a chunk of per-poll rows then two analyses in turn, so that the server writes rows while the
 * next analyses are computed.
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
    const parts = partStatements(auditId, items, settings, elections, seed);
    const polls = pollStatements(auditId, items);
    await sendInTurn(sequelize, alternate(polls, parts, 2), transaction);
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

/** The scorecards' INSERT, then each election's analysis INSERT; each computed only when asked for. */
function* partStatements(auditId: number, items: readonly AuditPollDto[], settings: AuditSettings, elections: readonly string[], seed: number) {
  yield auditPartInsert(auditId, 'scorecards', '', JSON.stringify(scorecardsFor(items, settings, seed)));
  let n = 0;
  for (const analysis of sharedErrorsFor(items, settings, elections)) {
    yield auditPartInsert(auditId, 'shared_error', elections[n++]!, JSON.stringify(analysis));
  }
}

/** The per-poll INSERTs, each of about POLL_CHUNK_CHARS, built only when asked for. */
function* pollStatements(auditId: number, items: readonly AuditPollDto[]) {
  const esc = sqlText;
  const head = 'INSERT INTO audit_polls (audit_id, poll_key, election_key, contest_key, pollster_id, in_window, is_final, abs_margin_error, metrics) VALUES ';
  let rows: string[] = [];
  let chars = head.length;
  for (const i of items) {
    const row = `(${auditId},${esc(i.pollKey)},${esc(i.electionKey)},${esc(i.contestKey)},${i.pollsterId},${i.inWindow ? 1 : 0},${i.isFinal ? 1 : 0},${i.absMarginError ?? 'NULL'},${esc(encodeAuditPoll(i))})`;
    if (rows.length && chars + row.length + 1 > POLL_CHUNK_CHARS) {
      yield checkStatementSize(head + rows.join(','), 'A chunk of per-poll rows');
      rows = [];
      chars = head.length;
    }
    rows.push(row);
    chars += row.length + 1;
  }
  if (rows.length) yield checkStatementSize(head + rows.join(','), 'A chunk of per-poll rows');
}

/** One from `a`, then `perA` from `b`, in turn until both are exhausted. */
function* alternate<T>(a: Iterator<T>, b: Iterator<T>, perA: number) {
  let doneA = false;
  let doneB = false;
  while (!doneA || !doneB) {
    if (!doneA) {
      const x = a.next();
      if (x.done) doneA = true;
      else yield x.value;
    }
    for (let k = 0; k < perA && !doneB; k++) {
      const y = b.next();
      if (y.done) doneB = true;
      else yield y.value;
    }
  }
}

/** Characters of statements queued on the connection at once while the next ones are built. */
const QUEUED_CHARS = 16 * 1024 * 1024;

/**
 * Sends the statements in order on the transaction's connection, keeping up to QUEUED_CHARS of
 * them queued (the connector runs them one after another) while the JavaScript behind the next
 * one runs, and yielding to the event loop after each so that the queued ones are written out
 * and the server works while the next analysis is computed.
 */
async function sendInTurn(sequelize: Sequelize, statements: Iterable<string>, transaction: Transaction) {
  const queued: { done: Promise<unknown>; chars: number }[] = [];
  let chars = 0;
  try {
    for (const sql of statements) {
      while (queued.length && chars + sql.length > QUEUED_CHARS) {
        const first = queued.shift()!;
        chars -= first.chars;
        await first.done;
      }
      const done = sequelize.query(sql, { transaction });
      // Rejections are awaited in order; this only keeps the queued ones from counting as unhandled.
      done.catch(() => undefined);
      queued.push({ done, chars: sql.length });
      chars += sql.length;
      await new Promise((resolve) => setImmediate(resolve));
    }
    while (queued.length) await queued.shift()!.done;
  } catch (err) {
    await Promise.allSettled(queued.map((q) => q.done));
    throw err;
  }
}

export async function loadAuditPolls(sequelize: Sequelize, auditId: number, electionKey?: string): Promise<AuditPollDto[]> {
  const rows = await sequelize.query<{ metrics: string }>(
    `SELECT metrics FROM audit_polls WHERE audit_id = :auditId ${electionKey ? 'AND election_key = :electionKey' : ''} ORDER BY election_key, contest_key, poll_key`,
    { replacements: { auditId, electionKey }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => decodeAuditPoll(r.metrics));
}
