/**
 * Which format a weather file is in, from its first lines, and reading it in that format:
 * tileflux's own CSV (and any CSV mapped with `columns`), GHCN-Daily exports (wide with a
 * header, or by-station without one) and Daymet single-pixel tables.
 */
import { SettingError } from '../../errors.js';
import { daymetTable, parseDaymet } from './daymet.js';
import { GHCN_BY_STATION_LINE, parseGhcnByStation, parseGhcnWide } from './ghcn.js';
import { parseWeatherCsv, type WeatherReadOptions, type WeatherReadResult } from './parse.js';

/** The weather formats tileflux reads; `auto` detects one of them from the header. */
export const WEATHER_FORMATS = ['auto', 'tileflux', 'ghcn', 'daymet'] as const;
export type WeatherFormat = (typeof WEATHER_FORMATS)[number];

/** What each format is, for help texts. */
export const WEATHER_FORMAT_HELP: Readonly<Record<Exclude<WeatherFormat, 'auto'>, string>> = {
  tileflux:
    "tileflux's own CSV (date, precip_mm, tmax_c, tmin_c, ...; other headers via --columns)",
  ghcn: 'GHCN-Daily CSV export (STATION, DATE, PRCP, TMAX, TMIN with _ATTRIBUTES; or the by-station file in tenths)',
  daymet:
    'Daymet single-pixel CSV (header lines, then year, yday, prcp (mm/day), tmax (deg c), tmin (deg c), ...)',
};

/**
 * The format of a weather file from its first lines: a `year,yday` table line within the first
 * 60 lines is Daymet; a header with STATION, DATE and PRCP or TMAX, or a first row shaped like
 * `ID,YYYYMMDD,ELEMENT,VALUE` is GHCN-Daily; anything else is tileflux's own.
 *
 * @example detectWeatherFormat('date,precip_mm,tmax_c,tmin_c\n') // 'tileflux'
 */
export function detectWeatherFormat(text: string): Exclude<WeatherFormat, 'auto'> {
  if (daymetTable(text) !== undefined) return 'daymet';
  const start = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  const firstLine = text
    .slice(start, start + 4096)
    .split(/\r\n|\r|\n/)
    .find((l) => l.trim() !== '');
  if (firstLine === undefined) return 'tileflux';
  if (GHCN_BY_STATION_LINE.test(firstLine)) return 'ghcn';
  const names = firstLine.split(',').map((h) => h.trim().replace(/^"(.*)"$/, '$1'));
  const has = (h: string) => names.includes(h);
  if (has('STATION') && has('DATE') && (has('PRCP') || has('TMAX'))) return 'ghcn';
  return 'tileflux';
}

/** Options that only tileflux's own format takes. */
const OWN_ONLY = ['columns', 'precipUnit', 'tempUnit', 'where'] as const;
/** Options that only GHCN-Daily files take. */
const GHCN_ONLY = ['station', 'exportUnits'] as const;

/**
 * Read weather text in the given format (detected when `auto` or not given); the result says
 * which format was read and what was done beyond reading (`notes`). An option of another
 * format is a SettingError naming it (the CLI: by its flag).
 */
export function readWeather(text: string, o: WeatherReadOptions = {}): WeatherReadResult {
  const format =
    o.format === undefined || o.format === 'auto' ? detectWeatherFormat(text) : o.format;
  const file = o.file ?? 'weather CSV';
  if (format !== 'tileflux') {
    for (const key of OWN_ONLY) {
      if (o[key] !== undefined) {
        throw new SettingError(
          (n) =>
            `${file}: ${n(key)} applies to tileflux's own format, not to ${format} files` +
            (key === 'where' ? `; choose a GHCN-Daily station with ${n('station')}` : ''),
        );
      }
    }
  } else {
    for (const key of GHCN_ONLY) {
      if (o[key] !== undefined) {
        throw new SettingError(
          (n) =>
            `${file}: ${n(key)} applies to GHCN-Daily files; this one reads as tileflux's own format ` +
            `(give ${n('format')} ghcn if it is one)`,
        );
      }
    }
  }
  if (format === 'daymet') return parseDaymet(text, o);
  if (format === 'ghcn') {
    const first = text
      .replace(/^\uFEFF/, '')
      .trimStart()
      .split(/\r?\n/, 1)[0];
    return GHCN_BY_STATION_LINE.test(first) ? parseGhcnByStation(text, o) : parseGhcnWide(text, o);
  }
  return parseWeatherCsv(text, o);
}
