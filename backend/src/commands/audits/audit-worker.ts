/**
 * The audit worker thread: computes slices of audits (see slice.ts) and the scorecards, and
 * hands back compressed parts. Started through audit-worker-entry.mjs by workers.ts; holds no
 * database connection (the main thread reads the inputs and writes every part in its transaction).
 */
import { parentPort } from 'node:worker_threads';
import type { AuditPollDto } from '@veracast/shared-types';
import { compressPart, type PartRow, type PartText } from './parts';
import { computeSlice, mergeUsed, pollChunkParts, scorecardsPart, sharedErrorParts, type AuditSlice, type SliceOutcome } from './slice';

export interface UsedRows {
  used: AuditPollDto[];
}

/**
 * Messages to the worker. A job's 'analyses' comes after the audit it belongs to is committed
 * (so that the analyses take no CPU from storing it); `scorecards` asks this job for them too,
 * over its used rows and `others` (every other slice's).
 */
export type ToWorker =
  | { type: 'slice'; job: number; slice: AuditSlice; electionKeys: string[] }
  | { type: 'analyses'; job: number; scorecards: { seed: number; others: UsedRows[] } | null }
  | { type: 'forget'; job: number };

/**
 * Messages from the worker, per job: 'used', then its poll chunks ('part' … 'polls-done'); once
 * asked, its elections' shared-error analyses and the scorecards if asked ('part' … 'analyses-done').
 */
export type FromWorker =
  | { type: 'ready' }
  | ({ type: 'used'; job: number; total: number; notComputable: number } & UsedRows)
  | { type: 'part'; job: number; part: PartRow }
  | { type: 'polls-done'; job: number }
  | { type: 'analyses-done'; job: number }
  | { type: 'error'; job: number; message: string; stack: string | null };

const port = parentPort;
if (!port) throw new Error('audit-worker.ts runs only as a worker thread');

/** Each job's slice and outcome, kept until its analyses are made (or it is forgotten). */
const jobs = new Map<number, { slice: AuditSlice; electionKeys: string[]; outcome: SliceOutcome }>();

const post = (m: FromWorker) => port.postMessage(m);
const fail = (job: number, err: unknown) =>
  post({ type: 'error', job, message: err instanceof Error ? err.message : String(err), stack: err instanceof Error ? (err.stack ?? null) : null });

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

async function runSlice(job: number, slice: AuditSlice, electionKeys: string[]) {
  const outcome = computeSlice(slice);
  jobs.set(job, { slice: { ...slice, polls: [] }, electionKeys, outcome });
  post({ type: 'used', job, used: outcome.used, total: outcome.total, notComputable: outcome.notComputable });
  await postParts(job, pollChunkParts(outcome, electionKeys));
  post({ type: 'polls-done', job });
}

async function runAnalyses(job: number, scorecards: { seed: number; others: UsedRows[] } | null) {
  const own = jobs.get(job);
  if (!own) throw new Error(`audit job ${job} has no slice here`);
  jobs.delete(job);
  const { settings } = own.slice;
  await postParts(job, sharedErrorParts(own.outcome.used, settings, own.electionKeys));
  if (scorecards) await postParts(job, [scorecardsPart(mergeUsed([own.outcome, ...scorecards.others]), settings, scorecards.seed)]);
  post({ type: 'analyses-done', job });
}

port.on('message', (m: ToWorker) => {
  if (m.type === 'slice') runSlice(m.job, m.slice, m.electionKeys).catch((err: unknown) => fail(m.job, err));
  else if (m.type === 'analyses') runAnalyses(m.job, m.scorecards).catch((err: unknown) => fail(m.job, err));
  else jobs.delete(m.job);
});
post({ type: 'ready' });
