/**
 * The figures a planner checks first in a weather record: its period, annual precipitation,
 * mean annual reference ET and how much of the precipitation falls as snow.
 */
import { dayIndexOf } from './calendar.js';
import { referenceEt, type EtMethod } from './referenceEt.js';
import { DEFAULT_SNOW, snowModel, type SnowParams } from './snow.js';
import type { WeatherSeries } from './weatherSeries.js';

/** Total of one calendar year. */
export interface YearTotal {
  year: number;
  mm: number;
}

/** Summary of a weather record. Annual figures come from complete calendar years. */
export interface WeatherSummary {
  firstDate: string;
  lastDate: string;
  days: number;
  /** Calendar years with all their days in the record. */
  completeYears: number[];
  /** Precipitation of each complete year, mm. */
  precipByYear: YearTotal[];
  /**
   * Mean annual precipitation, mm/yr: over complete years, or, when the record holds none, the
   * daily mean times 365.25 (see `annualBasis`).
   */
  precipMeanMmYr: number;
  /** Driest and wettest complete years (undefined without a complete year). */
  precipMin?: YearTotal;
  precipMax?: YearTotal;
  /** Mean annual reference ET, mm/yr, on the same basis as precipitation. */
  refEtMeanMmYr: number;
  refEtMethod: EtMethod;
  /** Snowfall as a percentage of all precipitation in the record (degree-day model). */
  snowSharePercent: number;
  annualBasis: 'complete years' | 'daily mean x 365.25';
}

/**
 * Summarise a weather record: annual precipitation (mean, driest and wettest complete year),
 * mean annual reference ET (referenceEt: FAO-56 Eq. 52 or Eq. 6, or the file's ref_et column) and
 * the snow share of precipitation (snowModel, degree-day method).
 *
 * @param w a gap-free daily record
 * @param latitudeDeg station latitude, decimal degrees (negative south)
 * @param elevationM station elevation, m (Penman-Monteith only)
 * @example summarizeWeather(series, 42).precipMeanMmYr
 */
export function summarizeWeather(
  w: WeatherSeries,
  latitudeDeg: number,
  elevationM = 0,
  snow: SnowParams = DEFAULT_SNOW,
): WeatherSummary {
  const n = w.dates.length;
  if (n === 0) throw new RangeError('summarizeWeather: the record has no days');
  const { refEtMm, method } = referenceEt(w, latitudeDeg, elevationM);
  const s = snowModel(w.precipMm, w.tmaxC, w.tminC, snow);

  const precipByYear: YearTotal[] = [];
  const etByYear: number[] = [];
  let precipTotal = 0;
  let etTotal = 0;
  let snowTotal = 0;
  const years = dayIndexOf(w.dates).year;
  let i = 0;
  while (i < n) {
    const year = years[i];
    const startsJan1 = w.dates[i].endsWith('-01-01');
    let p = 0;
    let e = 0;
    let j = i;
    for (; j < n && years[j] === year; j++) {
      p += w.precipMm[j];
      e += refEtMm[j];
      snowTotal += s.snowfallMm[j];
    }
    precipTotal += p;
    etTotal += e;
    if (startsJan1 && w.dates[j - 1].endsWith('-12-31')) {
      precipByYear.push({ year, mm: p });
      etByYear.push(e);
    }
    i = j;
  }
  const complete = precipByYear.length;
  const mean = (a: number[]) => a.reduce((x, y) => x + y, 0) / a.length;
  let precipMin: YearTotal | undefined;
  let precipMax: YearTotal | undefined;
  for (const t of precipByYear) {
    if (!precipMin || t.mm < precipMin.mm) precipMin = t;
    if (!precipMax || t.mm > precipMax.mm) precipMax = t;
  }
  return {
    firstDate: w.dates[0],
    lastDate: w.dates[n - 1],
    days: n,
    completeYears: precipByYear.map((t) => t.year),
    precipByYear,
    precipMeanMmYr: complete ? mean(precipByYear.map((t) => t.mm)) : (precipTotal / n) * 365.25,
    ...(precipMin && { precipMin }),
    ...(precipMax && { precipMax }),
    refEtMeanMmYr: complete ? mean(etByYear) : (etTotal / n) * 365.25,
    refEtMethod: method,
    snowSharePercent: precipTotal > 0 ? (100 * snowTotal) / precipTotal : 0,
    annualBasis: complete ? 'complete years' : 'daily mean x 365.25',
  };
}
