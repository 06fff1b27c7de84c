/**
 * Number formatting for the shared-error screens. Every formatter answers null for a missing or
 * non-finite value, so a screen can say "not enough data" instead of printing NaN.
 */

export const MINUS = '\u2212';
export const NOT_ENOUGH_DATA = 'not enough data';

export function isNum(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/** Rounds half away from zero at `digits` decimals and drops a negative zero. */
function rounded(value: number, digits: number): number {
  const factor = 10 ** digits;
  const r = Math.sign(value) * Math.round(Math.abs(value) * factor) / factor;
  return r === 0 ? 0 : r;
}

/** "3.4", "−3.4" (typographic minus); null when not a finite number. */
export function fmtNumber(value: number | null | undefined, digits = 1): string | null {
  if (!isNum(value)) return null;
  const r = rounded(value, digits);
  const text = Math.abs(r).toFixed(digits);
  return r < 0 ? `${MINUS}${text}` : text;
}

/** "+1.2", "−3.4", "0.0": the sign always shown, so a direction is never implied by colour. */
export function fmtSigned(value: number | null | undefined, digits = 1): string | null {
  if (!isNum(value)) return null;
  const r = rounded(value, digits);
  const text = Math.abs(r).toFixed(digits);
  return r > 0 ? `+${text}` : r < 0 ? `${MINUS}${text}` : text;
}

/** A p-value: "< 0.001" below a thousandth, three decimals otherwise. */
export function fmtP(p: number | null | undefined): string | null {
  if (!isNum(p)) return null;
  if (p < 0.001) return '< 0.001';
  return p.toFixed(3);
}

/** "p = 0.005" or "p < 0.001". */
export function fmtPEquals(p: number | null | undefined): string | null {
  const text = fmtP(p);
  if (text === null) return null;
  return text.startsWith('<') ? `p ${text}` : `p = ${text}`;
}

/** A share in [0, 1] as "41%". */
export function fmtPercent(share: number | null | undefined, digits = 0): string | null {
  if (!isNum(share)) return null;
  return `${fmtNumber(share * 100, digits)}%`;
}

/** "−5.5 to −1.3"; null unless both ends are finite. */
export function fmtInterval(lo: number | null | undefined, hi: number | null | undefined, digits = 1): string | null {
  const a = fmtSigned(lo, digits);
  const b = fmtSigned(hi, digits);
  return a === null || b === null ? null : `${a} to ${b}`;
}

/** "±4.3"; null when not finite or negative. */
export function fmtHalfWidth(value: number | null | undefined, digits = 1): string | null {
  if (!isNum(value) || value < 0) return null;
  return `±${fmtNumber(value, digits)}`;
}

/** A contest's short label: its key without the election key in front. */
export function contestLabel(contestKey: string, electionKey: string): string {
  const prefix = `${electionKey}-`;
  return contestKey.startsWith(prefix) && contestKey.length > prefix.length ? contestKey.slice(prefix.length) : contestKey;
}

/** A short label for an election: "2022 general" from `almerand-2022-general`, else its name. */
export function electionShortLabel(electionKey: string, name: string): string {
  const match = /(?:^|-)((?:19|20|21)\d{2}(?:-.+)?)$/.exec(electionKey);
  return match?.[1] ? match[1].replace(/-/g, ' ') : name;
}
