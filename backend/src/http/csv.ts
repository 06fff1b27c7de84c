import Papa from 'papaparse';
import type { Request, Response } from 'express';

/**
 * A spreadsheet runs a cell starting with = + - @ (or a tab or carriage return) as a formula.
 * Such text cells get a leading apostrophe; real numbers stay numbers. [practice: OWASP
 * "CSV injection" guidance]
 */
export function neutraliseCell(value: unknown): string | number | boolean | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (typeof value === 'boolean') return value;
  const text = Array.isArray(value) ? value.join(' | ') : typeof value === 'object' ? JSON.stringify(value) : String(value);
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export function toCsv(rows: readonly Record<string, unknown>[], columns?: readonly string[]): string {
  const cols = columns ?? (rows[0] ? Object.keys(rows[0]) : []);
  const data = rows.map((r) => cols.map((c) => neutraliseCell(r[c])));
  return Papa.unparse({ fields: [...cols], data }, { newline: '\r\n' });
}

export const wantsCsv = (req: Request) => req.query.format === 'csv';

/** Answers rows as a CSV download (UTF-8 with a BOM, so spreadsheets read the accents). */
export function sendCsv(res: Response, rows: readonly object[], filename: string, columns?: readonly string[]) {
  res.type('text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${filename.replace(/[^A-Za-z0-9_.-]/g, '_')}.csv"`);
  res.send('\uFEFF' + toCsv(rows as readonly Record<string, unknown>[], columns));
}

/** Answers a list as `{ items, total }`, or as CSV when `?format=csv`. */
export function sendList(req: Request, res: Response, items: readonly object[], opts: { total?: number; filename?: string; columns?: readonly string[]; extra?: Record<string, unknown> } = {}) {
  if (wantsCsv(req)) return sendCsv(res, items, opts.filename ?? 'export', opts.columns);
  res.json({ items, total: opts.total ?? items.length, ...opts.extra });
}
