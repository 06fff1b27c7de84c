import {
  POLL_COLUMNS,
  POLL_EXTRA_COLUMNS,
  POLL_WIDE_FIXED_COLUMNS,
  RESERVED_OPTION_KEYS,
  RESULT_COLUMNS,
  RESULT_EXTRA_COLUMNS,
} from '@veracast/shared-types';

export type ImportKind = 'results' | 'polls';
export type PollLayout = 'long' | 'wide';

/** Expected column → the file header that holds it ('' when the file has none). */
export type ColumnMap = Record<string, string>;
/** Wide layout: lower-case file header → option key ('' to ignore the column). */
export type OptionMap = Record<string, string>;

export interface OptionChoice {
  key: string;
  name: string;
}

export function requiredColumns(kind: ImportKind, layout: PollLayout = 'long'): readonly string[] {
  if (kind === 'results') return RESULT_COLUMNS;
  return layout === 'long' ? POLL_COLUMNS : POLL_WIDE_FIXED_COLUMNS;
}

export function optionalColumns(kind: ImportKind): readonly string[] {
  return kind === 'results' ? RESULT_EXTRA_COLUMNS : POLL_EXTRA_COLUMNS;
}

/** Every column the import understands for the kind (both poll layouts' columns for polls). */
export function knownColumns(kind: ImportKind): string[] {
  return kind === 'results' ? [...RESULT_COLUMNS, ...RESULT_EXTRA_COLUMNS] : [...POLL_COLUMNS, ...POLL_EXTRA_COLUMNS];
}

/** "Fieldwork Start " → "fieldwork_start": lower case, runs of spaces, dashes and dots become one underscore. */
export function normalizeHeader(header: string): string {
  return header.trim().toLowerCase().replace(/[\s.-]+/g, '_').replace(/^_+|_+$/g, '');
}

/** Other names files commonly give a column; matched after normalising. */
const SYNONYMS: Record<string, readonly string[]> = {
  pollster: ['firm', 'polling_firm', 'pollster_name', 'company'],
  sponsor: ['commissioned_by', 'client', 'media_partner'],
  poll_key: ['poll_id', 'id', 'key'],
  fieldwork_start: ['start', 'start_date', 'field_start', 'fieldwork_from'],
  fieldwork_end: ['end', 'end_date', 'field_end', 'fieldwork_to'],
  published_on: ['published', 'publication_date', 'release_date', 'date_published'],
  sample_size: ['n', 'sample', 'samplesize', 'sample_n'],
  moe: ['margin_of_error', 'margin', 'stated_moe'],
  option_key: ['option', 'party', 'candidate', 'answer'],
  share: ['pct', 'percent', 'percentage', 'value'],
  votes: ['vote_count', 'count'],
  source_url: ['source', 'url'],
};

/**
 * Pairs each expected column with a file header: first one whose normalised name equals the
 * column, else one that equals a common synonym. A header is used at most once.
 */
export function autoMatch(expected: readonly string[], headers: readonly string[]): ColumnMap {
  const used = new Set<string>();
  const map: ColumnMap = {};
  const take = (column: string, names: readonly string[]) => {
    const header = headers.find((h) => !used.has(h) && names.includes(normalizeHeader(h)));
    if (header !== undefined) {
      used.add(header);
      map[column] = header;
      return true;
    }
    return false;
  };
  for (const column of expected) if (!take(column, [column])) map[column] = '';
  for (const column of expected) if (map[column] === '') take(column, SYNONYMS[column] ?? []);
  return map;
}

/** Long when the file (as mapped) has both option_key and share, else wide. */
export function detectLayout(columnMap: ColumnMap): PollLayout {
  return columnMap.option_key && columnMap.share ? 'long' : 'wide';
}

/**
 * The file headers left over for options in the wide layout: those not mapped to a known column
 * and not named like one.
 */
export function optionColumns(headers: readonly string[], columnMap: ColumnMap): string[] {
  const mapped = new Set(Object.values(columnMap).filter(Boolean).map((h) => h.trim().toLowerCase()));
  const fixed = new Set<string>([...POLL_WIDE_FIXED_COLUMNS, ...POLL_EXTRA_COLUMNS, 'option_key', 'share']);
  return headers.filter((h) => h.trim() !== '' && !mapped.has(h.trim().toLowerCase()) && !fixed.has(h.trim().toLowerCase()));
}

const KEY_RE = /^[a-z0-9][a-z0-9._-]{0,99}$/;

/**
 * The option a wide-layout column most likely holds: a known option (or undecided/other) whose key
 * or name equals the header; else, when the contest's options are not known, the header itself
 * when it is a valid key; else none ('').
 */
export function defaultOptionKey(header: string, known: readonly OptionChoice[]): string {
  const h = header.trim().toLowerCase();
  const n = normalizeHeader(header);
  const byKey = known.find((o) => o.key === h || o.key === n);
  if (byKey) return byKey.key;
  const byName = known.find((o) => o.name.trim().toLowerCase() === h);
  if (byName) return byName.key;
  if ((RESERVED_OPTION_KEYS as readonly string[]).includes(n)) return n;
  if (['dk', 'dont_know', 'don_t_know', 'unsure', 'no_answer'].includes(n)) return 'undecided';
  // When the contest's options are known, a column that matches none of them is likely a note.
  if (known.length > 0) return '';
  return KEY_RE.test(h) ? h : '';
}

export function defaultOptionMap(columns: readonly string[], known: readonly OptionChoice[]): OptionMap {
  return Object.fromEntries(columns.map((c) => [c.trim().toLowerCase(), defaultOptionKey(c, known)]));
}

/** What stops the file from being sent as mapped, in words for the person mapping it. */
export function mappingProblems(kind: ImportKind, layout: PollLayout, columnMap: ColumnMap, optionMap: OptionMap = {}): string[] {
  const problems: string[] = [];
  const missing = requiredColumns(kind, layout).filter((c) => !columnMap[c]);
  if (missing.length) problems.push(`Choose the file column for ${missing.join(', ')}.`);
  const byHeader = new Map<string, string[]>();
  for (const [column, header] of Object.entries(columnMap)) {
    if (!header) continue;
    const list = byHeader.get(header) ?? [];
    list.push(column);
    byHeader.set(header, list);
  }
  for (const [header, columns] of byHeader) {
    if (columns.length > 1) problems.push(`The file column “${header}” is chosen for ${columns.join(' and ')}; each file column can fill one.`);
  }
  if (kind === 'polls' && layout === 'wide') {
    const keys = Object.values(optionMap).filter(Boolean);
    if (keys.length === 0) problems.push('Map at least one file column to an option.');
    const bad = keys.filter((k) => !KEY_RE.test(k));
    if (bad.length) problems.push(`Option keys must use lower-case letters, digits, dot, dash or underscore: ${bad.join(', ')}.`);
    const seen = new Set<string>();
    for (const key of keys) {
      if (seen.has(key)) problems.push(`Two file columns are mapped to the option ${key}.`);
      seen.add(key);
    }
  }
  return problems;
}

/** The `columnMap` field sent to the server: only the columns that are in the file. */
export function columnMapPayload(columnMap: ColumnMap, kind: ImportKind, layout: PollLayout): ColumnMap {
  const wanted = new Set([...requiredColumns(kind, layout), ...optionalColumns(kind)]);
  return Object.fromEntries(Object.entries(columnMap).filter(([column, header]) => header && wanted.has(column)));
}

/** The distinct values of one mapped column, in file order (e.g. the contest keys a file touches). */
export function distinctValues(headers: readonly string[], rows: readonly string[][], header: string | undefined, limit = 50): string[] {
  if (!header) return [];
  const index = headers.indexOf(header);
  if (index < 0) return [];
  const seen = new Set<string>();
  for (const row of rows) {
    const value = (row[index] ?? '').trim();
    if (value) seen.add(value);
    if (seen.size >= limit) break;
  }
  return [...seen];
}
