const oneDecimal = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

/** A signed difference in points: "+2.3", "−1.0" (a true minus sign), "0.0". */
export function formatSignedPoints(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = oneDecimal.format(Math.abs(value));
  if (text === '0.0') return '0.0';
  return value > 0 ? `+${text}` : `\u2212${text}`;
}
