/**
 * Fertilizer and manure events placed on the days of a run. An "MM-DD" event repeats every year,
 * a "YYYY-MM-DD" event happens once; either may be restricted to the years in which given crops
 * are grown (nitrogen goes on corn, not on soybean, in a corn-soybean rotation: common practice).
 * A year's crops are the crops with an in-season day in that calendar year of the crop calendar.
 * An "MM-DD" of 02-29 applies in leap years only.
 */
import { dayIndexOf, monthDayKey, type DayIndex } from '../climate/calendar.js';
import type { CropCalendar } from '../engine/types.js';
import type { FertilizerEvent } from './types.js';

const normal = (name: string) => name.trim().toLowerCase();

/**
 * Daily N applied (kg N/ha) for the events, aligned with `dates` (`days`: `dayIndexOf(dates)`,
 * when the caller has it already).
 *
 * @example
 * dailyFertilizer(['2024-04-19', '2024-04-20'], [{ date: '04-20', amountKgHa: 150 }], calendar)
 * // Float64Array [0, 150]
 */
export function dailyFertilizer(
  dates: readonly string[],
  events: readonly FertilizerEvent[],
  calendar: CropCalendar,
  days: DayIndex = dayIndexOf(dates),
): Float64Array {
  const n = dates.length;
  const out = new Float64Array(n);
  if (events.length === 0) return out;
  // Crops grown in each year, from the calendar.
  const cropsByYear = new Map<number, Set<string>>();
  for (let i = 0; i < n; i++) {
    const code = calendar.crop[i];
    if (code === 0) continue;
    const year = days.year[i];
    let set = cropsByYear.get(year);
    if (!set) cropsByYear.set(year, (set = new Set()));
    set.add(normal(calendar.crops[code - 1]));
  }
  for (const ev of events) {
    const wanted = ev.crops?.map(normal);
    const repeats = ev.date.length === 5;
    const md = monthDayKey(ev.date.slice(repeats ? 0 : 5));
    const year = repeats ? 0 : Number(ev.date.slice(0, 4));
    for (let i = 0; i < n; i++) {
      if (days.monthDay[i] !== md || (!repeats && days.year[i] !== year)) continue;
      if (wanted) {
        const grown = cropsByYear.get(days.year[i]);
        if (!grown || !wanted.some((c) => grown.has(c))) continue;
      }
      out[i] += ev.amountKgHa;
    }
  }
  return out;
}
