/**
 * What `tileflux weather check` and `weather make` print: the summary of a record (precipitation,
 * reference ET, snow) as JSON fields and as lines, and the side-by-side statistics of two
 * records (`weather check --compare`), in SI or US units.
 */
import { basename } from 'node:path';
import {
  DEFAULT_SNOW,
  ET_METHOD_SOURCE,
  WET_DAY_MM,
  type RecordStatistics,
  type WeatherSummary,
} from '../climate/index.js';
import { US, type UnitSystem } from '../units/quantity.js';
import { fixedText, roundTo } from '../units/decimal.js';

/** Rounded to 0.01 for JSON figures. */
/** The summary fields shared by check and make, with units in their names. */
export function summaryJson(
  s: WeatherSummary,
  latitudeDeg: number,
  assumed: boolean,
  elevationM: number,
) {
  return {
    first_date: s.firstDate,
    last_date: s.lastDate,
    days: s.days,
    complete_years: s.completeYears.length,
    annual_basis: s.annualBasis,
    precip_mean_mm_yr: roundTo(s.precipMeanMmYr, 2),
    precip_min_mm_yr: s.precipMin ? roundTo(s.precipMin.mm, 2) : null,
    precip_min_year: s.precipMin?.year ?? null,
    precip_max_mm_yr: s.precipMax ? roundTo(s.precipMax.mm, 2) : null,
    precip_max_year: s.precipMax?.year ?? null,
    ref_et_mean_mm_yr: roundTo(s.refEtMeanMmYr, 2),
    ref_et_method: s.refEtMethod,
    latitude_deg: latitudeDeg,
    latitude_assumed: assumed,
    elevation_m: elevationM,
    snow_share_percent: roundTo(s.snowSharePercent, 2),
  };
}

/** How the weather summaries show depths of water and temperatures in a unit system. */
function weatherDisplay(units: UnitSystem) {
  const us = units === 'us';
  return {
    /** A depth of water from mm, with its unit: "944.9 mm" or "37.20 in". */
    water: (mm: number, d = 1) =>
      us ? `${fixedText(mm / US.mmPerIn, d + 1)} in` : `${fixedText(mm, d)} mm`,
    waterUnit: us ? 'in' : 'mm',
    /** A depth of water from mm without its unit. */
    waterValue: (mm: number, d = 1) => (us ? fixedText(mm / US.mmPerIn, d + 1) : fixedText(mm, d)),
    /** A temperature from degC without its unit (degF by 9/5 C + 32). */
    temp: (c: number, d = 1) => fixedText(us ? (c * 9) / 5 + 32 : c, d),
    tempUnit: us ? 'degF' : 'degC',
  };
}

/** Human lines for the summary figures shared by check and make, in `units`. */
export function summaryLines(
  s: WeatherSummary,
  latitudeDeg: number,
  latitudeNote: string,
  units: UnitSystem = 'si',
): string[] {
  const u = weatherDisplay(units);
  const years = s.completeYears.length;
  const precip =
    years > 0
      ? `${u.water(s.precipMeanMmYr)}/yr, mean of ${years} complete year${years > 1 ? 's' : ''}; ` +
        `driest ${u.water(s.precipMin!.mm)} (${s.precipMin!.year}), ` +
        `wettest ${u.water(s.precipMax!.mm)} (${s.precipMax!.year})`
      : `${u.water(s.precipMeanMmYr)}/yr, scaled from the daily mean (no complete calendar year)`;
  let et = `${u.water(s.refEtMeanMmYr)}/yr by ${s.refEtMethod} (${ET_METHOD_SOURCE[s.refEtMethod]})`;
  if (s.refEtMethod !== 'ref_et column') {
    et += ` at latitude ${latitudeDeg} deg${latitudeNote}`;
  }
  const snow =
    `${fixedText(s.snowSharePercent, 1)} % of precipitation falls as snow (degree-day model: snow at a ` +
    `daily mean of ${units === 'us' ? u.temp(DEFAULT_SNOW.rainSnowThresholdC) : DEFAULT_SNOW.rainSnowThresholdC} ${u.tempUnit} or below)`;
  return [`  precipitation  ${precip}`, `  reference ET   ${et}`, `  snow           ${snow}`];
}

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ');

/** Annual totals of complete years: mean, standard deviation, driest, wettest (mm). */
function annual(s: RecordStatistics) {
  const a = s.annualTotalsMm;
  if (a.length === 0) return { years: 0, mean_mm: null, sd_mm: null, min_mm: null, max_mm: null };
  const mean = a.reduce((x, y) => x + y, 0) / a.length;
  const sd = Math.sqrt(a.reduce((x, y) => x + (y - mean) ** 2, 0) / Math.max(1, a.length - 1));
  return {
    years: a.length,
    mean_mm: roundTo(mean, 2),
    sd_mm: roundTo(sd, 2),
    min_mm: roundTo(Math.min(...a), 2),
    max_mm: roundTo(Math.max(...a), 2),
  };
}

/** The statistics of one record for JSON, rounded. */
function statisticsJson(file: string, s: RecordStatistics) {
  return {
    file: basename(file),
    first_date: s.firstDate,
    last_date: s.lastDate,
    days: s.days,
    precip_month_mm: s.precipMonthMm.map((x) => roundTo(x, 2)),
    wet_day_fraction: s.wetDayFraction.map((x) => roundTo(x, 3)),
    tmax_month_c: s.tmaxMonthC.map((x) => roundTo(x, 2)),
    tmin_month_c: s.tminMonthC.map((x) => roundTo(x, 2)),
    annual_precip: annual(s),
    max_daily_precip_mm: roundTo(s.maxDailyPrecipMm, 2),
    max_daily_precip_date: s.maxDailyPrecipDate,
    max_tmax_c: roundTo(s.maxTmaxC, 2),
    min_tmin_c: roundTo(s.minTminC, 2),
  };
}

export function compareJson(files: string[], a: RecordStatistics, b: RecordStatistics) {
  return { wet_day_mm: WET_DAY_MM, a: statisticsJson(files[0], a), b: statisticsJson(files[1], b) };
}

/** Side-by-side table of two records' statistics, in `units`. */
export function compareLines(
  files: string[],
  a: RecordStatistics,
  b: RecordStatistics,
  units: UnitSystem = 'si',
): string[] {
  const u = weatherDisplay(units);
  const pad = (x: string) => x.padStart(7);
  const pairWater = (x: number, y: number) => `${pad(u.waterValue(x))} ${pad(u.waterValue(y))}`;
  const pairTemp = (x: number, y: number) => `${pad(u.temp(x))} ${pad(u.temp(y))}`;
  const pair = (x: number, y: number, d: number) =>
    `${pad(fixedText(x, d))} ${pad(fixedText(y, d))}`;
  const lines = [
    `A = ${files[0]} (${a.firstDate} to ${a.lastDate}), B = ${files[1]} (${b.firstDate} to ${b.lastDate})`,
    `month   precip ${u.waterUnit}/month   wet-day share (>= ${units === 'us' ? `${fixedText(WET_DAY_MM / US.mmPerIn, 3)} in` : `${WET_DAY_MM} mm`})   mean Tmax ${u.tempUnit}   mean Tmin ${u.tempUnit}`,
    `             A       B               A       B            A       B        A       B`,
  ];
  for (let m = 0; m < 12; m++) {
    lines.push(
      `${MONTHS[m]}   ${pairWater(a.precipMonthMm[m], b.precipMonthMm[m])}       ${pair(a.wetDayFraction[m], b.wetDayFraction[m], 3)}    ${pairTemp(a.tmaxMonthC[m], b.tmaxMonthC[m])}  ${pairTemp(a.tminMonthC[m], b.tminMonthC[m])}`,
    );
  }
  const ya = annual(a);
  const yb = annual(b);
  const yearLine = (y: ReturnType<typeof annual>) =>
    y.years === 0
      ? 'no complete year'
      : `mean ${u.water(y.mean_mm!, 0)}, sd ${u.waterValue(y.sd_mm!, 0)}, driest ${u.waterValue(y.min_mm!, 0)}, wettest ${u.waterValue(y.max_mm!, 0)} (${y.years} years)`;
  lines.push(
    `annual precipitation  A: ${yearLine(ya)}`,
    `                      B: ${yearLine(yb)}`,
    `extremes  largest day A ${u.water(a.maxDailyPrecipMm)} (${a.maxDailyPrecipDate}), B ${u.water(b.maxDailyPrecipMm)} (${b.maxDailyPrecipDate}); ` +
      `highest Tmax A ${u.temp(a.maxTmaxC)}, B ${u.temp(b.maxTmaxC)} ${u.tempUnit}; lowest Tmin A ${u.temp(a.minTminC)}, B ${u.temp(b.minTminC)} ${u.tempUnit}`,
  );
  return lines;
}
