import { describe, expect, it } from 'vitest';
import { daysOut, isoDayNumber } from './days-out';

describe('daysOut', () => {
  it('measures from the fieldwork midpoint and end', () => {
    // [computed] Python 3.11 datetime.date(2026, 5, 10) − date(2026, 5, 1) = 9 days; − date(2026, 5, 4) = 6 days.
    expect(daysOut('2026-05-10', '2026-05-01', '2026-05-04')).toEqual({ daysOut: 7.5, daysOutEnd: 6 });
    expect(daysOut('2026-05-10', '2026-05-02', '2026-05-04')).toEqual({ daysOut: 7, daysOutEnd: 6 });
  });
  it('crosses month ends, leap days and year ends', () => {
    // [computed] Python 3.11 datetime.date(2024, 3, 1) − date(2024, 2, 28) = 2 days.
    expect(daysOut('2024-03-01', '2024-02-28', '2024-02-28')).toEqual({ daysOut: 2, daysOutEnd: 2 });
    // [computed] Python 3.11 datetime.date(2023, 3, 1) − date(2023, 2, 28) = 1 day.
    expect(daysOut('2023-03-01', '2023-02-28', '2023-02-28').daysOutEnd).toBe(1);
    // [computed] Python 3.11 datetime.date(2027, 1, 3) − date(2026, 12, 20) = 14 days.
    expect(daysOut('2027-01-03', '2026-12-20', '2026-12-20').daysOut).toBe(14);
  });
  it('is negative for fieldwork after election day', () => {
    expect(daysOut('2026-05-10', '2026-05-10', '2026-05-12')).toEqual({ daysOut: -1, daysOutEnd: -2 });
  });
});

describe('isoDayNumber', () => {
  it('agrees with Date.UTC across four centuries', () => {
    for (let ms = Date.UTC(1900, 0, 1); ms <= Date.UTC(2300, 0, 1); ms += 86_400_000 * 37) {
      const iso = new Date(ms).toISOString().slice(0, 10);
      expect(isoDayNumber('d', iso)).toBe(ms / 86_400_000);
    }
  });
  it('refuses dates that are not real', () => {
    for (const bad of ['2023-02-29', '2026-13-01', '2026-04-31', '2026-00-10', '2026-5-1', '2026-05-01T00:00']) {
      expect(() => isoDayNumber('d', bad)).toThrow(/d must/);
    }
    expect(isoDayNumber('d', '2000-02-29')).toBe(Date.UTC(2000, 1, 29) / 86_400_000);
  });
});
