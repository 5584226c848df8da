/**
 * Daily reference evapotranspiration for a whole weather record, choosing the method from the
 * columns present, in the order FAO-56 (Allen et al., 1998) recommends:
 *
 * 1. a `ref_et_mm` (or `ref_et_in`) column in the file is taken as given (the user's own ET0
 *    overrides every method);
 * 2. FAO Penman-Monteith (FAO-56 Eq. 6) when solar radiation, relative humidity and wind are all
 *    present;
 * 3. Hargreaves (FAO-56 Eq. 52) from Tmax and Tmin and the latitude otherwise.
 */
import { dayOfYearSeries } from './calendar.js';
import { extraterrestrialRadiation } from './extraterrestrialRadiation.js';
import { hargreavesRefEt } from './hargreaves.js';
import { penmanMonteithRefEt, vapourPressureFromRhMean } from './penmanMonteith.js';
import type { WeatherSeries } from './weatherSeries.js';

/** How the reference ET of a record was obtained. */
export type EtMethod = 'ref_et column' | 'FAO Penman-Monteith' | 'Hargreaves';

/** Equation reference for each method, for reports and help text. */
export const ET_METHOD_SOURCE: Readonly<Record<EtMethod, string>> = {
  'ref_et column': 'given in the weather file',
  'FAO Penman-Monteith': 'FAO-56 Eq. 6',
  Hargreaves: 'FAO-56 Eq. 52',
};

/**
 * Known bias of Hargreaves' equation, said wherever it is used: calibrated on a semi-arid
 * lysimeter record, it overestimates ET0 in humid climates, by of the order of 10-25 % against
 * Penman-Monteith in humid temperate regions (FAO-56 section on Eq. 52 advises checking it
 * against Penman-Monteith locally; published humid-region comparisons, from memory). Field files
 * can correct it with weather.etFactor from a local comparison.
 */
export const HARGREAVES_BIAS =
  'Hargreaves tends to overestimate ET0 in humid climates, by about 10-25 % (from memory); set weather.etFactor from a local Penman-Monteith comparison';

/**
 * Daily reference ET, mm/d, of a weather record, and the method used.
 *
 * @param w the weather record
 * @param latitudeDeg station latitude, decimal degrees (negative south); used for Ra
 * @param elevationM station elevation, m (Penman-Monteith only; default 0, sea level)
 * @example referenceEt(series, 42).method // 'Hargreaves' when only P, Tmax, Tmin are given
 */
export function referenceEt(
  w: WeatherSeries,
  latitudeDeg: number,
  elevationM = 0,
): { refEtMm: Float64Array; method: EtMethod } {
  const n = w.dates.length;
  if (w.refEtMm) return { refEtMm: Float64Array.from(w.refEtMm), method: 'ref_et column' };
  const et = new Float64Array(n);
  // Ra depends only on the day of year: compute the 366 values once.
  const raByDoy = new Float64Array(367);
  for (let j = 1; j <= 366; j++) raByDoy[j] = extraterrestrialRadiation(latitudeDeg, j);
  const { solarMJm2: rs, rhMeanPct: rh, wind2mMs: u2 } = w;
  const doy = dayOfYearSeries(w.dates);
  if (rs && rh && u2) {
    for (let i = 0; i < n; i++) {
      const tmax = w.tmaxC[i];
      const tmin = w.tminC[i];
      et[i] = penmanMonteithRefEt({
        tmaxC: tmax,
        tminC: tmin,
        eaKPa: vapourPressureFromRhMean(rh[i], tmax, tmin),
        rsMJm2: rs[i],
        raMJm2: raByDoy[doy[i]],
        u2Ms: u2[i],
        elevationM,
      });
    }
    return { refEtMm: et, method: 'FAO Penman-Monteith' };
  }
  for (let i = 0; i < n; i++) et[i] = hargreavesRefEt(w.tmaxC[i], w.tminC[i], raByDoy[doy[i]]);
  return { refEtMm: et, method: 'Hargreaves' };
}
