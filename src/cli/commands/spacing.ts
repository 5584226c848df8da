/**
 * `tileflux spacing`: the drain spacing that a soil and a design drainage rate call for
 * (Hooghoudt's steady-state equation), or, with --transient, the spacing that lowers the water
 * table midway between the drains by a given amount in a given time (Glover-Dumm).
 *
 * Also exports the small layout helpers `echo` and `blocks` that `size` uses for its report.
 */
import { Option, type Command } from 'commander';
import { TilefluxError } from '../../errors.js';
import {
  drainageIntensity,
  EQUIVALENT_DEPTH_METHODS,
  gloverSpacing,
  hooghoudtSpacing,
  kirkhamFlux,
  kirkhamGeometryFactor,
  type EquivalentDepthMethod,
} from '../../drainage/index.js';
import { US, type UnitSystem } from '../../units/quantity.js';
import { blocks, echo } from '../echo.js';
import { DEFAULT_DRAIN_RADIUS_M } from '../../drainage/defaults.js';
import {
  action,
  CAUTION,
  emit,
  fmt,
  quantityOption,
  requiredQuantity,
  parseUnits,
  warn,
} from '../common.js';
import { summaryOf } from '../catalog.js';

interface SpacingFlags {
  conductivity?: string;
  conductivityBelowDrains?: string;
  drainDepth?: string;
  restrictiveLayerDepth?: string;
  waterTable?: string;
  coefficient?: string;
  /** Former flag names, still read (with a warning). */
  k?: string;
  kBelow?: string;
  barrierDepth?: string;
  rate?: string;
  radius?: string;
  equivalentDepth?: string;
  transient?: boolean;
  drainablePorosity?: string;
  from?: string;
  to?: string;
  days?: string;
  units?: string;
  json?: boolean;
}

/** A length for people in the chosen unit system: metres or feet. */
function len(m: number, units: UnitSystem, decimals = 2): string {
  return units === 'us' ? `${fmt(m / US.mPerFt, decimals)} ft` : `${fmt(m, decimals)} m`;
}

/** A rate for people in the chosen unit system: mm/d or in/d. */
function rate(mmPerDay: number, units: UnitSystem): string {
  return units === 'us' ? `${fmt(mmPerDay / US.mmPerIn, 3)} in/d` : `${fmt(mmPerDay, 1)} mm/d`;
}

function positive(value: number, option: string, unit: string): number {
  if (!(value > 0))
    throw new TilefluxError(`${option} must be greater than 0 ${unit}; got ${value}`);
  return value;
}

function methodOf(value: string | undefined): EquivalentDepthMethod {
  const m = value ?? 'vdmw';
  if (m !== 'vdmw' && m !== 'moody') {
    throw new TilefluxError(`--equivalent-depth expects vdmw or moody; got ${m}`);
  }
  return m;
}

/** Former flag names, still read: [old key, new key, old flag, new flag]. */
const RENAMED: Array<[keyof SpacingFlags, keyof SpacingFlags, string, string]> = [
  ['k', 'conductivity', '--k', '--conductivity'],
  ['kBelow', 'conductivityBelowDrains', '--k-below', '--conductivity-below-drains'],
  ['barrierDepth', 'restrictiveLayerDepth', '--barrier-depth', '--restrictive-layer-depth'],
  ['rate', 'coefficient', '--rate', '--coefficient'],
];

/**
 * Read the former flag names into the new ones, with a warning: the flags now use the field
 * file's words (soil.conductivity, soil.restrictiveLayerDepth, drains.coefficient).
 */
function renamedFlags(o: SpacingFlags): void {
  for (const [old, now, oldFlag, newFlag] of RENAMED) {
    if (o[old] === undefined) continue;
    if (o[now] !== undefined)
      throw new TilefluxError(`${oldFlag} is the former name of ${newFlag}; give only ${newFlag}`);
    (o as Record<string, unknown>)[now] = o[old];
    warn(`${oldFlag} is now ${newFlag} (the field file's word); the old name will go`);
  }
}

/** Flags that belong to only one of the two modes, for a clear error when mixed. */
const STEADY_ONLY: Array<[keyof SpacingFlags, string]> = [
  ['waterTable', '--water-table'],
  ['coefficient', '--coefficient'],
  ['conductivityBelowDrains', '--conductivity-below-drains'],
];
const TRANSIENT_ONLY: Array<[keyof SpacingFlags, string]> = [
  ['drainablePorosity', '--drainable-porosity'],
  ['from', '--from'],
  ['to', '--to'],
  ['days', '--days'],
];

/** The layout options common to both modes, parsed and checked against each other. */
function layout(o: SpacingFlags) {
  const kMPerDay = positive(
    requiredQuantity(o.conductivity, 'conductivity', '--conductivity'),
    '--conductivity',
    'm/d',
  );
  const drainDepthM = positive(
    requiredQuantity(o.drainDepth, 'length', '--drain-depth'),
    '--drain-depth',
    'm',
  );
  const barrierDepthM = requiredQuantity(
    o.restrictiveLayerDepth,
    'length',
    '--restrictive-layer-depth',
  );
  const radiusM = positive(
    quantityOption(o.radius, 'length', '--radius') ?? DEFAULT_DRAIN_RADIUS_M,
    '--radius',
    'm',
  );
  if (!(barrierDepthM > drainDepthM)) {
    throw new TilefluxError(
      `--restrictive-layer-depth (${fmt(barrierDepthM, 3)} m) must be deeper than --drain-depth ` +
        `(${fmt(drainDepthM, 3)} m): the restrictive layer lies below the drains`,
    );
  }
  const layerBelowDrainsM = barrierDepthM - drainDepthM;
  if (!(radiusM < layerBelowDrainsM)) {
    throw new TilefluxError(
      `--radius (${fmt(radiusM, 3)} m) must be smaller than the layer between the drains and the ` +
        `barrier (--restrictive-layer-depth minus --drain-depth, ${fmt(layerBelowDrainsM, 3)} m)`,
    );
  }
  if (!(radiusM < drainDepthM)) {
    throw new TilefluxError(
      `--radius (${fmt(radiusM, 3)} m) must be smaller than --drain-depth (${fmt(drainDepthM, 3)} m)`,
    );
  }
  return {
    kMPerDay,
    drainDepthM,
    barrierDepthM,
    layerBelowDrainsM,
    radiusM,
    method: methodOf(o.equivalentDepth),
  };
}

type Layout = ReturnType<typeof layout>;

function layoutRows(o: SpacingFlags, l: Layout, units: UnitSystem): Array<[string, string]> {
  return [
    ['drain depth', echo(o.drainDepth, l.drainDepthM, 'm', 3, units)],
    [
      'barrier depth',
      `${echo(o.restrictiveLayerDepth, l.barrierDepthM, 'm', 3, units)} (${len(l.layerBelowDrainsM, units)} below the drains)`,
    ],
    ['drain radius', echo(o.radius, l.radiusM, 'm', 3, units)],
  ];
}

function steady(o: SpacingFlags, units: UnitSystem): void {
  const l = layout(o);
  const kBelowMPerDay = positive(
    quantityOption(o.conductivityBelowDrains, 'conductivity', '--conductivity-below-drains') ??
      l.kMPerDay,
    '--conductivity-below-drains',
    'm/d',
  );
  const waterTableM = requiredQuantity(o.waterTable, 'length', '--water-table');
  if (waterTableM < 0) {
    throw new TilefluxError(
      `--water-table (${fmt(waterTableM, 3)} m) puts the water table above the surface; give ` +
        `its depth below the surface, from 0 up to --drain-depth`,
    );
  }
  if (!(waterTableM < l.drainDepthM)) {
    throw new TilefluxError(
      `--water-table (${fmt(waterTableM, 3)} m) must be shallower than --drain-depth ` +
        `(${fmt(l.drainDepthM, 3)} m): the head midway is the height of the water table above ` +
        `the drains`,
    );
  }
  const rateMmPerDay = positive(
    requiredQuantity(o.coefficient, 'rate', '--coefficient'),
    '--coefficient',
    'mm/d',
  );
  const headM = l.drainDepthM - waterTableM;
  const sol = hooghoudtSpacing({
    kAboveMPerDay: l.kMPerDay,
    kBelowMPerDay,
    layerBelowDrainsM: l.layerBelowDrainsM,
    drainRadiusM: l.radiusM,
    headM,
    rateMPerDay: rateMmPerDay / 1000,
    method: l.method,
    drainDepthM: l.drainDepthM,
  });
  const intensity = drainageIntensity({
    kAboveMPerDay: l.kMPerDay,
    kBelowMPerDay,
    equivalentDepthM: sol.equivalentDepthM,
    drainDepthM: l.drainDepthM,
    spacingM: sol.spacingM,
  });
  // Kirkham's solution is for a uniform soil: given only when one conductivity applies.
  const uniform = kBelowMPerDay === l.kMPerDay;
  const ponded = uniform
    ? kirkhamFlux({
        kMPerDay: l.kMPerDay,
        pondedDepthM: 0,
        drainDepthM: l.drainDepthM,
        drainRadiusM: l.radiusM,
        spacingM: sol.spacingM,
        geometryFactor: kirkhamGeometryFactor({
          drainDepthM: l.drainDepthM,
          layerBelowDrainsM: l.layerBelowDrainsM,
          drainRadiusM: l.radiusM,
          spacingM: sol.spacingM,
        }),
      })
    : null;
  const data = {
    method: 'hooghoudt',
    equivalent_depth_method: l.method,
    spacing_m: sol.spacingM,
    equivalent_depth_m: sol.equivalentDepthM,
    head_m: headM,
    rate_mm_d: rateMmPerDay,
    drainage_intensity_mm_d: intensity * 1000,
    ponded_rate_mm_d: ponded === null ? null : ponded * 1000,
    k_m_d: l.kMPerDay,
    k_below_m_d: kBelowMPerDay,
    drain_depth_m: l.drainDepthM,
    barrier_depth_m: l.barrierDepthM,
    layer_below_drains_m: l.layerBelowDrainsM,
    water_table_depth_m: waterTableM,
    radius_m: l.radiusM,
    iterations: sol.iterations,
  };
  emit(o.json, data, () =>
    [
      'Drain spacing for a steady drainage rate (Hooghoudt equation)',
      '',
      blocks([
        [
          'Inputs',
          [
            ['conductivity above drains', echo(o.conductivity, l.kMPerDay, 'm/d', 3, units)],
            [
              'conductivity below drains',
              o.conductivityBelowDrains === undefined
                ? `${echo(undefined, kBelowMPerDay, 'm/d', 3, units).replace(' (default)', '')} (as --conductivity)`
                : echo(o.conductivityBelowDrains, kBelowMPerDay, 'm/d', 3, units),
            ],
            ...layoutRows(o, l, units),
            [
              'midpoint water table',
              `${echo(o.waterTable, waterTableM, 'm', 3, units)} below the surface`,
            ],
            ['drainage rate', echo(o.coefficient, rateMmPerDay, 'mm/d', 2, units)],
          ],
        ],
        [
          'Result',
          [
            ['spacing', len(sol.spacingM, units, 1)],
            ['equivalent depth d', len(sol.equivalentDepthM, units)],
            ['head midway', `${len(headM, units)} above the drains`],
            [
              'drainage intensity',
              `${rate(intensity * 1000, units)} with the water table at the surface midway`,
            ],
            [
              'ponded-surface rate',
              ponded === null
                ? 'not given: Kirkham (1957) assumes one conductivity (--conductivity-below-drains differs)'
                : `${rate(ponded * 1000, units)} with water just ponded on the surface (Kirkham 1957)`,
            ],
          ],
        ],
      ]),
      '',
      'Method: Hooghoudt (1940) steady-state equation q = (8 K2 d h + 4 K1 h^2) / L^2, solved',
      `for L in ${sol.iterations} Newton steps; equivalent depth d by`,
      `${EQUIVALENT_DEPTH_METHODS[l.method]}.`,
      CAUTION,
    ].join('\n'),
  );
}

function transient(o: SpacingFlags, units: UnitSystem): void {
  const l = layout(o);
  const porosity = requiredQuantity(o.drainablePorosity, 'fraction', '--drainable-porosity');
  if (!(porosity > 0 && porosity < 1)) {
    throw new TilefluxError(
      `--drainable-porosity must be a fraction between 0 and 1 (such as 0.05 or 5 %); got ${o.drainablePorosity}`,
    );
  }
  const fromM = requiredQuantity(o.from, 'length', '--from');
  const toM = requiredQuantity(o.to, 'length', '--to');
  const days = positive(requiredQuantity(o.days, 'duration', '--days'), '--days', 'd');
  if (fromM < 0) {
    throw new TilefluxError(
      `--from (${fmt(fromM, 3)} m) puts the water table above the surface; give its depth below ` +
        `the surface (0 for a water table at the surface)`,
    );
  }
  if (!(toM > fromM)) {
    throw new TilefluxError(
      `--to (${fmt(toM, 3)} m) must be deeper than --from (${fmt(fromM, 3)} m): the water table falls`,
    );
  }
  if (!(toM < l.drainDepthM)) {
    throw new TilefluxError(
      `--to (${fmt(toM, 3)} m) must be shallower than --drain-depth (${fmt(l.drainDepthM, 3)} m): ` +
        `drains never lower the water table quite to their own level`,
    );
  }
  const sol = gloverSpacing({
    kMPerDay: l.kMPerDay,
    drainablePorosity: porosity,
    drainDepthM: l.drainDepthM,
    layerBelowDrainsM: l.layerBelowDrainsM,
    drainRadiusM: l.radiusM,
    fromDepthM: fromM,
    toDepthM: toM,
    days,
    method: l.method,
  });
  const intensity = drainageIntensity({
    kAboveMPerDay: l.kMPerDay,
    kBelowMPerDay: l.kMPerDay,
    equivalentDepthM: sol.equivalentDepthM,
    drainDepthM: l.drainDepthM,
    spacingM: sol.spacingM,
  });
  const data = {
    method: 'glover-dumm',
    equivalent_depth_method: l.method,
    spacing_m: sol.spacingM,
    equivalent_depth_m: sol.equivalentDepthM,
    average_flow_depth_m: sol.averageFlowDepthM,
    initial_head_m: l.drainDepthM - fromM,
    final_head_m: l.drainDepthM - toM,
    head_ratio: sol.headRatio,
    days,
    drainable_porosity: porosity,
    drainage_intensity_mm_d: intensity * 1000,
    k_m_d: l.kMPerDay,
    drain_depth_m: l.drainDepthM,
    barrier_depth_m: l.barrierDepthM,
    layer_below_drains_m: l.layerBelowDrainsM,
    from_depth_m: fromM,
    to_depth_m: toM,
    radius_m: l.radiusM,
  };
  emit(o.json, data, () =>
    [
      'Drain spacing for a falling water table (Glover-Dumm)',
      '',
      blocks([
        [
          'Inputs',
          [
            ['conductivity', echo(o.conductivity, l.kMPerDay, 'm/d', 3, units)],
            ['drainable porosity', echo(o.drainablePorosity, porosity, '', 3)],
            ...layoutRows(o, l, units),
            [
              'midpoint water table',
              `from ${echo(o.from, fromM, 'm', 3, units)} to ${echo(o.to, toM, 'm', 3, units)} below the surface`,
            ],
            ['time allowed', echo(o.days, days, 'd', 2)],
          ],
        ],
        [
          'Result',
          [
            ['spacing', len(sol.spacingM, units, 1)],
            ['equivalent depth d', len(sol.equivalentDepthM, units)],
            ['average flow depth', `${len(sol.averageFlowDepthM, units)} (d + h0/2)`],
            [
              'head midway',
              `${len(data.initial_head_m, units)} falling to ${len(data.final_head_m, units)} (ratio ${fmt(sol.headRatio, 3)})`,
            ],
            [
              'drainage intensity',
              `${rate(intensity * 1000, units)} with the water table at the surface midway`,
            ],
          ],
        ],
      ]),
      '',
      'Method: Glover-Dumm solution of the linearized Boussinesq equation for an initially flat',
      'water table, series summed in full, flow depth D = d + h0/2; equivalent depth d by',
      `${EQUIVALENT_DEPTH_METHODS[l.method]}.`,
      CAUTION,
    ].join('\n'),
  );
}

const HELP = `
Steady state (Hooghoudt): the spacing at which drains remove --coefficient with the water table
midway held at --water-table below the surface. Falling water table (Glover-Dumm, with
--transient): the spacing that lowers the water table midway from --from to --to below the
surface in --days after a wetting, with no further recharge.

Depths are below the soil surface. The equivalent depth d accounts for the flow converging on
the pipe; --radius is the effective drain radius (0.1 m, the value of Hooghoudt's tables, when
not given; a bare corrugated pipe without envelope has a much smaller effective radius and
calls for a closer spacing).

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
    .action(
      action((o: SpacingFlags) => {
        renamedFlags(o);
        const units = parseUnits(o.units);
        const [wrong, mode] = o.transient ? [STEADY_ONLY, 'without'] : [TRANSIENT_ONLY, 'with'];
        for (const [key, flag] of wrong) {
          if (o[key] !== undefined) {
            throw new TilefluxError(
              `${flag} applies only ${mode} --transient; leave it out or change mode`,
            );
          }
        }
        if (o.transient) transient(o, units);
        else steady(o, units);
      }),
    );
}
