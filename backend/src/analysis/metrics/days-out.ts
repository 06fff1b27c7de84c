/**
 * Days out: how long before election day a poll's fieldwork took place
 * (SPEC §4). Pure calendar arithmetic on ISO dates in UTC; no clock, no time zone.
 */
import { MetricInputError } from '../errors';

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Day number of a proleptic Gregorian date, counted from 1970-01-01 = 0
 * (the civil-from-days arithmetic of era/year-of-era/day-of-year).
 */
function dayNumber(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

function daysInMonth(year: number, month: number): number {
  if (month === 2) return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0 ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

/**
 * Parses an ISO 8601 calendar date `YYYY-MM-DD` into a day number
 * (1970-01-01 = 0).
 *
 * @param parameter - name reported in the error.
 * @param iso - a real calendar date, e.g. `2024-02-29`.
 * @throws {MetricInputError} `parameter` when not `YYYY-MM-DD` or not a real date.
 * @example isoDayNumber('date', '1970-01-02') // => 1
 */
/** Day numbers of valid dates already read (dates repeat across polls); cleared when large. */
const known = new Map<string, number>();

export function isoDayNumber(parameter: string, iso: string): number {
  const seen = known.get(iso);
  if (seen !== undefined) return seen;
  const match = typeof iso === 'string' ? ISO_DATE.exec(iso) : null;
  if (match === null) throw new MetricInputError(parameter, 'must be an ISO date YYYY-MM-DD');
  const year = Number(match[1]);
  const month = Number(match[2]);
  const day = Number(match[3]);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) {
    throw new MetricInputError(parameter, 'must be a real calendar date');
  }
  const n = dayNumber(year, month, day);
  if (known.size >= 100_000) known.clear();
  known.set(iso, n);
  return n;
}

/** Days from fieldwork to election day. */
export interface DaysOut {
  /** Election date minus fieldwork midpoint, in days; a multiple of 0.5. */
  daysOut: number;
  /** Election date minus fieldwork end, in whole days. */
  daysOutEnd: number;
}

/**
 * Days out of a poll: election date minus the fieldwork midpoint
 * (start + (end − start)/2, so x.5 for an even number of days between them)
 * and minus the fieldwork end. Negative values mean fieldwork after election
 * day; callers that reject such polls check `daysOutEnd < 0`.
 *
 * @param electionDate - `YYYY-MM-DD`.
 * @param fieldworkStart - `YYYY-MM-DD`, not after `fieldworkEnd`.
 * @param fieldworkEnd - `YYYY-MM-DD`.
 * @throws {MetricInputError} `electionDate`, `fieldworkStart`, `fieldworkEnd`
 *   (bad date) or `fieldworkEnd` (before start).
 * @example daysOut('2026-05-10', '2026-05-01', '2026-05-04') // => { daysOut: 7.5, daysOutEnd: 6 }
 */
export function daysOut(electionDate: string, fieldworkStart: string, fieldworkEnd: string): DaysOut {
  const e = isoDayNumber('electionDate', electionDate);
  const s = isoDayNumber('fieldworkStart', fieldworkStart);
  const f = isoDayNumber('fieldworkEnd', fieldworkEnd);
  if (f < s) throw new MetricInputError('fieldworkEnd', 'must not be before fieldworkStart');
  return { daysOut: (e - s + (e - f)) / 2, daysOutEnd: e - f };
}
