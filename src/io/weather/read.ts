/** Reading a weather file from disk. */
import { readTextFile } from '../files.js';
import { readWeather } from './formats.js';
import type { WeatherReadOptions, WeatherReadResult } from './parse.js';

/** The text of a weather file, or a one-line error saying why it cannot be read. */
export function readWeatherText(path: string): string {
  return readTextFile(path, 'weather file');
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
