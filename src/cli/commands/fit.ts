/**
 * `tileflux fit FIELD --weather CSV --observed OBS.csv --out DIR`: fit the field's drain-side
 * parameters to a monitored site's daily drain flow and/or water-table depths, and write
 * fitted.yaml (the field with the fitted values), fit.json, fit.csv, charts and report.html into
 * an output folder, atomically.
 */
import type { Command } from 'commander';
import { action, CAUTION, IMAGES_HELP } from '../common.js';
import { DEFAULT_FIT_PATHS, FIT_OBJECTIVES, FIT_PARAMETER_BOUNDS } from '../helpFacts.js';
import { addWeatherReadOptions } from '../weatherFlags.js';
import { summaryOf } from '../catalog.js';
import type { FitCommandOptions } from '../actions/fit.js';

export function registerFit(program: Command): void {
  const cmd = program
    .command('fit')
    .summary(summaryOf('fit'))
    .description(
      'Calibrate the drain-side parameters of a field file against observations at a monitored ' +
        'site (daily drain flow at the outlet and/or water-table depth in wells midway between ' +
        'drains) and report how well the model fits on a calibration and a validation period: ' +
        'NSE, KGE with r, alpha and beta, log-NSE, PBIAS, RMSE, R^2, peak and volume errors, with ' +
        'the usual ratings for daily field-scale drain flow.\n\n' +
        'OBS.csv has a date column and any of drainflow_mm, drainflow_in (depth per day over ' +
        'the drained area), flow_l_s, flow_m3_s, flow_gpm, flow_cfs (outlet flow rates, with ' +
        '--area), water_table_depth_m, water_table_depth_ft and no3n_mg_l; an empty cell is a day ' +
        'without that observation. The search (Latin hypercube sample, then bounded Nelder-Mead ' +
        'from the field file’s values and the best sample points) is seeded: the same inputs ' +
        'give the same fit.\n\n' +
        `Parameters (--params): ${FIT_PARAMETER_BOUNDS.map(([path]) => path).join(', ')}. Default: ` +
        `${DEFAULT_FIT_PATHS.join(', ')}; default bounds: ` +
        FIT_PARAMETER_BOUNDS.map(([path, lo, hi, unit]) => `${path} ${lo} to ${hi} ${unit}`).join(
          '; ',
        ) +
        ' (change them in the field file’s fit.bounds).',
    )
    .argument('<field>', 'field file (YAML)')
    .requiredOption('-w, --weather <csv>', 'daily weather CSV covering the observations')
    .requiredOption(
      '--observed <csv>',
      'observations: date plus drain flow and/or water-table depth',
    );
  addWeatherReadOptions(cmd);
  cmd
    .option('-o, --out <dir>', 'output folder (default: <field name>-fit)')
    .option('--params <list>', 'comma-separated parameters to fit (see above)')
    .option('--objective <name>', `what the search optimises: ${FIT_OBJECTIVES.join(', ')}`, 'kge')
    .option(
      '--calibrate <from..to>',
      'calibration period, e.g. 2013-01-01..2014-12-31 (default: all observations after the warm-up, less --validate)',
    )
    .option(
      '--validate <from..to>',
      'validation period, not used for fitting, e.g. 2015-01-01..2015-12-31',
    )
    .option('--seed <n>', 'seed of the search (whole number)', '1')
    .option(
      '--area <area>',
      'drained area behind the outlet, for flow rates [ha; e.g. "16 ha" or "40 ac"]',
    )
    .option(
      '--warmup-years <n>',
      'years of weather simulated before the first compared day (default 1)',
    )
    .option(
      '--workers <n>',
      'worker threads for the candidate runs (0: none; default: the cores, at most 4)',
    )
    .option('--no-charts', 'skip the charts/ folder, the charts’ Vega-Lite specs')
    .option('--images', IMAGES_HELP)
    .option('--no-report', 'skip report.html')
    .option('-f, --force', 'replace the output folder if it exists')
    .option('--json', 'print fit.json on stdout instead of the summary')
    .addHelpText(
      'after',
      '\nExamples:\n' +
        '  tileflux fit field.yaml --weather weather.csv --observed outlet.csv --out field-fit\n' +
        '  Flow measured in L/s at an outlet draining 16 ha (SI):\n' +
        '    tileflux fit field.yaml --weather weather.csv --observed outlet.csv --area "16 ha" --out fit-si\n' +
        '  Flow in gpm from 40 acres (US), two parameters, calibration and validation years:\n' +
        '  tileflux fit field.yaml --weather weather.csv --observed outlet.csv --area "40 ac" \\\n' +
        '    --params soil.conductivity,drains.capacity --calibrate 2013-01-01..2014-12-31 \\\n' +
        '    --validate 2015-01-01..2015-12-31 --objective nse --seed 7\n\n' +
        CAUTION,
    )
    .action(
      action(async (fieldPath: string, o: FitCommandOptions) =>
        (await import('../actions/fit.js')).fit(fieldPath, o),
      ),
    );
}
