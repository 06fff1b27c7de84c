/** A fraction 0–1 as a whole percentage: "70%"; an em dash when missing. */
export function formatPercent(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : `${Math.round(value * 100)}%`;
}

const integer = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
export function formatInteger(value: number): string {
  return integer.format(value);
}
