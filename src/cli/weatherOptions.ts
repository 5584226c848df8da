/**
 * Reading weather with the reading options of a command: `weatherReadOptions` turns the flags
 * (added by `addWeatherReadOptions` of cli/weatherFlags.ts) into library options,
 * `readWeatherOption` reads a file with them. The commands load this module when their action
 * runs: it brings in the weather readers.
 */
import { TilefluxError } from '../errors.js';
import {
  readWeatherFile,
  WEATHER_FORMATS,
  WEATHER_VARIABLES,
  type WeatherReadOptions,
  type WeatherReadResult,
} from '../io/weather.js';
import type { WeatherReadFlags } from './weatherFlags.js';

export type { WeatherReadFlags } from './weatherFlags.js';

/** Turn the raw reading options into WeatherReadOptions, rejecting malformed values. */
export function weatherReadOptions(f: WeatherReadFlags): WeatherReadOptions {
  const o: WeatherReadOptions = { fill: Boolean(f.fill) };
  if (f.format !== undefined) {
    const format = f.format.trim().toLowerCase();
    if (!(WEATHER_FORMATS as readonly string[]).includes(format)) {
      throw new TilefluxError(
        `--format expects one of ${WEATHER_FORMATS.join(', ')}; got ${f.format}`,
      );
    }
    o.format = format as NonNullable<WeatherReadOptions['format']>;
  }
  if (f.columns !== undefined) {
    const columns: Record<string, string> = {};
    for (const pair of f.columns.split(',')) {
      const eq = pair.indexOf('=');
      const key = pair.slice(0, eq).trim().toLowerCase();
      const header = pair.slice(eq + 1).trim();
      if (eq < 0 || key === '' || header === '') {
        throw new TilefluxError(
          '--columns expects VARIABLE=HEADER pairs separated by commas, such as ' +
            `date=DATE,precip=PRCP,tmax=TMAX,tmin=TMIN; got "${f.columns}"`,
        );
      }
      if (!(WEATHER_VARIABLES as readonly string[]).includes(key)) {
        throw new TilefluxError(
          `--columns: unknown variable "${key}"; accepted: ${WEATHER_VARIABLES.join(', ')}`,
        );
      }
      columns[key] = header;
    }
    o.columns = columns;
  }
  if (f.precipUnit !== undefined) {
    const u = f.precipUnit.trim().toLowerCase();
    if (u !== 'mm' && u !== 'in') {
      throw new TilefluxError(`--precip-unit expects mm or in; got ${f.precipUnit}`);
    }
    o.precipUnit = u;
  }
  if (f.tempUnit !== undefined) {
    const u = f.tempUnit.trim().toLowerCase();
    if (u !== 'c' && u !== 'f')
      throw new TilefluxError(`--temp-unit expects c or f; got ${f.tempUnit}`);
    o.tempUnit = u;
  }
  if (f.where !== undefined) {
    const eq = f.where.indexOf('=');
    if (eq <= 0) {
      throw new TilefluxError(
        `--where expects COLUMN=VALUE, such as "station=North"; got "${f.where}"`,
      );
    }
    o.where = { column: f.where.slice(0, eq).trim(), value: f.where.slice(eq + 1).trim() };
  }
  if (f.station !== undefined) {
    if (f.station.trim() === '') throw new TilefluxError('--station expects a station id');
    o.station = f.station.trim();
  }
  if (f.exportUnits !== undefined) {
    const u = f.exportUnits.trim().toLowerCase();
    if (u !== 'metric' && u !== 'standard') {
      throw new TilefluxError(`--export-units expects metric or standard; got ${f.exportUnits}`);
    }
    o.exportUnits = u;
  }
  return o;
}

/**
 * Read a weather file with the reading options of a command.
 *
 * @example readWeatherOption('weather.csv', { format: 'daymet' })
 */
export function readWeatherOption(path: string, flags: WeatherReadFlags): WeatherReadResult {
  return readWeatherFile(path, weatherReadOptions(flags));
}

/** One line on how a file was read: format, period, and what was filled. */
export function weatherReadNote(r: WeatherReadResult): string {
  return [`format ${r.format}`, ...r.notes].join('; ');
}
