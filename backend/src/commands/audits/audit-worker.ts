/**
 * The audit worker thread: reads its slice of an audit's polls on a database connection of its
 * own, hashes and computes them (see slice.ts), makes the analyses when asked, and hands back
 * compressed parts. Started through audit-worker-entry.mjs by workers.ts. The main thread writes
 * every part in its transaction; the worker only reads, in a snapshot it opens when the main
 * thread asks (while the input tables are locked, so that every thread sees the same state).
 */
import { parentPort } from 'node:worker_threads';
import * as mariadb from 'mariadb';
import type { AuditPollDto } from '@veracast/shared-types';
import { START_SNAPSHOT, selectOn } from '../../db/raw';
import { readPolls } from '../../queries/archive';
import { electionPollDigests } from './inputs';
import { compressPart, type PartRow, type PartText } from './parts';
import { computeSlice, mergeUsed, pollChunkParts, scorecardsPart, sharedErrorParts, type AuditSlice, type SliceOutcome } from './slice';

export interface UsedRows {
  used: AuditPollDto[];
}

/** Where the worker reads: the database the main thread's Sequelize uses. */
export interface WorkerDatabase {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
}

/** A slice as sent to a worker: its elections and contests; the worker reads their polls itself. */
export type SliceSpec = Omit<AuditSlice, 'polls'>;

/** What a worker sends back for its slice: its used rows, counts and each election's poll digest (hash scheme 2). */
export type SliceUsed = UsedRows & { total: number; notComputable: number; digests: Record<string, string> };

/**
 * Messages to the worker, per job: 'open' (take a snapshot), then 'slice' (read it, compute),
 * then — once the audit is committed, so that they take no CPU from storing it — 'analyses';
 * `scorecards` asks this job for them too, over its used rows and `others` (every other slice's).
 */
export type ToWorker =
  | { type: 'open'; job: number; db: WorkerDatabase }
  | { type: 'slice'; job: number; slice: SliceSpec; electionKeys: string[] }
  | { type: 'analyses'; job: number; scorecards: { seed: number; others: UsedRows[] } | null }
  | { type: 'forget'; job: number };

/**
 * Messages from the worker, per job: 'opened', 'used', its poll chunks ('part' … 'polls-done');
 * once asked, its elections' shared-error analyses and the scorecards if asked ('part' … 'analyses-done').
 */
export type FromWorker =
  | { type: 'ready' }
  | { type: 'opened'; job: number }
  | ({ type: 'used'; job: number } & SliceUsed)
  | { type: 'part'; job: number; part: PartRow }
  | { type: 'polls-done'; job: number }
  | { type: 'analyses-done'; job: number }
  | { type: 'error'; job: number; message: string; stack: string | null };

const port = parentPort;
if (!port) throw new Error('audit-worker.ts runs only as a worker thread');

interface Job {
  /** The connection holding the job's snapshot (one of its own), until its slice is read. */
  connection: mariadb.Connection | null;
  slice: SliceSpec | null;
  electionKeys: string[];
  outcome: SliceOutcome | null;
}

/** Each job's state, kept until its analyses are made (or it is forgotten). */
const jobs = new Map<number, Job>();

const post = (m: FromWorker) => port.postMessage(m);
/** Forgets the job (closing its connection if still open). */
const forget = (job: number) => void closeSnapshot(job).finally(() => jobs.delete(job));
const fail = (job: number, err: unknown) => {
  forget(job);
  post({ type: 'error', job, message: err instanceof Error ? err.message : String(err), stack: err instanceof Error ? (err.stack ?? null) : null });
};

/** Ends the job's snapshot, if still open, by closing its connection. */
async function closeSnapshot(job: number) {
  const state = jobs.get(job);
  const connection = state?.connection;
  if (!state || !connection) return;
  state.connection = null;
  try {
    await connection.end();
  } catch {
    connection.destroy();
  }
}

/** Compresses parts as they are produced and posts each; resolves when every one is posted. */
async function postParts(job: number, parts: Iterable<PartText>) {
  const pending: Promise<void>[] = [];
  for (const text of parts) {
    pending.push(compressPart(text).then((part) => post({ type: 'part', job, part })));
    // Let finished compressions go out while the next part is computed.
    await new Promise((resolve) => setImmediate(resolve));
  }
  await Promise.all(pending);
}

async function open(job: number, db: WorkerDatabase) {
  const state: Job = { connection: null, slice: null, electionKeys: [], outcome: null };
  jobs.set(job, state);
  // A connection per job (a few milliseconds on the same host): nothing is kept between audits.
  const connection = await mariadb.createConnection({ ...db, connectTimeout: 3000 });
  if (jobs.get(job) !== state) {
    // Forgotten while connecting: the audit has gone.
    await connection.end();
    return;
  }
  state.connection = connection;
  await connection.query(START_SNAPSHOT);
  post({ type: 'opened', job });
}

async function runSlice(job: number, slice: SliceSpec, electionKeys: string[]) {
  const state = jobs.get(job);
  if (!state?.connection) throw new Error(`audit job ${job} has no open snapshot here`);
  const polls = await readPolls(selectOn(state.connection), { contestIds: slice.contests.map((c) => c.id) });
  await closeSnapshot(job);
  const digests = electionPollDigests(slice.elections, slice.contests, polls);
  const outcome = computeSlice({ ...slice, polls });
  Object.assign(state, { slice, electionKeys, outcome });
  post({ type: 'used', job, used: outcome.used, total: outcome.total, notComputable: outcome.notComputable, digests });
  await postParts(job, pollChunkParts(outcome, electionKeys));
  post({ type: 'polls-done', job });
}

async function runAnalyses(job: number, scorecards: { seed: number; others: UsedRows[] } | null) {
  const state = jobs.get(job);
  if (!state?.outcome || !state.slice) throw new Error(`audit job ${job} has no slice here`);
  jobs.delete(job);
  const { settings } = state.slice;
  await postParts(job, sharedErrorParts(state.outcome.used, settings, state.electionKeys));
  if (scorecards) await postParts(job, [scorecardsPart(mergeUsed([state.outcome, ...scorecards.others]), settings, scorecards.seed)]);
  post({ type: 'analyses-done', job });
}

port.on('message', (m: ToWorker) => {
  if (m.type === 'open') open(m.job, m.db).catch((err: unknown) => fail(m.job, err));
  else if (m.type === 'slice') runSlice(m.job, m.slice, m.electionKeys).catch((err: unknown) => fail(m.job, err));
  else if (m.type === 'analyses') runAnalyses(m.job, m.scorecards).catch((err: unknown) => fail(m.job, err));
  else forget(m.job);
});
post({ type: 'ready' });
