/**
 * Control-structure schedules resolved to a daily outlet level.
 *
 * A schedule is a list of steps. Yearly steps ("MM-DD") repeat every year: the step in force on a
 * day is the latest one whose date has passed, wrapping from the previous year, so
 * [{ from: '10-25', depthM: 0.3 }, { from: '04-10', depthM: null }] holds the outlet at 0.3 m from
 * late October to early April and leaves it free over the season. Dated steps ("YYYY-MM-DD") are
 * a one-off list; before the first one the outlet is free.
 *
 * A free outlet (the outlet at the drains) has one representation in the core: a step's depth of
 * `null`, and a schedule without steps for a free outlet all the time. The daily series the
 * engine reads holds NaN on those days, the null of a Float64Array. The field file's word "free"
 * is converted to these where the field is resolved (`scenarios/resolve.ts`), and back to words
 * where a schedule is shown.
 */

import { dayIndexOf, monthDayKey, type DayIndex } from '../climate/calendar.js';

export interface OutletStep {
  /** "MM-DD" for a yearly schedule, "YYYY-MM-DD" for a dated list. */
  from: string;
  /** Outlet level, m below the surface; null = free outlet. */
  depthM: number | null;
}

/** The steps of a control structure; no steps: a free outlet all the time. */
export interface OutletSchedule {
  steps: OutletStep[];
}

/** A sortable integer key of a step date: MMDD for "MM-DD", YYYYMMDD for "YYYY-MM-DD". */
export function stepKey(from: string): number {
  return from.length === 5
    ? monthDayKey(from)
    : Number(from.slice(0, 4)) * 10000 + monthDayKey(from.slice(5));
}

/**
 * Daily outlet level for a schedule; NaN where the outlet is free.
 * @param days `dayIndexOf(dates)`, when the caller has it already
 * @example outletSeries(['2020-11-01'], { steps: [{ from: '10-25', depthM: 0.3 }] }) // [0.3]
 */
export function outletSeries(
  dates: readonly string[],
  schedule: OutletSchedule,
  days: DayIndex = dayIndexOf(dates),
): Float64Array {
  const out = new Float64Array(dates.length).fill(NaN);
  if (schedule.steps.length === 0) return out;
  const yearly = schedule.steps[0].from.length === 5;
  const steps = schedule.steps
    .map((s) => ({ key: stepKey(s.from), depth: s.depthM === null ? NaN : s.depthM }))
    .sort((a, b) => a.key - b.key);
  for (let i = 0; i < dates.length; i++) {
    const key = yearly ? days.monthDay[i] : days.year[i] * 10000 + days.monthDay[i];
    // Latest step at or before the day; for a yearly schedule wrap to the last step of the year.
    let depth = yearly ? steps[steps.length - 1].depth : NaN;
    for (const s of steps) {
      if (s.key <= key) depth = s.depth;
      else break;
    }
    out[i] = depth;
  }
  return out;
}
