/**
 * What `tileflux weather check` and `tileflux weather make` do (registered in
 * cli/commands/weather.ts): read, check and summarise a record, or write a synthetic one. What
 * both print is built in cli/weatherDisplay.ts.
 */
import { basename } from 'node:path';
import { TilefluxError } from '../../errors.js';
import {
  changeClimate,
  fitGenerator,
  recordStatistics,
  DEFAULT_GENERATOR,
  forHemisphere,
  generateWeather,
  summarizeWeather,
  type WeatherSeries,
} from '../../climate/index.js';
import {
  formatWeatherCsv,
  parseWeatherCsv,
  readWeatherFile,
  type WeatherReadResult,
} from '../../io/weather.js';
import { weatherReadNote, weatherReadOptions, type WeatherReadFlags } from '../weatherOptions.js';
import { describeChange, monthlyChange } from '../climateOptions.js';
import { emit, parseUnits } from '../common.js';
import { quantityOption } from '../quantityOptions.js';
import { writeFileAtomic } from '../../io/atomicOutput.js';
import { DEFAULT_LATITUDE_DEG } from '../commands/weather.js';
import { compareJson, compareLines, summaryJson, summaryLines } from '../weatherDisplay.js';

/** --latitude in degrees (default DEFAULT_LATITUDE_DEG), checked to lie in -90..90. */
function latitudeOption(value: string | undefined): { latitudeDeg: number; assumed: boolean } {
  const lat = quantityOption(value, 'latitude', '--latitude');
  if (lat === undefined) return { latitudeDeg: DEFAULT_LATITUDE_DEG, assumed: true };
  if (!(lat >= -90 && lat <= 90)) {
    throw new TilefluxError(
      `--latitude expects degrees from -90 (south) to 90 (north); got ${value}`,
    );
  }
  return { latitudeDeg: lat, assumed: false };
}

/** A whole-number option within a range. */
function integerOption(
  value: string | undefined,
  option: string,
  lo: number,
  hi: number,
): number | undefined {
  if (value === undefined) return undefined;
  const x = Number(value);
  if (!/^\s*\d+\s*$/.test(value) || !Number.isSafeInteger(x) || x < lo || x > hi) {
    throw new TilefluxError(`${option} expects a whole number from ${lo} to ${hi}; got ${value}`);
  }
  return x;
}

/** The options of `weather check`. */
export interface CheckFlags extends WeatherReadFlags {
  compare?: string[];
  units?: string;
  latitude?: string;
  elevation?: string;
  json?: boolean;
}

/** The options of `weather make`. */
export interface MakeFlags extends WeatherReadFlags {
  like?: string;
  units?: string;
  precipChange?: string;
  tempChange?: string;
  years?: string;
  seed?: string;
  latitude?: string;
  startYear?: string;
  out?: string;
  force?: boolean;
  json?: boolean;
}

/** Check and summarise the weather file `file` (or compare two with --compare). */
export function weatherCheck(file: string | undefined, f: CheckFlags): void {
  const o = weatherReadOptions(f);
  if (f.compare !== undefined) {
    if (f.compare.length !== 2 || file !== undefined) {
      throw new TilefluxError(
        '--compare expects exactly two weather files: weather check --compare A.csv B.csv',
      );
    }
    const [a, b] = f.compare.map((path) => readWeatherFile(path, o));
    const sa = recordStatistics(a.series);
    const sb = recordStatistics(b.series);
    emit(f.json, compareJson(f.compare, sa, sb), () =>
      compareLines(f.compare!, sa, sb, parseUnits(f.units)).join('\n'),
    );
    return;
  }
  if (file === undefined) {
    throw new TilefluxError('give a weather file, or --compare A.csv B.csv');
  }
  const { latitudeDeg, assumed } = latitudeOption(f.latitude);
  const elevationM = quantityOption(f.elevation, 'length', '--elevation') ?? 0;
  if (!(elevationM >= -500 && elevationM <= 9000)) {
    throw new TilefluxError(`--elevation expects -500 to 9000 m; got ${f.elevation}`);
  }
  const r = readWeatherFile(file, o);
  const s = summarizeWeather(r.series, latitudeDeg, elevationM);
  const json = {
    file: basename(file),
    where: o.where ? `${o.where.column}=${o.where.value}` : null,
    columns: r.columnsUsed,
    units: r.unitsUsed,
    format: r.format,
    notes: r.notes,
    filled_days: r.filledDays,
    ...summaryJson(s, latitudeDeg, assumed, elevationM),
  };
  emit(f.json, json, () => {
    const cols = Object.entries(r.columnsUsed)
      .map(([v, h]) => (v === 'date' ? `${v}=${h}` : `${v}=${h} (${r.unitsUsed[v]})`))
      .join(', ');
    const filled = r.filledDays === 0 ? 'none filled' : `${r.filledDays} filled (--fill)`;
    return [
      `${file}${o.where ? `, rows where ${o.where.column} = ${o.where.value}` : ''}: ` +
        `${s.firstDate} to ${s.lastDate}, ${s.days} days, ${filled}`,
      `  columns        ${cols}`,
      `  read as        ${weatherReadNote(r)}`,
      ...summaryLines(
        s,
        latitudeDeg,
        assumed ? ', assumed: give --latitude for your site' : '',
        parseUnits(f.units),
      ),
    ].join('\n');
  });
}

/** Write a synthetic weather record. */
export function weatherMake(f: MakeFlags): void {
  if (f.years === undefined) throw new TilefluxError('--years is required, e.g. --years 30');
  if (f.seed === undefined) throw new TilefluxError('--seed is required, e.g. --seed 7');
  const years = integerOption(f.years, '--years', 1, 2000)!;
  const seed = integerOption(f.seed, '--seed', 0, Number.MAX_SAFE_INTEGER)!;
  const startYear = integerOption(f.startYear, '--start-year', 1, 9999 - years + 1) ?? 1991;
  const { latitudeDeg, assumed } = latitudeOption(f.latitude);
  if (f.json && f.out === undefined) {
    throw new TilefluxError('--json prints a summary of the written file; give --out FILE too');
  }
  let like: WeatherReadResult | undefined;
  let params = forHemisphere(DEFAULT_GENERATOR, latitudeDeg);
  if (f.like !== undefined) {
    like = readWeatherFile(f.like, weatherReadOptions(f));
    params = fitGenerator(like.series);
  }
  const precipChange = monthlyChange(f.precipChange, '--precip-change', 'precip');
  const tempChange = monthlyChange(f.tempChange, '--temp-change', 'temp');
  const changed = [...precipChange, ...tempChange].some((x) => x !== 0);
  if (changed) {
    params = changeClimate(params, {
      precipChangePct: precipChange,
      tempChangeC: tempChange,
    });
  }
  const climate =
    (like
      ? `fitted to ${basename(f.like!)} (${like.series.dates[0]} to ${like.series.dates.at(-1)})`
      : 'the invented humid-continental site') +
    (changed
      ? `; precipitation intensity ${describeChange(precipChange, '%')}, ` +
        `temperature ${describeChange(tempChange, ' degC')} (delta change)`
      : '');
  const csv = formatWeatherCsv(generateWeather({ years, seed, startYear, params }));
  if (f.out === undefined) {
    process.stdout.write(csv);
    return;
  }
  writeFileAtomic(f.out, csv, Boolean(f.force));
  // Summarise what was written (rounded values), so it matches `weather check` on the file.
  const written: WeatherSeries = parseWeatherCsv(csv, { file: f.out }).series;
  const s = summarizeWeather(written, latitudeDeg);
  const json = {
    file: f.out,
    years,
    seed,
    start_year: startYear,
    climate,
    precip_change_percent: precipChange,
    temp_change_c: tempChange,
    ...summaryJson(s, latitudeDeg, assumed, 0),
  };
  emit(f.json, json, () =>
    [
      `Wrote ${f.out}: synthetic weather${like ? '' : ' of an invented site'}, ${s.firstDate} to ${s.lastDate} ` +
        `(${years} years, seed ${seed}, ${s.days} days)`,
      `  climate        ${climate}`,
      ...summaryLines(s, latitudeDeg, assumed ? ' (the default)' : '', parseUnits(f.units)),
    ].join('\n'),
  );
}
