#!/usr/bin/env node
/**
 * The `tileflux` command line. Each command lives in `commands/` and registers itself here.
 */
import { Command } from 'commander';
import { VERSION } from '../version.js';
import { registerWeather } from './commands/weather.js';
import { registerDemo } from './commands/demo.js';
import { registerInit } from './commands/init.js';
import { registerRun } from './commands/run.js';
import { registerSweep } from './commands/sweep.js';
import { registerBatch } from './commands/batch.js';
import { registerFit } from './commands/fit.js';
import { registerSpacing } from './commands/spacing.js';
import { registerSize } from './commands/size.js';
import { registerSystem } from './commands/system.js';
import { registerExplorer } from './commands/explorer.js';

const program = new Command();
program
  .name('tileflux')
  .description(
    'Plan agricultural subsurface (tile) drainage: drain spacing and pipe size, a daily ' +
      'water-table and drain-outflow simulation from a weather CSV, nitrate-N loads, and a ' +
      'comparison of conventional, shallow and controlled drainage.\n\n' +
      'Quantities accept unit strings ("1.2 m", "48 in", "0.5 in/d"); a bare number is in the ' +
      'SI unit given beside each option. Every command takes --json.\n\n' +
      'Results are planning estimates: local drainage guides, practice standards, permits ' +
      'and a licensed professional decide the design.',
  )
  .version(VERSION, '-V, --version')
  .showHelpAfterError(
    '(run with --help for usage; quote a value that has a unit, e.g. --conductivity "1 m/d")',
  )
  .configureHelp({ sortSubcommands: false })
  .addHelpText(
    'after',
    `
Main tasks, one example each (add --units us for inches, feet and lb N/ac):
  See what tileflux does, on the bundled demo field:
    tileflux demo
  Check your weather file and what it holds:
    tileflux weather check my-weather.csv
  Start a field file of your own, then compare its drainage alternatives:
    tileflux init my-field.yaml
    tileflux run my-field.yaml --weather my-weather.csv --out my-run
  Drain spacing for a soil and a drainage rate:
    tileflux spacing --conductivity "1 m/d" --drain-depth "1.2 m" --restrictive-layer-depth "2.5 m" --water-table "0.3 m" --coefficient "12 mm/d"
  Pipe size for a lateral:
    tileflux size --length "1300 ft" --spacing "60 ft" --coefficient "0.5 in/d" --slope "0.2 %" --units us
  Rank designs and managements under uncertain soils, with costs:
    tileflux sweep my-field.yaml --weather my-weather.csv --out my-study
  Fit the soil to a monitored outlet before trusting a comparison:
    tileflux fit my-field.yaml --weather my-weather.csv --observed my-outlet.csv --out my-fit
  Lay out mains and laterals with grades and depth of cut:
    tileflux system my-system.yaml --out my-plan

Each command's --help has more examples.`,
  );

const registrations: Array<(p: Command) => void> = [
  // Each command module adds its registration here, in the order --help lists them.
  registerDemo,
  registerRun,
  registerSweep,
  registerBatch,
  registerFit,
  registerExplorer,
  registerInit,
  registerWeather,
  registerSpacing,
  registerSize,
  registerSystem,
];
for (const register of registrations) register(program);

await program.parseAsync(process.argv);
