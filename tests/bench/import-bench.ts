/**
 * Import benchmark (issue 3 §8): the real poll import path against MariaDB's own bulk loader.
 *
 * A = importPolls on the generated file (parse, validate, resolve, set-based upsert, one
 *     transaction), with rss/heap sampled every 20 ms and the kernel's peak RSS.
 * B = LOAD DATA LOCAL INFILE of exactly the rows A wrote (polls with their resolved ids, then
 *     poll_shares), both files in one transaction, after emptying the two tables.
 * The pollsters A created (60 firms) and its `imports` row are kept: B loads ids already resolved.
 * A and B alternate three times (BENCH_IMPORT_RUNS); the speed verdict is on the median ratio,
 * the memory verdict on the first run (later runs start with the heap the earlier ones grew; a
 * later A also finds the firms of the first one already there). Every run is printed.
 *
 * LOAD DATA LOCAL with the mariadb connector 3.0.2: the Sequelize instance already sets
 * `permitLocalInfile: true`; the connector then streams the file the server asks for, and only
 * when that exact path is written, quoted, right after `LOAD DATA LOCAL INFILE` in the statement
 * (it refuses any other name, so no placeholder). The server runs with --local-infile=1.
 */
import fs from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { QueryTypes, type Sequelize } from 'sequelize';
import { importPolls } from '../../backend/src/commands/imports/polls';
import { parseCsv } from '../../backend/src/commands/imports/csv';
import type { BenchArchive } from './archive';
import {
  collectGarbage, mariadbPid, printTable, queriesTotal, readRss, round, sortedBuckets, timeQueries, toMb, verdict, withMemorySampling, writeJson,
  type MemoryPeaks, type QueryTiming,
} from './support';

const RATIO_TARGET = 2;
/** A and B each run this many times, alternating (BENCH_IMPORT_RUNS, default 3). */
const RUNS = Math.max(1, Number(process.env.BENCH_IMPORT_RUNS ?? 3));
const MEMORY_TARGET_MB = 400;

/** The columns of `polls` the import writes (created_at/updated_at take their defaults in both runs). */
const POLL_COLUMNS = [
  'id', 'key', 'pollster_id', 'sponsor_id', 'contest_id', 'fieldwork_start', 'fieldwork_end', 'published_on', 'sample_size', 'population',
  'mode', 'moe', 'study_key', 'is_headline', 'tracking', 'source_url', 'question_wording', 'weighting_statement', 'tables_url', 'import_id',
] as const;
const SHARE_COLUMNS = ['poll_id', 'option_key', 'share'] as const;

export interface ImportBenchResult {
  rows: { polls: number; shares: number; csvRows: number; csvMegabytes: number };
  resultsImportSeconds: number;
  /** Medians over the runs. */
  importSeconds: number;
  loadDataSeconds: number;
  runs: { importSeconds: number; loadDataSeconds: number; ratio: number; peakRssMb: number }[];
  loadDataByTable: Record<string, number>;
  ratio: number;
  ratioTarget: number;
  ratioPass: boolean;
  memory: { baselineRssMb: number; rssPeakMb: number; heapUsedPeakMb: number; kernelPeakRssMb: number | null; samples: number; mariadbRssMb: { before: number | null; after: number | null } };
  memoryTargetMb: number;
  memoryPass: boolean;
  identical: boolean;
  breakdown: { queries: QueryTiming[]; queriesSeconds: number; javascript: QueryTiming[]; javascriptSeconds: number; parseCsvSeconds: number };
}

const q = (name: string) => `\`${name}\``;

/** LOAD DATA's default escaping: backslash, tab and newline escaped, NULL as \N. */
function tsvCell(v: unknown): string {
  if (v === null || v === undefined) return '\\N';
  return String(v).replace(/[\\\t\n\r]/g, (c) => (c === '\\' ? '\\\\' : c === '\t' ? '\\t' : c === '\n' ? '\\n' : '\\r'));
}

/** Writes a table's rows (every value as text from the server) to a tab-separated file. */
async function dumpTable(sequelize: Sequelize, table: string, columns: readonly string[], file: string): Promise<number> {
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT ${columns.map((c) => `CAST(${q(c)} AS CHAR) AS ${q(c)}`).join(', ')} FROM ${q(table)} ORDER BY ${q(columns[0]!)}${table === 'poll_shares' ? ', option_key' : ''}`,
    { type: QueryTypes.SELECT },
  );
  const out = fs.openSync(file, 'w');
  try {
    const lines: string[] = [];
    for (const r of rows) {
      lines.push(columns.map((c) => tsvCell(r[c])).join('\t'));
      if (lines.length === 20_000) {
        fs.writeSync(out, `${lines.join('\n')}\n`);
        lines.length = 0;
      }
    }
    if (lines.length) fs.writeSync(out, `${lines.join('\n')}\n`);
  } finally {
    fs.closeSync(out);
  }
  return rows.length;
}

/** Row count and an order-independent checksum over every written column, to prove B = A. */
async function fingerprint(sequelize: Sequelize, table: string, columns: readonly string[]): Promise<string> {
  const [r] = await sequelize.query<{ n: number | string; crc: number | string | null }>(
    `SELECT COUNT(*) AS n, SUM(CRC32(CONCAT_WS('|', ${columns.map((c) => `IFNULL(${q(c)}, '<null>')`).join(', ')}))) AS crc FROM ${q(table)}`,
    { type: QueryTypes.SELECT },
  );
  return `${String(r?.n)}:${String(r?.crc)}`;
}

/**
 * Empties polls and poll_shares as freshly created tables (TRUNCATE, so B does not run against
 * InnoDB's purge of deleted rows; A also wrote into fresh tables). TRUNCATE of a parent
 * table needs foreign_key_checks off on that connection; a transaction pins the connection.
 */
async function emptyPollTables(sequelize: Sequelize) {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('SET FOREIGN_KEY_CHECKS = 0', { transaction });
    try {
      await sequelize.query('TRUNCATE TABLE poll_shares', { transaction });
      await sequelize.query('TRUNCATE TABLE polls', { transaction });
    } finally {
      await sequelize.query('SET FOREIGN_KEY_CHECKS = 1', { transaction });
    }
  });
  const [n] = await sequelize.query<{ n: number | string }>('SELECT (SELECT COUNT(*) FROM polls) + (SELECT COUNT(*) FROM poll_shares) AS n', { type: QueryTypes.SELECT });
  if (Number(n?.n) !== 0) throw new Error('polls/poll_shares are not empty before LOAD DATA');
}

function loadDataSql(file: string, table: string, columns: readonly string[]): string {
  if (!/^[\w/.-]+$/.test(file)) throw new Error(`unexpected characters in ${file}`);
  // The connector checks that the server asks for the very file named in this statement.
  return `LOAD DATA LOCAL INFILE '${file}' INTO TABLE ${q(table)} CHARACTER SET utf8mb4 FIELDS TERMINATED BY '\\t' ESCAPED BY '\\\\' LINES TERMINATED BY '\\n' (${columns.map(q).join(', ')})`;
}

/** Reads the file into a Buffer (untimed), then times importPolls on it with memory sampling. */
async function timeImport(archive: BenchArchive) {
  const buffer = fs.readFileSync(archive.pollsCsvPath);
  collectGarbage();
  const baselineRss = process.memoryUsage().rss;
  const run = await withMemorySampling(async () => {
    const timing = timeQueries(archive.sequelize);
    try {
      return { outcome: await importPolls(archive.sequelize, buffer, { fileName: 'bench-polls.csv', userId: archive.userId, userRole: 'admin' }), timing };
    } finally {
      timing.finish();
    }
  });
  return { ...run, baselineRss };
}

/** One run: A into empty poll tables, the rows it wrote dumped, the tables emptied, B, and B checked equal to A. */
async function oneRun(archive: BenchArchive, pid: number | null) {
  const { sequelize } = archive;
  // A: the real import path, from one Buffer as a memory-storage upload would hand it over.
  const mariadbBefore = pid ? readRss(pid) : null;
  const a = await timeImport(archive);
  const mariadbAfter = pid ? readRss(pid) : null;
  const { outcome } = a.value;
  if (outcome.status !== 'committed' || outcome.created !== archive.nPolls) {
    throw new Error(`poll import ${outcome.status}: created ${outcome.created} of ${archive.nPolls}; ${JSON.stringify(outcome.errors.slice(0, 3))}`);
  }
  collectGarbage();

  // Untimed: the rows A wrote, as LOAD DATA files, and their fingerprints.
  const pollsTsv = path.join(archive.dir, 'polls.tsv');
  const sharesTsv = path.join(archive.dir, 'poll_shares.tsv');
  const polls = await dumpTable(sequelize, 'polls', POLL_COLUMNS, pollsTsv);
  const shares = await dumpTable(sequelize, 'poll_shares', SHARE_COLUMNS, sharesTsv);
  const before = [await fingerprint(sequelize, 'polls', POLL_COLUMNS), await fingerprint(sequelize, 'poll_shares', SHARE_COLUMNS)];
  await emptyPollTables(sequelize);
  collectGarbage();

  // B: MariaDB's bulk loader, same tables, same constraints (foreign keys checked), one transaction.
  const loadData: Record<string, number> = {};
  const startB = performance.now();
  await sequelize.transaction(async (transaction) => {
    for (const [file, table, columns] of [[pollsTsv, 'polls', POLL_COLUMNS], [sharesTsv, 'poll_shares', SHARE_COLUMNS]] as const) {
      const start = performance.now();
      await sequelize.query(loadDataSql(file, table, columns), { transaction });
      loadData[table] = round((performance.now() - start) / 1000);
    }
  });
  const loadDataSeconds = (performance.now() - startB) / 1000;
  const after = [await fingerprint(sequelize, 'polls', POLL_COLUMNS), await fingerprint(sequelize, 'poll_shares', SHARE_COLUMNS)];
  const identical = before[0] === after[0] && before[1] === after[1];
  if (!identical) throw new Error(`LOAD DATA did not restore the imported rows: ${before.join(' ')} vs ${after.join(' ')}`);
  return { a, loadData, loadDataSeconds, identical, polls, shares, mariadbBefore, mariadbAfter, ratio: a.seconds / loadDataSeconds };
}

const median = (xs: readonly number[]) => {
  const s = [...xs].sort((x, y) => x - y);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};

export async function runImportBench(archive: BenchArchive): Promise<ImportBenchResult> {
  const pid = mariadbPid();
  // A and B alternate RUNS times (A, B, A, B, …; the poll tables emptied before each A); the
  // ratio is the median of the runs' ratios.
  const runs: Awaited<ReturnType<typeof oneRun>>[] = [];
  for (let k = 0; k < RUNS; k++) {
    if (k > 0) await emptyPollTables(archive.sequelize);
    runs.push(await oneRun(archive, pid));
  }
  const middle = [...runs].sort((x, y) => x.ratio - y.ratio)[(runs.length - 1) >> 1]!;
  const first = runs[0]!;
  const { loadData, identical, polls, shares, mariadbBefore, mariadbAfter } = middle;
  const { timing } = first.a.value;
  const baselineRss = first.a.baselineRss;
  const loadDataSeconds = median(runs.map((r) => r.loadDataSeconds));
  const importSeconds = median(runs.map((r) => r.a.seconds));

  // Breakdown: parseCsv alone (the first step of A), on a fresh Buffer.
  collectGarbage();
  const parseStart = performance.now();
  const parsed = parseCsv(fs.readFileSync(archive.pollsCsvPath));
  const parseCsvSeconds = (performance.now() - parseStart) / 1000;
  const csvRows = parsed.rows.length;
  collectGarbage();

  // Memory: the first run's (a fresh process, as a single import measures it); later runs start
  // with the heap the earlier ones grew and are listed for information.
  const memory: MemoryPeaks = first.a.memory;
  const queries = sortedBuckets(timing.buckets);
  const javascript = sortedBuckets(timing.gaps);
  const queriesSeconds = queriesTotal(timing.buckets);
  const ratio = median(runs.map((r) => r.ratio));
  const peakMb = toMb(Math.max(memory.rssPeak, memory.kernelPeak ?? 0));
  const result: ImportBenchResult = {
    rows: { polls, shares, csvRows, csvMegabytes: toMb(archive.pollsCsvBytes) },
    resultsImportSeconds: round(archive.resultsImportSeconds),
    importSeconds: round(importSeconds),
    runs: runs.map((r) => ({ importSeconds: round(r.a.seconds), loadDataSeconds: round(r.loadDataSeconds), ratio: round(r.ratio, 2), peakRssMb: toMb(Math.max(r.a.memory.rssPeak, r.a.memory.kernelPeak ?? 0)) })),
    loadDataSeconds: round(loadDataSeconds),
    loadDataByTable: loadData,
    ratio: round(ratio, 2),
    ratioTarget: RATIO_TARGET,
    ratioPass: ratio <= RATIO_TARGET,
    memory: {
      baselineRssMb: toMb(baselineRss), rssPeakMb: toMb(memory.rssPeak), heapUsedPeakMb: toMb(memory.heapUsedPeak),
      kernelPeakRssMb: memory.kernelPeak === null ? null : toMb(memory.kernelPeak), samples: memory.samples,
      mariadbRssMb: { before: mariadbBefore === null ? null : toMb(mariadbBefore), after: mariadbAfter === null ? null : toMb(mariadbAfter) },
    },
    memoryTargetMb: MEMORY_TARGET_MB,
    memoryPass: peakMb < MEMORY_TARGET_MB,
    identical,
    breakdown: { queries, queriesSeconds: round(queriesSeconds), javascript, javascriptSeconds: round(first.a.seconds - queriesSeconds), parseCsvSeconds: round(parseCsvSeconds) },
  };

  printTable(`Import benchmark: ${archive.nPolls.toLocaleString('en')} polls (issue 3 §8)`, [
    ['rows', `${polls.toLocaleString('en')} polls + ${shares.toLocaleString('en')} share rows (${csvRows.toLocaleString('en')} CSV rows, ${result.rows.csvMegabytes} MB)`],
    ['results import (not in ratio)', `${result.resultsImportSeconds} s (${archive.resultsRows.toLocaleString('en')} rows)`],
    [`runs (A then B, alternating)`, `${runs.length}`],
    ...result.runs.map((r, k) => [`  run ${k + 1}: A / B = ratio, peak RSS`, `${r.importSeconds} s / ${r.loadDataSeconds} s = ${r.ratio}, ${r.peakRssMb} MB`] as const),
    ['A importPolls (median)', `${result.importSeconds} s`],
    ['B LOAD DATA LOCAL INFILE (median)', `${result.loadDataSeconds} s (median run: polls ${loadData.polls} s, poll_shares ${loadData.poll_shares} s)`],
    ['ratio A/B (median of the runs)', `${result.ratio}`],
    ['peak RSS during A (sampled, run 1)', `${result.memory.rssPeakMb} MB (baseline ${result.memory.baselineRssMb} MB, ${memory.samples} samples)`],
    ['peak RSS during A (kernel VmHWM, run 1)', result.memory.kernelPeakRssMb === null ? 'unavailable' : `${result.memory.kernelPeakRssMb} MB`],
    ['peak heapUsed during A', `${result.memory.heapUsedPeakMb} MB`],
    ['mariadbd RSS before/after A', `${result.memory.mariadbRssMb.before ?? '?'} / ${result.memory.mariadbRssMb.after ?? '?'} MB (not the target)`],
    ['B restores A\'s rows exactly', identical ? 'yes (count + CRC32 of every column)' : 'NO'],
    [`target ratio A/B <= ${RATIO_TARGET}`, verdict(result.ratioPass)],
    [`target peak RSS < ${MEMORY_TARGET_MB} MB`, `${verdict(result.memoryPass)} (${peakMb} MB, larger of sampled and kernel peak)`],
  ]);
  printTable('Where A spends its time', [
    ['parseCsv alone (separate run)', `${result.breakdown.parseCsvSeconds} s`],
    ['SQL statements (wall time)', `${result.breakdown.queriesSeconds} s`],
    ...queries.slice(0, 6).map((b) => [`  ${b.label}`, `${b.seconds} s x${b.count}`] as const),
    ['JavaScript between statements', `${result.breakdown.javascriptSeconds} s`],
    ...javascript.slice(0, 6).map((b) => [`  ${b.label}`, `${b.seconds} s x${b.count}`] as const),
  ]);
  const file = writeJson('import.json', { benchmark: 'import', nPolls: archive.nPolls, seed: archive.seed, at: new Date().toISOString(), node: process.version, ...result });
  process.stdout.write(`wrote ${path.relative(process.cwd(), file)}\n\n`);
  return result;
}
