import type { Transaction } from 'sequelize';
import type { ImportRowError, ImportSummary } from '@veracast/shared-types';
import { ImportModel } from '../../db/models';

export interface ImportOptions {
  fileName: string;
  userId: number | null;
  userRole: 'viewer' | 'analyst' | 'reviewer' | 'admin';
  dryRun?: boolean;
  /** Import the valid rows only when some rows have errors; recorded on the import. */
  validOnly?: boolean;
  /** Expected column → file header, as mapped on the import screen. */
  columnMap?: Record<string, string>;
  /** Reason required when a certified result changes. */
  reason?: string;
  /** Test hook: called after each written batch inside the transaction. */
  afterBatch?: (batch: number) => Promise<void> | void;
}

export class Collector {
  readonly errors: ImportRowError[] = [];
  /** Data row indexes (0-based) that have an error. */
  readonly badRows = new Set<number>();
  constructor(private readonly lineOf: (i: number) => number) {}
  add(index: number, column: string, code: string, message: string) {
    this.badRows.add(index);
    if (this.errors.length < 10_000) this.errors.push({ row: index < 0 ? 0 : this.lineOf(index), column, code, message });
  }
}

export async function recordImport(
  kind: 'results' | 'polls',
  opts: ImportOptions,
  fileHash: string,
  summary: Omit<ImportSummary, 'importId' | 'status'>,
  status: 'committed' | 'dry_run' | 'failed',
  transaction?: Transaction,
) {
  const record = await ImportModel.create(
    {
      kind,
      fileName: opts.fileName.slice(0, 255),
      fileHash,
      userId: opts.userId,
      status,
      rows: summary.rows,
      created: summary.created,
      updated: summary.updated,
      unchanged: summary.unchanged,
      skipped: summary.skipped,
      errorCount: summary.errors.length,
      errors: summary.errors.length ? JSON.stringify(summary.errors) : null,
      validOnly: Boolean(opts.validOnly),
    },
    { transaction },
  );
  return record.id;
}

/** Escapes a value for a multi-row INSERT built by hand (numbers, null, booleans, strings). */
export function sqlValue(escape: (v: string) => string, v: unknown): string {
  if (v === null || v === undefined) return 'NULL';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : 'NULL';
  if (typeof v === 'boolean') return v ? '1' : '0';
  return escape(String(v));
}

export const chunk = <T,>(xs: readonly T[], size: number): T[][] => {
  const out: T[][] = [];
  for (let i = 0; i < xs.length; i += size) out.push(xs.slice(i, i + size));
  return out;
};
