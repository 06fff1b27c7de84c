const MINUS = '\u2212';

function finite(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/** Fixed decimals with a true minus sign; an em dash for a missing value. */
export function fixed(value: number | null | undefined, digits = 2): string {
  if (!finite(value)) return '—';
  const text = Math.abs(value).toFixed(digits);
  return value < 0 && Number(text) !== 0 ? `${MINUS}${text}` : text;
}

/** Fixed decimals with an explicit sign: `+1.10`. */
export function signed(value: number | null | undefined, digits = 2): string {
  if (!finite(value)) return '—';
  const text = fixed(value, digits);
  return value > 0 && Number(Math.abs(value).toFixed(digits)) !== 0 ? `+${text}` : text;
}

export function yesNo(value: boolean | null | undefined, none = '—'): string {
  return value === true ? 'Yes' : value === false ? 'No' : none;
}
