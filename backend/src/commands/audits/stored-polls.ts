import type { AuditPollDto } from '@veracast/shared-types';

/**
 * How an audit stores its per-poll rows: chunks of an election's rows (in `audit_parts`, kind
 * 'polls'), each chunk the JSON text `{"format":"audit-polls/2","fields":[...],"rows":[[...],...]}`
 * where every row lists the AuditPollDto fields in the order `fields` names (no detail). The
 * field names are stored once per chunk, so a chunk stays readable when the row type gains a field.
 *
 * Audits stored before kept one `audit_polls` row per poll whose `metrics` was a JSON array tagged
 * 'audit-poll/1' (same field order) or, earlier, a JSON object: `decodeAuditPoll` reads both.
 */
const CHUNK_FORMAT = 'audit-polls/2';
const ROW_FORMAT_TAG = 'audit-poll/1';

export const STORED_FIELDS = [
  'pollKey', 'contestKey', 'electionKey', 'pollsterId', 'pollster', 'inWindow', 'isFinal', 'fieldworkEnd', 'sampleSize', 'population', 'mode',
  'sponsorType', 'disclosure', 'refA', 'refB', 'refBasis', 'marginError', 'absMarginError', 'lean', 'mosteller3', 'mosteller5', 'mtkA', 'mtkSe',
  'mtkP', 'aeB', 'aeBw', 'winnerCalled', 'shareCovered', 'marginCovered', 'daysOut', 'daysOutEnd', 'undecidedShare', 'twoPartyShareError',
  'nEff', 'pollA', 'pollB', 'resultA', 'resultB', 'notes', 'error',
] as const satisfies readonly (keyof AuditPollDto)[];

// Every field but detail is stored: this fails to compile when AuditPollDto gains a field not listed.
type Unlisted = Exclude<keyof AuditPollDto, 'detail' | (typeof STORED_FIELDS)[number]>;
const everyFieldListed: [Unlisted] extends [never] ? true : never = true;
void everyFieldListed;

/** The JSON text of one chunk of poll rows (their detail, if any, is not stored). */
export function encodePollChunk(items: readonly AuditPollDto[]): string {
  const rows: unknown[][] = new Array<unknown[]>(items.length);
  for (let r = 0; r < items.length; r++) {
    const item = items[r]!;
    const values: unknown[] = new Array<unknown>(STORED_FIELDS.length);
    for (let i = 0; i < STORED_FIELDS.length; i++) values[i] = item[STORED_FIELDS[i]!];
    rows[r] = values;
  }
  return JSON.stringify({ format: CHUNK_FORMAT, fields: STORED_FIELDS, rows });
}

/** A chunk's rows back as AuditPollDto objects, fields in the order the chunk names them. */
export function decodePollChunk(text: string): AuditPollDto[] {
  const chunk = JSON.parse(text) as { format?: unknown; fields?: unknown; rows?: unknown };
  if (chunk.format !== CHUNK_FORMAT || !Array.isArray(chunk.fields) || !Array.isArray(chunk.rows)) {
    throw new Error(`a stored chunk of poll rows is not in the ${CHUNK_FORMAT} format`);
  }
  const fields = chunk.fields as string[];
  return (chunk.rows as unknown[][]).map((row) => {
    const item: Record<string, unknown> = {};
    for (let i = 0; i < fields.length; i++) item[fields[i]!] = row[i];
    return item as unknown as AuditPollDto;
  });
}

/** A poll row stored in `audit_polls.metrics` by an earlier audit, from either of its formats. */
export function decodeAuditPoll(text: string): AuditPollDto {
  const parsed = JSON.parse(text) as unknown;
  if (!Array.isArray(parsed) || parsed[0] !== ROW_FORMAT_TAG) return parsed as AuditPollDto;
  const item: Record<string, unknown> = {};
  for (let i = 0; i < STORED_FIELDS.length; i++) item[STORED_FIELDS[i]!] = parsed[i + 1];
  return item as unknown as AuditPollDto;
}
