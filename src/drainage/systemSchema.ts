/**
 * The drain-system file's schema (`tileflux system SYSTEM.yaml`): an outlet, mains as chains of
 * reaches listed from their downstream end upward, laterals and surface inlets attached to
 * reaches, the pipe material, the drainage coefficient and the trench limits. One source of each
 * key's unit, default, range and description. Quantities accept unit strings ("120 m",
 * "400 ft", "0.2 %", "0.5 in/d"); a bare number is in the unit in brackets.
 *
 * @example systemSchema.parse({ name: 'plan', coefficient: '0.5 in/d', mains: [{ name: 'trunk',
 *   reaches: [{ length: '100 m', grade: '0.2 %', area: '2 ha' }] }] }).round // 'up'
 */
import { z } from 'zod';
import { zQuantity } from '../units/zodQuantity.js';
import {
  COEFFICIENT_CROPS,
  COEFFICIENT_INLETS,
  COEFFICIENT_SOILS,
  DEFAULT_COEFFICIENT_PRESET,
} from './drainageCoefficient.js';
import { SEDIMENT_VELOCITY_MS } from './manning.js';
import { PIPE_MATERIALS } from './pipeMaterials.js';

const material = z.enum(PIPE_MATERIALS).describe(`Pipe material: ${PIPE_MATERIALS.join(', ')}`);
const grade = (what: string) =>
  zQuantity('slope', `Fixed grade of ${what} (laid from the profile when absent)`, {
    min: 0,
    exclusiveMin: true,
    max: 0.5,
  });
const name = z
  .string()
  .regex(/^[A-Za-z0-9][A-Za-z0-9 _.-]{0,39}$/, 'expects a name of letters, digits, space, _ . -');

/** A group of parallel laterals draining into one reach. */
export const lateralGroupSchema = z.strictObject({
  count: z.number().int().min(1).max(10000).default(1).describe('Number of laterals [-]'),
  length: zQuantity('length', 'Length of each lateral', { min: 1, max: 5000 }),
  spacing: zQuantity('length', 'Distance between the laterals (default: laterals.spacing)', {
    min: 1,
    max: 500,
  }).optional(),
  grade: grade('the laterals (default: laterals.grade)').optional(),
  material: material.optional(),
  side: z.enum(['left', 'right', 'both']).optional().describe('Side of the main, for the record'),
});

/** A reach of a main: the length between two junctions, carrying everything above its lower end. */
export const reachSchema = z.strictObject({
  length: zQuantity('length', 'Length of the reach', { min: 1, max: 10000 }),
  grade: grade('the reach').optional(),
  material: material.optional(),
  laterals: z.array(lateralGroupSchema).optional().describe('Laterals joining this reach'),
  area: zQuantity('area', 'Further area draining into the reach (random lines, wet spots)', {
    min: 0,
  }).optional(),
  inletFlow: zQuantity('flow', 'Flow of the surface inlets on this reach, added to the design', {
    min: 0,
  }).optional(),
});

/** A main: reaches from its downstream end (the outlet or its junction) upward. */
export const mainSchema = z.strictObject({
  name,
  joins: z
    .strictObject({
      main: name.describe('The main it discharges into'),
      station: zQuantity('length', 'Station on that main, from its downstream end', { min: 0 }),
    })
    .optional()
    .describe('Where this main discharges into another (absent for the main at the outlet)'),
  material: material.optional(),
  grade: grade('every reach of this main').optional(),
  reaches: z.array(reachSchema).min(1),
});

export const systemSchema = z.strictObject({
  name: z.string().min(1).describe('Name of the plan'),
  description: z.string().optional(),
  coefficient: z
    .union([
      zQuantity('rate', 'Drainage coefficient', { min: 0, exclusiveMin: true, max: 200 }),
      z.strictObject({
        soil: z.enum(COEFFICIENT_SOILS).default(DEFAULT_COEFFICIENT_PRESET.soil),
        crop: z.enum(COEFFICIENT_CROPS).default(DEFAULT_COEFFICIENT_PRESET.crop),
        inlets: z.enum(COEFFICIENT_INLETS).default(DEFAULT_COEFFICIENT_PRESET.inlets),
      }),
    ])
    .describe(
      'Drainage coefficient: the depth of water removed per day from the drained area, as a ' +
        'rate [mm/d; e.g. 12 mm/d or 0.5 in/d] or a preset {soil, crop, inlets} from the table ' +
        'of drainage coefficients',
    ),
  profile: z
    .string()
    .min(1)
    .optional()
    .describe('Ground profile CSV, relative to this file (--profile overrides it)'),
  material: material.default('corrugated'),
  sizes: z
    .string()
    .default('in')
    .describe('Pipe sizes: in, mm or a list of inside diameters such as "4,5,6,8 in"'),
  // 1.4 ft/s keeps fine sediment moving (SEDIMENT_VELOCITY_MS, manning.ts).
  velocity: zQuantity('velocity', 'Full-flow velocity of the minimum (flushing) grade', {
    min: 0,
    exclusiveMin: true,
    max: 5,
  }).default(SEDIMENT_VELOCITY_MS),
  round: z
    .enum(['up', 'down'])
    .default('up')
    .describe('Round a required size up to the next size (common practice) or down'),
  outlet: z
    .strictObject({
      invert: zQuantity('length', 'Invert elevation of the pipe at the outlet').optional(),
      depth: zQuantity('length', 'Depth of the outlet invert below the ground (with a profile)', {
        min: 0,
        exclusiveMin: true,
        max: 10,
      }).optional(),
    })
    .default({})
    .describe('The outlet: invert elevation, or depth below the ground at station 0'),
  // Trench defaults: design depth 1.2 m (field drains lie 0.9-1.5 m deep in humid-region
  // practice, common practice); minimum cover 0.6 m (2 ft, the least cover conservation practice
  // standards for subsurface drains ask in mineral soils, from memory); maximum depth 2.5 m
  // (assumption: about what drainage plows and trenchers reach; give the machine's figure).
  trench: z
    .strictObject({
      depth: zQuantity('length', 'Design depth of cut to the invert of the mains', {
        min: 0.3,
        max: 10,
      }).default(1.2),
      minimumCover: zQuantity('length', 'Least soil cover over the top of the pipe', {
        min: 0,
        max: 5,
      }).default(0.6),
      maximumDepth: zQuantity('length', 'Deepest cut the machine digs, to the invert', {
        min: 0.3,
        max: 10,
      }).default(2.5),
    })
    .default({ depth: 1.2, minimumCover: 0.6, maximumDepth: 2.5 })
    .describe('Depth of cut: design depth, minimum cover, maximum depth'),
  laterals: z
    .strictObject({
      spacing: zQuantity('length', 'Lateral spacing', { min: 1, max: 500 }).optional(),
      grade: grade('the laterals').optional(),
      material: material.optional(),
    })
    .default({})
    .describe('Defaults for every lateral group'),
  mains: z.array(mainSchema).min(1),
});

export type SystemFile = z.infer<typeof systemSchema>;
export type MainInput = z.infer<typeof mainSchema>;
export type ReachInput = z.infer<typeof reachSchema>;
export type LateralGroupInput = z.infer<typeof lateralGroupSchema>;
