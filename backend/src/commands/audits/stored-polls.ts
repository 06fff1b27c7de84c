/**
 * How an audit stores its per-poll rows: chunks of an election's rows (in `audit_parts`, kind
 * 'polls'), each chunk one binary block (format 'audit-polls/3', below) holding the AuditPollDto
 * fields of its rows column by column (no detail).
 *
 * Earlier forms, still read: chunks as the JSON text `{"format":"audit-polls/2","fields":[...],
 * "rows":[[...],...]}`; and, before chunks, one `audit_polls` row per poll whose `metrics` was a
 * JSON array tagged 'audit-poll/1' or a JSON object (`decodeAuditPoll`).
 */
import type { AuditPollDto } from '@veracast/shared-types';

const JSON_CHUNK_FORMAT = 'audit-polls/2';
const BINARY_CHUNK_FORMAT = 'audit-polls/3';
const ROW_FORMAT_TAG = 'audit-poll/1';

export const STORED_FIELDS = [
  'pollKey', 'contestKey', 'electionKey', 'pollsterId', 'pollster', 'inWindow', 'isFinal', 'fieldworkEnd', 'sampleSize', 'population', 'mode',
  'sponsorType', 'disclosure', 'refA', 'refB', 'refBasis', 'marginError', 'absMarginError', 'lean', 'mosteller3', 'mosteller5', 'mtkA', 'mtkSe',
  'mtkP', 'aeB', 'aeBw', 'winnerCalled', 'shareCovered', 'marginCovered', 'daysOut', 'daysOutEnd', 'undecidedShare', 'twoPartyShareError',
  'nEff', 'pollA', 'pollB', 'resultA', 'resultB', 'notes', 'error',
] as const satisfies readonly (keyof AuditPollDto)[];
type StoredField = (typeof STORED_FIELDS)[number];

// Every field but detail is stored: this fails to compile when AuditPollDto gains a field not listed.
type Unlisted = Exclude<keyof AuditPollDto, 'detail' | StoredField>;
const everyFieldListed: [Unlisted] extends [never] ? true : never = true;
void everyFieldListed;

/** How each field is stored in a binary chunk: a float64 column, a flag column, or JSON. */
const NUMBER_FIELDS = [
  'pollsterId', 'sampleSize', 'disclosure', 'marginError', 'absMarginError', 'mosteller3', 'mosteller5', 'mtkA', 'mtkSe', 'mtkP', 'aeB', 'aeBw',
  'daysOut', 'daysOutEnd', 'undecidedShare', 'twoPartyShareError', 'nEff', 'pollA', 'pollB', 'resultA', 'resultB',
] as const satisfies readonly StoredField[];
const FLAG_FIELDS = ['inWindow', 'isFinal', 'winnerCalled', 'shareCovered', 'marginCovered'] as const satisfies readonly StoredField[];
const VALUE_FIELDS = STORED_FIELDS.filter((f) => !(NUMBER_FIELDS as readonly string[]).includes(f) && !(FLAG_FIELDS as readonly string[]).includes(f));

/** 'VCP3': the first four bytes of a binary chunk. */
const MAGIC = 0x33504356;

/**
 * One chunk of poll rows as a binary block, column by column: bytes 0-3 'VCP3', 4-7 the length L
 * of a JSON header (UTF-8, padded with spaces to a multiple of 8) from byte 8:
 * `{"format":"audit-polls/3","n":…,"numbers":[names],"flags":[names],"values":{name:[n values]}}`;
 * then one float64 column (little-endian) of n values per name in `numbers`, null as NaN; then one
 * int8 column per name in `flags` (1 true, 0 false, -1 null).
 *
 * Numbers keep every bit (no text formatting; about 6 times faster to write than JSON), except
 * what JSON would not keep either: −0 is stored as 0, and NaN or ±Infinity (which the metrics
 * core never returns) as null.
 */
export function encodePollChunk(items: readonly AuditPollDto[]): Buffer {
  const n = items.length;
  const values: Record<string, unknown[]> = {};
  for (const f of VALUE_FIELDS) {
    const column = new Array<unknown>(n);
    for (let r = 0; r < n; r++) column[r] = items[r]![f];
    values[f] = column;
  }
  let header = JSON.stringify({ format: BINARY_CHUNK_FORMAT, n, numbers: NUMBER_FIELDS, flags: FLAG_FIELDS, values });
  header += ' '.repeat((8 - (Buffer.byteLength(header) % 8)) % 8);
  const headerBytes = Buffer.byteLength(header);
  const numbersAt = 8 + headerBytes;
  const flagsAt = numbersAt + NUMBER_FIELDS.length * n * 8;
  const out = Buffer.alloc(flagsAt + FLAG_FIELDS.length * n);
  out.writeUInt32LE(MAGIC, 0);
  out.writeUInt32LE(headerBytes, 4);
  out.write(header, 8, 'utf8');
  const numbers = new Float64Array(out.buffer, out.byteOffset + numbersAt, NUMBER_FIELDS.length * n);
  NUMBER_FIELDS.forEach((f, k) => {
    for (let r = 0; r < n; r++) {
      const v = items[r]![f];
      numbers[k * n + r] = typeof v === 'number' && Number.isFinite(v) ? (v === 0 ? 0 : v) : NaN;
    }
  });
  const flags = new Int8Array(out.buffer, out.byteOffset + flagsAt, FLAG_FIELDS.length * n);
  FLAG_FIELDS.forEach((f, k) => {
    for (let r = 0; r < n; r++) {
      const v = items[r]![f];
      flags[k * n + r] = v === true ? 1 : v === false ? 0 : -1;
    }
  });
  return out;
}

/** A stored chunk's rows back as AuditPollDto objects (binary 'audit-polls/3' or JSON 'audit-polls/2'). */
export function decodePollChunk(bytes: Buffer): AuditPollDto[] {
  if (bytes.length >= 8 && bytes.readUInt32LE(0) === MAGIC) return decodeBinaryChunk(bytes);
  const chunk = JSON.parse(bytes.toString('utf8')) as { format?: unknown; fields?: unknown; rows?: unknown };
  if (chunk.format !== JSON_CHUNK_FORMAT || !Array.isArray(chunk.fields) || !Array.isArray(chunk.rows)) {
    throw new Error(`a stored chunk of poll rows is in neither the ${BINARY_CHUNK_FORMAT} nor the ${JSON_CHUNK_FORMAT} format`);
  }
  const fields = chunk.fields as string[];
  return (chunk.rows as unknown[][]).map((row) => {
    const item: Record<string, unknown> = {};
    for (let i = 0; i < fields.length; i++) item[fields[i]!] = row[i];
    return item as unknown as AuditPollDto;
  });
}

function decodeBinaryChunk(bytes: Buffer): AuditPollDto[] {
  const headerBytes = bytes.readUInt32LE(4);
  const header = JSON.parse(bytes.toString('utf8', 8, 8 + headerBytes)) as {
    format: string; n: number; numbers: string[]; flags: string[]; values: Record<string, unknown[]>;
  };
  if (header.format !== BINARY_CHUNK_FORMAT) throw new Error(`a stored chunk of poll rows is not in the ${BINARY_CHUNK_FORMAT} format`);
  const { n } = header;
  const numbersAt = 8 + headerBytes;
  const flagsAt = numbersAt + header.numbers.length * n * 8;
  if (bytes.length !== flagsAt + header.flags.length * n) throw new Error('a stored chunk of poll rows is cut short or too long');
  // Copied out: the block's offset in its buffer need not suit a float64 view.
  const numbers = new Float64Array(bytes.buffer.slice(bytes.byteOffset + numbersAt, bytes.byteOffset + flagsAt));
  const flags = new Int8Array(bytes.buffer, bytes.byteOffset + flagsAt, header.flags.length * n);
  // Fields in STORED_FIELDS order where the chunk has them, then any the chunk has that this version does not.
  const kinds = new Map<string, ['number' | 'flag' | 'value', number]>();
  header.numbers.forEach((f, k) => kinds.set(f, ['number', k]));
  header.flags.forEach((f, k) => kinds.set(f, ['flag', k]));
  Object.keys(header.values).forEach((f) => kinds.set(f, ['value', 0]));
  const order = [...STORED_FIELDS.filter((f) => kinds.has(f)), ...[...kinds.keys()].filter((f) => !(STORED_FIELDS as readonly string[]).includes(f))];
  const rows: AuditPollDto[] = new Array<AuditPollDto>(n);
  for (let r = 0; r < n; r++) {
    const item: Record<string, unknown> = {};
    for (const f of order) {
      const [kind, k] = kinds.get(f)!;
      if (kind === 'number') {
        const v = numbers[k * n + r]!;
        item[f] = Number.isNaN(v) ? null : v;
      } else if (kind === 'flag') {
        const v = flags[k * n + r]!;
        item[f] = v === 1 ? true : v === 0 ? false : null;
      } else item[f] = header.values[f]![r];
    }
    rows[r] = item as unknown as AuditPollDto;
  }
  return rows;
}

/** A poll row stored in `audit_polls.metrics` by an earlier audit, from either of its formats. */
export function decodeAuditPoll(text: string): AuditPollDto {
  const parsed = JSON.parse(text) as unknown;
  if (!Array.isArray(parsed) || parsed[0] !== ROW_FORMAT_TAG) return parsed as AuditPollDto;
  const item: Record<string, unknown> = {};
  for (let i = 0; i < STORED_FIELDS.length; i++) item[STORED_FIELDS[i]!] = parsed[i + 1];
  return item as unknown as AuditPollDto;
}
