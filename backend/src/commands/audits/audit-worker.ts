/**
 * The audit worker thread: computes slices of audits (see slice.ts) and the scorecards, and
 * hands back compressed parts. Started through audit-worker-entry.mjs by workers.ts; holds no
 * database connection (the main thread reads the inputs and writes every part in its transaction).
 */
import { parentPort } from 'node:worker_threads';
import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { scorecardsFor } from './compute';
import { compressPart, type PartRow } from './parts';
import { computeSlice, mergeUsed, sliceParts, type AuditSlice, type SliceOutcome } from './slice';

export interface UsedRows {
  used: AuditPollDto[];
}

/** Messages to the worker. A job's 'scorecards' comes after the worker answered its 'slice' with 'used'. */
export type ToWorker =
  | { type: 'slice'; job: number; slice: AuditSlice; electionKeys: string[] }
  | { type: 'scorecards'; job: number; settings: AuditSettings; seed: number; others: UsedRows[] }
  | { type: 'forget'; job: number };

/** Messages from the worker. */
export type FromWorker =
  | { type: 'ready' }
  | ({ type: 'used'; job: number; total: number; notComputable: number } & UsedRows)
  | { type: 'part'; job: number; part: PartRow }
  | { type: 'slice-done'; job: number }
  | { type: 'scorecards-done'; job: number }
  | { type: 'error'; job: number; message: string; stack: string | null };

const port = parentPort;
if (!port) throw new Error('audit-worker.ts runs only as a worker thread');

/** Each job's slice outcome, kept until the job's scorecards are made (or it is forgotten). */
const jobs = new Map<number, SliceOutcome>();

const post = (m: FromWorker) => port.postMessage(m);
const fail = (job: number, err: unknown) =>
  post({ type: 'error', job, message: err instanceof Error ? err.message : String(err), stack: err instanceof Error ? (err.stack ?? null) : null });

async function runSlice(job: number, slice: AuditSlice, electionKeys: string[]) {
  const outcome = computeSlice(slice);
  jobs.set(job, outcome);
  post({ type: 'used', job, used: outcome.used, total: outcome.total, notComputable: outcome.notComputable });
  const pending: Promise<void>[] = [];
  for (const text of sliceParts(outcome, slice.settings, electionKeys)) {
    pending.push(compressPart(text).then((part) => post({ type: 'part', job, part })));
    // Let finished compressions go out while the next part is computed.
    await new Promise((resolve) => setImmediate(resolve));
  }
  await Promise.all(pending);
  post({ type: 'slice-done', job });
}

async function runScorecards(job: number, settings: AuditSettings, seed: number, others: UsedRows[]) {
  const own = jobs.get(job);
  if (!own) throw new Error(`audit job ${job} has no slice here`);
  jobs.delete(job);
  const used = mergeUsed([own, ...others]);
  const part = await compressPart({ kind: 'scorecards', partKey: '', chunk: 0, content: JSON.stringify(scorecardsFor(used, settings, seed)) });
  post({ type: 'part', job, part });
  post({ type: 'scorecards-done', job });
}

port.on('message', (m: ToWorker) => {
  if (m.type === 'slice') runSlice(m.job, m.slice, m.electionKeys).catch((err: unknown) => fail(m.job, err));
  else if (m.type === 'scorecards') runScorecards(m.job, m.settings, m.seed, m.others).catch((err: unknown) => fail(m.job, err));
  else jobs.delete(m.job);
});
post({ type: 'ready' });
