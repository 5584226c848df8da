/**
 * `tileflux weather check` and `tileflux weather make`: check a daily weather CSV and summarise
 * it, or write a synthetic record from the Richardson (1981) weather generator. What both print
 * is built in cli/weatherDisplay.ts. (The file is longer than most: two subcommands, each with its
 * options, its teaching help text and its action.)
 *
 * The reading options live in cli/weatherOptions.ts so
 * that every command reading weather offers the same ones.
 */
import { basename } from 'node:path';
import type { Command } from 'commander';
import { TilefluxError } from '../../errors.js';
import {
  changeClimate,
  fitGenerator,
  recordStatistics,
  DEFAULT_GENERATOR,
  WET_DAY_MM,
  forHemisphere,
  generateWeather,
  summarizeWeather,
  type WeatherSeries,
} from '../../climate/index.js';
import {
  formatWeatherCsv,
  MAX_FILL_DAYS,
  parseWeatherCsv,
  readWeatherFile,
  WEATHER_BOUNDS,
  WEATHER_FORMAT_HELP,
  type WeatherReadResult,
} from '../../io/weather.js';
import {
  addWeatherReadOptions,
  weatherReadNote,
  weatherReadOptions,
  type WeatherReadFlags,
} from '../weatherOptions.js';
import { describeChange, monthlyChange } from '../climateOptions.js';
import { action, emit, quantityOption, parseUnits } from '../common.js';
import { writeFileAtomic } from '../../io/atomicOutput.js';
import { summaryOf } from '../catalog.js';
import { compareJson, compareLines, summaryJson, summaryLines } from '../weatherDisplay.js';

/** Latitude used for reference ET when --latitude is not given, degrees north. */
export const DEFAULT_LATITUDE_DEG = 42;

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

interface CheckFlags extends WeatherReadFlags {
  compare?: string[];
  units?: string;
  latitude?: string;
  elevation?: string;
  json?: boolean;
}

interface MakeFlags extends WeatherReadFlags {
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

const bounds = Object.entries(WEATHER_BOUNDS)
  .map(([v, [lo, hi, unit]]) => `    ${v.padEnd(7)}${lo} to ${hi} ${unit}`)
  .join('\n');

const CHECK_HELP = `
What the file must look like
  A header row, then one row per day with consecutive dates (YYYY-MM-DD). Columns are
  found by name; the unit is the header's suffix:
    date                                   required
    precip_mm or precip_in                 required, daily total
    tmax_c or tmax_f, tmin_c or tmin_f     required, daily maximum and minimum
    ref_et_mm or ref_et_in                       optional reference ET; overrides every method
    solar_mj_m2 or solar_w_m2              optional solar radiation (daily total or mean)
    rh_pct                                 optional daily mean relative humidity
    wind_m_s, wind_km_h or wind_mph        optional wind speed at 2 m
  Other columns are ignored. Name yours with --columns; headers mapped without a suffix are
  in --precip-unit and --temp-unit (mm and c unless given).

What is checked
  Missing columns, dates that are not YYYY-MM-DD, duplicated or unordered dates, missing days
  (the first ones are listed), cells that are not numbers or are empty (NA, NaN and null
  count as empty), negative precipitation, Tmin above Tmax, and values outside these
  physical bounds (beyond them lies a unit mix-up or a missing-value code such as -9999):
${bounds}
  Every problem names the line and column. --fill fills runs of up to ${MAX_FILL_DAYS} missing days or
  empty cells: precipitation 0, everything else interpolated linearly between neighbours.

What is reported
  Period and day count, filled days, annual precipitation (mean, driest and wettest complete
  calendar year), mean annual reference ET and its method, and the snow share of precipitation.
  Reference ET: the ref_et column if present; else FAO Penman-Monteith (FAO-56 Eq. 6) when
  solar, humidity and wind are all present; else Hargreaves (FAO-56 Eq. 52) from Tmax and
  Tmin. Both need the latitude: give --latitude, otherwise ${DEFAULT_LATITUDE_DEG} degrees north is assumed and
  the output says so.

Other formats (--format, detected from the header when not given)
${Object.entries(WEATHER_FORMAT_HELP)
  .map(([k, v]) => `  ${k.padEnd(9)}${v}`)
  .join('\n')}
  GHCN-Daily: --station picks one station of several; a wide export needs --export-units metric
  or standard; missing and quality-flagged values are gaps (--fill). Daymet leaves out
  31 December in leap years: it is filled (precipitation 0, the rest interpolated) and said.

Examples
  tileflux weather check data-demo/weather.csv --latitude 42.5
  tileflux weather check data-demo/weather.csv --units us       (inches and degF)
  tileflux weather check export.csv --station XX000000001 --export-units metric --fill
  tileflux weather check daymet-point.csv
  tileflux weather check --compare data-demo/weather.csv future.csv
  tileflux weather check stations.csv --columns date=DATE,precip=PRCP,tmax=TMAX,tmin=TMIN \\
      --precip-unit in --temp-unit f --where STATION=North --fill --json
`;

const MAKE_HELP = `
The record comes from a stochastic weather generator (Richardson, 1981): wet and dry days
from a first-order Markov chain, gamma-distributed wet-day amounts, and Tmax and Tmin from
seasonal harmonics with day-to-day persistence. Its climate is an invented humid-continental
site: about ${Math.round(expectedAnnualPrecip())} mm of precipitation a year, cold snowy winters and warm summers.
The same --years, --seed, --start-year and --latitude always give the same file.

The file is in tileflux's own form: date,precip_mm,tmax_c,tmin_c. A negative --latitude moves
the seasons half a year (southern hemisphere); the latitude also sets the reference ET in the
printed summary. It is synthetic weather for demonstrations and risk studies, not a record.

With --like FILE the generator's parameters are fitted to your record instead: wet/dry
transition probabilities and gamma wet-day amounts per month (a wet day has ${WET_DAY_MM} mm or more),
Tmax and Tmin harmonics with monthly corrections, their spread and day-to-day persistence.
--precip-change and --temp-change apply delta changes to the fitted or default climate:
precipitation as intensity (every wet-day amount scales by the percentage; the number and
sequence of wet days stay), temperature added to Tmax and Tmin. The output names the climate.

Examples
  tileflux weather make --years 30 --seed 7 --out weather.csv
  tileflux weather make --like data-demo/weather.csv --years 500 --seed 1 --out long.csv
  tileflux weather make --like data-demo/weather.csv --years 30 --seed 1 \\
      --precip-change "djf:+15%,jja:-10%" --temp-change +2C --out future.csv
  tileflux weather make --years 5 --seed 1 --start-year 2001 > short.csv
  tileflux weather make --years 30 --seed 7 --latitude 44 --units us --out weather.csv
      (the file is always in mm and degC; --units us prints its summary in inches and degF)
`;

/** Long-run mean annual precipitation of the default generator, mm (for the help text). */
function expectedAnnualPrecip(): number {
  const p = DEFAULT_GENERATOR;
  const days = [31, 28.25, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
  return days.reduce((sum, d, m) => {
    const pi = p.pWetGivenDry[m] / (1 + p.pWetGivenDry[m] - p.pWetGivenWet[m]);
    return sum + d * pi * p.gammaShape[m] * p.gammaScaleMm[m];
  }, 0);
}

/** Register `tileflux weather check` and `tileflux weather make`. */
export function registerWeather(program: Command): void {
  const weather = program
    .command('weather')
    .summary(summaryOf('weather'))
    .description(
      'Daily weather is what drives every simulation. `weather check` reads a weather CSV the way ' +
        '`run` does, reports its problems with line and column, and summarises it; `weather make` ' +
        'writes a synthetic record for demonstrations and long risk studies.',
    );

  const check = weather
    .command('check')
    .summary('check a weather CSV and summarise it')
    .description(
      'Read a daily weather CSV, report every problem with its line and column, and summarise ' +
        'the record: period, filled days, annual precipitation, reference ET and snow.',
    )
    .argument('[file]', 'daily weather file (any format of --format)');
  addWeatherReadOptions(check)
    .option(
      '--latitude <deg>',
      `site latitude in decimal degrees, negative south (default ${DEFAULT_LATITUDE_DEG}, stated as assumed)`,
    )
    .option(
      '--elevation <m>',
      'site elevation, m or a length such as 900 ft (Penman-Monteith only; default 0)',
    )
    .option(
      '--compare <files...>',
      'compare two records side by side (monthly means, wet-day frequency, extremes, annual totals)',
    )
    .option(
      '--units <system>',
      'units of the printed summary: si (mm, degC) or us (in, degF); JSON stays SI',
      'si',
    )
    .option('--json', 'print the summary as JSON')
    .addHelpText('after', CHECK_HELP)
    .action(
      action((file: string | undefined, f: CheckFlags) => {
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
      }),
    );

  const make = weather
    .command('make')
    .summary('write a synthetic daily weather record')
    .description(
      'Write years of synthetic daily weather (precipitation, Tmax, Tmin) for an invented ' +
        'humid-continental site, as a CSV that every tileflux command reads.',
    )
    .option('--years <n>', 'whole calendar years to generate, 1 to 2000 (required)')
    .option('--seed <s>', 'seed of the random stream, a whole number (required)')
    .option('--start-year <y>', 'first calendar year (default 1991)')
    .option(
      '--latitude <deg>',
      `site latitude, negative south: sets the hemisphere and the summary's reference ET (default ${DEFAULT_LATITUDE_DEG})`,
    )
    .option('-o, --out <file>', 'write the CSV here (default: standard output)')
    .option('-f, --force', 'overwrite --out if it exists')
    .option('--json', 'with --out, print a JSON summary of the written record')
    .option(
      '--units <system>',
      'units of the printed summary: si (mm, degC) or us (in, degF); the file is always mm and degC',
      'si',
    )
    .option(
      '--like <file>',
      'fit the generator to this daily record (any format of --format) instead of the invented site',
    )
    .option(
      '--precip-change <change>',
      'delta change of precipitation intensity: +10% for the year, or per month or season ' +
        '(jan:+5%,djf:+20%); wet-day amounts scale, the number of wet days stays',
    )
    .option(
      '--temp-change <change>',
      'delta change of Tmax and Tmin: +2C (or +3.6F) for the year, or per month or season (jja:+3C)',
    );
  addWeatherReadOptions(make)
    .addHelpText('after', MAKE_HELP)
    .action(
      action((f: MakeFlags) => {
        if (f.years === undefined) throw new TilefluxError('--years is required, e.g. --years 30');
        if (f.seed === undefined) throw new TilefluxError('--seed is required, e.g. --seed 7');
        const years = integerOption(f.years, '--years', 1, 2000)!;
        const seed = integerOption(f.seed, '--seed', 0, Number.MAX_SAFE_INTEGER)!;
        const startYear = integerOption(f.startYear, '--start-year', 1, 9999 - years + 1) ?? 1991;
        const { latitudeDeg, assumed } = latitudeOption(f.latitude);
        if (f.json && f.out === undefined) {
          throw new TilefluxError(
            '--json prints a summary of the written file; give --out FILE too',
          );
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
      }),
    );
}
