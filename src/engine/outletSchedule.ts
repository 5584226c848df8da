/**
 * Control-structure schedules resolved to a daily outlet level.
 *
 * A schedule is a list of steps. Yearly steps ("MM-DD") repeat every year: the step in force on a
 * day is the latest one whose date has passed, wrapping from the previous year, so
 * [{ from: '10-25', depth: 0.3 }, { from: '04-10', depth: null }] holds the outlet at 0.3 m from
 * late October to early April and leaves it free over the season. Dated steps ("YYYY-MM-DD") are
 * a one-off list; before the first one the outlet is free. `null` depth means free (the outlet at
 * the drains).
 */

export interface OutletStep {
  /** "MM-DD" for a yearly schedule, "YYYY-MM-DD" for a dated list. */
  from: string;
  /** Outlet level, m below the surface; null = free outlet. */
  depthM: number | null;
}

export type OutletSchedule = 'free' | { steps: OutletStep[] };

/**
 * Daily outlet level for a schedule; NaN where the outlet is free.
 * @example outletSeries(['2020-11-01'], { steps: [{ from: '10-25', depthM: 0.3 }] }) // [0.3]
 */
export function outletSeries(dates: string[], schedule: OutletSchedule): Float64Array {
  const out = new Float64Array(dates.length).fill(NaN);
  if (schedule === 'free' || schedule.steps.length === 0) return out;
  const yearly = schedule.steps[0].from.length === 5;
  const steps = [...schedule.steps].sort((a, b) =>
    a.from < b.from ? -1 : a.from > b.from ? 1 : 0,
  );
  for (let i = 0; i < dates.length; i++) {
    const key = yearly ? dates[i].slice(5) : dates[i];
    // Latest step at or before the day; for a yearly schedule wrap to the last step of the year.
    let active: OutletStep | undefined = yearly ? steps[steps.length - 1] : undefined;
    for (const s of steps) {
      if (s.from <= key) active = s;
      else break;
    }
    if (active && active.depthM !== null) out[i] = active.depthM;
  }
  return out;
}
