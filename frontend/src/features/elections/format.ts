const oneDecimal = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

/** A fraction 0–1 as a percentage with one decimal: "62.5%"; an em dash for a missing value. */
export function formatFraction(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : `${oneDecimal.format(value * 100)}%`;
}
