/**
 * The top-level `tileflux` program without its commands: name, description, version and the
 * help text, plus the cheap stubs that list every command in `--help` without loading it.
 */
import { Command, Help } from 'commander';
import { VERSION } from '../version.js';
import { COMMANDS } from './catalog.js';

/** The `tileflux` program with its description and help text but no commands yet. */
export function baseProgram(): Command {
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
  return program;
}

/**
 * Lists every command of the catalog on `program` with its usage term and summary, without
 * loading any command module (for the top-level help and a misspelt command's suggestion).
 */
export function addCatalogEntries(program: Command): void {
  const terms = new Map(COMMANDS.map((c) => [c.name, c.term]));
  program.configureHelp({
    sortSubcommands: false,
    subcommandTerm: (cmd) => terms.get(cmd.name()) ?? new Help().subcommandTerm(cmd),
  });
  for (const entry of COMMANDS) program.command(entry.name).summary(entry.summary);
}
