/**
 * The pool of audit worker threads (audit-worker.ts). An audit of many polls is split into slices
 * of whole elections; the main thread computes one slice and each worker another, in parallel,
 * and one worker also computes the scorecards. Workers start once (about half a second each, for
 * the TypeScript loader and the modules) and are kept: the server warms them at start-up.
 *
 * A worker that fails to start or dies is dropped; the next audit starts a new one, and an audit
 * with no worker available is computed wholly on the main thread (the same results).
 */
import os from 'node:os';
import { Worker } from 'node:worker_threads';
import type { FromWorker, ToWorker } from './audit-worker';

const ENTRY = new URL('./audit-worker-entry.mjs', import.meta.url);
const START_TIMEOUT_MS = 20_000;

/** One worker thread, with the listeners of its jobs. */
export class AuditWorker {
  readonly ready: Promise<void>;
  private readonly worker: Worker;
  private readonly listeners = new Map<number, (m: FromWorker) => void>();
  private dead: Error | null = null;
  private active = 0;

  constructor() {
    this.worker = new Worker(ENTRY);
    this.worker.unref();
    this.ready = new Promise<void>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error('an audit worker did not start in time')), START_TIMEOUT_MS);
      timer.unref();
      this.worker.on('message', (m: FromWorker) => {
        if (m.type === 'ready') {
          clearTimeout(timer);
          resolve();
        } else this.listeners.get(m.job)?.(m);
      });
      const die = (err: Error) => {
        clearTimeout(timer);
        this.dead ??= err;
        reject(err);
        for (const [job, listener] of this.listeners) listener({ type: 'error', job, message: `the audit worker stopped: ${err.message}`, stack: null });
        this.listeners.clear();
      };
      this.worker.on('error', die);
      this.worker.on('exit', (code) => die(new Error(`exit code ${code}`)));
    });
    this.ready.catch(() => undefined);
  }

  get alive(): boolean {
    return this.dead === null;
  }

  /** No audit job is using this worker (a job counts from `listen` until its release). */
  get idle(): boolean {
    return this.active === 0;
  }

  /**
   * Listens to a job's messages and keeps the worker referenced (so the process stays up while it
   * works) until `release` is called.
   */
  listen(job: number, listener: (m: FromWorker) => void): { release: () => void } {
    if (this.dead) {
      const message = `the audit worker stopped: ${this.dead.message}`;
      queueMicrotask(() => listener({ type: 'error', job, message, stack: null }));
      return { release: () => undefined };
    }
    this.listeners.set(job, listener);
    if (this.active++ === 0) this.worker.ref();
    let released = false;
    return {
      release: () => {
        if (released) return;
        released = true;
        this.listeners.delete(job);
        if (--this.active === 0) this.worker.unref();
        if (this.alive) this.send({ type: 'forget', job });
      },
    };
  }

  send(m: ToWorker) {
    this.worker.postMessage(m);
  }

  terminate() {
    return this.worker.terminate();
  }
}

let wanted: number | null = null;
let pool: AuditWorker[] = [];

/** Default pool size: one thread per CPU besides the main one, at most 3. */
const defaultCount = () => Math.max(0, Math.min(3, os.availableParallelism() - 1));

/** Sets the pool size (0 = compute audits on the main thread only); null = the default. */
export function configureAuditWorkers(count: number | null | undefined) {
  wanted = count ?? null;
}

export function auditWorkerCount(): number {
  return wanted ?? defaultCount();
}

/** Starts the workers that are missing (dropping dead ones) without waiting for them. */
export function warmAuditWorkers(): AuditWorker[] {
  pool = pool.filter((w) => w.alive);
  while (pool.length < auditWorkerCount()) pool.push(new AuditWorker());
  return pool;
}

/**
 * The started workers, once ready; those that failed to start are left out (the caller computes
 * their share itself).
 */
export async function readyAuditWorkers(): Promise<AuditWorker[]> {
  const started = warmAuditWorkers().slice(0, auditWorkerCount());
  const ok = await Promise.all(started.map((w) => w.ready.then(() => true, () => false)));
  return started.filter((_, i) => ok[i]);
}

export async function stopAuditWorkers() {
  const all = pool;
  pool = [];
  await Promise.all(all.map((w) => w.terminate()));
}
