/**
 * `tileflux size`: the pipe a drain line needs for its design flow (drained area times drainage
 * rate) by Manning's equation for a full circular pipe, rounded up to the next commercial size,
 * with the full-flow velocity and the minimum grade for a velocity target.
 *
 * The work is in cli/actions/size.ts, loaded when the command runs.
 */
import { Option, type Command } from 'commander';
import {
  COEFFICIENT_CROPS,
  COEFFICIENT_INLETS,
  COEFFICIENT_SOILS,
  drainageCoefficient,
} from '../../drainage/drainageCoefficient.js';
import { fixedText } from '../../units/decimal.js';
import { action, CAUTION } from '../common.js';
import { summaryOf } from '../catalog.js';
import type { SizeFlags } from '../actions/size.js';

/** The drainage-coefficient table, one line per soil and crop, for --help. */
function coefficientTable(): string {
  return COEFFICIENT_SOILS.flatMap((soil) =>
    COEFFICIENT_CROPS.map(
      (crop) =>
        `  ${`${soil} ${crop}`.padEnd(14)}` +
        COEFFICIENT_INLETS.map((inlets) => {
          const c = drainageCoefficient({ soil, crop, inlets });
          return `${inlets} ${fixedText(c.lowInPerDay, 3)}-${fixedText(c.highInPerDay, 3)}`;
        }).join(', '),
    ),
  ).join('\n');
}

const HELP = `
Examples:
  A lateral 400 m long draining a 20 m strip at 3/8 inch per day on a 0.2 % grade:
    tileflux size --length 400 --spacing 20 --coefficient "0.375 in/d" --slope "0.2 %"
  A main serving 16 ha at 12 mm/d, smooth pipe, metric sizes:
    tileflux size --area 16 --coefficient 12 --slope 0.1% --material smooth --sizes mm
  The same lateral at the tabulated coefficient for vegetables on an organic soil with blind inlets:
    tileflux size --length 400 --spacing 20 --coefficient "organic truck blind" --slope "0.2 %"
  Your own list of inside diameters:
    tileflux size --area "40 ac" --coefficient "0.5 in/d" --slope "0.1 %" --sizes "6,8,10,12 in" --units us

The design flow is the drained area times the drainage rate (drainage coefficient); common
practice for field crops on mineral soils without surface inlets is 3/8 to 1/2 inch per day,
more for organic soils, vegetables and fields with surface inlets. --coefficient takes words for
the soil (mineral|organic), crop (field|truck) and surface inlets (none|blind|open) and uses the
middle of the tabulated range (in/d; common practice, from memory; field files use the same table):
${coefficientTable()}
Nominal sizes are taken as inside diameters.

${CAUTION}`;

/** Register `tileflux size`. */
export function registerSize(program: Command): void {
  program
    .command('size')
    .summary(summaryOf('size'))
    .description(
      'Pipe diameter a drain line needs to carry its drained area times the drainage rate, by ' +
        "Manning's equation for a full circular pipe, rounded up to the next commercial size, " +
        'with the full-flow velocity and the minimum grade for a velocity target.',
    )
    .option('--area <area>', 'drained area, bare number ha (or give --length and --spacing)')
    .option('--length <length>', 'length of the lateral, m')
    .option('--spacing <length>', 'drain spacing (width drained by the lateral), m')
    .option(
      '--coefficient <rate|words>',
      'drainage coefficient: a rate, bare number mm/d (e.g. "0.5 in/d"), or the tabulated value for soil, crop, inlets (e.g. "mineral field none")',
    )
    .addOption(new Option('--rate <rate>').hideHelp())
    .option(
      '--slope <slope>',
      'pipe grade with its unit: %, m/m or ft/100ft (e.g. "0.2 %" or 0.002m/m); a bare number is refused',
    )
    .option('--roughness <n>', 'Manning n (overrides --material)')
    .option('--material <kind>', 'corrugated (n 0.015) or smooth (n 0.012); default corrugated')
    .option(
      '--sizes <list>',
      'in (3-24 in), mm (50-630 mm) or a list such as "4,6,8 in"; default in',
    )
    .option(
      '--velocity <speed>',
      'full-flow velocity target for the minimum grade, m/s (default 1.4 ft/s)',
    )
    .option('--units <system>', 'units of printed results: si or us (JSON is always SI)', 'si')
    .option('--json', 'print the result as JSON')
    .addHelpText('after', HELP)
    .action(action(async (o: SizeFlags) => (await import('../actions/size.js')).size(o)));
}
