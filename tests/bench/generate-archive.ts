/**
 * Writes `generateBenchArchive(n, seed)` as bench-results.csv and bench-polls.csv into a folder.
 * Run in its own process by archive.ts, so the generator's strings never count in the memory of
 * the process that is measured. Usage: generate-archive.ts <nPolls> <seed> <folder>
 */
import fs from 'node:fs';
import path from 'node:path';
import { generateBenchArchive } from '@veracast/database';

const [nPolls, seed, dir] = process.argv.slice(2);
if (!nPolls || !seed || !dir) throw new Error('usage: generate-archive.ts <nPolls> <seed> <folder>');
const { resultsCsv, pollsCsv } = generateBenchArchive(Number(nPolls), Number(seed));
fs.writeFileSync(path.join(dir, 'bench-results.csv'), resultsCsv);
fs.writeFileSync(path.join(dir, 'bench-polls.csv'), pollsCsv);
