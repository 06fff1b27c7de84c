import type { AuditPollDto } from '@veracast/shared-types';

/**
 * How an audit stores one poll's row in `audit_polls.metrics`: a JSON array whose first entry is
 * a format tag and whose other entries are the AuditPollDto fields in the order below (no field
 * names, no detail: about half the bytes of the object). Rows stored before this format are JSON
 * objects; `decodeAuditPoll` reads both.
 */
const FORMAT_TAG = 'audit-poll/1';

const FIELDS = [
  'pollKey', 'contestKey', 'electionKey', 'pollsterId', 'pollster', 'inWindow', 'isFinal', 'fieldworkEnd', 'sampleSize', 'population', 'mode',
  'sponsorType', 'disclosure', 'refA', 'refB', 'refBasis', 'marginError', 'absMarginError', 'lean', 'mosteller3', 'mosteller5', 'mtkA', 'mtkSe',
  'mtkP', 'aeB', 'aeBw', 'winnerCalled', 'shareCovered', 'marginCovered', 'daysOut', 'daysOutEnd', 'undecidedShare', 'twoPartyShareError',
  'nEff', 'pollA', 'pollB', 'resultA', 'resultB', 'notes', 'error',
] as const satisfies readonly (keyof AuditPollDto)[];

// Every field but detail is stored: this fails to compile when AuditPollDto gains a field not listed.
type Unlisted = Exclude<keyof AuditPollDto, 'detail' | (typeof FIELDS)[number]>;
const everyFieldListed: [Unlisted] extends [never] ? true : never = true;
void everyFieldListed;

/** The stored JSON of one poll row (its detail, if any, is not stored). */
export function encodeAuditPoll(item: AuditPollDto): string {
  const values: unknown[] = new Array<unknown>(FIELDS.length + 1);
  values[0] = FORMAT_TAG;
  for (let i = 0; i < FIELDS.length; i++) values[i + 1] = item[FIELDS[i]!];
  return JSON.stringify(values);
}

/** A stored poll row back as an AuditPollDto (fields in the order above), from either format. */
export function decodeAuditPoll(text: string): AuditPollDto {
  const parsed = JSON.parse(text) as unknown;
  if (!Array.isArray(parsed) || parsed[0] !== FORMAT_TAG) return parsed as AuditPollDto;
  const item: Record<string, unknown> = {};
  for (let i = 0; i < FIELDS.length; i++) item[FIELDS[i]!] = parsed[i + 1];
  return item as unknown as AuditPollDto;
}
