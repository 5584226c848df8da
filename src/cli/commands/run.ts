/**
 * `tileflux run FIELD --weather CSV`: simulate every scenario of a field over a weather record
 * and write daily.csv, annual.csv, summary.json (and the comparison, charts and report) into an
 * output folder, atomically.
 */
import type { Command } from 'commander';
import { action, CAUTION, IMAGES_HELP } from '../common.js';
import { addWeatherReadOptions } from '../weatherFlags.js';
import type { RunCommandOptions } from '../runShared.js';
import { summaryOf } from '../catalog.js';

export function registerRun(program: Command): void {
  const cmd = program
    .command('run')
    .summary(summaryOf('run'))
    .description(
      'Simulate the daily water table midway between drains, drain outflow, runoff, ET, seepage ' +
        'and nitrate-N load for every scenario of a field file over a weather record, and write ' +
        'daily.csv, annual.csv and summary.json into an output folder.\n\n' +
        'Without `scenarios:` in the field file, three alternatives are derived: conventional (as ' +
        'given), shallow (0.75 m drains at the spacing with the same drainage intensity) and ' +
        'controlled (outlet held 0.30 m below the surface from 1 November to 1 April).',
    )
    .argument('<field>', 'field file (YAML; `tileflux init` writes a starter)')
    .requiredOption('-w, --weather <csv>', 'daily weather CSV (see `tileflux weather check`)');
  addWeatherReadOptions(cmd);
  cmd
    .option(
      '-o, --out <dir>',
      'output folder (default: the field file’s name without extension, plus -run)',
    )
    .option('-s, --scenario <name...>', 'run only these scenarios')
    .option(
      '--from <date>',
      'first reported day, YYYY-MM-DD (default: first whole year after warm-up)',
    )
    .option('--to <date>', 'last reported day, YYYY-MM-DD (default: last whole year)')
    .option('--warmup-years <n>', 'years simulated before --from and not reported (default 1)')
    .option('--units <system>', 'units of written and printed figures: si or us', 'si')
    .option(
      '--no-charts',
      'skip the charts/ folder, the charts’ Vega-Lite specs (for scripted use)',
    )
    .option('--images', IMAGES_HELP)
    .option('--no-report', 'skip report.html (faster, for scripted use)')
    .option('--no-explorer', 'skip explorer.html, the interactive page (faster, for scripted use)')
    .option('--daily <what>', 'csv writes daily.csv, none skips it (large studies)', 'csv')
    .option('--year <year>', 'year shown in the water-table chart (default: the wettest year)')
    .option('-f, --force', 'replace the output folder if it exists and tileflux wrote it')
    .option('--json', 'print summary.json on stdout instead of the table')
    .addHelpText(
      'after',
      '\nExamples:\n' +
        '  The demo field and weather, SI units (mm, m, kg N/ha):\n' +
        '    tileflux run data-demo/field.yaml --weather data-demo/weather.csv --out demo-run\n' +
        '  The same in US units (in, ft, lb N/ac), the water-table chart for 1995:\n' +
        '    tileflux run data-demo/field.yaml --weather data-demo/weather.csv --out demo-run-us \\\n' +
        '      --units us --year 1995\n' +
        '  Your field on a GHCN-Daily export in standard units, from 2001, without daily.csv:\n' +
        '    tileflux run my-field.yaml --weather export.csv --station XX000000001 \\\n' +
        '      --export-units standard --from 2001-01-01 --daily none --out my-run --units us\n\n' +
        CAUTION,
    )
    .action(
      action(async (fieldPath: string, o: RunCommandOptions) =>
        (await import('../actions/run.js')).run(fieldPath, o),
      ),
    );
}
