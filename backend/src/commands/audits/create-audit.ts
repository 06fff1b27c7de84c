import { QueryTypes, Transaction, type Sequelize } from 'sequelize';
import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { CORE_VERSION } from '../../analysis/version';
import { conflict, unprocessable } from '../../http/errors';
import { LOCK_WAIT_TIMEOUT, rawRows, whileTablesLocked, withConnection } from '../../db/raw';
import { headlineOfUsed, seedOf } from './compute';
import { combineHash, electionPollDigests, HASH_SCHEME } from './inputs';
import { countElectionPolls, countPolls, loadContests, loadElections, readPolls } from '../../queries/archive';
import { PartWriter, writeParts, type PartRow } from './parts';
import { computeSlice, mergeUsed, pollChunkParts, scorecardsPart, sharedErrorParts, splitElections, type AuditSlice, type SliceOutcome } from './slice';
import { trackAnalyses } from './analyses';
import { readyAuditWorkers, type AuditWorker } from './workers';
import type { FromWorker, SliceSpec, SliceUsed, UsedRows, WorkerDatabase } from './audit-worker';

/** Audits of fewer polls are computed on the main thread alone (a worker's round trip is not worth it). */
export const PARALLEL_MIN_POLLS = 5000;
/**
 * Share of the polls each thread takes: each reads, hashes and computes its own, and the main
 * thread then merges and writes while the workers compress their parts; equal shares measured
 * best with one worker on 2 CPUs (0.9 : 1.1 and 1.1 : 0.9 were slower). The first worker's
 * scorecards come after the audit is committed.
 */
const MAIN_WEIGHT = 1;
const WORKER_WEIGHT = 1;

/**
 * The tables an audit reads (loadElections, loadContests, readPolls). They are locked (READ) while
 * the threads take their snapshots, for a few milliseconds, so that every thread reads the same
 * committed state; a table those readers join later must be added here.
 */
const AUDIT_INPUT_TABLES = ['elections', 'contests', 'options', 'polls', 'poll_shares', 'pollsters', 'sponsors'] as const;

/** How long an audit waits for writes under way on its inputs before it gives up (409 archive_busy). */
const LOCK_WAIT_SECONDS = 30;

export interface CreateAuditOptions {
  /** Split the work over the audit worker threads; default: when there are PARALLEL_MIN_POLLS polls or more. */
  parallel?: boolean;
  /** The workers to use when parallel (default: the pool's ready ones). */
  workers?: AuditWorker[];
  /** Seconds to wait for writes under way before the threads take their snapshots (default 30). */
  lockWaitSeconds?: number;
}

let nextJob = 1;

/**
 * Creates a frozen audit: reads the chosen elections set-based, computes every poll's metrics and
 * the headline, and stores the audit — settings, data hash (scheme {@link HASH_SCHEME}), core
 * version, headline and every poll's row — in one transaction; resolves when that is committed.
 * Its analyses (the scorecards, seeded from the data hash, and each election's shared-error
 * analysis: views of the stored rows, see analyses.ts) are stored right after in a second
 * transaction; `analyses` settles when they are (it never rejects), and readers wait for them
 * through `ensureAnalyses`.
 *
 * Reading: every input is read in one consistent snapshot. With audit workers (workers.ts), each
 * worker reads its own slice on a connection of its own; their snapshots and the main thread's
 * are all taken while the input tables are locked against writes, so they are one state.
 *
 * Work: the elections are split into slices; the main thread reads, hashes and computes one and
 * each audit worker another at the same time. Once the audit is committed, and not before (they
 * would take CPU from storing it), each thread makes its elections' shared-error analyses and the
 * first worker the scorecards. Results do not depend on the split: slices are whole elections,
 * the data hash combines each election's poll digest, and the used polls are merged back in the
 * audit's poll order before the headline and the scorecards.
 *
 * Storage (see parts.ts): compressed parts — each election's poll rows in chunks, then the
 * scorecards and each election's shared-error analysis — written while the rest is computed.
 */
export async function createAudit(
  sequelize: Sequelize, name: string, settings: AuditSettings, userId: number | null, rerunOf: number | null = null, options: CreateAuditOptions = {},
) {
  const known = await loadElections(sequelize, { keys: [...settings.electionKeys] });
  const missing = settings.electionKeys.filter((k) => !known.some((e) => e.key === k));
  if (missing.length) throw unprocessable('unknown_election', `Unknown election${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`, [{ field: 'electionKeys', message: `unknown: ${missing.join(', ')}` }]);
  const parallel = options.parallel ?? (await countElectionPolls(sequelize, known.map((e) => e.id))) >= PARALLEL_MIN_POLLS;
  // Only idle workers: one busy with another audit would open its snapshot only once free, and
  // writers would wait for it meanwhile. Each job reserves its worker from here on.
  const workers = parallel ? (options.workers ?? (await readyAuditWorkers())).filter((w) => w.idle) : [];
  let jobs = workers.map((w, k) => new WorkerJob(w, k === 0));
  try {
    const read = await sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.REPEATABLE_READ }, async (snapshot) => {
      if (jobs.length) {
        // Every thread's snapshot, taken while no one can write the inputs: one state. This
        // transaction's is taken at its first read, the workers' when they open theirs.
        const db = workerDatabase(sequelize);
        await whileTablesLocked(sequelize, AUDIT_INPUT_TABLES, options.lockWaitSeconds ?? LOCK_WAIT_SECONDS, async () => {
          await rawRows(sequelize, 'SELECT 1 FROM elections LIMIT 1', [], snapshot);
          await Promise.all(jobs.map((j) => j.open(db)));
        }).catch((err: unknown) => {
          if ((err as { errno?: number }).errno !== LOCK_WAIT_TIMEOUT) throw err;
          throw conflict('archive_busy', 'The archive is still being written (an import or an edit is under way), so the audit did not start. Try again once it has finished.');
        });
      }
      // Read again in the snapshot (the first read only checked the keys and sized the work).
      const elections = await loadElections(sequelize, { keys: [...settings.electionKeys] }, snapshot);
      const contests = await loadContests(sequelize, { electionIds: elections.map((e) => e.id) }, snapshot);
      const pollsPerContest = await countPolls(sequelize, contests.map((c) => c.id), snapshot);
      const [own, ...theirs] = splitElections(elections, contests, pollsPerContest, [MAIN_WEIGHT, ...jobs.map(() => WORKER_WEIGHT)]);
      jobs.forEach((job, k) => job.start({ settings, elections: theirs[k]!.elections, contests: theirs[k]!.contests }));
      const polls = await readPolls((sql, values) => rawRows(sequelize, sql, values, snapshot), { contestIds: own!.contests.map((c) => c.id) });
      const mySlice: AuditSlice = { settings, elections: own!.elections, contests: own!.contests, polls };
      return { elections, contests, mySlice };
    });
    const { elections, contests, mySlice } = read;
    const myElections = mySlice.elections.map((e) => e.key);
    const digests = electionPollDigests(mySlice.elections, mySlice.contests, mySlice.polls);
    const mine = computeSlice(mySlice);
    // The input rows are no longer needed here: let them go before the parts are built.
    mySlice.polls = [];
    const others = await Promise.all(jobs.map((j) => j.used));
    for (const o of others) Object.assign(digests, o.digests);
    const dataHash = combineHash(elections, contests, digests);
    const seed = seedOf(dataHash);
    const usedRows: UsedRows[] = [{ used: mine.used }, ...others.map((o) => ({ used: o.used }))];
    const counts = { pollsTotal: mine.total, notComputable: mine.notComputable };
    for (const o of others) {
      counts.pollsTotal += o.total;
      counts.notComputable += o.notComputable;
    }
    const allUsed = mergeUsed(usedRows);
    const summary = JSON.stringify({ headline: headlineOfUsed(allUsed, counts, elections, contests) });

    // The audit: its row and every poll row, in one transaction.
    const created = await sequelize.transaction(async (transaction) => {
      const [id] = await sequelize.query(
        `INSERT INTO audits (name, settings, data_hash, hash_scheme, core_version, poll_count, summary, scorecards, shared_error, rerun_of_id, created_by_id)
         VALUES (:name, :settings, :hash, :scheme, :core, :count, :summary, NULL, NULL, :rerunOf, :userId)`,
        {
          replacements: { name, settings: JSON.stringify(settings), hash: dataHash, scheme: HASH_SCHEME, core: CORE_VERSION, count: counts.pollsTotal, summary, rerunOf, userId },
          type: QueryTypes.INSERT,
          transaction,
        },
      );
      const auditId = Number(id);
      await withConnection(sequelize, transaction, async (c) => {
        const writer = new PartWriter(c, auditId);
        for (const job of jobs) job.sendPartsTo('polls', writer);
        await writeParts(writer, pollChunkParts(mine, myElections));
        await Promise.all(jobs.map((j) => j.pollsDone));
        await writer.finish();
      });
      return { id: auditId, dataHash, pollCount: counts.pollsTotal, threads: 1 + jobs.length };
    });

    // Its analyses (views of the rows just stored), in a transaction of their own right after.
    const releasing = jobs;
    jobs = [];
    const forScorecards = usedRows.filter((_, k) => k !== 1);
    const analyses = storeAnalyses(sequelize, created.id, releasing, mine, allUsed, forScorecards, settings, seed, myElections)
      .then(() => ({ ok: true as const }), (error: unknown) => ({ ok: false as const, error }))
      .finally(() => {
        for (const job of releasing) job.release();
      });
    trackAnalyses(created.id, analyses.then(() => undefined));
    return { ...created, analyses };
  } finally {
    for (const job of jobs) job.release();
  }
}

/**
 * Stores the scorecards and each election's shared-error analysis: the main thread's elections'
 * here, the workers' from the workers (the first one also makes the scorecards, over its used
 * rows and `others`), or all here when there is no worker.
 */
async function storeAnalyses(
  sequelize: Sequelize, auditId: number, jobs: readonly WorkerJob[], mine: SliceOutcome, allUsed: readonly AuditPollDto[], others: UsedRows[],
  settings: AuditSettings, seed: number, myElections: readonly string[],
) {
  jobs.forEach((job, k) => job.requestAnalyses(k === 0 ? { seed, others } : null));
  await sequelize.transaction((transaction) =>
    withConnection(sequelize, transaction, async (c) => {
      const writer = new PartWriter(c, auditId);
      for (const job of jobs) job.sendPartsTo('analyses', writer);
      await writeParts(writer, sharedErrorParts(mine.used, settings, myElections));
      if (!jobs.length) writer.addText(scorecardsPart(allUsed, settings, seed));
      await Promise.all(jobs.map((j) => j.done));
      await writer.finish();
    }),
  );
}

/** Which transaction a worker's part goes to: the audit's (poll rows) or the analyses'. */
type PartGroup = 'polls' | 'analyses';

/** The database the workers read: the one `sequelize` uses, with its credentials. */
function workerDatabase(sequelize: Sequelize): WorkerDatabase {
  const c = sequelize.config;
  return { host: c.host ?? '127.0.0.1', port: Number(c.port), user: c.username, password: c.password ?? '', database: c.database };
}

/**
 * One slice of an audit given to a worker: the worker opens its snapshot when asked (`open`),
 * reads and computes the slice once `start`ed (`used`), then sends its parts as they come.
 */
class WorkerJob {
  readonly used: Promise<SliceUsed>;
  private readonly opened: Promise<void>;
  /** Settles when the worker has sent every poll chunk of its slice. */
  readonly pollsDone: Promise<void>;
  /** Settles when the worker has sent every part of the job (its slice's, its analyses and the scorecards if asked). */
  readonly done: Promise<void>;
  private readonly id = nextJob++;
  private readonly listening: { release: () => void };
  private readonly received: Record<PartGroup, PartRow[]> = { polls: [], analyses: [] };
  private readonly writers: Record<PartGroup, PartWriter | null> = { polls: null, analyses: null };

  constructor(private readonly worker: AuditWorker, private readonly scorecards: boolean) {
    const settled = <T,>() => {
      let resolve!: (v: T) => void;
      let reject!: (err: Error) => void;
      const promise = new Promise<T>((res, rej) => {
        resolve = res;
        reject = rej;
      });
      promise.catch(() => undefined);
      return { promise, resolve, reject };
    };
    const opened = settled<void>();
    const used = settled<SliceUsed>();
    const pollsDone = settled<void>();
    const done = settled<void>();
    this.opened = opened.promise;
    this.used = used.promise;
    this.pollsDone = pollsDone.promise;
    this.done = done.promise;
    this.listening = worker.listen(this.id, (m: FromWorker) => {
      if (m.type === 'opened') opened.resolve();
      else if (m.type === 'used') used.resolve({ used: m.used, total: m.total, notComputable: m.notComputable, digests: m.digests });
      else if (m.type === 'part') {
        const part = { ...m.part, payload: Buffer.from(m.part.payload.buffer, m.part.payload.byteOffset, m.part.payload.byteLength) };
        this.receive(part.kind === 'polls' ? 'polls' : 'analyses', part);
      } else if (m.type === 'polls-done') pollsDone.resolve();
      else if (m.type === 'analyses-done') done.resolve();
      else if (m.type === 'error') {
        const err = new Error(`audit worker: ${m.message}`);
        if (m.stack) err.stack = `${err.message}\n  worker stack: ${m.stack}`;
        opened.reject(err);
        used.reject(err);
        pollsDone.reject(err);
        done.reject(err);
      }
    });
  }

  /** Asks the worker to open its snapshot of `db`; settles when it is taken. */
  open(db: WorkerDatabase): Promise<void> {
    this.worker.send({ type: 'open', job: this.id, db });
    return this.opened;
  }

  /** Gives the worker its slice, to read in its snapshot and compute. */
  start(slice: SliceSpec) {
    this.worker.send({ type: 'slice', job: this.id, slice, electionKeys: slice.elections.map((e) => e.key) });
  }

  /**
   * Asks the worker for its elections' shared-error analyses, and for the scorecards over its used
   * rows and `scorecards.others` (every other slice's) when given; sent once the audit is committed.
   */
  requestAnalyses(scorecards: { seed: number; others: UsedRows[] } | null) {
    if (scorecards && !this.scorecards) throw new Error('this audit job was not set up to make the scorecards');
    this.worker.send({ type: 'analyses', job: this.id, scorecards });
  }

  /** Hands the group's parts received so far, and every later one, to `writer`. */
  sendPartsTo(group: PartGroup, writer: PartWriter) {
    this.writers[group] = writer;
    for (const part of this.received[group].splice(0)) writer.add(part, part.payload.length);
  }

  private receive(group: PartGroup, part: PartRow) {
    const writer = this.writers[group];
    if (writer) writer.add(part, part.payload.length);
    else this.received[group].push(part);
  }

  release() {
    this.listening.release();
  }
}

/** The audit's per-poll rows (of one election when `electionKey` is given), by election, contest and poll key. */
export { loadStoredPolls as loadAuditPolls } from './parts';
