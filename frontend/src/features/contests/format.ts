const integer = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
const oneDecimal = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

export function formatInteger(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : integer.format(value);
}

/** Points with one decimal; an em dash for a missing value. */
export function formatPoints(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : oneDecimal.format(value);
}

/** A signed difference in points: "+2.3", "−1.0" (a true minus sign), "0.0". */
export function formatSignedPoints(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = oneDecimal.format(Math.abs(value));
  if (text === '0.0') return '0.0';
  return value > 0 ? `+${text}` : `\u2212${text}`;
}

/** A fraction 0–1 as a whole percentage: "70%". */
export function formatPercent(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : `${Math.round(value * 100)}%`;
}
