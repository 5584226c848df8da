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
    '(run with --help for usage; quote a value that has a unit, e.g. --k "1 m/d")',
  )
  .configureHelp({ sortSubcommands: false });

const registrations: Array<(p: Command) => void> = [
  // Each command module adds its registration here, in the order --help lists them.
  registerDemo,
  registerRun,
  registerSweep,
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
