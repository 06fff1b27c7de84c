import Papa from 'papaparse';
import { downloadBlob } from './download';

/** CSV files made in the browser: every cell neutralised against spreadsheet formulas. */

export type CsvValue = string | number | boolean | null | undefined;
export type CsvRow = Record<string, CsvValue>;

export interface CsvColumn<Row> {
  header: string;
  value: (row: Row) => unknown;
}

/**
 * A spreadsheet runs a text cell starting with = + - @ (or a tab or carriage return) as a
 * formula, so such cells get a leading apostrophe. Finite numbers stay numbers (so −1.5 is not
 * touched); anything missing or not finite becomes an empty cell; a list is joined with " | ".
 * [practice: OWASP "CSV injection" guidance]
 */
export function neutraliseCsvCell(value: unknown): string | number | boolean | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (typeof value === 'boolean') return value;
  const text = Array.isArray(value) ? value.join(' | ') : typeof value === 'object' ? JSON.stringify(value) : String(value);
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** Rows as CSV text: a header line, CRLF line ends, every cell neutralised. */
export function toCsv<Row>(rows: readonly Row[], columns: readonly CsvColumn<Row>[]): string {
  const fields = columns.map((c) => c.header);
  // Without rows Papa would end the header with a line break; keep the same shape as with rows.
  if (rows.length === 0) return Papa.unparse([fields], { newline: '\r\n' });
  return Papa.unparse({ fields, data: rows.map((row) => columns.map((c) => neutraliseCsvCell(c.value(row)))) }, { newline: '\r\n' });
}

/** Records as CSV text; the columns are `fields`, or else the keys of the first record. */
export function recordsToCsv(rows: readonly CsvRow[], fields?: readonly string[]): string {
  const names = fields ?? (rows[0] ? Object.keys(rows[0]) : []);
  return toCsv(
    rows,
    names.map((name) => ({ header: name, value: (row: CsvRow) => row[name] })),
  );
}

/** Offers CSV text as a download. */
export function downloadCsv(csv: string, fileName: string): void {
  // The byte-order mark lets spreadsheet programs read the file as UTF-8 (names, minus signs).
  downloadBlob(new Blob(['\uFEFF', csv], { type: 'text/csv;charset=utf-8' }), fileName);
}
