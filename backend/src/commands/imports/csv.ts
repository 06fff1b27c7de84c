import { isAscii, isUtf8 } from 'node:buffer';
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

/** A CSV file opened for reading row by row (see `openCsv`). */
export interface CsvReader {
  /** Header cells, trimmed and lower-cased. */
  headers: string[];
  /**
   * Hands each data row (trimmed cells, blank rows skipped) to `onRow` in file order and returns
   * the number of data rows. The reader keeps no row: a row array is the callback's to keep or drop.
   * Call it once.
   */
  forEachRow: (onRow: (cells: string[], index: number) => void) => number;
  /** Spreadsheet row number of each data row (header = 1). */
  lineOf: (index: number) => number;
}

const lineOfIndex = (i: number) => i + 2;

/** Trims every cell in place; false when the row is blank (papaparse's greedy rule: all cells blank). */
function trimCells(cells: string[]): boolean {
  let any = false;
  for (let j = 0; j < cells.length; j++) {
    const v = cells[j]!.trim();
    cells[j] = v;
    if (v !== '') any = true;
  }
  return any;
}

/**
 * papaparse's choice of line ending for a file without quote characters: `\n` unless `\r` comes
 * first, then `\r\n` when at least half the `\r` are followed by `\n`, else `\r` (first 1 MB).
 */
function guessNewline(text: string): '\n' | '\r\n' | '\r' {
  const head = text.substring(0, 1024 * 1024);
  const r = head.split('\r');
  const n = head.split('\n');
  if (r.length === 1 || (n.length > 1 && n[0]!.length < r[0]!.length)) return '\n';
  let withN = 0;
  for (const part of r) if (part[0] === '\n') withN++;
  return withN >= r.length / 2 ? '\r\n' : '\r';
}

/**
 * Opens a CSV file: UTF-8 with or without BOM, comma or semicolon delimited, header row first.
 * Blank lines are skipped. Throws ImportFileError for a file that is not such a CSV.
 *
 * A file without quote characters is split line by line as it is read (what papaparse itself
 * does for such input), so no array of all rows is ever built; a file with quotes goes through
 * papaparse whole, so its quoting errors are reported before anything else.
 */
export function openCsv(buffer: Buffer): CsvReader {
  if (!isUtf8(buffer)) throw new ImportFileError('not_utf8', 'The file is not UTF-8 text; save it as CSV UTF-8 and try again');
  // The decoder drops one byte order mark and the reader one more, as a whole-file decode would.
  let start = 0;
  for (let k = 0; k < 2 && buffer[start] === 0xef && buffer[start + 1] === 0xbb && buffer[start + 2] === 0xbf; k++) start += 3;

  if (buffer.indexOf(0x22, start) === -1) {
    // No quote character: lines are decoded one at a time from the bytes (a line ending is ASCII,
    // never part of a multi-byte character), so the whole file never exists as one string.
    const firstNl = buffer.indexOf(0x0a, start);
    let firstLine = buffer.toString('utf8', start, firstNl === -1 ? buffer.length : firstNl);
    if (firstNl !== -1 && firstLine.endsWith('\r')) firstLine = firstLine.slice(0, -1);
    const delimiter = (firstLine.match(/;/g)?.length ?? 0) > (firstLine.match(/,/g)?.length ?? 0) ? ';' : ',';
    const newline = buffer.indexOf(0x0d, start) === -1 ? '\n' : guessNewline(buffer.toString('utf8', start, Math.min(buffer.length, start + 4 * 1024 * 1024 + 4)));
    const len = buffer.length;
    // An all-ASCII file (the usual case) decodes as single-byte text, without UTF-8 decoding.
    const encoding: BufferEncoding = isAscii(buffer) ? 'latin1' : 'utf8';
    let pos = start;
    /** The next line (as `text.split(newline)` would give it), or null past the end. */
    // Searching for a byte is cheaper than for a one-character string (no conversion per call).
    const needle: number | string = newline === '\n' ? 0x0a : newline === '\r' ? 0x0d : newline;
    const nextLine = (): string | null => {
      if (pos > len) return null;
      let end = buffer.indexOf(needle, pos);
      if (end === -1) end = len;
      const line = buffer.toString(encoding, pos, end);
      pos = end + newline.length;
      return line;
    };
    let head: string[] | null = null;
    for (let line = nextLine(); line !== null; line = nextLine()) {
      const cells = line.split(delimiter);
      if (trimCells(cells)) {
        head = cells;
        break;
      }
    }
    if (!head) throw new ImportFileError('empty_file', 'The file has no header row');
    return {
      headers: head.map((h) => h.toLowerCase()),
      lineOf: lineOfIndex,
      forEachRow: (onRow) => {
        let index = 0;
        for (let line = nextLine(); line !== null; line = nextLine()) {
          const cells = line.split(delimiter);
          if (trimCells(cells)) onRow(cells, index++);
        }
        return index;
      },
    };
  }

  const text = buffer.toString('utf8', start);
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const delimiter = (firstLine.match(/;/g)?.length ?? 0) > (firstLine.match(/,/g)?.length ?? 0) ? ';' : ',';
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: 'greedy' });
  const fatal = parsed.errors.find((e) => e.type === 'Quotes');
  if (fatal) {
    throw new ImportFileError('bad_csv', `The CSV could not be read: ${fatal.message}`, [
      { row: (fatal.row ?? 0) + 1, column: '', code: 'bad_csv', message: fatal.message },
    ]);
  }
  const data = parsed.data;
  const head = data[0];
  if (!head || head.length === 0) throw new ImportFileError('empty_file', 'The file has no header row');
  return {
    headers: head.map((h) => h.trim().toLowerCase()),
    lineOf: lineOfIndex,
    forEachRow: (onRow) => {
      const n = data.length - 1;
      for (let i = 1; i < data.length; i++) {
        const cells = data[i]!.map((c) => (c ?? '').trim());
        data[i] = [];
        onRow(cells, i - 1);
      }
      return n;
    },
  };
}

/** Parses a whole CSV file (see `openCsv`) into its header and all its rows. */
export function parseCsv(buffer: Buffer): ParsedCsv {
  const csv = openCsv(buffer);
  const rows: string[][] = [];
  csv.forEachRow((cells) => {
    rows.push(cells);
  });
  return { headers: csv.headers, rows, lineOf: csv.lineOf };
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
