import Papa from 'papaparse';

export interface CsvColumn<Row> {
  header: string;
  value: (row: Row) => unknown;
}

/**
 * A spreadsheet runs a text cell starting with = + - @ (or a tab or carriage return) as a
 * formula, so such cells get a leading apostrophe; finite numbers stay numbers; anything
 * missing or not finite becomes an empty cell. [practice: OWASP "CSV injection" guidance]
 */
export function neutraliseCell(value: unknown): string | number | boolean | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (typeof value === 'boolean') return value;
  const text = Array.isArray(value) ? value.join(' | ') : typeof value === 'object' ? JSON.stringify(value) : String(value);
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export function toCsv<Row>(rows: readonly Row[], columns: readonly CsvColumn<Row>[]): string {
  return Papa.unparse(
    { fields: columns.map((c) => c.header), data: rows.map((row) => columns.map((c) => neutraliseCell(c.value(row)))) },
    { newline: '\r\n' },
  );
}

/** Offers `content` as a file download. */
export function downloadBlob(filename: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  link.rel = 'noopener';
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function downloadCsv<Row>(filename: string, rows: readonly Row[], columns: readonly CsvColumn<Row>[]): void {
  // The byte-order mark lets spreadsheet programs read the file as UTF-8 (minus signs, en dashes).
  downloadBlob(filename, new Blob(['\uFEFF', toCsv(rows, columns)], { type: 'text/csv;charset=utf-8' }));
}

/** A file name safe on every system: letters, digits, dot, dash and underscore. */
export function safeFilename(name: string): string {
  return name.replace(/[^A-Za-z0-9_.-]+/g, '-').replace(/^-+|-+$/g, '') || 'export';
}
