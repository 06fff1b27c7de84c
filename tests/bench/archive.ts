/**
 * The benchmark archive: a fresh migrated database with an admin user and the
 * `generateBenchArchive` files, written to a temporary folder by a child process (so the
 * generator's strings never inflate this process's memory; a real upload arrives as one Buffer).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { execFileSync } from 'node:child_process';
import type { Sequelize } from 'sequelize';
import { migrate } from '../../backend/src/bootstrap';
import { createSequelize } from '../../backend/src/db/sequelize';
import { initModels, UserModel } from '../../backend/src/db/models';
import { hashPassword } from '../../backend/src/services/crypto';
import { importResults } from '../../backend/src/commands/imports/results';
import { collectGarbage, createBenchDatabase, ROOT, type BenchDatabase } from './support';

export interface BenchArchive {
  db: BenchDatabase;
  sequelize: Sequelize;
  userId: number;
  nPolls: number;
  seed: number;
  /** Temporary folder holding the CSV files and the LOAD DATA files; removed by close(). */
  dir: string;
  resultsCsvPath: string;
  pollsCsvPath: string;
  pollsCsvBytes: number;
  generateSeconds: number;
  resultsImportSeconds: number;
  resultsRows: number;
  close(): Promise<void>;
}

/**
 * Creates the database, migrates it, creates an admin, generates the archive and imports its
 * results through `importResults` (timed apart: it is not part of any ratio). On any failure the
 * database and the folder are removed before the error propagates.
 */
export async function openBenchArchive(nPolls: number, seed: number): Promise<BenchArchive> {
  const db = await createBenchDatabase();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'veracast-bench-'));
  let sequelize: Sequelize | null = null;
  const close = async () => {
    try {
      if (sequelize) await sequelize.close();
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
      await db.drop();
    }
  };
  try {
    sequelize = createSequelize(db.config);
    await migrate(sequelize);
    initModels(sequelize);
    const user = await UserModel.create({
      email: `bench-${Date.now().toString(36)}@example.test`, name: 'Bench admin', role: 'admin', passwordHash: await hashPassword('bench-password-not-used'),
    });

    let start = performance.now();
    const resultsCsvPath = path.join(dir, 'bench-results.csv');
    const pollsCsvPath = path.join(dir, 'bench-polls.csv');
    execFileSync(process.execPath, ['--import', 'tsx', path.join(ROOT, 'tests/bench/generate-archive.ts'), String(nPolls), String(seed), dir], { stdio: 'inherit', cwd: ROOT });
    const generateSeconds = (performance.now() - start) / 1000;

    start = performance.now();
    const outcome = await importResults(sequelize, fs.readFileSync(resultsCsvPath), { fileName: 'bench-results.csv', userId: user.id, userRole: 'admin' });
    const resultsImportSeconds = (performance.now() - start) / 1000;
    if (outcome.status !== 'committed') throw new Error(`results import ${outcome.status}: ${JSON.stringify(outcome.errors.slice(0, 3))}`);
    collectGarbage();

    return {
      db, sequelize, userId: user.id, nPolls, seed, dir, resultsCsvPath, pollsCsvPath, pollsCsvBytes: fs.statSync(pollsCsvPath).size,
      generateSeconds, resultsImportSeconds, resultsRows: outcome.rows, close,
    };
  } catch (err) {
    await close().catch((e: unknown) => process.stderr.write(`bench clean-up failed: ${String(e)}\n`));
    throw err;
  }
}
