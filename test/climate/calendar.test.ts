import { describe, it, expect } from 'vitest';
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
