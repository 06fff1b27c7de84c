import { QueryTypes, type Sequelize } from 'sequelize';
import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { CORE_VERSION } from '../../analysis/version';
import { unprocessable } from '../../http/errors';
import { withConnection } from '../../db/raw';
import { headlineOfUsed, scorecardsFor, seedOf } from './compute';
import { hashInputs } from './inputs';
import { countPolls, loadContests, loadElections, loadPollGroups } from '../../queries/archive';
import { loadStoredPolls, PartWriter, type PartRow } from './parts';
import { computeSlice, mergeUsed, sliceParts, splitElections, type AuditSlice } from './slice';
import { readyAuditWorkers, type AuditWorker } from './workers';
import type { FromWorker, UsedRows } from './audit-worker';

/** Audits of fewer polls are computed on the main thread alone (a worker's round trip is not worth it). */
export const PARALLEL_MIN_POLLS = 5000;
/**
 * Share of the polls each thread takes: the main thread also reads and hashes the inputs (about
 * as long as computing a third of the polls), the first worker also makes the scorecards.
 */
const MAIN_WEIGHT = 1.3;
const SCORECARD_WORKER_WEIGHT = 0.7;

export interface CreateAuditOptions {
  /** Split the work over the audit worker threads; default: when there are PARALLEL_MIN_POLLS polls or more. */
  parallel?: boolean;
  /** The workers to use when parallel (default: the pool's ready ones). */
  workers?: AuditWorker[];
}

let nextJob = 1;

/**
 * Creates a frozen audit: reads the chosen elections set-based, computes every poll's metrics,
 * the headline, the scorecards (seeded from the data hash) and the shared-error analysis per
 * election, and stores them with the settings, the data hash and the core's version, in one
 * transaction.
 *
 * Work: the elections are split into slices; the main thread computes one and each audit worker
 * (workers.ts) another at the same time, the first worker then the scorecards. Results do not
 * depend on the split: slices are whole elections and the used polls are merged back in the
 * audit's poll order before the headline and the scorecards.
 *
 * Storage (see parts.ts): the audit row (settings, headline), then compressed parts — each
 * election's poll rows in chunks, the scorecards, each election's shared-error analysis — written
 * while the rest is still being computed.
 */
export async function createAudit(
  sequelize: Sequelize, name: string, settings: AuditSettings, userId: number | null, rerunOf: number | null = null, options: CreateAuditOptions = {},
) {
  const elections = await loadElections(sequelize, { keys: [...settings.electionKeys] });
  const missing = settings.electionKeys.filter((k) => !elections.some((e) => e.key === k));
  if (missing.length) throw unprocessable('unknown_election', `Unknown election${missing.length > 1 ? 's' : ''}: ${missing.join(', ')}`, [{ field: 'electionKeys', message: `unknown: ${missing.join(', ')}` }]);
  const contests = await loadContests(sequelize, { electionIds: elections.map((e) => e.id) });
  const pollsPerContest = await countPolls(sequelize, contests.map((c) => c.id));
  let pollCount = 0;
  for (const n of pollsPerContest.values()) pollCount += n;

  const workers = (options.parallel ?? pollCount >= PARALLEL_MIN_POLLS) ? (options.workers ?? (await readyAuditWorkers())) : [];
  const groups = splitElections(elections, contests, pollsPerContest, [MAIN_WEIGHT, ...workers.map((_, k) => (k === 0 ? SCORECARD_WORKER_WEIGHT : 1))]);
  const slices: AuditSlice[] = groups.map((g) => ({ settings, elections: g.elections, contests: g.contests, polls: [] }));
  const jobs: WorkerJob[] = [];
  try {
    // The workers' polls are read first and handed over at once, so they start while the rest is read.
    const readOrder = [...slices.keys()].slice(1).concat(0);
    await loadPollGroups(sequelize, readOrder.map((k) => ({ contestIds: slices[k]!.contests.map((c) => c.id) })), (g, polls) => {
      const k = readOrder[g]!;
      slices[k]!.polls = polls;
      // The first worker will also make the scorecards: its job is done only once they are sent.
      if (k > 0) jobs.push(new WorkerJob(workers[k - 1]!, slices[k]!, k === 1));
    });
    const dataHash = hashInputs(elections, contests, slices.flatMap((x) => x.polls));
    const seed = seedOf(dataHash);
    const mine = computeSlice(slices[0]!);
    // The input rows are no longer needed here: let them go before the parts are built.
    for (const slice of slices) slice.polls = [];
    const others = await Promise.all(jobs.map((j) => j.used));
    const usedRows: UsedRows[] = [{ used: mine.used }, ...others];
    const counts = { pollsTotal: mine.total, notComputable: mine.notComputable };
    for (const o of others) {
      counts.pollsTotal += o.total;
      counts.notComputable += o.notComputable;
    }
    const allUsed = mergeUsed(usedRows);
    const summary = JSON.stringify({ headline: headlineOfUsed(allUsed, counts, elections, contests) });
    jobs[0]?.requestScorecards(settings, seed, usedRows.filter((_, k) => k !== 1));

    return await sequelize.transaction(async (transaction) => {
      const [id] = await sequelize.query(
        `INSERT INTO audits (name, settings, data_hash, core_version, poll_count, summary, scorecards, shared_error, rerun_of_id, created_by_id)
         VALUES (:name, :settings, :hash, :core, :count, :summary, NULL, NULL, :rerunOf, :userId)`,
        {
          replacements: { name, settings: JSON.stringify(settings), hash: dataHash, core: CORE_VERSION, count: counts.pollsTotal, summary, rerunOf, userId },
          type: QueryTypes.INSERT,
          transaction,
        },
      );
      const auditId = Number(id);
      await withConnection(sequelize, transaction, async (c) => {
        const writer = new PartWriter(c, auditId);
        for (const job of jobs) job.sendPartsTo(writer);
        for (const text of sliceParts(mine, settings, slices[0]!.elections.map((e) => e.key))) {
          if (writer.failed) break;
          writer.addText(text);
          // Lets the compression, the writes and the workers' messages proceed between parts.
          await new Promise((resolve) => setImmediate(resolve));
        }
        if (!jobs.length) writer.addText({ kind: 'scorecards', partKey: '', chunk: 0, content: JSON.stringify(scorecardsFor(allUsed, settings, seed)) });
        await Promise.all(jobs.map((j) => j.done));
        await writer.finish();
      });
      return { id: auditId, dataHash, pollCount: counts.pollsTotal, threads: 1 + jobs.length };
    });
  } finally {
    for (const job of jobs) job.release();
  }
}

/** One slice of an audit given to a worker: its used rows, then its parts as they come. */
class WorkerJob {
  readonly used: Promise<UsedRows & { total: number; notComputable: number }>;
  /** Settles when the worker has sent every part of the job (its slice's, and the scorecards if asked). */
  readonly done: Promise<void>;
  private readonly id = nextJob++;
  private readonly listening: { release: () => void };
  private readonly received: PartRow[] = [];
  private writer: PartWriter | null = null;

  constructor(private readonly worker: AuditWorker, slice: AuditSlice, private readonly scorecards: boolean) {
    let resolveUsed!: (v: UsedRows & { total: number; notComputable: number }) => void;
    let resolveDone!: () => void;
    let reject!: (err: Error) => void;
    let failUsed!: (err: Error) => void;
    this.used = new Promise((res, rej) => {
      resolveUsed = res;
      failUsed = rej;
    });
    this.done = new Promise((res, rej) => {
      resolveDone = res;
      reject = rej;
    });
    this.used.catch(() => undefined);
    this.done.catch(() => undefined);
    let sliceDone = false;
    let scorecardsDone = false;
    const settle = () => {
      if (sliceDone && (!this.scorecards || scorecardsDone)) resolveDone();
    };
    this.listening = worker.listen(this.id, (m: FromWorker) => {
      if (m.type === 'used') resolveUsed({ used: m.used, total: m.total, notComputable: m.notComputable });
      else if (m.type === 'part') this.receive({ ...m.part, payload: Buffer.from(m.part.payload.buffer, m.part.payload.byteOffset, m.part.payload.byteLength) });
      else if (m.type === 'slice-done') {
        sliceDone = true;
        settle();
      } else if (m.type === 'scorecards-done') {
        scorecardsDone = true;
        settle();
      } else if (m.type === 'error') {
        const err = new Error(`audit worker: ${m.message}`);
        if (m.stack) err.stack = `${err.message}\n  worker stack: ${m.stack}`;
        failUsed(err);
        reject(err);
      }
    });
    worker.send({ type: 'slice', job: this.id, slice, electionKeys: slice.elections.map((e) => e.key) });
  }

  /** Asks the worker for the scorecards over its used rows and `others` (every other slice's). */
  requestScorecards(settings: AuditSettings, seed: number, others: UsedRows[]) {
    if (!this.scorecards) throw new Error('this audit job was not set up to make the scorecards');
    this.worker.send({ type: 'scorecards', job: this.id, settings, seed, others });
  }

  /** Hands the parts received so far, and every later one, to `writer`. */
  sendPartsTo(writer: PartWriter) {
    this.writer = writer;
    for (const part of this.received.splice(0)) writer.add(part, part.payload.length);
  }

  private receive(part: PartRow) {
    if (this.writer) this.writer.add(part, part.payload.length);
    else this.received.push(part);
  }

  release() {
    this.listening.release();
  }
}

/** The audit's per-poll rows (of one election when `electionKey` is given), by election, contest and poll key. */
export function loadAuditPolls(sequelize: Sequelize, auditId: number, electionKey?: string): Promise<AuditPollDto[]> {
  return loadStoredPolls(sequelize, auditId, electionKey);
}
