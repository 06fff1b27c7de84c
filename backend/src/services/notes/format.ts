/** Small, pure helpers shared by the block views, the sanitiser and the PDF writer. */

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for an HTML text node or a double-quoted attribute. */
export const escapeHtml = (text: string): string => text.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]!);

const isNum = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** Points with two decimals (`3.00`), or an em dash for a missing value. */
export const pts = (x: number | null | undefined, digits = 2): string => (isNum(x) ? x.toFixed(digits) : '—');

/** Signed points with an explicit plus (`+1.10`, `-0.50`). */
export const signedPts = (x: number | null | undefined, digits = 2): string => (isNum(x) ? `${x > 0 ? '+' : ''}${x.toFixed(digits)}` : '—');

/** A share in [0, 1] as a whole percentage (`73%`). */
export const pct = (x: number | null | undefined): string => (isNum(x) ? `${Math.round(x * 100)}%` : '—');

/** A plain number with a fixed number of decimals. */
export const num = (x: number | null | undefined, digits = 3): string => (isNum(x) ? x.toFixed(digits) : '—');

/** A p-value: three significant digits, or `< 0.001`. */
export const pValue = (p: number | null | undefined): string => (isNum(p) ? (p < 0.001 ? '< 0.001' : p.toPrecision(3)) : '—');

/** `[lo, hi]` as `lo to hi` in points. */
export const interval = (iv: readonly [number, number] | null | undefined, digits = 2): string =>
  iv && isNum(iv[0]) && isNum(iv[1]) ? `${signedPts(iv[0], digits)} to ${signedPts(iv[1], digits)}` : '—';

export const yesNo = (x: boolean | null | undefined): string => (x === true ? 'yes' : x === false ? 'no' : '—');

/** The date part of an ISO timestamp. */
export const isoDate = (d: Date | string): string => new Date(d).toISOString().slice(0, 10);
