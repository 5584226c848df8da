/**
 * `tileflux explorer FIELD --weather CSV --out explorer.html`: write the interactive page that
 * runs the engine in the browser (design A = the field file, B = its controlled variant), one
 * self-contained file that opens offline. Written atomically; an existing file is replaced only
 * with --force.
 */
import type { Command } from 'commander';
import { explorerHtmlOf } from '../../explorer/page.js';
import { readFieldFile } from '../../io/field.js';
import { readWeatherFile } from '../../io/weather.js';
import { action, CAUTION, emit, parseUnits } from '../common.js';
import { writeFileAtomic } from '../../io/atomicOutput.js';
import {
  addWeatherReadOptions,
  weatherReadOptions,
  type WeatherReadFlags,
} from '../weatherOptions.js';
import { summaryOf } from '../catalog.js';

interface ExplorerOptions extends WeatherReadFlags {
  weather: string;
  out?: string;
  units?: string;
  force?: boolean;
  json?: boolean;
}

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
      action((fieldPath: string, o: ExplorerOptions) => {
        const units = parseUnits(o.units);
        const out = o.out ?? 'explorer.html';
        const field = readFieldFile(fieldPath);
        const weather = readWeatherFile(o.weather, weatherReadOptions(o));
        const html = explorerHtmlOf(field, weather.series, o.weather, units);
        writeFileAtomic(out, html, Boolean(o.force));
        emit(o.json, { written: out, bytes: Buffer.byteLength(html) }, () =>
          [`Wrote ${out}: open it in a browser (it needs no network).`, CAUTION].join('\n'),
        );
      }),
    );
}
