import { promisify } from 'node:util';
import { gunzipSync, gzip, constants as zlib } from 'node:zlib';
import type { Sequelize } from 'sequelize';
import type { AuditPollDto } from '@veracast/shared-types';
import { rawRows, type RawConnection } from '../../db/raw';
import { decodeAuditPoll, decodePollChunk } from './stored-polls';

/**
 * An audit's stored results live in `audit_parts` (migrations 20261202000500 and …0600), one row
 * per part and chunk:
 * - 'polls': the per-poll rows, part key = election key, chunks 0, 1, … of POLLS_PER_CHUNK rows;
 * - 'scorecards': part key '', chunk 0;
 * - 'shared_error': part key = election key, chunk 0.
 * Payloads are stored gzip-compressed (`encoding` 'gzip'): poll chunks as binary blocks
 * (stored-polls.ts), the others as JSON text; parts written before migration 0600 are plain JSON
 * ('json'). Audits stored before audit_parts kept their
 * analyses in `audits.scorecards` / `audits.shared_error` and their poll rows in `audit_polls`;
 * the readers here fall back to those.
 */
export type AuditPartKind = 'polls' | 'scorecards' | 'shared_error';

/** Poll rows per stored chunk (~0.35 MB as a binary block, ~0.15 MB compressed). */
export const POLLS_PER_CHUNK = 2000;

/**
 * The largest statement an audit sends. MariaDB connector 3.0.2 fails intermittently on
 * statements over 16 MiB; this keeps a margin below that.
 */
export const MAX_STATEMENT_BYTES = 15 * 1024 * 1024;
/** Compressed payload bytes gathered into one multi-row INSERT. */
const BATCH_BYTES = 4 * 1024 * 1024;

/** One part before it is compressed and stored: JSON text, or (poll chunks) a binary block. */
export interface PartText {
  kind: AuditPartKind;
  partKey: string;
  chunk: number;
  content: string | Buffer;
}

/** One part compressed, ready to store. */
export interface PartRow {
  kind: AuditPartKind;
  partKey: string;
  chunk: number;
  payload: Buffer;
}

const gzipAsync = promisify(gzip);

/** gzip at level 1 on the thread pool: JSON shrinks about 5-fold at ~100 MB/s. */
export function compressPart(part: PartText): Promise<PartRow> {
  return gzipAsync(part.content, { level: 1, strategy: zlib.Z_DEFAULT_STRATEGY }).then((payload) => ({ kind: part.kind, partKey: part.partKey, chunk: part.chunk, payload }));
}

function describe(part: { kind: AuditPartKind; partKey: string; chunk: number }) {
  if (part.kind === 'scorecards') return 'The scorecards';
  if (part.kind === 'shared_error') return `The shared-error analysis of ${part.partKey}`;
  return `Chunk ${part.chunk} of the poll rows of ${part.partKey}`;
}

async function insertRows(c: RawConnection, auditId: number, rows: readonly PartRow[], keepExisting: boolean) {
  let start = 0;
  while (start < rows.length) {
    let end = start;
    let bytes = 0;
    while (end < rows.length && (end === start || bytes + rows[end]!.payload.length <= BATCH_BYTES)) bytes += rows[end++]!.payload.length;
    const batch = rows.slice(start, end);
    const big = batch.find((r) => r.payload.length > MAX_STATEMENT_BYTES - 1024);
    if (big) {
      throw new Error(`${describe(big)} is too large to store in one statement (${(big.payload.length / 1024 / 1024).toFixed(1)} MiB compressed; at most ${MAX_STATEMENT_BYTES / 1024 / 1024} MiB)`);
    }
    await c.query(
      { sql: `INSERT ${keepExisting ? 'IGNORE ' : ''}INTO audit_parts (audit_id, kind, part_key, chunk, encoding, payload) VALUES ${batch.map(() => "(?, ?, ?, ?, 'gzip', ?)").join(', ')}` },
      batch.flatMap((r) => [auditId, r.kind, r.partKey, r.chunk, r.payload]),
    );
    start = end;
  }
}

/**
 * Writes compressed parts on `c` (the caller's transaction's connection) in multi-row INSERTs of
 * about BATCH_BYTES, in the order they are added, while the caller goes on producing parts.
 * `finish` waits for every write and throws the first failure.
 */
export class PartWriter {
  private chain: Promise<void> = Promise.resolve();
  private batch: Promise<PartRow>[] = [];
  private expectedBytes = 0;
  private failure: { error: unknown } | null = null;
  private finished = false;

  /** `keepExisting`: a part already stored is kept (INSERT IGNORE), for parts that anyone computes alike. */
  constructor(private readonly c: RawConnection, private readonly auditId: number, private readonly options: { keepExisting?: boolean } = {}) {}

  get failed(): boolean {
    return this.failure !== null;
  }

  /** Adds a part: a compressed row, or the promise of one (failures surface in `finish`). */
  add(row: PartRow | Promise<PartRow>, expectedBytes: number) {
    if (this.finished) {
      // A part after `finish` would never be written: fail the audit rather than lose it.
      this.failure ??= { error: new Error('a part of the audit arrived after its parts were all written') };
      return;
    }
    const pending = Promise.resolve(row);
    pending.catch(() => undefined);
    this.batch.push(pending);
    this.expectedBytes += expectedBytes;
    if (this.expectedBytes >= BATCH_BYTES) this.flush();
  }

  /** Adds a part before compression (JSON text or a binary block), compressed on the thread pool. */
  addText(part: PartText) {
    // ~5:1 compression: the expected stored bytes.
    this.add(compressPart(part), (typeof part.content === 'string' ? part.content.length : part.content.byteLength) / 5);
  }

  private flush() {
    if (!this.batch.length) return;
    const rows = this.batch;
    this.batch = [];
    this.expectedBytes = 0;
    this.chain = this.chain.then(async () => {
      if (!this.failure) await insertRows(this.c, this.auditId, await Promise.all(rows), this.options.keepExisting ?? false);
    });
    this.chain.catch((error: unknown) => (this.failure ??= { error }));
  }

  async finish(): Promise<void> {
    this.finished = true;
    this.flush();
    await this.chain.catch(() => undefined);
    if (this.failure) throw this.failure.error;
  }
}

/**
 * Adds parts to the writer one at a time, compressing each on the thread pool as soon as it is
 * produced. `parts` is read lazily: between two parts the event loop turns, so the compression,
 * the server's writes and other messages (a worker's parts) proceed while the next is computed.
 */
export async function writeParts(writer: PartWriter, parts: Iterable<PartText>): Promise<void> {
  for (const part of parts) {
    if (writer.failed) break;
    writer.addText(part);
    await new Promise((resolve) => setImmediate(resolve));
  }
}

/** The bytes of a stored payload, uncompressed. */
function payloadBytes(encoding: unknown, payload: unknown): Buffer {
  const bytes = Buffer.isBuffer(payload) ? payload : Buffer.from(String(payload), 'utf8');
  return encoding === 'gzip' ? gunzipSync(bytes) : bytes;
}

/** The JSON text of a stored payload. */
const payloadText = (encoding: unknown, payload: unknown): string => payloadBytes(encoding, payload).toString('utf8');

/** The audit's stored scorecards (JSON text), or null when it stored none. */
export async function loadStoredScorecards(sequelize: Sequelize, auditId: number): Promise<string | null> {
  const [part] = await rawRows(sequelize, "SELECT encoding, payload FROM audit_parts WHERE audit_id = ? AND kind = 'scorecards' AND part_key = '' AND chunk = 0", [auditId]);
  if (part) return payloadText(part[0], part[1]);
  const [legacy] = await rawRows(sequelize, 'SELECT scorecards FROM audits WHERE id = ?', [auditId]);
  return (legacy?.[0] as string | null | undefined) ?? null;
}

/**
 * The audit's stored shared-error analyses by election key: the ones named by `electionKeys`,
 * or every one when it is omitted. An election the audit has no analysis for is absent.
 */
export async function loadStoredSharedErrors<T = unknown>(sequelize: Sequelize, auditId: number, electionKeys?: readonly string[]): Promise<Record<string, T>> {
  if (electionKeys && !electionKeys.length) return {};
  const parts = await rawRows(
    sequelize,
    `SELECT part_key, encoding, payload FROM audit_parts WHERE audit_id = ? AND kind = 'shared_error' ${electionKeys ? 'AND part_key IN (?)' : ''} ORDER BY part_key`,
    electionKeys ? [auditId, [...electionKeys]] : [auditId],
  );
  const out: Record<string, T> = {};
  if (parts.length) {
    for (const p of parts) out[String(p[0])] = JSON.parse(payloadText(p[1], p[2])) as T;
    return out;
  }
  // An audit stored before audit_parts: either all its analyses are in parts, or none are.
  const hasParts = await rawRows(sequelize, 'SELECT 1 FROM audit_parts WHERE audit_id = ? LIMIT 1', [auditId]);
  if (hasParts.length) return out;
  const [legacy] = await rawRows(sequelize, 'SELECT shared_error FROM audits WHERE id = ?', [auditId]);
  const all = JSON.parse((legacy?.[0] as string | null | undefined) ?? '{}') as Record<string, T>;
  if (!electionKeys) return all;
  for (const k of electionKeys) if (Object.prototype.hasOwnProperty.call(all, k)) out[k] = all[k]!;
  return out;
}

/**
 * The audit's per-poll rows (of one election when `electionKey` is given), ordered by election,
 * contest and poll key. Audits stored before poll chunks keep them in `audit_polls`.
 */
export async function loadStoredPolls(sequelize: Sequelize, auditId: number, electionKey?: string): Promise<AuditPollDto[]> {
  const parts = await rawRows(
    sequelize,
    `SELECT encoding, payload FROM audit_parts WHERE audit_id = ? AND kind = 'polls' ${electionKey !== undefined ? 'AND part_key = ?' : ''} ORDER BY part_key, chunk`,
    electionKey !== undefined ? [auditId, electionKey] : [auditId],
  );
  if (parts.length) return parts.flatMap((p) => decodePollChunk(payloadBytes(p[0], p[1])));
  const rows = await rawRows(
    sequelize,
    `SELECT metrics FROM audit_polls WHERE audit_id = ? ${electionKey !== undefined ? 'AND election_key = ?' : ''} ORDER BY election_key, contest_key, poll_key`,
    electionKey !== undefined ? [auditId, electionKey] : [auditId],
  );
  return rows.map((r) => decodeAuditPoll(String(r[0])));
}
