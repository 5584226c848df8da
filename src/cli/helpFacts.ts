/**
 * Facts of the library that the commands' `--help` names, held here so that a command's help
 * loads neither the scenarios (and with them zod) nor the batch and weather readers. Each is a copy:
 * test/cli/helpFacts.test.ts checks it against the module it comes from, so a change there fails
 * the test instead of leaving the help out of date.
 */

/** What `tileflux fit` can adjust, with its default search bounds (scenarios/fitParams.ts). */
export const FIT_PARAMETER_BOUNDS: readonly (readonly [string, number, number, string])[] = [
  ['soil.conductivity', 0.05, 10, 'm/d'],
  ['soil.conductivityBelowDrains', 0.05, 10, 'm/d'],
  ['soil.drainablePorosity', 0.01, 0.2, '-'],
  ['soil.seepageConductance', 0, 10, 'mm/d per m'],
  ['soil.seepage', 0, 5, 'mm/d'],
  ['drains.capacity', 2, 60, 'mm/d'],
  ['soil.surfaceStorage', 0, 50, 'mm'],
  ['soil.capillaryDecay', 0.05, 2, 'm'],
  ['soil.rootZoneDepth', 0.2, 1.5, 'm'],
];

/** The parameters `tileflux fit` adjusts without --params (scenarios/fitParams.ts). */
export const DEFAULT_FIT_PATHS: readonly string[] = [
  'soil.conductivity',
  'soil.drainablePorosity',
  'soil.seepageConductance',
  'drains.capacity',
];

/** What the search of `tileflux fit` can optimise (scenarios/fit.ts). */
export const FIT_OBJECTIVES: readonly string[] = ['kge', 'nse', 'lognse', 'rmse'];

/** The separator of scenario names in a manifest's scenarios column (io/batchManifest.ts). */
export const SCENARIO_SEPARATOR = ';';

/** The weather formats --format accepts (io/weather/formats.ts, which also loads the readers). */
export const WEATHER_FORMATS: readonly string[] = ['auto', 'tileflux', 'ghcn', 'daymet'];

/** What each weather format is (io/weather/formats.ts), for `weather --help`. */
export const WEATHER_FORMAT_HELP: Readonly<Record<string, string>> = {
  tileflux:
    "tileflux's own CSV (date, precip_mm, tmax_c, tmin_c, ...; other headers via --columns)",
  ghcn: 'GHCN-Daily CSV export (STATION, DATE, PRCP, TMAX, TMIN with _ATTRIBUTES; or the by-station file in tenths)',
  daymet:
    'Daymet single-pixel CSV (header lines, then year, yday, prcp (mm/day), tmax (deg c), tmin (deg c), ...)',
};
