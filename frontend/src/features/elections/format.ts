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

/** A fraction 0–1 as a percentage with one decimal: "62.5%". */
export function formatFraction(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : `${oneDecimal.format(value * 100)}%`;
}
