/**
 * The field-file parameters `tileflux fit` can adjust: their paths, units, default search
 * bounds and how each is read from and written into a field. Also the `fit:` section of the
 * field file (bounds, weights of flow and water table, the behavioural tolerance).
 *
 * Default bounds span the range met in drained mineral soils (common practice, from memory):
 * lateral conductivity 0.05-10 m/d, drainable porosity 0.01-0.20, drainage coefficients
 * 2-60 mm/d, seepage conductance 0-10 mm/d per m of head. Parameters that only scale (positive
 * with a lower bound above 0) are searched on a log scale, the others on a linear one.
 */
import { z } from 'zod';
import { zQuantity } from '../units/zodQuantity.js';
import type { QuantityKind } from '../units/quantity.js';
import type { Field } from './fieldSchema.js';
import { capacityOf } from './resolve.js';

export interface FitParameter {
  /** Key path in the field file, e.g. "soil.conductivity". */
  path: string;
  /** Unit of the value in the core (and in fit.json), e.g. "m/d". */
  unit: string;
  /** Quantity kind of the key (undefined for a plain number). */
  kind?: QuantityKind;
  /** Default search bounds, in `unit`. */
  bounds: readonly [number, number];
  /** Searched on a log scale. */
  log: boolean;
  /** Hard limits of the key in the field schema, in `unit`. */
  limits: readonly [number, number];
}

/** Every parameter fit accepts, in the order they are listed in help and outputs. */
export const FIT_PARAMETERS: readonly FitParameter[] = [
  {
    path: 'soil.conductivity',
    unit: 'm/d',
    kind: 'conductivity',
    bounds: [0.05, 10],
    log: true,
    limits: [1e-6, 100],
  },
  {
    path: 'soil.conductivityBelowDrains',
    unit: 'm/d',
    kind: 'conductivity',
    bounds: [0.05, 10],
    log: true,
    limits: [1e-6, 100],
  },
  {
    path: 'soil.drainablePorosity',
    unit: '-',
    kind: 'fraction',
    bounds: [0.01, 0.2],
    log: true,
    limits: [1e-4, 1],
  },
  {
    path: 'soil.seepageConductance',
    unit: 'mm/d per m',
    bounds: [0, 10],
    log: false,
    limits: [0, 1e6],
  },
  { path: 'soil.seepage', unit: 'mm/d', kind: 'rate', bounds: [0, 5], log: false, limits: [0, 50] },
  {
    path: 'drains.capacity',
    unit: 'mm/d',
    kind: 'rate',
    bounds: [2, 60],
    log: true,
    limits: [1e-3, 1000],
  },
  {
    path: 'soil.surfaceStorage',
    unit: 'mm',
    kind: 'depthMm',
    bounds: [0, 50],
    log: false,
    limits: [0, 500],
  },
  {
    path: 'soil.capillaryDecay',
    unit: 'm',
    kind: 'length',
    bounds: [0.05, 2],
    log: true,
    limits: [0.01, 5],
  },
  {
    path: 'soil.rootZoneDepth',
    unit: 'm',
    kind: 'length',
    bounds: [0.2, 1.5],
    log: false,
    limits: [0.05, 3],
  },
];

/** The drain-side parameters that flow and water-table observations usually constrain. */
export const DEFAULT_FIT_PATHS = [
  'soil.conductivity',
  'soil.drainablePorosity',
  'soil.seepageConductance',
  'drains.capacity',
] as const;

/** The registry entry of a path, or undefined. */
export function fitParameter(path: string): FitParameter | undefined {
  return FIT_PARAMETERS.find((p) => p.path === path);
}

/**
 * The value a field holds for a parameter, in its unit; undefined when the field gives it in a
 * form fit cannot adjust (layered drainable porosity). Unlimited drain capacity is Infinity.
 */
export function fieldValue(f: Field, path: string): number | undefined {
  switch (path) {
    case 'soil.conductivityBelowDrains':
      return f.soil.conductivityBelowDrains ?? f.soil.conductivity;
    case 'soil.drainablePorosity':
      return typeof f.soil.drainablePorosity === 'number' ? f.soil.drainablePorosity : undefined;
    case 'drains.capacity':
      return capacityOf(f);
  }
  const [section, key] = path.split('.');
  return (f as unknown as Record<string, Record<string, number>>)[section][key];
}

/**
 * A copy of the field with the parameter set (the field is not changed).
 * @example withValue(field, 'soil.conductivity', 0.8).soil.conductivity // 0.8
 */
export function withValue(f: Field, path: string, value: number): Field {
  const [section, key] = path.split('.') as [keyof Field, string];
  const part = f[section] as unknown as Record<string, unknown>;
  return { ...f, [section]: { ...part, [key]: value } };
}

const boundsOf = (p: FitParameter) => {
  const q = p.kind
    ? zQuantity(p.kind, `${p.path} bound`, { min: p.limits[0], max: p.limits[1] })
    : z.number().min(p.limits[0]).max(p.limits[1]);
  return z
    .tuple([q, q])
    .describe(`Search bounds [min, max] of ${p.path} [${p.unit}; default ${p.bounds.join(' to ')}]`)
    .optional();
};

/** The `fit:` section of a field file. */
export const fitSectionSchema = z
  .strictObject({
    params: z
      .array(z.enum(FIT_PARAMETERS.map((p) => p.path) as [string, ...string[]]))
      .min(1)
      .optional()
      .describe(
        `Parameters to fit when --params is not given (default ${DEFAULT_FIT_PATHS.join(', ')})`,
      ),
    bounds: z
      .strictObject(Object.fromEntries(FIT_PARAMETERS.map((p) => [p.path, boundsOf(p)])))
      .optional()
      .describe('Search bounds per parameter, replacing the defaults'),
    weights: z
      .strictObject({
        flow: z.number().min(0).default(1).describe('Weight of drain flow in the objective [-]'),
        waterTable: z
          .number()
          .min(0)
          .default(1)
          .describe('Weight of water-table depth in the objective [-]'),
      })
      .optional()
      .describe('Weights of the observed series when both flow and water table are observed'),
    behaviouralTolerance: z
      .number()
      .min(0)
      .max(1)
      .default(0.05)
      .describe(
        'Parameter sets whose objective loss is within this of the best count as behavioural [-]',
      ),
  })
  .optional()
  .describe('Settings of `tileflux fit` (calibration against observations)');

export type FitSection = NonNullable<z.output<typeof fitSectionSchema>>;
