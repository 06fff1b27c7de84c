import Papa from 'papaparse';

/** The server refuses larger uploads (UPLOAD_MAX_MB, 50 by default). */
export const UPLOAD_LIMIT_MB = 50;
export const UPLOAD_LIMIT_BYTES = UPLOAD_LIMIT_MB * 1024 * 1024;

export interface ParsedFile {
  headers: string[];
  /** Data rows as cells, blank lines dropped; row i is spreadsheet row i + 2. */
  rows: string[][];
  delimiter: ',' | ';';
  /** Problems papaparse reported that did not stop the reading, e.g. a row with too few cells. */
  warnings: string[];
}

export class FileProblem extends Error {
  override readonly name = 'FileProblem';
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

export function checkSize(size: number): void {
  if (size > UPLOAD_LIMIT_BYTES) {
    throw new FileProblem(`The file is ${formatBytes(size)}; the upload limit is ${UPLOAD_LIMIT_MB} MB. Split it into smaller files and import them one by one.`);
  }
}

/** Comma unless the header line has more semicolons than commas (the server decides the same way). */
export function guessDelimiter(text: string): ',' | ';' {
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  return (firstLine.match(/;/g)?.length ?? 0) > (firstLine.match(/,/g)?.length ?? 0) ? ';' : ',';
}

/** Reads CSV text as the server will: BOM dropped, header row first, blank lines skipped. */
export function parseCsvText(input: string): ParsedFile {
  const text = input.charCodeAt(0) === 0xfeff ? input.slice(1) : input;
  const delimiter = guessDelimiter(text);
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: 'greedy' });
  const quotes = parsed.errors.find((e) => e.type === 'Quotes');
  if (quotes) throw new FileProblem(`The CSV could not be read near row ${(quotes.row ?? 0) + 1}: ${quotes.message}.`);
  const [head, ...body] = parsed.data;
  if (!head || head.every((h) => h.trim() === '')) throw new FileProblem('The file has no header row.');
  const warnings = parsed.errors.slice(0, 20).map((e) => `Row ${(e.row ?? 0) + 1}: ${e.message}`);
  return { headers: head.map((h) => h.trim()), rows: body.map((r) => r.map((c) => (c ?? '').trim())), delimiter, warnings };
}

/** Checks the size, decodes strictly as UTF-8 and parses; throws FileProblem with a sentence to show. */
export async function readCsvFile(file: File): Promise<ParsedFile> {
  checkSize(file.size);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(await file.arrayBuffer());
  } catch {
    throw new FileProblem('The file is not UTF-8 text. Save it as “CSV UTF-8” and choose it again.');
  }
  return parseCsvText(text);
}
