import Papa from 'papaparse';
import type { ImportRowError } from '@veracast/shared-types';

export interface ParsedCsv {
  headers: string[];
  /** Data rows as arrays of trimmed cells, in file order. */
  rows: string[][];
  /** Spreadsheet row number of each data row (header = 1). */
  lineOf: (index: number) => number;
}

export class ImportFileError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly errors: ImportRowError[] = [],
  ) {
    super(message);
  }
}

/**
 * Parses a CSV file: UTF-8 with or without BOM, comma or semicolon delimited, header row first.
 * Blank lines are skipped. Throws ImportFileError for a file that is not such a CSV.
 */
export function parseCsv(buffer: Buffer): ParsedCsv {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw new ImportFileError('not_utf8', 'The file is not UTF-8 text; save it as CSV UTF-8 and try again');
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const delimiter = (firstLine.match(/;/g)?.length ?? 0) > (firstLine.match(/,/g)?.length ?? 0) ? ';' : ',';
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: 'greedy' });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal) {
    throw new ImportFileError('bad_csv', `The CSV could not be read: ${fatal.message}`, [
      { row: (fatal.row ?? 0) + 1, column: '', code: 'bad_csv', message: fatal.message },
    ]);
  }
  const [head, ...body] = parsed.data;
  if (!head || head.length === 0) throw new ImportFileError('empty_file', 'The file has no header row');
  const headers = head.map((h) => h.trim().toLowerCase());
  const rows = body.map((r) => r.map((c) => (c ?? '').trim()));
  return { headers, rows, lineOf: (i) => i + 2 };
}

/** Header names that only a respondent-level (microdata) file would have. */
const RESPONDENT_HEADERS = [
  'respondent', 'respondent_id', 'respondentid', 'resp_id', 'respid', 'case_id', 'caseid', 'serial', 'interview_id',
  'age', 'age_group', 'gender', 'sex', 'birth_year', 'year_of_birth', 'vote', 'vote_intention', 'voting_intention', 'q1', 'weight',
];

/**
 * Veracast holds only published aggregates. A file whose header names respondent-level fields
 * (ids, ages, genders, individual votes) is refused before anything else is read.
 */
export function refuseRespondentLevel(headers: readonly string[]) {
  const hits = headers.filter((h) => RESPONDENT_HEADERS.includes(h.replace(/[\s-]+/g, '_')));
  const aggregate = headers.includes('share') || headers.includes('votes');
  if (hits.length >= 2 || (hits.length === 1 && !aggregate)) {
    throw new ImportFileError(
      'respondent_level',
      `This looks like respondent-level data (columns ${hits.join(', ')}). Veracast holds only published aggregates: poll shares per option and certified vote counts. Do not upload interview records.`,
    );
  }
}

/**
 * Renames file headers to the expected ones. `columnMap` maps an expected column to the file's
 * header that holds it (as chosen on the import screen).
 */
export function applyColumnMap(headers: string[], columnMap: Record<string, string> | undefined): string[] {
  if (!columnMap) return headers;
  const reverse = new Map(Object.entries(columnMap).map(([expected, fileHeader]) => [fileHeader.trim().toLowerCase(), expected]));
  return headers.map((h) => reverse.get(h) ?? h);
}

export function requireColumns(headers: readonly string[], required: readonly string[]) {
  const missing = required.filter((c) => !headers.includes(c));
  if (missing.length) {
    throw new ImportFileError(
      'missing_columns',
      `The file lacks the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}; map them on the import screen or fix the header`,
      missing.map((c) => ({ row: 1, column: c, code: 'missing_column', message: `column ${c} is required` })),
    );
  }
}

export const isIsoDate = (s: string) => /^\d{4}-\d{2}-\d{2}$/.test(s) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s);
export const KEY_RE = /^[a-z0-9][a-z0-9._-]{0,99}$/;
export const isUrl = (s: string) => {
  try {
    const u = new URL(s);
    return u.protocol === 'http:' || u.protocol === 'https:';
  } catch {
    return false;
  }
};
export const parseBool = (s: string): boolean | null => {
  const v = s.toLowerCase();
  if (['1', 'true', 'yes', 'y'].includes(v)) return true;
  if (['0', 'false', 'no', 'n', ''].includes(v)) return false;
  return null;
};

/** Normalised form of a pollster name for alias matching. */
export const normalizeName = (s: string) =>
  s.toLowerCase().replace(/&/g, ' and ').replace(/[^\p{L}\p{N}]+/gu, ' ').trim().replace(/\s+/g, ' ').replace(/ (ltd|limited|inc|llc|plc|gmbh|co)$/, '');
