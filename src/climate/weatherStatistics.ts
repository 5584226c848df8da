/**
 * The statistics by which two daily records are compared (`weather check --compare`) and a
 * generated record is judged against the one it was fitted to: monthly means, wet-day
 * frequencies, extremes and annual totals.
 */
import { monthIndexSeries, WET_DAY_MM } from './generatorFit.js';
import type { WeatherSeries } from './weatherSeries.js';

/** Mean length of each month over the 400-year Gregorian cycle, days (February 28.2425). */
export const MEAN_MONTH_DAYS = [31, 28.2425, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** Statistics of a daily record. Monthly arrays run January to December. */
export interface RecordStatistics {
  days: number;
  firstDate: string;
  lastDate: string;
  /** Mean monthly precipitation, mm: mean daily precipitation of the month x its mean length. */
  precipMonthMm: number[];
  /** Share of days with at least WET_DAY_MM of precipitation. */
  wetDayFraction: number[];
  /** Mean daily maximum and minimum temperature, degC. */
  tmaxMonthC: number[];
  tminMonthC: number[];
  /** Totals of complete calendar years, mm (empty without one). */
  annualTotalsMm: number[];
  /** Largest daily precipitation (mm) and its date; highest Tmax and lowest Tmin, degC. */
  maxDailyPrecipMm: number;
  maxDailyPrecipDate: string;
  maxTmaxC: number;
  minTminC: number;
}

/**
 * Compute the statistics of a gap-free daily record.
 *
 * @example recordStatistics(series).wetDayFraction[6] // share of wet July days
 */
export function recordStatistics(w: WeatherSeries): RecordStatistics {
  const n = w.dates.length;
  const month = monthIndexSeries(w.dates);
  const count = new Float64Array(12);
  const precip = new Float64Array(12);
  const wet = new Float64Array(12);
  const tmax = new Float64Array(12);
  const tmin = new Float64Array(12);
  let maxP = -Infinity;
  let maxPAt = 0;
  let maxT = -Infinity;
  let minT = Infinity;
  const annualTotalsMm: number[] = [];
  let yearSum = 0;
  let yearStart = 0;
  for (let i = 0; i < n; i++) {
    const m = month[i];
    const p = w.precipMm[i];
    count[m]++;
    precip[m] += p;
    if (p >= WET_DAY_MM) wet[m]++;
    tmax[m] += w.tmaxC[i];
    tmin[m] += w.tminC[i];
    if (p > maxP) {
      maxP = p;
      maxPAt = i;
    }
    if (w.tmaxC[i] > maxT) maxT = w.tmaxC[i];
    if (w.tminC[i] < minT) minT = w.tminC[i];
    if (w.dates[i].endsWith('-01-01')) {
      yearSum = 0;
      yearStart = i;
    }
    yearSum += p;
    if (w.dates[i].endsWith('-12-31') && w.dates[yearStart].endsWith('-01-01') && i >= 364) {
      if (w.dates[yearStart].slice(0, 4) === w.dates[i].slice(0, 4)) annualTotalsMm.push(yearSum);
    }
  }
  const per = (a: Float64Array, scale = (_m: number) => 1) =>
    Array.from(a, (s, m) => (count[m] > 0 ? (s / count[m]) * scale(m) : NaN));
  return {
    days: n,
    firstDate: w.dates[0],
    lastDate: w.dates[n - 1],
    precipMonthMm: per(precip, (m) => MEAN_MONTH_DAYS[m]),
    wetDayFraction: per(wet),
    tmaxMonthC: per(tmax),
    tminMonthC: per(tmin),
    annualTotalsMm,
    maxDailyPrecipMm: maxP,
    maxDailyPrecipDate: w.dates[maxPAt],
    maxTmaxC: maxT,
    minTminC: minT,
  };
}
