/**
 * The weather reading options every command that reads weather offers (`run`, `weather check`,
 * and any other): --format, --columns, --precip-unit, --temp-unit, --where, --station,
 * --export-units, --fill. `addWeatherReadOptions` adds them with the same names and help
 * everywhere; cli/weatherOptions.ts turns the flags into library options and reads a file with
 * them. This module is loaded with the command's options, for its `--help` too, so it imports
 * only the lists the help names (not the readers).
 */
import type { Command } from 'commander';
import { MAX_FILL_DAYS, WEATHER_VARIABLES } from '../io/weather/units.js';
import { WEATHER_FORMATS } from './helpFacts.js';

/** Raw values of the weather reading options, as commander hands them over. */
export interface WeatherReadFlags {
  format?: string;
  columns?: string;
  precipUnit?: string;
  tempUnit?: string;
  where?: string;
  station?: string;
  exportUnits?: string;
  fill?: boolean;
}

/** Add the weather reading options to a command (same names and help everywhere). */
export function addWeatherReadOptions(cmd: Command): Command {
  return cmd
    .option(
      '--format <format>',
      `weather file format: ${WEATHER_FORMATS.join(', ')} (default auto: detected from the ` +
        'header; tileflux = own CSV, ghcn = GHCN-Daily CSV export, daymet = Daymet single-pixel CSV)',
    )
    .option(
      '--columns <map>',
      'map variables to your headers: VARIABLE=HEADER pairs separated by commas, variables ' +
        `${WEATHER_VARIABLES.join(', ')} (e.g. date=DATE,precip=PRCP,tmax=TMAX,tmin=TMIN)`,
    )
    .option(
      '--precip-unit <unit>',
      'unit of precipitation and ref_et columns without a suffix: mm or in (default mm)',
    )
    .option(
      '--temp-unit <unit>',
      'unit of temperature columns without a suffix: c or f (default c)',
    )
    .option(
      '--where <column=value>',
      'keep only rows whose COLUMN equals VALUE (one station of several)',
    )
    .option('--station <id>', 'GHCN-Daily: the station to read from a file of several')
    .option(
      '--export-units <units>',
      'GHCN-Daily wide export: metric (mm, degC) or standard (in, degF), as ordered',
    )
    .option(
      '--fill',
      `fill runs of up to ${MAX_FILL_DAYS} missing days, empty cells or flagged values and say how many`,
    );
}
