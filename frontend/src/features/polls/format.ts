import { formatNumber, formatSigned } from '../../lib/format';

/** Fixed decimals (two unless told) with a true minus sign; an em dash for a missing value. */
export function fixed(value: number | null | undefined, digits = 2): string {
  return formatNumber(value, digits);
}

/** Fixed decimals with an explicit sign: `+1.10`. */
export function signed(value: number | null | undefined, digits = 2): string {
  return formatSigned(value, digits);
}

export function yesNo(value: boolean | null | undefined, none = '—'): string {
  return value === true ? 'Yes' : value === false ? 'No' : none;
}
