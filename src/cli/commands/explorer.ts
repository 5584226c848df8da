/**
 * `tileflux explorer FIELD --weather CSV --out explorer.html`: write the interactive page that
 * runs the engine in the browser (design A = the field file, B = its controlled variant), one
 * self-contained file that opens offline. Written atomically; an existing file is replaced only
 * with --force.
 */
import type { Command } from 'commander';
import { action, CAUTION } from '../common.js';
import { addWeatherReadOptions } from '../weatherFlags.js';
import { summaryOf } from '../catalog.js';
import type { ExplorerOptions } from '../actions/explorer.js';

export function registerExplorer(program: Command): void {
  const cmd = program
    .command('explorer')
    .summary(summaryOf('explorer'))
    .description(
      'Write one self-contained HTML page (no network; opens from a file on a laptop or tablet) ' +
        'holding the field, the weather record and the engine. Design A is the field file as ' +
        'given, design B its controlled variant (the first scenario with an outlet schedule, or ' +
        'A with the outlet held 0.30 m below the surface from 1 November to 1 April). Change the ' +
        'drain depth, spacing, soil conductivity, drainable porosity, outlet schedule or the ' +
        'nitrate setting and every year is run again; "Save field file" writes YAML that ' +
        '`tileflux run` accepts and that gives the same figures.',
    )
    .argument('<field>', 'field file (YAML; `tileflux init` writes a starter)')
    .requiredOption('-w, --weather <csv>', 'daily weather CSV (see `tileflux weather check`)');
  addWeatherReadOptions(cmd);
  cmd
    .option('-o, --out <file>', 'the page to write', 'explorer.html')
    .option('--units <system>', 'units of the controls and figures: si or us', 'si')
    .option('-f, --force', 'replace the page if it exists')
    .option('--json', 'print {"written": FILE, "bytes": N} instead of the sentence')
    .addHelpText(
      'after',
      '\nExample:\n  tileflux explorer data-demo/field.yaml --weather data-demo/weather.csv --out explorer.html\n\n' +
        CAUTION,
    )
    .action(
      action(async (fieldPath: string, o: ExplorerOptions) =>
        (await import('../actions/explorer.js')).explorer(fieldPath, o),
      ),
    );
}
