/**
 * `tileflux weather check` and `tileflux weather make`: check a daily weather CSV and summarise
 * it, or write a synthetic record from the Richardson (1981) weather generator.
 *
 * The reading options (--columns, --precip-unit, --temp-unit, --where, --fill) are exported as
 * addWeatherReadOptions / weatherReadOptions so that every command reading weather offers the
 * same ones.
 */
import { basename } from 'node:path';
import type { Command } from 'commander';
import { TilefluxError } from '../../errors.js';
import {
  DEFAULT_GENERATOR,
  DEFAULT_SNOW,
  ET_METHOD_SOURCE,
  forHemisphere,
  generateWeather,
  summarizeWeather,
  type WeatherSeries,
  type WeatherSummary,
} from '../../climate/index.js';
import {
  formatWeatherCsv,
  MAX_FILL_DAYS,
  parseWeatherCsv,
  readWeatherFile,
  WEATHER_BOUNDS,
  WEATHER_VARIABLES,
  type WeatherReadOptions,
} from '../../io/weather.js';
import { action, emit, fmt, quantityOption, writeFileAtomic } from '../common.js';

/** Latitude used for reference ET when --latitude is not given, degrees north. */
export const DEFAULT_LATITUDE_DEG = 42;

/** Raw values of the weather reading options, as commander hands them over. */
export interface WeatherReadFlags {
  columns?: string;
  precipUnit?: string;
  tempUnit?: string;
  where?: string;
  fill?: boolean;
}

/** Add the weather reading options to a command (same names and help everywhere). */
export function addWeatherReadOptions(cmd: Command): Command {
  return cmd
    .option(
      '--columns <map>',
      'map variables to your headers: VARIABLE=HEADER pairs separated by commas, variables ' +
        `${WEATHER_VARIABLES.join(', ')} (e.g. date=DATE,precip=PRCP,tmax=TMAX,tmin=TMIN)`,
    )
    .option(
      '--precip-unit <unit>',
      'unit of precipitation and pet columns without a suffix: mm or in (default mm)',
    )
    .option(
      '--temp-unit <unit>',
      'unit of temperature columns without a suffix: c or f (default c)',
    )
    .option(
      '--where <column=value>',
      'keep only rows whose COLUMN equals VALUE (one station of several)',
    )
    .option(
      '--fill',
      `fill runs of up to ${MAX_FILL_DAYS} missing days or empty cells and say how many`,
    );
}

/** Turn the raw reading options into WeatherReadOptions, rejecting malformed values. */
export function weatherReadOptions(f: WeatherReadFlags): WeatherReadOptions {
  const o: WeatherReadOptions = { fill: Boolean(f.fill) };
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
  return o;
}

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

const round2 = (x: number) => Math.round(x * 100) / 100;

/** The summary fields shared by check and make, with units in their names. */
function summaryJson(s: WeatherSummary, latitudeDeg: number, assumed: boolean, elevationM: number) {
  return {
    first_date: s.firstDate,
    last_date: s.lastDate,
    days: s.days,
    complete_years: s.completeYears.length,
    annual_basis: s.annualBasis,
    precip_mean_mm_yr: round2(s.precipMeanMmYr),
    precip_min_mm_yr: s.precipMin ? round2(s.precipMin.mm) : null,
    precip_min_year: s.precipMin?.year ?? null,
    precip_max_mm_yr: s.precipMax ? round2(s.precipMax.mm) : null,
    precip_max_year: s.precipMax?.year ?? null,
    ref_et_mean_mm_yr: round2(s.refEtMeanMmYr),
    ref_et_method: s.refEtMethod,
    latitude_deg: latitudeDeg,
    latitude_assumed: assumed,
    elevation_m: elevationM,
    snow_share_percent: round2(s.snowSharePercent),
  };
}

/** Human lines for the summary figures shared by check and make. */
function summaryLines(s: WeatherSummary, latitudeDeg: number, latitudeNote: string): string[] {
  const years = s.completeYears.length;
  const precip =
    years > 0
      ? `${fmt(s.precipMeanMmYr)} mm/yr, mean of ${years} complete year${years > 1 ? 's' : ''}; ` +
        `driest ${fmt(s.precipMin!.mm)} mm (${s.precipMin!.year}), ` +
        `wettest ${fmt(s.precipMax!.mm)} mm (${s.precipMax!.year})`
      : `${fmt(s.precipMeanMmYr)} mm/yr, scaled from the daily mean (no complete calendar year)`;
  let et = `${fmt(s.refEtMeanMmYr)} mm/yr by ${s.refEtMethod} (${ET_METHOD_SOURCE[s.refEtMethod]})`;
  if (s.refEtMethod !== 'pet column') {
    et += ` at latitude ${latitudeDeg} deg${latitudeNote}`;
  }
  const snow =
    `${fmt(s.snowSharePercent)} % of precipitation falls as snow (degree-day model: snow at a ` +
    `daily mean of ${DEFAULT_SNOW.rainSnowThresholdC} degC or below)`;
  return [`  precipitation  ${precip}`, `  reference ET   ${et}`, `  snow           ${snow}`];
}

interface CheckFlags extends WeatherReadFlags {
  latitude?: string;
  elevation?: string;
  json?: boolean;
}

interface MakeFlags {
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
    pet_mm or pet_in                       optional reference ET; overrides every method
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
  Reference ET: the pet column if present; else FAO Penman-Monteith (FAO-56 Eq. 6) when
  solar, humidity and wind are all present; else Hargreaves (FAO-56 Eq. 52) from Tmax and
  Tmin. Both need the latitude: give --latitude, otherwise ${DEFAULT_LATITUDE_DEG} degrees north is assumed and
  the output says so.

Examples
  tileflux weather check data-demo/weather.csv --latitude 42.5
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

Examples
  tileflux weather make --years 30 --seed 7 --out weather.csv
  tileflux weather make --years 5 --seed 1 --start-year 2001 > short.csv
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
    .summary('check a daily weather CSV, or make a synthetic one')
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
    .argument('<file>', 'daily weather CSV');
  addWeatherReadOptions(check)
    .option(
      '--latitude <deg>',
      `site latitude in decimal degrees, negative south (default ${DEFAULT_LATITUDE_DEG}, stated as assumed)`,
    )
    .option(
      '--elevation <m>',
      'site elevation, m or a length such as 900 ft (Penman-Monteith only; default 0)',
    )
    .option('--json', 'print the summary as JSON')
    .addHelpText('after', CHECK_HELP)
    .action(
      action((file: string, f: CheckFlags) => {
        const o = weatherReadOptions(f);
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
            ...summaryLines(
              s,
              latitudeDeg,
              assumed ? ', assumed: give --latitude for your site' : '',
            ),
          ].join('\n');
        });
      }),
    );

  weather
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
        const params = forHemisphere(DEFAULT_GENERATOR, latitudeDeg);
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
          ...summaryJson(s, latitudeDeg, assumed, 0),
        };
        emit(f.json, json, () =>
          [
            `Wrote ${f.out}: synthetic weather of an invented site, ${s.firstDate} to ${s.lastDate} ` +
              `(${years} years, seed ${seed}, ${s.days} days)`,
            ...summaryLines(s, latitudeDeg, assumed ? ' (the default)' : ''),
          ].join('\n'),
        );
      }),
    );
}
