/**
 * `tileflux demo`: the main job on the bundled invented field. Runs conventional, shallow and
 * controlled drainage over the 30-year synthetic weather, writes the full output folder with the
 * report, and prints the headline table.
 */
import type { Command } from 'commander';
import { action, CAUTION, IMAGES_HELP } from '../common.js';
import { summaryOf } from '../catalog.js';
import type { DemoOptions } from '../actions/demo.js';

export function registerDemo(program: Command): void {
  program
    .command('demo')
    .summary(summaryOf('demo'))
    .description(
      'Run the comparison on the bundled demo: an invented field on an invented farm with 30 years ' +
        'of synthetic weather, under conventional, shallow and controlled drainage. Writes the ' +
        'run folder (daily.csv, annual.csv, comparison.csv, summary.json, charts/, report.html, explorer.html) ' +
        'and prints the headline table and the path of the report.',
    )
    .option('-o, --out <dir>', 'output folder', 'tileflux-demo')
    .option('--units <system>', 'units of written and printed figures: si or us', 'si')
    .option('--images', IMAGES_HELP)
    .option('-f, --force', 'replace the output folder if it exists and tileflux wrote it')
    .option('--json', 'print summary.json on stdout instead of the table')
    .addHelpText(
      'after',
      `\nThe demo's inputs are data-demo/field.yaml and data-demo/weather.csv; copy them to start a study of your own.\n\n` +
        'Examples:\n' +
        '  tileflux demo                                  # SI units (mm, m, kg N/ha), into tileflux-demo/\n' +
        '  tileflux demo --units us --out demo-us         # US units (in, ft, lb N/ac)\n' +
        '  tileflux demo --images                         # also SVG and PNG of each chart\n' +
        `  tileflux demo --json > demo-summary.json       # the summary for scripts\n\n${CAUTION}`,
    )
    .action(action(async (o: DemoOptions) => (await import('../actions/demo.js')).demo(o)));
}
