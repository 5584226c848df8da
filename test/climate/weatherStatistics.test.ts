import { describe, it, expect } from 'vitest';
import { MEAN_MONTH_DAYS, recordStatistics, type WeatherSeries } from '../../src/climate/index.js';

// recordStatistics on small hand-made records, each built inside its test. Expected values are
// hand counts or plain loops written here, never the library's own output.

/** Consecutive ISO days from `first`, `n` of them (UTC calendar arithmetic). */
function days(first: string, n: number): string[] {
  const t0 = Date.parse(`${first}T00:00:00Z`);
  return Array.from({ length: n }, (_, i) =>
    new Date(t0 + i * 86400000).toISOString().slice(0, 10),
  );
}

/** A record whose daily values follow the given functions of the day's position. */
function record(
  first: string,
  n: number,
  precip: (i: number) => number,
  tmax: (i: number) => number,
  tmin: (i: number) => number,
): WeatherSeries {
  return {
    dates: days(first, n),
    precipMm: Float64Array.from({ length: n }, (_, i) => precip(i)),
    tmaxC: Float64Array.from({ length: n }, (_, i) => tmax(i)),
    tminC: Float64Array.from({ length: n }, (_, i) => tmin(i)),
  };
}

describe('recordStatistics', () => {
  it('mean lengths of the months: 97 leap years in 400 give February 28 + 97/400 days', () => {
    // Gregorian calendar rule (from memory): 97 leap years per 400-year cycle.
    expect(MEAN_MONTH_DAYS).toEqual([31, 28 + 97 / 400, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31]);
  });

  it('counts a day of exactly 0.1 mm as wet and 0.09 mm as dry, month by month', () => {
    // 2001-01-01 .. 2001-02-28 (59 days). Every 5th day 0.1 mm, every 5th + 1 day 0.09 mm, every
    // 5th + 2 day 7 mm, else dry. Hand count: January days 0..30 at positions i % 5 === 0 are
    // i = 0,5,...,30 (7 days) with 0.1 mm and i % 5 === 2 are 2,7,...,27 (6 days) with 7 mm: 13
    // wet of 31. February i = 31..58: i % 5 === 0 at 35,...,55 (5), i % 5 === 2 at 32,...,57 (6):
    // 11 wet of 28. The threshold of 0.1 mm is common practice.
    const p = (i: number) => [0.1, 0.09, 7, 0, 0][i % 5];
    const s = recordStatistics(
      record(
        '2001-01-01',
        59,
        p,
        () => 5,
        () => -1,
      ),
    );
    expect(s.wetDayFraction[0]).toBe(13 / 31);
    expect(s.wetDayFraction[1]).toBe(11 / 28);
    // January total by hand: 7 x 0.1 + 6 x 0.09 (i % 5 === 1 at 1,...,26) + 6 x 7 = 43.24 mm,
    // as a mean daily amount x 31 days; February: 5 x 0.1 + 6 x 0.09 + 6 x 7 = 43.04 mm over 28
    // days, times the mean February of 28.2425 days.
    expect(s.precipMonthMm[0]).toBeCloseTo(43.24, 10);
    expect(s.precipMonthMm[1]).toBeCloseTo((43.04 / 28) * 28.2425, 10);
    expect(Number.isNaN(s.precipMonthMm[2])).toBe(true);
    expect(Number.isNaN(s.wetDayFraction[11])).toBe(true);
    expect(s.days).toBe(59);
    expect(s.firstDate).toBe('2001-01-01');
    expect(s.lastDate).toBe('2001-02-28');
  });

  it('monthly mean Tmax and Tmin, the highest Tmax, the lowest Tmin and the wettest day', () => {
    // 2003-03-30 .. 2003-04-03: March days 30, 31; April days 1, 2, 3 (hand layout).
    const tmax = [10, 14, 9, 21, 12];
    const tmin = [-3, 2, -7, 4, 1];
    const p = [0, 12.5, 3, 0.2, 0];
    const s = recordStatistics(
      record(
        '2003-03-30',
        5,
        (i) => p[i],
        (i) => tmax[i],
        (i) => tmin[i],
      ),
    );
    // Hand means: March Tmax (10 + 14) / 2 = 12, Tmin (-3 + 2) / 2 = -0.5; April Tmax
    // (9 + 21 + 12) / 3 = 14, Tmin (-7 + 4 + 1) / 3 = -2/3.
    expect(s.tmaxMonthC[2]).toBe(12);
    expect(s.tminMonthC[2]).toBe(-0.5);
    expect(s.tmaxMonthC[3]).toBe(14);
    expect(s.tminMonthC[3]).toBeCloseTo(-2 / 3, 12);
    // Extremes by eye: highest Tmax 21 on 2003-04-01 (not the last day), lowest Tmin -7 (middle
    // day), wettest day 12.5 mm on 2003-03-31 (followed by smaller amounts).
    expect(s.maxTmaxC).toBe(21);
    expect(s.minTminC).toBe(-7);
    expect(s.maxDailyPrecipMm).toBe(12.5);
    expect(s.maxDailyPrecipDate).toBe('2003-03-31');
    expect(s.lastDate).toBe('2003-04-03');
  });

  it('extremes of a record whose first day holds them, and of all-negative temperatures', () => {
    // Falling Tmax from -1 degC, rising Tmin from -30 degC, falling rain from 9 mm: the first day
    // holds every extreme (hand layout).
    const s = recordStatistics(
      record(
        '2004-12-01',
        4,
        (i) => 9 - 2 * i,
        (i) => -1 - i,
        (i) => -30 + i,
      ),
    );
    expect(s.maxTmaxC).toBe(-1);
    expect(s.minTminC).toBe(-30);
    expect(s.maxDailyPrecipMm).toBe(9);
    expect(s.maxDailyPrecipDate).toBe('2004-12-01');
  });

  it('totals only complete calendar years; a leap year begun on 2 January is not complete', () => {
    // 2000-01-02 .. 2002-01-03: 2000 (a leap year) lacks 1 January; 2001 is the one complete year;
    // 2002 has three days. Rain 1 mm on even days of the month, 2.5 mm on days divisible by 5.
    const dates = days('2000-01-02', 733);
    expect(dates[dates.length - 1]).toBe('2002-01-03');
    const p = (i: number) => {
      const d = Number(dates[i].slice(8, 10));
      return (d % 2 === 0 ? 1 : 0) + (d % 5 === 0 ? 2.5 : 0);
    };
    const s = recordStatistics(
      record(
        '2000-01-02',
        733,
        p,
        () => 10,
        () => 0,
      ),
    );
    // Plain loop over the days of 2001.
    let total2001 = 0;
    for (let i = 0; i < dates.length; i++) if (dates[i].startsWith('2001-')) total2001 += p(i);
    expect(s.annualTotalsMm).toHaveLength(1);
    expect(s.annualTotalsMm[0]).toBeCloseTo(total2001, 9);
  });

  it('a record of exactly one calendar year (non-leap, 365 days) has that year as its total', () => {
    // 2001-01-01 .. 2001-12-31, 2 mm every third day: 122 such days (i = 0, 3, ..., 363), 244 mm
    // by hand.
    const s = recordStatistics(
      record(
        '2001-01-01',
        365,
        (i) => (i % 3 === 0 ? 2 : 0),
        () => 8,
        () => 1,
      ),
    );
    expect(s.lastDate).toBe('2001-12-31');
    expect(s.annualTotalsMm).toEqual([244]);
  });

  it('a record from mid-year to mid-year has one complete year', () => {
    // 2001-07-01 .. 2003-06-30: only 2002 is complete; 1 mm a day in 2002 gives 365 mm by hand,
    // and 5 mm a day outside it must not be counted.
    const dates = days('2001-07-01', 730);
    const s = recordStatistics(
      record(
        '2001-07-01',
        730,
        (i) => (dates[i].startsWith('2002-') ? 1 : 5),
        () => 8,
        () => 1,
      ),
    );
    expect(s.annualTotalsMm).toEqual([365]);
  });
});
