/**
 * Calendar arithmetic on ISO dates (`YYYY-MM-DD`) for daily series: day numbers, day of year,
 * leap years. Proleptic Gregorian calendar, computed with `Date.UTC` so that it runs the same in
 * Node and in a browser and never depends on the local time zone.
 */

const MS_PER_DAY = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Day number of an ISO date: whole days since 1970-01-01 (negative before it), or `undefined`
 * when the text is not a real calendar date in the form `YYYY-MM-DD`.
 *
 * @example dayNumber('1970-01-02') // 1
 * @example dayNumber('2023-02-29') // undefined (2023 is not a leap year)
 */
export function dayNumber(iso: string): number | undefined {
  const m = ISO_DATE.exec(iso);
  if (!m) return undefined;
  const y = Number(m[1]);
  const mo = Number(m[2]);
  const d = Number(m[3]);
  if (mo < 1 || mo > 12 || d < 1 || d > daysInMonth(y, mo)) return undefined;
  return dayNumberOf(y, mo, d);
}

/** Day number of a year, month (1-12) and day; no range checks. */
export function dayNumberOf(year: number, month: number, day: number): number {
  const t = new Date(0);
  t.setUTCFullYear(year, month - 1, day); // setUTCFullYear keeps years 0-99 literal
  t.setUTCHours(0, 0, 0, 0);
  return Math.round(t.getTime() / MS_PER_DAY);
}

/**
 * ISO date (`YYYY-MM-DD`) of a day number.
 *
 * @example isoDate(0) // '1970-01-01'
 */
export function isoDate(day: number): string {
  const t = new Date(day * MS_PER_DAY);
  const y = t.getUTCFullYear();
  const m = t.getUTCMonth() + 1;
  const d = t.getUTCDate();
  return `${String(y).padStart(4, '0')}-${m < 10 ? '0' : ''}${m}-${d < 10 ? '0' : ''}${d}`;
}

/** Gregorian leap year rule. @example isLeapYear(2000) // true */
export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

/** Days in a month (1-12) of a year. @example daysInMonth(2024, 2) // 29 */
export function daysInMonth(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28;
  return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
}

/**
 * Day of the year, 1 on 1 January up to 365 or 366: the "J" of FAO-56 (Allen et al., 1998,
 * Eq. 21-25 and Annex 2 Table 2.5).
 *
 * @example dayOfYear('2023-09-03') // 246
 */
export function dayOfYear(iso: string): number {
  const y = Number(iso.slice(0, 4));
  const m = Number(iso.slice(5, 7));
  const d = Number(iso.slice(8, 10));
  return dayNumberOf(y, m, d) - dayNumberOf(y, 1, 1) + 1;
}

/**
 * Consecutive ISO dates starting at `firstIso`.
 *
 * @example consecutiveDates('2024-02-28', 3) // ['2024-02-28', '2024-02-29', '2024-03-01']
 */
export function consecutiveDates(firstIso: string, count: number): string[] {
  const start = dayNumber(firstIso);
  if (start === undefined) throw new RangeError(`not an ISO date: ${firstIso}`);
  // Steps year, month and day as integers and joins a cached "YYYY-" to a cached "MM-DD": one
  // string per day, no Date object (about 1/25 of the time of isoDate per day).
  const out = new Array<string>(count);
  const monthDays = monthDayTexts();
  let y = digits2(firstIso, 0) * 100 + digits2(firstIso, 2);
  let m = digits2(firstIso, 5);
  let d = digits2(firstIso, 8);
  let prefix = `${String(y).padStart(4, '0')}-`;
  let last = daysInMonth(y, m);
  for (let i = 0; i < count; i++) {
    out[i] = prefix + monthDays[m * 32 + d];
    if (++d > last) {
      d = 1;
      if (++m > 12) {
        m = 1;
        y++;
        prefix = `${String(y).padStart(4, '0')}-`;
      }
      last = daysInMonth(y, m);
    }
  }
  return out;
}

let monthDayCache: string[] | undefined;

/** "MM-DD" of every month (1-12) and day (1-31), at index month * 32 + day. */
function monthDayTexts(): string[] {
  if (monthDayCache) return monthDayCache;
  const t = new Array<string>(13 * 32).fill('');
  for (let m = 1; m <= 12; m++) {
    for (let d = 1; d <= 31; d++)
      t[m * 32 + d] = `${m < 10 ? '0' : ''}${m}-${d < 10 ? '0' : ''}${d}`;
  }
  monthDayCache = t;
  return t;
}

/** Days before the first of each month in a common year (index 1-12). */
const DAYS_BEFORE_MONTH = [0, 0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334];

/**
 * Day of year of every date of a series, read from the digits of the ISO text (no Date objects,
 * no substrings).
 *
 * @example dayOfYearSeries(['2024-03-01']) // Uint16Array [61]
 */
export function dayOfYearSeries(dates: readonly string[]): Uint16Array {
  const out = new Uint16Array(dates.length);
  for (let i = 0; i < dates.length; i++) {
    const s = dates[i];
    const m = digits2(s, 5);
    const d = digits2(s, 8);
    out[i] =
      DAYS_BEFORE_MONTH[m] + d + (m > 2 && isLeapYear(digits2(s, 0) * 100 + digits2(s, 2)) ? 1 : 0);
  }
  return out;
}

/**
 * Integer calendar fields of every day of a series, read once from the ISO text so that daily
 * loops never touch strings: the year, the month (1-12), the day of the month and the month-day
 * key `month * 100 + day` (e.g. 1025 for 25 October), which orders like "MM-DD" text.
 */
export interface DayIndex {
  year: Int32Array;
  month: Uint8Array;
  dayOfMonth: Uint8Array;
  monthDay: Uint16Array;
}

/** Two ASCII digits at `at` as a number. */
function digits2(s: string, at: number): number {
  return (s.charCodeAt(at) - 48) * 10 + (s.charCodeAt(at + 1) - 48);
}

/**
 * The integer calendar fields of ISO dates `YYYY-MM-DD` (four-digit years).
 *
 * @example dayIndexOf(['2024-10-25']).monthDay // Uint16Array [1025]
 */
export function dayIndexOf(dates: readonly string[]): DayIndex {
  const n = dates.length;
  const out: DayIndex = {
    year: new Int32Array(n),
    month: new Uint8Array(n),
    dayOfMonth: new Uint8Array(n),
    monthDay: new Uint16Array(n),
  };
  for (let i = 0; i < n; i++) {
    const s = dates[i];
    out.year[i] = digits2(s, 0) * 100 + digits2(s, 2);
    const m = digits2(s, 5);
    const d = digits2(s, 8);
    out.month[i] = m;
    out.dayOfMonth[i] = d;
    out.monthDay[i] = m * 100 + d;
  }
  return out;
}

/**
 * The month-day key (`month * 100 + day`) of "MM-DD" text.
 *
 * @example monthDayKey('04-05') // 405
 */
export function monthDayKey(mmdd: string): number {
  return digits2(mmdd, 0) * 100 + digits2(mmdd, 3);
}
