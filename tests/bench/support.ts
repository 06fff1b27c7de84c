/**
 * Shared plumbing of the benchmarks: a throw-away `veracast_bench_…` database, memory sampling,
 * query timing and plain-text reports. Benchmarks measure; they never assert a target.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import type { Sequelize } from 'sequelize';
import { loadConfig, type Config } from '../../backend/src/config';
import { createSequelize } from '../../backend/src/db/sequelize';
import { ROOT, testEnv } from '../helpers/env';

export { ROOT };
export const OUTPUT_DIR = path.join(ROOT, 'bench-output');

export interface BenchDatabase {
  config: Config;
  name: string;
  drop(): Promise<void>;
}

/**
 * Creates an empty database named `<DB_NAME>_bench_<timestamp>_<random>` (the application user
 * holds ALL on `<DB_NAME>_bench%`, see docker-free-scripts/lib.sh) and returns its config.
 */
export async function createBenchDatabase(): Promise<BenchDatabase> {
  const base = loadConfig({ ...testEnv(), NODE_ENV: 'production' });
  const stamp = new Date().toISOString().replace(/\D/g, '').slice(0, 14);
  const name = `${base.DB_NAME}_bench_${stamp}_${randomBytes(2).toString('hex')}`;
  const admin = createSequelize(base);
  try {
    await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  } finally {
    await admin.close();
  }
  return {
    config: { ...base, DB_NAME: name },
    name,
    async drop() {
      const s = createSequelize(base);
      try {
        await s.query(`DROP DATABASE IF EXISTS \`${name}\``);
      } finally {
        await s.close();
      }
    },
  };
}

export const MB = 1024 * 1024;
export const toMb = (bytes: number) => Math.round((bytes / MB) * 10) / 10;
export const round = (x: number, digits = 3) => Math.round(x * 10 ** digits) / 10 ** digits;

/** Runs a full collection when node was started with --expose-gc (bench.sh does). */
export function collectGarbage() {
  const gc = (globalThis as { gc?: () => void }).gc;
  if (gc) {
    gc();
    gc();
  }
}

/** Peak resident set of this process since the last reset, from /proc (Linux); null elsewhere. */
export function readHighWaterMark(pid: number | 'self' = 'self'): number | null {
  try {
    const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
    const m = /VmHWM:\s+(\d+) kB/.exec(status);
    return m ? Number(m[1]) * 1024 : null;
  } catch {
    return null;
  }
}

/** Current resident set of another process (e.g. mariadbd), from /proc; null when unreadable. */
export function readRss(pid: number): number | null {
  try {
    const m = /VmRSS:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) * 1024 : null;
  } catch {
    return null;
  }
}

/** Resets the kernel's peak-RSS counter of this process (writes 5 to clear_refs); false if refused. */
export function resetHighWaterMark(): boolean {
  try {
    fs.writeFileSync('/proc/self/clear_refs', '5');
    return true;
  } catch {
    return false;
  }
}

export interface MemoryPeaks {
  /** Largest sampled process.memoryUsage().rss. */
  rssPeak: number;
  /** Largest sampled heapUsed. */
  heapUsedPeak: number;
  samples: number;
  /** Kernel high-water mark (VmHWM) over the whole measured span, when the reset worked. */
  kernelPeak: number | null;
}

/**
 * Samples rss and heapUsed every `everyMs` while `work` runs. Synchronous stretches of `work` hold
 * the event loop, so samples can miss a short peak; the kernel's VmHWM (reset first) catches it.
 */
export async function withMemorySampling<T>(work: () => Promise<T>, everyMs = 20): Promise<{ value: T; seconds: number; memory: MemoryPeaks }> {
  const kernelReset = resetHighWaterMark();
  let rssPeak = 0;
  let heapUsedPeak = 0;
  let samples = 0;
  const sample = () => {
    const m = process.memoryUsage();
    rssPeak = Math.max(rssPeak, m.rss);
    heapUsedPeak = Math.max(heapUsedPeak, m.heapUsed);
    samples++;
  };
  sample();
  const timer = setInterval(sample, everyMs);
  const start = performance.now();
  try {
    const value = await work();
    const seconds = (performance.now() - start) / 1000;
    sample();
    return { value, seconds, memory: { rssPeak, heapUsedPeak, samples, kernelPeak: kernelReset ? readHighWaterMark() : null } };
  } finally {
    clearInterval(timer);
  }
}

export interface QueryTiming {
  label: string;
  count: number;
  seconds: number;
}

/**
 * Wraps `sequelize.query` on this instance so every statement's wall time is added to a bucket
 * named by its first words, and the JavaScript time before each statement (since the previous
 * one ended, or since the wrapper was installed) to a `js before …` bucket named by that
 * statement: a timeline of the caller's phases without touching its code. `finish()` removes the
 * wrapper and books the time after the last statement as `js after the last statement`.
 */
export function timeQueries(sequelize: Sequelize): { buckets: Map<string, QueryTiming>; gaps: Map<string, QueryTiming>; finish: () => void } {
  const buckets = new Map<string, QueryTiming>();
  const gaps = new Map<string, QueryTiming>();
  const add = (map: Map<string, QueryTiming>, label: string, seconds: number) => {
    const b = map.get(label) ?? { label, count: 0, seconds: 0 };
    b.count++;
    b.seconds += seconds;
    map.set(label, b);
  };
  const original = sequelize.query;
  let lastEnd = performance.now();
  let inFlight = 0;
  const wrapped = async function (this: Sequelize, ...args: Parameters<Sequelize['query']>) {
    const sql = typeof args[0] === 'string' ? args[0] : (args[0] as { query?: string }).query ?? '';
    const label = labelOf(sql);
    const start = performance.now();
    if (inFlight === 0) add(gaps, `js before ${label}`, (start - lastEnd) / 1000);
    inFlight++;
    try {
      return await (original as (...a: unknown[]) => Promise<unknown>).apply(this, args);
    } finally {
      inFlight--;
      lastEnd = performance.now();
      add(buckets, label, (lastEnd - start) / 1000);
    }
  };
  (sequelize as unknown as { query: unknown }).query = wrapped;
  return {
    buckets,
    gaps,
    finish: () => {
      add(gaps, 'js after the last statement', (performance.now() - lastEnd) / 1000);
      (sequelize as unknown as { query: unknown }).query = original;
    },
  };
}

function labelOf(sql: string): string {
  const s = sql.replace(/\s+/g, ' ').trim();
  const m = /^(SELECT .*? FROM [`\w]+|INSERT (?:IGNORE )?INTO [`\w]+|DELETE FROM [`\w]+|UPDATE [`\w]+|LOAD DATA LOCAL INFILE|START TRANSACTION|COMMIT|ROLLBACK|SET [\w ]+)/i.exec(s);
  const label = m ? m[1]! : s.slice(0, 40);
  return label.length > 70 ? `${label.slice(0, 67)}...` : label;
}

/** Buckets, slowest first, seconds rounded to the millisecond. */
export const sortedBuckets = (buckets: Map<string, QueryTiming>) =>
  [...buckets.values()].sort((x, y) => y.seconds - x.seconds).map((b) => ({ ...b, seconds: round(b.seconds) }));

/** Sums the buckets' seconds. */
export const queriesTotal = (buckets: Map<string, QueryTiming>) => [...buckets.values()].reduce((a, b) => a + b.seconds, 0);

/** Prints rows of [label, value] as an aligned two-column table under a title. */
export function printTable(title: string, rows: readonly (readonly [string, string])[]) {
  const width = Math.max(...rows.map(([k]) => k.length));
  const lines = [title, '-'.repeat(Math.max(title.length, width + 20)), ...rows.map(([k, v]) => `${k.padEnd(width)}  ${v}`)];
  process.stdout.write(`${lines.join('\n')}\n\n`);
}

/** The machine's size and load: other work on it slows the database and both sides of a ratio. */
export const machine = () => ({ cpus: os.cpus().length, loadAverage: os.loadavg().map((x) => round(x, 2)), totalMemoryMb: toMb(os.totalmem()) });

/** Writes bench-output/<file> (git-ignored) with the machine's state appended. */
export function writeJson(file: string, value: object) {
  fs.mkdirSync(OUTPUT_DIR, { recursive: true });
  const target = path.join(OUTPUT_DIR, file);
  fs.writeFileSync(target, `${JSON.stringify({ ...value, machine: machine() }, null, 2)}\n`);
  return target;
}

export const verdict = (ok: boolean) => (ok ? 'PASS' : 'MISS');

/** The pid of the private MariaDB started by docker-free-scripts (null when not found). */
export function mariadbPid(): number | null {
  try {
    const pid = Number(fs.readFileSync(path.join(ROOT, '.data/mariadb/mysqld.pid'), 'utf8').trim());
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}
