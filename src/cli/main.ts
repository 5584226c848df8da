#!/usr/bin/env node
/**
 * The `tileflux` command line. Each command lives in `commands/` and registers itself here.
 */
import { Command } from 'commander';
import { VERSION } from '../version.js';
import { registerWeather } from './commands/weather.js';
import { registerInit } from './commands/init.js';
import { registerRun } from './commands/run.js';

const program = new Command();
program
  .name('tileflux')
  .description(
    'Plan agricultural subsurface (tile) drainage: drain spacing and pipe size, a daily\n' +
      'water-table and drain-outflow simulation from a weather CSV, nitrate-N loads, and a\n' +
      'comparison of conventional, shallow and controlled drainage.\n\n' +
      'Quantities accept unit strings ("1.2 m", "48 in", "0.5 in/d"); a bare number is in the\n' +
      'SI unit given beside each option. Every command takes --json.\n\n' +
      'Results are planning estimates: local drainage guides, practice standards, permits\n' +
      'and a licensed professional decide the design.',
  )
  .version(VERSION, '-V, --version')
  .showHelpAfterError('(run with --help for usage)')
  .configureHelp({ sortSubcommands: false });

const registrations: Array<(p: Command) => void> = [
  // Each command module adds its registration here.
  registerWeather,
  registerRun,
  registerInit,
];
for (const register of registrations) register(program);

await program.parseAsync(process.argv);
