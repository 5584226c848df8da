/** Reading a weather file from disk. */
import { readFileSync } from 'node:fs';
import { TilefluxError } from '../../errors.js';
import { readWeather } from './formats.js';
import type { WeatherReadOptions, WeatherReadResult } from './parse.js';

/** The text of a weather file, or a one-line error saying why it cannot be read. */
export function readWeatherText(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'it is a folder'
          : String(code ?? err);
    throw new TilefluxError(`cannot read weather file ${path}: ${why}`);
  }
}

/**
 * Read a weather file in any format tileflux reads (`format`, detected when not given), with the
 * file's name in every message.
 *
 * @example readWeatherFile('data-demo/weather.csv').series.dates.length // 10958
 */
export function readWeatherFile(path: string, o: WeatherReadOptions = {}): WeatherReadResult {
  return readWeather(readWeatherText(path), { ...o, file: o.file ?? path });
}
