/**
 * Audit benchmark (issue 4 §6): createAudit end to end against a pandas script over the same rows.
 *
 * C = createAudit over every bench election with the default settings: read set-based (the main
 *     thread and each audit worker its own elections, in snapshots taken together), hash and
 *     compute every per-poll metric and the headline, store the audit (settings, hash, core
 *     version, headline, every poll's row) in one transaction — what POST /api/v1/audits waits
 *     for — with the audit worker threads started beforehand as the server starts them.
 * E = the analyses derived from the stored rows (scorecards, each election's shared-error
 *     analysis), which createAudit stores right after C in a second transaction; printed apart and
 *     waited for before D, never counted in C.
 * Both sides' ratios are printed: C/D (the target) and (C + E)/D.
 * C (then E) and D alternate three times (BENCH_AUDIT_RUNS), as the import benchmark's A and B do:
 * single runs drift by 10–20% within minutes on a 2-CPU machine, and the first C follows the
 * import benchmark's writes (the server is still purging and flushing them). The verdict is on
 * the median ratio; every run is printed; memory is run 1's.
 * D = /usr/bin/python3 tests/bench/pandas_audit.py: start-up, read the same rows from MariaDB,
 *     compute reference pairs, margin errors, M3, M5 and MTK's A per poll, write them to a CSV.
 * The per-poll values of both are compared afterwards (an outside check of the audit's numbers).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { performance } from 'node:perf_hooks';
import { QueryTypes } from 'sequelize';
import { auditCreateSchema, type AuditPollDto } from '@veracast/shared-types';
import { createAudit, loadAuditPolls } from '../../backend/src/commands/audits/create-audit';
import { loadAuditInputs } from '../../backend/src/commands/audits/inputs';
import { computeAuditPolls, headline, scorecardsFor, seedOf, sharedErrorFor } from '../../backend/src/commands/audits/compute';
import { auditWorkerCount, readyAuditWorkers, stopAuditWorkers } from '../../backend/src/commands/audits/workers';
import type { BenchArchive } from './archive';
import {
  collectGarbage, printTable, queriesTotal, ROOT, round, sortedBuckets, timeQueries, toMb, verdict, withMemorySampling, writeJson, type QueryTiming,
} from './support';

const RATIO_TARGET = 1;
/** C (+E) and D each run this many times, alternating (BENCH_AUDIT_RUNS, default 3). */
const RUNS = Math.max(1, Number(process.env.BENCH_AUDIT_RUNS ?? 3));
const PYTHON = '/usr/bin/python3';
const TOLERANCE = 1e-9;

interface PandasReport {
  seconds: number;
  phases: Record<string, number>;
  counts: Record<string, number>;
  versions: Record<string, string>;
}

interface PandasPoll {
  refA: string; refB: string; basis: string;
  marginError: number | null; absMarginError: number | null; mosteller3: number | null; mosteller5: number | null; mtkA: number | null;
}

export interface AuditBenchResult {
  polls: number;
  elections: number;
  /** createAudit's wall time; when it failed, the time until it failed (a lower bound of C). */
  auditSeconds: number;
  /** E: from C's end until the audit's analyses were stored (not part of C; see the module notes). */
  analysesSeconds: number | null;
  /** Threads that computed C (the main one and the audit workers it used). */
  threads: number | null;
  auditError: { code: string | null; message: string; statementMegabytes: number | null } | null;
  /** Every run: C, E, D and C/D. auditSeconds, analysesSeconds, pandasSeconds and ratio are the median run's (by ratio). */
  runs: { auditSeconds: number; analysesSeconds: number | null; pandasSeconds: number; ratio: number }[];
  pandasSeconds: { wall: number; script: number; phases: Record<string, number> };
  /** C/D of the median run; a lower bound when createAudit failed. */
  ratio: number;
  ratioIsLowerBound: boolean;
  ratioTarget: number;
  ratioPass: boolean;
  memory: { rssPeakMb: number; heapUsedPeakMb: number; kernelPeakRssMb: number | null };
  crossCheck: { source: 'stored audit (loadAuditPolls)' | 'computeAuditPolls (createAudit failed to store)'; compared: number; maxAbsDiff: Record<string, number>; overTolerance: number; nullMismatches: number; pairMismatches: number; tolerance: number };
  breakdown: { queries: QueryTiming[]; queriesSeconds: number; javascript: QueryTiming[]; phases: Record<string, number> };
  pandasVersions: Record<string, string>;
}

function runPandas(archive: BenchArchive, electionKeys: readonly string[], outFile: string): Promise<{ wall: number; report: PandasReport }> {
  const { config } = archive.db;
  const env = {
    PATH: process.env.PATH ?? '/usr/bin:/bin', HOME: process.env.HOME ?? '/tmp', DB_HOST: config.DB_HOST, DB_PORT: String(config.DB_PORT),
    DB_USER: config.DB_USER, DB_PASSWORD: config.DB_PASSWORD, DB_NAME: config.DB_NAME, BENCH_ELECTIONS: electionKeys.join(','), BENCH_OUT: outFile,
  };
  return new Promise((resolve, reject) => {
    const start = performance.now();
    const child = spawn(PYTHON, [path.join(ROOT, 'tests/bench/pandas_audit.py')], { env, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (c: Buffer) => (stdout += c.toString()));
    child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
    child.on('error', reject);
    child.on('close', (code) => {
      const wall = (performance.now() - start) / 1000;
      if (code !== 0) return reject(new Error(`pandas_audit.py exited with ${code}: ${stderr.slice(-2000)}`));
      const line = stdout.trim().split('\n').pop() ?? '';
      try {
        resolve({ wall, report: JSON.parse(line) as PandasReport });
      } catch {
        reject(new Error(`pandas_audit.py printed no JSON: ${stdout.slice(-500)} ${stderr.slice(-500)}`));
      }
    });
  });
}

function readPandasCsv(file: string): Map<string, PandasPoll> {
  const [head, ...lines] = fs.readFileSync(file, 'utf8').trim().split('\n');
  const cols = (head ?? '').split(',');
  const at = (name: string) => {
    const i = cols.indexOf(name);
    if (i < 0) throw new Error(`pandas output lacks column ${name}`);
    return i;
  };
  const ix = { key: at('poll_key'), a: at('ref_a'), b: at('ref_b'), basis: at('basis'), me: at('margin_error'), ame: at('abs_margin_error'), m3: at('mosteller3'), m5: at('mosteller5'), mtk: at('mtk_a') };
  const num = (v: string | undefined) => (v === undefined || v === '' ? null : Number(v));
  const out = new Map<string, PandasPoll>();
  for (const line of lines) {
    const c = line.split(',');
    out.set(c[ix.key] ?? '', {
      refA: c[ix.a] ?? '', refB: c[ix.b] ?? '', basis: c[ix.basis] ?? '', marginError: num(c[ix.me]), absMarginError: num(c[ix.ame]),
      mosteller3: num(c[ix.m3]), mosteller5: num(c[ix.m5]), mtkA: num(c[ix.mtk]),
    });
  }
  return out;
}

function crossCheck(audit: readonly AuditPollDto[], pandas: Map<string, PandasPoll>) {
  const fields = ['marginError', 'absMarginError', 'mosteller3', 'mosteller5', 'mtkA'] as const;
  const maxAbsDiff: Record<string, number> = Object.fromEntries(fields.map((f) => [f, 0]));
  let overTolerance = 0;
  let nullMismatches = 0;
  let pairMismatches = 0;
  let compared = 0;
  for (const a of audit) {
    const p = pandas.get(a.pollKey);
    if (!p) {
      nullMismatches++;
      continue;
    }
    compared++;
    if (a.refA !== null && (a.refA !== p.refA || a.refB !== p.refB || a.refBasis !== p.basis)) pairMismatches++;
    for (const f of fields) {
      const x = a[f];
      const y = p[f];
      if (x === null || y === null) {
        if (x !== y) nullMismatches++;
        continue;
      }
      const d = Math.abs(x - y);
      maxAbsDiff[f] = Math.max(maxAbsDiff[f] ?? 0, d);
      if (!(d <= TOLERANCE)) overTolerance++;
    }
  }
  if (pandas.size !== audit.length) nullMismatches += Math.abs(pandas.size - audit.length);
  return { compared, maxAbsDiff, overTolerance, nullMismatches, pairMismatches, tolerance: TOLERANCE };
}

/** What a failed createAudit reports: the server's code and message, and the statement's size. */
function describeFailure(err: unknown): NonNullable<AuditBenchResult['auditError']> {
  const parent = (err as { parent?: { code?: string; sqlMessage?: string; text?: string; message?: string; sql?: string } }).parent;
  const message = parent?.sqlMessage ?? parent?.text ?? parent?.message ?? (err instanceof Error ? err.message : String(err));
  return {
    code: parent?.code ?? null,
    message: message.length > 200 ? `${message.slice(0, 200)}...` : message,
    statementMegabytes: parent?.sql ? toMb(Buffer.byteLength(parent.sql)) : null,
  };
}

/** The phases of createAudit timed one by one (a second, separate pass over the same data). */
async function phaseTimes(archive: BenchArchive, settings: ReturnType<typeof auditCreateSchema.parse>) {
  const phases: Record<string, number> = {};
  const time = async <T,>(name: string, f: () => T | Promise<T>): Promise<T> => {
    const start = performance.now();
    const v = await f();
    phases[name] = round((performance.now() - start) / 1000);
    return v;
  };
  const inputs = await time('loadAuditInputs (read + hash)', () => loadAuditInputs(archive.sequelize, settings.electionKeys));
  const items = await time('computeAuditPolls', () => computeAuditPolls(inputs, settings));
  await time('headline', () => headline(items, settings, inputs.elections, inputs.contests));
  await time('scorecardsFor (1000 draws)', () => scorecardsFor(items, settings, seedOf(inputs.dataHash)));
  await time('sharedErrorFor (every election)', () => inputs.elections.map((e) => sharedErrorFor(items, settings, e.key)));
  await time('JSON.stringify of every poll row', () => items.reduce((n, i) => n + JSON.stringify(i).length, 0));
  return { phases, items };
}

const median = (xs: readonly number[]) => {
  const s = [...xs].sort((x, y) => x - y);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};

/** One run: C (createAudit), E (its analyses, waited for), then D (the pandas script). */
async function oneRun(archive: BenchArchive, name: string, settings: ReturnType<typeof auditCreateSchema.parse>, electionKeys: readonly string[], outFile: string) {
  const { sequelize } = archive;
  collectGarbage();
  const c = await withMemorySampling(async () => {
    const timing = timeQueries(sequelize);
    try {
      return { created: await createAudit(sequelize, name, settings, archive.userId), timing, error: null };
    } catch (err) {
      return { created: null, timing, error: describeFailure(err) };
    } finally {
      timing.finish();
    }
  });
  const { created, timing, error } = c.value;
  // E: the analyses (scorecards, shared error) that createAudit stores right after the audit is
  // committed, timed from C's end; D starts only once they are stored.
  const startE = performance.now();
  const analyses = created ? await created.analyses : null;
  const eSeconds = (performance.now() - startE) / 1000;
  if (analyses && !analyses.ok) throw new Error(`storing the audit's analyses failed: ${String(analyses.error)}`);
  collectGarbage();
  const d = await runPandas(archive, electionKeys, outFile);
  return { created, timing, error, cSeconds: c.seconds, eSeconds, memory: c.memory, d, ratio: c.seconds / d.wall };
}

export async function runAuditBench(archive: BenchArchive): Promise<AuditBenchResult> {
  const { sequelize } = archive;
  const electionKeys = (await sequelize.query<{ key: string }>('SELECT `key` FROM elections ORDER BY `key`', { type: QueryTypes.SELECT })).map((r) => r.key);
  const name = `Benchmark audit of ${archive.nPolls} polls`;
  const settings = auditCreateSchema.parse({ name, electionKeys });

  // The server starts its audit workers at start-up; so does the bench, before timing C.
  const workers = await readyAuditWorkers();
  const outFile = path.join(archive.dir, 'pandas-audit.csv');
  const runs: Awaited<ReturnType<typeof oneRun>>[] = [];
  for (let k = 0; k < RUNS; k++) {
    const run = await oneRun(archive, name, settings, electionKeys, outFile);
    runs.push(run);
    if (run.error) break;
  }
  const middle = [...runs].sort((x, y) => x.ratio - y.ratio)[(runs.length - 1) >> 1]!;
  const first = runs[0]!;
  const last = runs.at(-1)!;
  const { created, error } = last;
  const { timing } = first;
  const d = middle.d;

  collectGarbage();
  const { phases, items } = await phaseTimes(archive, settings);
  // The last run's stored audit against the last pandas output (both over the same rows).
  const check = {
    source: created ? 'stored audit (loadAuditPolls)' as const : 'computeAuditPolls (createAudit failed to store)' as const,
    ...crossCheck(created ? await loadAuditPolls(sequelize, created.id) : items, readPandasCsv(outFile)),
  };

  const queries = sortedBuckets(timing.buckets);
  const javascript = sortedBuckets(timing.gaps);
  const ratio = median(runs.map((r) => r.ratio));
  const result: AuditBenchResult = {
    polls: created?.pollCount ?? items.length,
    elections: electionKeys.length,
    auditSeconds: round(middle.cSeconds),
    analysesSeconds: middle.created ? round(middle.eSeconds) : null,
    threads: created?.threads ?? null,
    auditError: error,
    runs: runs.map((r) => ({ auditSeconds: round(r.cSeconds), analysesSeconds: r.created ? round(r.eSeconds) : null, pandasSeconds: round(r.d.wall), ratio: round(r.ratio, 2) })),
    pandasSeconds: { wall: round(d.wall), script: round(d.report.seconds), phases: Object.fromEntries(Object.entries(d.report.phases).map(([k, v]) => [k, round(v)])) },
    ratio: round(ratio, 2),
    ratioIsLowerBound: error !== null,
    ratioTarget: RATIO_TARGET,
    ratioPass: error === null && ratio <= RATIO_TARGET,
    memory: { rssPeakMb: toMb(first.memory.rssPeak), heapUsedPeakMb: toMb(first.memory.heapUsedPeak), kernelPeakRssMb: first.memory.kernelPeak === null ? null : toMb(first.memory.kernelPeak) },
    crossCheck: check,
    breakdown: { queries, queriesSeconds: round(queriesTotal(timing.buckets)), javascript, phases },
    pandasVersions: d.report.versions,
  };

  const fmt = (x: number) => (x === 0 ? '0' : x.toExponential(2));
  printTable(`Audit benchmark: ${archive.nPolls.toLocaleString('en')} polls in ${electionKeys.length} elections (issue 4 §6)`, [
    ['polls audited', `${result.polls.toLocaleString('en')} (pandas read ${d.report.counts.polls ?? '?'} polls, ${d.report.counts.shares ?? '?'} shares)`],
    [`runs (C, then E, then D; alternating)`, `${runs.length}`],
    ...result.runs.map((r, k) => [`  run ${k + 1}: C / D = ratio (E)`, `${r.auditSeconds} s / ${r.pandasSeconds} s = ${r.ratio} (E ${r.analysesSeconds ?? '?'} s)`] as const),
    error
      ? ['C createAudit (read, compute, store)', `FAILED after ${round(last.cSeconds)} s: ${error.code ?? ''} ${error.message.slice(0, 90)} (statement of ${error.statementMegabytes ?? '?'} MB)`]
      : ['C createAudit (read, compute, store), median run', `${result.auditSeconds} s`],
    ['E analyses stored after C (not in the ratio), median run', `${result.analysesSeconds ?? '?'} s (scorecards, shared error; C + E = ${result.analysesSeconds === null ? '?' : round(result.auditSeconds + result.analysesSeconds)} s)`],
    ['threads in C (main + audit workers)', `${result.threads ?? '?'} (${workers.length} worker(s) ready of ${auditWorkerCount()} configured; ${os.availableParallelism()} CPUs)`],
    ['D pandas script, wall time, median run', `${result.pandasSeconds.wall} s`],
    ['D pandas script, own clock, median run', `${result.pandasSeconds.script} s (${Object.entries(result.pandasSeconds.phases).map(([k, v]) => `${k} ${v}`).join(', ')})`],
    ['ratio C/D (wall), median of the runs', error ? `>= ${result.ratio} (C did not finish)` : `${result.ratio}`],
    ['ratio (C + E)/D, analyses counted (not the target), median run', result.analysesSeconds === null ? '?' : `${round((result.auditSeconds + result.analysesSeconds) / d.wall, 2)}`],
    ['peak RSS during C, run 1', `${result.memory.rssPeakMb} MB sampled, ${result.memory.kernelPeakRssMb ?? '?'} MB kernel; heapUsed ${result.memory.heapUsedPeakMb} MB`],
    ['cross-check polls compared', `${check.compared.toLocaleString('en')} (${check.source})`],
    ['  max |diff| margin / |margin|', `${fmt(check.maxAbsDiff.marginError ?? 0)} / ${fmt(check.maxAbsDiff.absMarginError ?? 0)}`],
    ['  max |diff| M3 / M5 / MTK A', `${fmt(check.maxAbsDiff.mosteller3 ?? 0)} / ${fmt(check.maxAbsDiff.mosteller5 ?? 0)} / ${fmt(check.maxAbsDiff.mtkA ?? 0)}`],
    [`  values over ${TOLERANCE} / null mismatches / pair mismatches`, `${check.overTolerance} / ${check.nullMismatches} / ${check.pairMismatches}`],
    [`target ratio C/D <= ${RATIO_TARGET}`, verdict(result.ratioPass)],
  ]);
  printTable('Where C spends its time', [
    ['SQL through Sequelize during run 1\'s C (wall time; the poll reads and', `${result.breakdown.queriesSeconds} s`],
    ['  part writes use the raw connection and are not listed here)', ''],
    ...queries.slice(0, 6).map((b) => [`  ${b.label}`, `${b.seconds} s x${b.count}`] as const),
    ['JavaScript between statements during run 1\'s C', `${round(queriesTotal(timing.gaps))} s`],
    ...javascript.slice(0, 4).map((b) => [`  ${b.label}`, `${b.seconds} s x${b.count}`] as const),
    ['Phases, timed one by one in a second pass:', ''],
    ...Object.entries(phases).map(([k, v]) => [`  ${k}`, `${v} s`] as const),
  ]);
  await stopAuditWorkers();
  const file = writeJson('audit.json', { benchmark: 'audit', nPolls: archive.nPolls, seed: archive.seed, at: new Date().toISOString(), node: process.version, ...result });
  process.stdout.write(`wrote ${path.relative(process.cwd(), file)}\n\n`);
  return result;
}
