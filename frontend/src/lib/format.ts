/** Number formats shared by the screens. Points carry a true minus sign; missing values are an em dash. */

const MINUS = '\u2212';

function withMinus(text: string): string {
  return text.startsWith('-') ? `${MINUS}${text.slice(1)}` : text;
}

/** `3.14159` → `3.1`; `-0.04` → `0.0` (no negative zero). */
export function formatNumber(value: number | null | undefined, digits = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toFixed(digits);
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : withMinus(text);
}

/** A signed figure with an explicit plus: `+1.2`, `−0.4`, `0.0`. */
export function formatSigned(value: number | null | undefined, digits = 1): string {
  const text = formatNumber(value, digits);
  if (text === '—' || text.startsWith(MINUS) || Number(text) === 0) return text;
  return `+${text}`;
}

/** `0.8412` → `84%`. */
export function formatPercent(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${formatNumber(value * 100, digits)}%`;
}

/** `[-1.63, 0.4]` → `−1.6 to 0.4`. */
export function formatInterval(interval: readonly [number, number] | null | undefined, digits = 1): string {
  if (!interval) return '—';
  return `${formatNumber(interval[0], digits)} to ${formatNumber(interval[1], digits)}`;
}

/** Ranks may be averages of ties: `2.5` stays `2.5`, `3` is `3`. */
export function formatRank(rank: number | null | undefined): string {
  if (rank === null || rank === undefined || !Number.isFinite(rank)) return '—';
  return Number.isInteger(rank) ? String(rank) : formatNumber(rank, 1);
}

const integer = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
const oneDecimal = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

/** 1,234,567; an em dash for a missing value. */
export function formatInteger(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : integer.format(value);
}

/** A share in points with one decimal: "37.8"; an em dash for a missing value. */
export function formatPoints(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : oneDecimal.format(value);
}
