/** Small formatting helpers shared by the demo and the benchmark generators: dates and CSV. */

const MS_PER_DAY = 86_400_000;

/** Days since 1970-01-01 (UTC) for an ISO `YYYY-MM-DD` date. */
export function dayNumber(iso: string): number {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(iso);
  if (!match) throw new RangeError(`not an ISO date: ${iso}`);
  return Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3])) / MS_PER_DAY;
}

/** ISO `YYYY-MM-DD` for a day number (days since 1970-01-01, UTC). */
export function isoDate(day: number): string {
  return new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
}

/** Lowercase ASCII slug: letters and digits, words joined by `-`. */
export function slugify(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[^\x20-\x7e]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
}

const NEEDS_QUOTES = /[",\r\n]|^\s|\s$/;

/** One CSV cell (RFC 4180): quoted when it holds a comma, quote, line break or edge space. */
export function csvField(value: string | number): string {
  const text = typeof value === 'number' ? String(value) : value;
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One CSV line with its `\n` terminator. */
export function csvLine(fields: readonly (string | number)[]): string {
  return `${fields.map(csvField).join(',')}\n`;
}

/** Accumulates CSV lines in bounded chunks, so very long files never sit in one huge array. */
export class CsvChunks {
  private readonly done: string[] = [];
  private pending: string[] = [];

  constructor(private readonly chunkLines = 8192) {}

  push(line: string): void {
    this.pending.push(line);
    if (this.pending.length >= this.chunkLines) {
      this.done.push(this.pending.join(''));
      this.pending = [];
    }
  }

  toString(): string {
    if (this.pending.length > 0) {
      this.done.push(this.pending.join(''));
      this.pending = [];
    }
    return this.done.join('');
  }
}
