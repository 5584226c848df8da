/**
 * The water table in the fieldwork windows, for the owner's question "is the field dry enough
 * when I need to get on it?": for each window the median and the 80th-percentile water-table
 * depth over every window day of the period, and the number of years in which the field was too
 * wet for fieldwork on more than half of the window (README "Measures").
 */
import { quantileSorted } from 'simple-statistics';
import { inWindow } from './annual.js';
import type { AnnualRow } from './types.js';

/** One window of one scenario. */
export interface WindowWaterTable {
  scenario: string;
  window: 'spring' | 'fall';
  from: string;
  to: string;
  /** Median water-table depth over all window days of the period, m. */
  medianDepthM: number;
  /** 80th percentile: on 80 % of the window days the water table was at this depth or shallower, m. */
  p80DepthM: number;
  /** Years with fieldwork possible on fewer than half of the window's days. */
  tooWetYears: number;
  years: number;
}

/**
 * Window statistics of one scenario from its daily water-table depths and its annual rows.
 * Percentiles interpolate linearly between ranks (simple-statistics `quantileSorted`).
 *
 * @example windowWaterTable('a', dates, depthM, annual, { springWindow, fallWindow })
 */
export function windowWaterTable(
  scenario: string,
  dates: readonly string[],
  waterTableDepthM: Float64Array,
  annual: readonly AnnualRow[],
  w: { springWindow: { from: string; to: string }; fallWindow: { from: string; to: string } },
): WindowWaterTable[] {
  const rows = annual.filter((r) => r.scenario === scenario);
  const of = (window: 'spring' | 'fall', win: { from: string; to: string }): WindowWaterTable => {
    const depths: number[] = [];
    for (let i = 0; i < dates.length; i++) {
      if (inWindow(dates[i].slice(5), win)) depths.push(waterTableDepthM[i]);
    }
    depths.sort((a, b) => a - b);
    const tooWet = rows.filter((r) =>
      window === 'spring'
        ? r.spring_fieldwork_days < r.spring_window_days / 2
        : r.fall_fieldwork_days < r.fall_window_days / 2,
    ).length;
    return {
      scenario,
      window,
      from: win.from,
      to: win.to,
      medianDepthM: depths.length ? quantileSorted(depths, 0.5) : NaN,
      p80DepthM: depths.length ? quantileSorted(depths, 0.8) : NaN,
      tooWetYears: tooWet,
      years: rows.length,
    };
  };
  return [of('spring', w.springWindow), of('fall', w.fallWindow)];
}
