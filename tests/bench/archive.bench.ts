/**
 * `npm run bench`: the import benchmark (issue 3 §8) and the audit benchmark (issue 4 §6) on one
 * generated archive in a throw-away database, dropped at the end whatever happens.
 * BENCH_POLLS (default 100000) and BENCH_SEED (default 1) change the archive for quick runs.
 * Targets are printed as PASS/MISS; nothing here fails on a miss, only on a broken run.
 */
import { openBenchArchive } from './archive';
import { runImportBench } from './import-bench';
import { runAuditBench } from './audit-bench';
import { machine, round } from './support';

const nPolls = Number(process.env.BENCH_POLLS ?? 100_000);
const seed = Number(process.env.BENCH_SEED ?? 1);

async function main() {
  const m = machine();
  process.stdout.write(`Veracast benchmarks: ${nPolls.toLocaleString('en')} polls, seed ${seed}, node ${process.version}, ${m.cpus} CPUs, load ${m.loadAverage.join(' ')}\n\n`);
  const archive = await openBenchArchive(nPolls, seed);
  try {
    process.stdout.write(`database ${archive.db.name}; archive generated in ${round(archive.generateSeconds)} s\n\n`);
    await runImportBench(archive);
    await runAuditBench(archive);
  } finally {
    await archive.close();
    process.stdout.write(`dropped ${archive.db.name}\n`);
  }
}

/** A Sequelize error keeps the server's message on `parent`; print it with the statement's start. */
function describe(err: unknown): string {
  if (!(err instanceof Error)) return String(err);
  const parent = (err as Error & { parent?: Error & { sqlMessage?: string; code?: string; sql?: string } }).parent;
  const detail = parent ? `\n  cause: ${parent.code ?? ''} ${parent.sqlMessage ?? parent.message}\n  sql: ${(parent.sql ?? '').slice(0, 300)}` : '';
  return `${err.stack ?? err.message}${detail}`;
}

main().catch((err: unknown) => {
  process.stderr.write(`${describe(err)}\n`);
  process.exitCode = 1;
});
