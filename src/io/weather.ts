/**
 * Daily weather files in and out (the modules are in `io/weather/`): units and bounds
 * (`units.ts`), located problems (`problems.ts`), the CSV record reader (`csvRows.ts`), column
 * resolution (`columns.ts`), tileflux's own format (`parse.ts`), dates, gaps and filling
 * (`assemble.ts`), GHCN-Daily exports (`ghcn.ts`), Daymet tables (`daymet.ts`), format detection
 * (`formats.ts`), reading files (`read.ts`) and the writer (`write.ts`).
 */
export {
  MAX_FILL_DAYS,
  WEATHER_BOUNDS,
  WEATHER_VARIABLES,
  type WeatherVariable,
} from './weather/units.js';
export { WeatherInputError, type WeatherProblem } from './weather/problems.js';
export {
  parseWeatherCsv,
  type WeatherReadOptions,
  type WeatherReadResult,
} from './weather/parse.js';
export { readWeatherFile } from './weather/read.js';
export {
  detectWeatherFormat,
  readWeather,
  WEATHER_FORMAT_HELP,
  WEATHER_FORMATS,
  type WeatherFormat,
} from './weather/formats.js';
export { formatWeatherCsv } from './weather/write.js';
