import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  consecutiveDates,
  dayNumber,
  dayOfYear,
  dayOfYearSeries,
  daysInMonth,
  isoDate,
  isLeapYear,
} from '../../src/climate/calendar.js';

describe('calendar', () => {
  it('rejects dates that are not real calendar days in YYYY-MM-DD form', () => {
    for (const bad of [
      '2023-02-29',
      '2024-13-01',
      '2024-00-10',
      '2024-04-31',
      '24-01-01',
      '2024/01/01',
      '2024-1-1',
      '',
    ]) {
      expect(dayNumber(bad)).toBeUndefined();
    }
    expect(dayNumber('2024-02-29')).toBeDefined();
  });

  it('numbers days from 1970-01-01 and back again', () => {
    expect(dayNumber('1970-01-01')).toBe(0);
    // 2000-01-01 is 10957 days after 1970-01-01: 30 years with 7 leap days (1972..1996).
    expect(dayNumber('2000-01-01')).toBe(30 * 365 + 7);
    for (const d of ['1900-03-01', '1969-12-31', '2000-02-29', '2100-12-31', '0999-06-15']) {
      expect(isoDate(dayNumber(d)!)).toBe(d);
    }
  });

  it('follows the Gregorian leap-year rule', () => {
    expect([1900, 2000, 2023, 2024].map(isLeapYear)).toEqual([false, true, false, true]);
    expect(daysInMonth(1900, 2)).toBe(28);
    expect(daysInMonth(2000, 2)).toBe(29);
  });

  it('gives the day of year (FAO-56 J), the same from both helpers', () => {
    expect(dayOfYear('2023-09-03')).toBe(246); // FAO-56 Example 8 (from memory)
    expect(dayOfYear('2024-12-31')).toBe(366);
    const dates = consecutiveDates('1999-12-25', 800);
    const fast = dayOfYearSeries(dates);
    dates.forEach((d, i) => expect(fast[i]).toBe(dayOfYear(d)));
    expect(dates[7]).toBe('2000-01-01');
  });
});

describe('consecutiveDates against the platform calendar', () => {
  // The reference is JavaScript's own proleptic Gregorian calendar (ECMA-262 Date, printed by
  // toISOString), which shares no code with the stepping of year, month and day.
  const MS_PER_DAY = 86_400_000;
  const platformDate = (day: number) => new Date(day * MS_PER_DAY).toISOString().slice(0, 10);
  const platformDayOfYear = (day: number) => {
    const t = new Date(day * MS_PER_DAY);
    return (day * MS_PER_DAY - Date.UTC(t.getUTCFullYear(), 0, 1)) / MS_PER_DAY + 1;
  };

  it('steps over month ends, leap days and century years (hand cases)', () => {
    expect(consecutiveDates('1900-02-28', 2)).toEqual(['1900-02-28', '1900-03-01']);
    expect(consecutiveDates('2000-02-28', 2)).toEqual(['2000-02-28', '2000-02-29']);
    expect(consecutiveDates('0099-12-31', 2)).toEqual(['0099-12-31', '0100-01-01']);
    expect(consecutiveDates('2024-04-30', 2)).toEqual(['2024-04-30', '2024-05-01']);
    expect(consecutiveDates('2024-01-01', 0)).toEqual([]);
  });

  it('gives the same dates and days of year as Date for any start from year 100 to 9990 (property)', () => {
    const first = dayNumber('0100-01-01') as number;
    const last = dayNumber('9990-01-01') as number;
    fc.assert(
      fc.property(
        fc.integer({ min: first, max: last }),
        fc.integer({ min: 0, max: 1500 }),
        (start, count) => {
          const dates = consecutiveDates(platformDate(start), count);
          expect(dates).toHaveLength(count);
          const doy = dayOfYearSeries(dates);
          for (let i = 0; i < count; i++) {
            expect(dates[i]).toBe(platformDate(start + i));
            expect(doy[i]).toBe(platformDayOfYear(start + i));
          }
        },
      ),
      { numRuns: 200 },
    );
  });
});
