/**
 * `tileflux sweep FIELD --weather [NAME=]CSV ... --out DIR`: the planner's study. Runs every
 * design of the field file's `sweep:` section (drain depth x spacing x outlet management) for
 * each soil sample on worker threads, under each climate given by a --weather, and writes
 * designs.csv, samples.csv, summary.json, charts/ and report.html atomically. Ctrl-C stops it
 * with nothing written.
 */
import type { Command } from 'commander';
import { action, CAUTION, IMAGES_HELP } from '../common.js';
import { addWeatherReadOptions } from '../weatherFlags.js';
import { summaryOf } from '../catalog.js';
import type { SweepCommandOptions } from '../actions/sweep.js';

export function registerSweep(program: Command): void {
  const cmd = program
    .command('sweep')
    .summary(summaryOf('sweep'))
    .description(
      'Run every design of the field file’s sweep: section (drain depth x lateral spacing x ' +
        'outlet management) over a weather record, for each Latin-hypercube sample of the ' +
        'uncertain soil values, with installed and annualised costs (costs: section, or ' +
        'illustrative defaults). Writes designs.csv (one row per design: medians and 10th/90th ' +
        'percentiles across the samples, changes against the field as given, cost per kg N ' +
        'avoided, on_frontier, frontier_share), samples.csv, summary.json, charts/ and ' +
        'report.html, and prints the recommended candidates. Give --weather once per climate ' +
        '(NAME=FILE) to rank the same designs and soil samples under each: every climate gets ' +
        'its own baseline, results and frontier, the tables a climate column, and the report ' +
        'and summary show which frontier designs hold under every climate. Results are the ' +
        'same for any --workers with the same --seed.',
    )
    .argument('<field>', 'field file with a sweep: section (`tileflux init` shows one)')
    .requiredOption(
      '-w, --weather <[name=]file>',
      'daily weather file of a climate (see `tileflux weather check`); repeat it for more ' +
        'climates, each NAME=FILE with a name of letters, digits, - or _ (default name: the ' +
        'file name without its extension); the reading options apply to every file',
      (v: string, prev: string[] | undefined) => [...(prev ?? []), v],
    );
  addWeatherReadOptions(cmd);
  cmd
    .option('-o, --out <dir>', 'output folder (default: <field file name>-sweep)')
    .option('--samples <n>', 'soil samples per design (default: sweep.samples, else 1)')
    .option('--seed <s>', 'seed of the Latin hypercube (default 1)')
    .option('--workers <k>', 'worker threads (default: the cores available)')
    .option('--no-charts', 'skip the charts/ folder, the charts’ Vega-Lite specs')
    .option('--images', IMAGES_HELP)
    .option('--no-report', 'skip report.html')
    .option('-f, --force', 'replace the output folder if it exists')
    .option('--json', 'print summary.json on stdout instead of the summary')
    .addHelpText(
      'after',
      '\nExamples:\n' +
        '  A sweep written in SI units (sweep: depth: [0.9 m, 1.2 m], spacing: { from: 10 m, ... }):\n' +
        '    tileflux sweep my-field.yaml --weather weather.csv --out study --samples 40 --seed 7\n' +
        '  A study written in US units (depth: [3 ft, 4 ft], spacing: { from: 30 ft, ... }) on a\n' +
        '  GHCN-Daily export in standard units (inches, degF); results are written in SI:\n' +
        '    tileflux sweep my-field-us.yaml --weather export.csv --station XX000000001 \\\n' +
        '      --export-units standard --out study-us --samples 40 --seed 7\n' +
        '  A quick look on the demo field with two workers:\n' +
        '    tileflux sweep data-demo/field.yaml --weather data-demo/weather.csv --out quick --samples 8 --workers 2\n' +
        "  The same designs under today's weather and a wetter, warmer climate made from it by\n" +
        '  weather make --like data-demo/weather.csv --years 30 --seed 1 --precip-change +20%\n' +
        '  --temp-change +2C --out wetter.csv (a scenario you choose, not a projection):\n' +
        '    tileflux sweep data-demo/field.yaml --weather today=data-demo/weather.csv \\\n' +
        '      --weather wetter=wetter.csv --out climates --samples 8\n\n' +
        CAUTION,
    )
    .action(
      action(async (fieldPath: string, o: SweepCommandOptions) =>
        (await import('../actions/sweep.js')).sweep(fieldPath, o),
      ),
    );
}
