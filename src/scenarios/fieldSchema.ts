/**
 * The field file's schema: one source of truth for every key's meaning, unit, default and range.
 * Validation messages, `tileflux init` comments and the resolved parameters all come from here.
 * Quantities accept unit strings ("1.2 m", "48 in", "0.5 in/d"); a bare number is in the unit
 * shown in brackets in each description.
 *
 * The parsed `Field` keeps the file's key names (`drains.depth`, `pipe.diameter`), each in the unit
 * its description states; `resolve.ts` turns it into the core's parameter objects, whose names
 * carry their unit (`drainDepthM`, `kAboveMPerDay`, `capacityMmPerDay`); the engine and the
 * nitrate models read only those.
 *
 * Longer than most files: it is the whole field file, section after section, and each key's
 * description here is its documentation (messages and `tileflux init` print them).
 */
import { DEFAULT_DRAIN_RADIUS_M } from '../drainage/defaults.js';
import { z } from 'zod';
import { zQuantity } from '../units/zodQuantity.js';
import { nitrateSchema } from '../nitrate/schema.js';
import { checkSweep, costsSchema, managementName, sweepSchema } from './sweepSchema.js';
import { fitSectionSchema } from './fitParams.js';
import {
  COEFFICIENT_CROPS,
  COEFFICIENT_INLETS,
  COEFFICIENT_SOILS,
} from '../drainage/drainageCoefficient.js';
import { SEEPAGE_SETTINGS } from '../engine/seepage.js';
import { dayNumber } from '../climate/calendar.js';

// Real calendar days only: "02-30" and "2015-02-30" are refused ("02-29" is a month-day of leap
// years, and a yearly step from it takes effect on 1 March in the other years).
const mmdd = z
  .string()
  .refine(
    (s) => /^\d{2}-\d{2}$/.test(s) && dayNumber(`2000-${s}`) !== undefined,
    'expects a real month-day such as "10-25" (MM-DD)',
  );
const isoDate = z
  .string()
  .refine(
    (s) => dayNumber(s) !== undefined,
    'expects a real calendar date such as "2024-10-25" (YYYY-MM-DD)',
  );

const fraction = (description: string) => zQuantity('fraction', description, { min: 0, max: 1 });

export const siteSchema = z
  .strictObject({
    latitude: zQuantity(
      'latitude',
      'Latitude, degrees north (south negative); sets day length for reference ET',
      {
        min: -66,
        max: 66,
      },
    ).default(42),
    elevation: zQuantity('length', 'Elevation above sea level (Penman-Monteith air pressure)', {
      min: -400,
      max: 5000,
    }).default(250),
  })
  .describe('Where the field is');

/** A drainable porosity: above 0 (at 0 a millimetre of recharge would raise the water table without bound). */
const porosity = (description: string) =>
  zQuantity('fraction', description, { min: 0, exclusiveMin: true, max: 1 });

const porosityLayer = z.strictObject({
  depth: zQuantity('length', 'Bottom of this layer below the surface', {
    min: 0,
    exclusiveMin: true,
  }),
  value: porosity('Drainable porosity of the layer'),
});

export const soilSchema = z
  .strictObject({
    conductivity: zQuantity(
      'conductivity',
      'Lateral saturated hydraulic conductivity above drain level',
      {
        min: 0,
        exclusiveMin: true,
        max: 100,
      },
    ),
    conductivityBelowDrains: zQuantity(
      'conductivity',
      'Lateral saturated conductivity below drain level (defaults to conductivity)',
      { min: 0, exclusiveMin: true, max: 100 },
    ).optional(),
    restrictiveLayerDepth: zQuantity(
      'length',
      'Depth of the restrictive (impermeable) layer below the surface',
      {
        min: 0,
        exclusiveMin: true,
        max: 50,
      },
    ),
    drainablePorosity: z
      .union([
        porosity('Drainable porosity (specific yield), one value for the whole profile'),
        z.array(porosityLayer).min(1),
      ])
      .default(0.05)
      .describe(
        'Drainable porosity (specific yield): one value, or a list of {depth, value} layers from the surface down',
      ),
    rootZoneDepth: zQuantity(
      'length',
      'Effective root-zone depth held all year; leave it out for per-crop roots that grow from 0.15 m at planting to the crop maximum (FAO-56 Table 22 middle: corn 1.35, soybean 0.95, small grains 1.25 m), capped by the restrictive layer',
      { min: 0.05, max: 3 },
    ).optional(),
    fieldCapacity: fraction('Volumetric water content at field capacity').default(0.3),
    wiltingPoint: fraction('Volumetric water content at the permanent wilting point').default(0.14),
    surfaceStorage: zQuantity('depthMm', 'Depression storage held on the surface before runoff', {
      min: 0,
      max: 500,
    }).default(10),
    seepage: zQuantity(
      'rate',
      'Extra constant deep seepage while the water table is above the restrictive layer (added to the seepage section)',
      {
        min: 0,
        max: 50,
      },
    ).default(0),
    seepageConductance: z
      .number()
      .min(0)
      .default(0)
      .describe(
        'Extra deep seepage per metre of water-table head above the restrictive layer, added to the seepage section [mm/d per m]',
      ),
    capillaryDecay: zQuantity(
      'length',
      'Decay length of upward supply from the water table below the root zone (model assumption)',
      { min: 0.01, max: 5 },
    ).default(0.3),
  })
  .describe('Soil and profile');

const pipeSchema = z.strictObject({
  diameter: zQuantity('diameter', 'Inside diameter of the lateral at its outlet end', {
    min: 10,
    max: 2000,
  }),
  grade: zQuantity('slope', 'Grade of the lateral', { min: 0, exclusiveMin: true, max: 0.5 }),
  length: zQuantity('length', 'Length of the lateral (area served = length x spacing)', {
    min: 1,
    max: 10000,
  }),
  roughness: z.number().min(0.005).max(0.05).default(0.015).describe("Manning's n of the pipe [-]"),
});

export const drainsSchema = z
  .strictObject({
    depth: zQuantity('length', 'Drain depth below the surface', { min: 0.2, max: 5 }),
    spacing: zQuantity('length', 'Distance between parallel laterals', { min: 1, max: 500 }),
    radius: zQuantity('length', 'Effective drain radius (pipe plus envelope)', {
      min: 0.001,
      max: 0.5,
    }).default(DEFAULT_DRAIN_RADIUS_M),
    coefficient: z
      .union([
        zQuantity('rate', 'Drainage coefficient as a rate', {
          min: 0,
          exclusiveMin: true,
          max: 1000,
        }),
        z.strictObject({
          soil: z.enum(COEFFICIENT_SOILS).default('mineral'),
          crop: z.enum(COEFFICIENT_CROPS).default('field'),
          inlets: z.enum(COEFFICIENT_INLETS).default('none'),
        }),
      ])
      .optional()
      .describe(
        'Drainage coefficient of the system: a rate, or {soil: mineral|organic, crop: field|truck, inlets: none|blind|open} from the 24-hour table (middle of the tabulated range; default mineral, field, none = 11.1 mm/d); the pipes carry at most this unless capacity or pipe is given',
      ),
    capacity: zQuantity(
      'rate',
      'The most the pipes carry, depth per day over the area (overrides coefficient and pipe)',
      {
        min: 0,
        exclusiveMin: true,
        max: 1000,
      },
    ).optional(),
    pipe: pipeSchema
      .optional()
      .describe('Lateral pipe, to compute the capacity by Manning (instead of capacity)'),
    system: z
      .string()
      .min(1)
      .optional()
      .describe(
        'Drain-system file (YAML, relative to this file; see `tileflux system`): its selected sizes set the capacity (instead of capacity or pipe)',
      ),
    equivalentDepth: z
      .enum(['vdmw', 'moody'])
      .default('vdmw')
      .describe(
        'Equivalent-depth method: vdmw (van der Molen & Wesseling 1991) or moody (Moody 1966)',
      ),
  })
  .describe('Drain layout');

const outletStep = (from: z.ZodType<string>) =>
  z.strictObject({
    from,
    depth: z
      .union([
        z.literal('free'),
        zQuantity('length', 'Outlet level below the surface', { min: 0, max: 5 }),
      ])
      .describe('Outlet level below the surface from 0 to 5 m, or "free"'),
  });

/** Height of one stop-log board: the report then gives the schedule in boards. */
const boardHeight = zQuantity(
  'length',
  'Height of one stop-log board of the control structure, e.g. 6 in; the report then gives the schedule in boards (counted up from the outlet pipe at drain depth)',
  { min: 0.01, max: 0.6 },
).optional();

/** A list of outlet steps, each `from` at most once (a repeated day would silently drop a step). */
const outletSteps = (from: z.ZodType<string>) =>
  z
    .array(outletStep(from))
    .min(1)
    .superRefine((steps, ctx) => {
      const seen = new Map<string, number>();
      steps.forEach((s, i) => {
        const first = seen.get(s.from);
        if (first === undefined) seen.set(s.from, i);
        else
          ctx.addIssue({
            code: 'custom',
            path: [i, 'from'],
            message: `repeats "${s.from}" of step ${first + 1}; each step needs its own day`,
          });
      });
    });

export const outletSchema = z
  .union([
    z.literal('free'),
    z.strictObject({ schedule: outletSteps(mmdd), boardHeight }),
    z.strictObject({ dates: outletSteps(isoDate), boardHeight }),
  ])
  .default('free')
  .describe(
    'Outlet: "free", a yearly schedule {schedule: [{from: "MM-DD", depth}]}, or a one-off dated list {dates: [{from: "YYYY-MM-DD", depth}]}; either may give boardHeight',
  );

const cropOverride = z.strictObject({
  planting: mmdd.optional().describe('Planting date "MM-DD"'),
  harvest: mmdd.optional().describe('Harvest date "MM-DD"'),
  kcIni: z.number().min(0).max(2).optional(),
  kcMid: z.number().min(0).max(2).optional(),
  kcEnd: z.number().min(0).max(2).optional(),
  stagesDays: z
    .tuple([
      z.number().int().min(1),
      z.number().int().min(1),
      z.number().int().min(1),
      z.number().int().min(1),
    ])
    .optional(),
  depletionFraction: z.number().min(0.05).max(0.95).optional(),
  maxRootDepth: zQuantity('length', 'Maximum effective rooting depth of the crop', {
    min: 0.1,
    max: 3,
  }).optional(),
});

export const CROP_NAMES = ['corn', 'soybean', 'small grains'] as const;

export const cropsSchema = z
  .strictObject({
    rotation: z
      .array(z.enum(CROP_NAMES))
      .min(1)
      .default(['corn', 'soybean'])
      .describe('Crops in order, one per year, repeating: corn, soybean, small grains'),
    firstYear: z
      .number()
      .int()
      .min(1800)
      .max(2200)
      .default(2000)
      .describe(
        'A calendar year in which the rotation grows its first crop; the rotation repeats from it both ways, whatever year the run starts (default 2000: corn in even years for [corn, soybean])',
      ),
    corn: cropOverride.optional().describe('Overrides of the FAO-56 corn defaults'),
    soybean: cropOverride.optional().describe('Overrides of the FAO-56 soybean defaults'),
    'small grains': cropOverride
      .optional()
      .describe('Overrides of the FAO-56 small-grain defaults'),
  })
  .default({ rotation: ['corn', 'soybean'], firstYear: 2000 })
  .describe('Crop rotation and calendar');

const seepageLength = (what: string) => zQuantity('length', what, { min: 0, max: 100 });

export const seepageSchema = z
  .union([
    z.enum(Object.keys(SEEPAGE_SETTINGS) as [keyof typeof SEEPAGE_SETTINGS]),
    z.strictObject({
      vertical: z
        .strictObject({
          to: seepageLength('Depth of the regional groundwater head below the surface'),
          conductance: z
            .number()
            .min(0)
            .max(0.1)
            .describe(
              "Leakance K'/b' of the layers between the water table and the regional head [1/d]",
            ),
        })
        .optional()
        .describe("Vertical leakage q = K'/b' x (regional head depth - water-table depth)"),
      lateral: z
        .strictObject({
          distance: zQuantity('length', 'Distance from the middle of the field to its edge', {
            min: 1,
            max: 100000,
          }),
          level: seepageLength(
            'Water level at the edge (boundary ditch or undrained neighbour) below the surface',
          ),
          conductivity: zQuantity(
            'conductivity',
            'Lateral conductivity toward the edge (defaults to soil.conductivity)',
            { min: 0, exclusiveMin: true, max: 100 },
          ).optional(),
        })
        .optional()
        .describe('Lateral seepage to the field edge, q = K (H^2 - He^2) / x^2 (Dupuit)'),
    }),
  ])
  .default('medium')
  .describe(
    'Seepage out of the field: low, medium (default, a typical till field), high, none, or {vertical, lateral}; see the README section on seepage',
  );

export const weatherSchema = z
  .strictObject({
    etFactor: z
      .number()
      .min(0.5)
      .max(1.5)
      .default(1)
      .describe(
        'Factor on reference ET, e.g. 0.85 to correct Hargreaves for a humid climate from a local calibration [-]',
      ),
  })
  .default({ etFactor: 1 })
  .describe('How the weather record is used');

export const initialSchema = z
  .strictObject({
    waterTableDepth: zQuantity('length', 'Water-table depth on the first day', {
      min: 0,
      max: 50,
    }).default(0.8),
  })
  .default({ waterTableDepth: 0.8 })
  .describe('Starting state');

const window = (from: string, to: string, what: string) =>
  z.strictObject({ from: mmdd, to: mmdd }).default({ from, to }).describe(what);

export const wetnessSchema = z
  .strictObject({
    threshold: zQuantity(
      'length',
      'A growing-season day is wet when the midpoint water table is shallower than this',
      {
        min: 0.01,
        max: 3,
      },
    ).default(0.3),
    growingSeason: window(
      '05-01',
      '09-30',
      'Window counted for wet, aeration-stress and water-stress days',
    ),
    aerationLayer: zQuantity(
      'length',
      'Upper root-zone layer whose air-filled porosity is judged for aeration stress',
      { min: 0.05, max: 1.5 },
    ).default(0.3),
    aerationThreshold: fraction(
      'A day is aeration-stressed when the air-filled porosity of that layer is below this [volume fraction; 0.10 is the usual agronomic limit]',
    ).default(0.1),
    springWindow: window('04-15', '05-31', 'Spring fieldwork window (planting)'),
    fallWindow: window('09-20', '11-15', 'Fall fieldwork window (harvest)'),
    surfaceLayer: zQuantity(
      'length',
      'Surface layer whose water content decides whether the field can carry machines',
      { min: 0.02, max: 0.5 },
    ).default(0.1),
    trafficabilityLimit: zQuantity(
      'fraction',
      'A day is suitable for fieldwork when the surface layer holds at most this fraction of field capacity, with no standing water or snow [fraction of field capacity]',
      { min: 0.5, max: 1 },
    ).default(0.9),
  })
  .default({
    threshold: 0.3,
    growingSeason: { from: '05-01', to: '09-30' },
    aerationLayer: 0.3,
    aerationThreshold: 0.1,
    springWindow: { from: '04-15', to: '05-31' },
    fallWindow: { from: '09-20', to: '11-15' },
    surfaceLayer: 0.1,
    trafficabilityLimit: 0.9,
  })
  .describe('How wetness, aeration and days suitable for fieldwork are judged (README "Measures")');

export const simulationSchema = z
  .strictObject({
    substepsPerDay: z
      .number()
      .int()
      .min(
        8,
        'expects at least 8 sub-steps a day (fewer change annual drain flow by more than 1 %)',
      )
      .max(1000)
      .default(8)
      .describe(
        'Least number of internal time steps per day, 8 or more (more are taken when drains react fast)',
      ),
  })
  .default({ substepsPerDay: 8 })
  .describe('Numerical settings');

/** The keys a scenario may override (everything that describes the field, layout and management). */
export const OVERRIDABLE = ['soil', 'drains', 'outlet', 'crops', 'initial', 'nitrate'] as const;

export const scenarioSchema = z.looseObject({
  name: z.string().min(1).max(80).describe('Scenario name (unique)'),
  description: z.string().max(500).optional().describe('One line saying what the scenario is'),
});

export const fieldSchema = z
  .strictObject({
    name: z.string().min(1).max(200).describe('Field name shown in reports'),
    description: z.string().max(2000).optional().describe('Free text about the field'),
    site: siteSchema.default({ latitude: 42, elevation: 250 }),
    soil: soilSchema,
    drains: drainsSchema,
    outlet: outletSchema,
    crops: cropsSchema,
    seepage: seepageSchema,
    weather: weatherSchema,
    initial: initialSchema,
    nitrate: nitrateSchema,
    wetness: wetnessSchema,
    simulation: simulationSchema,
    sweep: sweepSchema
      .extend({
        outlet: z
          .record(managementName, outletSchema)
          .default({ free: 'free' })
          .describe(
            'Named outlet managements, each "free" or a schedule as in outlet:, e.g. winter hold: { schedule: [...] }',
          ),
      })
      .optional()
      .describe('Designs a study sweeps (tileflux sweep): depth x spacing x outlet management'),
    costs: costsSchema.optional(),
    fit: fitSectionSchema,
    scenarios: z
      .array(scenarioSchema)
      .optional()
      .describe(
        'Named overrides of the base field (soil, drains, outlet, crops, initial, nitrate); the first is the baseline. Without it: conventional, shallow and controlled are derived',
      ),
  })
  .superRefine((f, ctx) => {
    checkSweep(f, soilSchema.shape, (path, message) =>
      ctx.addIssue({ code: 'custom', path, message }),
    );
    // Plant-available water is field capacity minus wilting point: it must be positive.
    if (f.soil.fieldCapacity <= f.soil.wiltingPoint) {
      ctx.addIssue({
        code: 'custom',
        path: ['soil', 'fieldCapacity'],
        message: `must be above soil.wiltingPoint (${f.soil.wiltingPoint}); got ${f.soil.fieldCapacity}`,
      });
    }
    // Hooghoudt's and Kirkham's equations need flow below the drains: the pipe must lie above
    // the restrictive layer by more than its radius.
    const below = f.soil.restrictiveLayerDepth - f.drains.depth;
    if (below <= f.drains.radius) {
      ctx.addIssue({
        code: 'custom',
        path: ['drains', 'depth'],
        message:
          `must lie above the restrictive layer (soil.restrictiveLayerDepth, ` +
          `${f.soil.restrictiveLayerDepth} m) by more than the drain radius (${f.drains.radius} m); ` +
          `got ${f.drains.depth} m`,
      });
    }
  })
  .describe('A drained field');

export type FieldInput = z.input<typeof fieldSchema>;
export type Field = z.output<typeof fieldSchema>;
