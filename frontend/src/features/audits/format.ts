/** Number formats of the audit screens. A missing value is an em dash, never 0 or NaN. */

import { formatNumber, formatSigned } from '../../lib/format';

const MINUS = '\u2212';

function finite(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/** Points with a fixed number of decimals: `3.80`; negative values carry a true minus sign. */
export function formatPoints(value: number | null | undefined, digits = 2): string {
  return formatNumber(value, digits);
}

/** Signed points: `+1.10`, `−0.50`, `0.00`. */
export function formatSignedPoints(value: number | null | undefined, digits = 2): string {
  return formatSigned(value, digits);
}

/** A rate in [0, 1] as a percentage: `81.5%`. */
export function formatRate(value: number | null | undefined, digits = 1): string {
  if (!finite(value)) return '—';
  return `${(value * 100).toFixed(digits)}%`;
}

/** A unitless statistic with a given number of significant decimals. */
export function formatStat(value: number | null | undefined, digits = 3): string {
  return formatPoints(value, digits);
}

export function formatCount(value: number | null | undefined): string {
  if (!finite(value)) return '—';
  return value.toLocaleString('en-GB');
}

export function formatBoolean(value: boolean | null | undefined, labels = { yes: 'Yes', no: 'No', none: '—' }): string {
  if (value === true) return labels.yes;
  if (value === false) return labels.no;
  return labels.none;
}

/** Parses a number as these formats write it (true minus sign, plus sign, percent). */
export function parseShownNumber(text: string): number {
  return Number(text.replace(MINUS, '-').replace(/[+%\s]/g, ''));
}
