import Papa from 'papaparse';

export type CsvValue = string | number | boolean | null | undefined;
export type CsvRow = Record<string, CsvValue>;

/**
 * A spreadsheet runs a text cell that starts with = + - @ (or a tab or carriage return) as a
 * formula; such cells get a leading apostrophe. Real numbers stay numbers, so −1.5 is not touched.
 */
export function neutraliseCsvCell(value: CsvValue): string | number | boolean | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (typeof value === 'boolean') return value;
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** Rows as CSV text with a header line, CRLF line ends and every cell neutralised. */
export function toCsv(rows: readonly CsvRow[], columns?: readonly string[]): string {
  const fields = columns ? [...columns] : rows[0] ? Object.keys(rows[0]) : [];
  if (rows.length === 0) return Papa.unparse([fields.map((f) => neutraliseCsvCell(f))], { newline: '\r\n' });
  const data = rows.map((row) => fields.map((field) => neutraliseCsvCell(row[field])));
  return Papa.unparse({ fields, data }, { newline: '\r\n' });
}
