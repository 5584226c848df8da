/**
 * Writing tileflux's own weather CSV: `date,precip_mm,tmax_c,tmin_c` plus any optional columns,
 * with fixed decimals so the same series always gives the same bytes.
 */
import type { WeatherSeries } from '../../climate/weatherSeries.js';
import { fixedText } from '../../units/decimal.js';

/** Columns of tileflux's own weather CSV: header, series field, decimals. */
const OWN_COLUMNS: ReadonlyArray<[string, keyof Omit<WeatherSeries, 'dates'>, number]> = [
  ['precip_mm', 'precipMm', 2],
  ['tmax_c', 'tmaxC', 1],
  ['tmin_c', 'tminC', 1],
  ['ref_et_mm', 'refEtMm', 2],
  ['solar_mj_m2', 'solarMJm2', 2],
  ['rh_pct', 'rhMeanPct', 1],
  ['wind_m_s', 'wind2mMs', 2],
];

/**
 * Write a series as tileflux's own CSV: `date,precip_mm,tmax_c,tmin_c` then whichever of
 * `ref_et_mm,solar_mj_m2,rh_pct,wind_m_s` the series has; LF line ends; fixed decimals (2 for
 * depths, speed and radiation, 1 for temperature and humidity), so output is byte-identical for
 * the same series and reads back with parseWeatherCsv.
 *
 * @example formatWeatherCsv(series) // 'date,precip_mm,tmax_c,tmin_c\n2024-05-01,12.70,20.0,10.0\n'
 */
export function formatWeatherCsv(w: WeatherSeries): string {
  const used = OWN_COLUMNS.filter(([, key]) => w[key] !== undefined);
  const arrays = used.map(([, key]) => w[key] as Float64Array);
  const decimals = used.map(([, , d]) => d);
  const out: string[] = ['date,' + used.map(([h]) => h).join(',')];
  for (let i = 0; i < w.dates.length; i++) {
    let row = w.dates[i];
    for (let k = 0; k < arrays.length; k++) {
      row += ',' + fixedText(arrays[k][i], decimals[k]);
    }
    out.push(row);
  }
  return out.join('\n') + '\n';
}
