/**
 * `tileflux weather check` and `tileflux weather make`: check a daily weather CSV and summarise
 * it, or write a synthetic record from the Richardson (1981) weather generator. What both print
 * is built in cli/weatherDisplay.ts. (The file is longer than most: two subcommands, each with its
 * options and its teaching help text.)
 *
 * The reading options live in cli/weatherFlags.ts so that every command reading weather offers
 * the same ones. The actions are in cli/actions/weather.ts, loaded when a subcommand runs.
 */
import type { Command } from 'commander';
import { DEFAULT_GENERATOR } from '../../climate/weatherGenerator.js';
import { WET_DAY_MM } from '../../climate/generatorFit.js';
import { MAX_FILL_DAYS, WEATHER_BOUNDS } from '../../io/weather/units.js';
import { addWeatherReadOptions } from '../weatherFlags.js';
import { WEATHER_FORMAT_HELP } from '../helpFacts.js';
import { action } from '../common.js';
import { summaryOf } from '../catalog.js';
import type { CheckFlags, MakeFlags } from '../actions/weather.js';

/** Latitude used for reference ET when --latitude is not given, degrees north. */
export const DEFAULT_LATITUDE_DEG = 42;

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
      action(async (file: string | undefined, f: CheckFlags) =>
        (await import('../actions/weather.js')).weatherCheck(file, f),
      ),
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
    .action(action(async (f: MakeFlags) => (await import('../actions/weather.js')).weatherMake(f)));
}
