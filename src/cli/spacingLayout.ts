/**
 * The flags and the layout checks `tileflux spacing` shares between its two modes (steady,
 * Hooghoudt; falling water table, Glover-Dumm): the flag set, former flag names, the flags of one
 * mode only, the parsed and cross-checked layout, and the printing helpers.
 */
import { US, type UnitSystem } from '../units/quantity.js';
import { TilefluxError } from '../errors.js';
import type { EquivalentDepthMethod } from '../drainage/index.js';
import { DEFAULT_DRAIN_RADIUS_M } from '../drainage/defaults.js';
import { echo } from './echo.js';
import { warn } from './common.js';
import { quantityOption, requiredQuantity } from './quantityOptions.js';
import { fixedText } from '../units/decimal.js';

export interface SpacingFlags {
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
export function len(m: number, units: UnitSystem, decimals = 2): string {
  return units === 'us'
    ? `${fixedText(m / US.mPerFt, decimals)} ft`
    : `${fixedText(m, decimals)} m`;
}

/** A rate for people in the chosen unit system: mm/d or in/d. */
export function rate(mmPerDay: number, units: UnitSystem): string {
  return units === 'us'
    ? `${fixedText(mmPerDay / US.mmPerIn, 3)} in/d`
    : `${fixedText(mmPerDay, 1)} mm/d`;
}

export function positive(value: number, option: string, unit: string): number {
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
export function renamedFlags(o: SpacingFlags): void {
  for (const [old, now, oldFlag, newFlag] of RENAMED) {
    if (o[old] === undefined) continue;
    if (o[now] !== undefined)
      throw new TilefluxError(`${oldFlag} is the former name of ${newFlag}; give only ${newFlag}`);
    (o as Record<string, unknown>)[now] = o[old];
    warn(`${oldFlag} is now ${newFlag} (the field file's word); the old name will go`);
  }
}

/** Flags that belong to only one of the two modes, for a clear error when mixed. */
export const STEADY_ONLY: Array<[keyof SpacingFlags, string]> = [
  ['waterTable', '--water-table'],
  ['coefficient', '--coefficient'],
  ['conductivityBelowDrains', '--conductivity-below-drains'],
];
export const TRANSIENT_ONLY: Array<[keyof SpacingFlags, string]> = [
  ['drainablePorosity', '--drainable-porosity'],
  ['from', '--from'],
  ['to', '--to'],
  ['days', '--days'],
];

/** The layout options common to both modes, parsed and checked against each other. */
export function layout(o: SpacingFlags) {
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
      `--restrictive-layer-depth (${fixedText(barrierDepthM, 3)} m) must be deeper than --drain-depth ` +
        `(${fixedText(drainDepthM, 3)} m): the restrictive layer lies below the drains`,
    );
  }
  const layerBelowDrainsM = barrierDepthM - drainDepthM;
  if (!(radiusM < layerBelowDrainsM)) {
    throw new TilefluxError(
      `--radius (${fixedText(radiusM, 3)} m) must be smaller than the layer between the drains and the ` +
        `barrier (--restrictive-layer-depth minus --drain-depth, ${fixedText(layerBelowDrainsM, 3)} m)`,
    );
  }
  if (!(radiusM < drainDepthM)) {
    throw new TilefluxError(
      `--radius (${fixedText(radiusM, 3)} m) must be smaller than --drain-depth (${fixedText(drainDepthM, 3)} m)`,
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

/** The layout lines of the printed inputs, the same in both modes. */
export function layoutRows(o: SpacingFlags, l: Layout, units: UnitSystem): Array<[string, string]> {
  return [
    ['drain depth', echo(o.drainDepth, l.drainDepthM, 'm', 3, units)],
    [
      'barrier depth',
      `${echo(o.restrictiveLayerDepth, l.barrierDepthM, 'm', 3, units)} (${len(l.layerBelowDrainsM, units)} below the drains)`,
    ],
    ['drain radius', echo(o.radius, l.radiusM, 'm', 3, units)],
  ];
}
