/**
 * `tileflux spacing`: the drain spacing that a soil and a design drainage rate call for
 * (Hooghoudt's steady-state equation, `cli/spacingSteady.ts`), or, with --transient, the spacing
 * that lowers the water table midway between the drains by a given amount in a given time
 * (Glover-Dumm, `cli/spacingTransient.ts`); the shared flags and layout checks are in
 * `cli/spacingLayout.ts`; cli/actions/spacing.ts picks the mode when the command runs.
 */
import { Option, type Command } from 'commander';
import { DEFAULT_DRAIN_RADIUS_M } from '../../drainage/defaults.js';
import { action, CAUTION } from '../common.js';
import { summaryOf } from '../catalog.js';
import type { SpacingFlags } from '../spacingLayout.js';

const HELP = `
Steady state (Hooghoudt): the spacing at which drains remove --coefficient with the water table
midway held at --water-table below the surface. Falling water table (Glover-Dumm, with
--transient): the spacing that lowers the water table midway from --from to --to below the
surface in --days after a wetting, with no further recharge.

Depths are below the soil surface. The equivalent depth d accounts for the flow converging on
the pipe; --radius is the effective drain radius (${DEFAULT_DRAIN_RADIUS_M} m when not given, the
field file's default; Hooghoudt's tables use 0.1 m; a bare corrugated pipe without envelope has
a much smaller effective radius and calls for a closer spacing).

Examples:
  Steady state: 0.5 m/d soil, drains 1.2 m deep, restrictive layer at 3.2 m, 7 mm/d:
    tileflux spacing --conductivity 0.5 --drain-depth 1.2 --restrictive-layer-depth 3.2 --water-table 0.5 --coefficient 7
  The same kind of design in US units:
    tileflux spacing --conductivity "0.8 in/h" --drain-depth "4 ft" --restrictive-layer-depth "10 ft" \\
      --water-table "1 ft" --coefficient "0.375 in/d" --units us
  Falling water table, surface to 0.3 m in 2 days:
    tileflux spacing --transient --conductivity 0.5 --drainable-porosity 0.05 --drain-depth 1.2 \\
      --restrictive-layer-depth 3.2 --from 0 --to 0.3 --days 2

${CAUTION}`;

/** Register `tileflux spacing`. */
export function registerSpacing(program: Command): void {
  program
    .command('spacing')
    .summary(summaryOf('spacing'))
    .description(
      'Drain spacing for a design drainage rate and midpoint water table (Hooghoudt ' +
        'steady-state equation), or with --transient for lowering the water table midway in a ' +
        'given time (Glover-Dumm). Quantities take units ("1.2 m", "48 in", "0.5 in/d"); bare ' +
        'numbers are in the unit shown beside each option.',
    )
    .option(
      '--conductivity <conductivity>',
      'saturated hydraulic conductivity (above drain level), bare number m/d',
    )
    .option(
      '--conductivity-below-drains <conductivity>',
      'conductivity below drain level, m/d (default: --conductivity; steady only)',
    )
    .option('--drain-depth <length>', 'drain depth below the surface, m')
    .option(
      '--restrictive-layer-depth <length>',
      'depth of the restrictive (impermeable) layer below the surface, m',
    )
    .option(
      '--water-table <length>',
      'allowed midpoint water-table depth below the surface, m (steady)',
    )
    .option('--coefficient <rate>', 'design drainage rate (drainage coefficient), mm/d (steady)')
    .option('--radius <length>', `effective drain radius, m (default ${DEFAULT_DRAIN_RADIUS_M})`)
    .option(
      '--equivalent-depth <method>',
      'equivalent depth: vdmw (van der Molen & Wesseling) or moody',
      'vdmw',
    )
    .option('--transient', 'design for a falling water table (Glover-Dumm) instead')
    .option(
      '--drainable-porosity <fraction>',
      'drainable porosity (specific yield), e.g. 0.05 or 5 % (transient)',
    )
    .option('--from <length>', 'midpoint water-table depth at the start, m (transient)')
    .option('--to <length>', 'midpoint water-table depth to reach, m (transient)')
    .option('--days <duration>', 'time allowed for the drawdown, d (transient)')
    .option('--units <system>', 'units of printed results: si or us (JSON is always SI)', 'si')
    .option('--json', 'print the result as JSON')
    .addOption(new Option('--k <conductivity>').hideHelp())
    .addOption(new Option('--k-below <conductivity>').hideHelp())
    .addOption(new Option('--barrier-depth <length>').hideHelp())
    .addOption(new Option('--rate <rate>').hideHelp())
    .addHelpText('after', HELP)
    .action(action(async (o: SpacingFlags) => (await import('../actions/spacing.js')).spacing(o)));
}
