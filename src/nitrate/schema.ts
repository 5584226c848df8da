/**
 * The field file's `nitrate:` section: which concentration model turns drain flow into nitrate-N
 * load, with its parameters. One source of truth for each key's meaning, unit, default and
 * range; the parsed section is the core's `NitrateConfig` (SI units, defaults filled), except a
 * rating to be fitted to an observations file, which the reader resolves with
 * `ratingFromObservations` once it has read the file.
 *
 * Concentrations, depths of water and flows accept unit strings ("12 mg/L", "300 mm",
 * "0.5 in/d"). Masses per area (kg N/ha) are numbers or strings such as "150 kg/ha" or
 * "134 lb/ac" (1 lb/ac = 1.12085 kg/ha). Without a section the default `pool` model runs.
 *
 * @example
 * nitrateSchema.parse({ model: 'fixed', concentration: '12 mg/L' })
 * // { model: 'fixed', concentrationMgL: 12, runoffExtractionRatio: 0.1 }
 */
import { z } from 'zod';
import { TilefluxError } from '../errors.js';
import { fitRating } from './fitRating.js';
import { DEFAULT_POOL_PARAMS as D, DEFAULT_RATING_RANGE_MM } from './defaults.js';
import { poolConfig, poolSchema } from './poolSchema.js';
import { readRatingPairsCsv } from './ratingCsv.js';
import { concentration, positiveRate, runoffExtractionRatio } from './schemaValues.js';
import type { NitrateConfig, RatingFit } from './types.js';

const fixedSchema = z
  .strictObject({
    model: z.literal('fixed').describe('One flow-weighted concentration for all drain water'),
    concentration: concentration('Nitrate-N concentration of drain water'),
    runoffExtractionRatio,
  })
  .describe('fixed: one concentration');

const seasonalSchema = z
  .strictObject({
    model: z.literal('seasonal').describe('One concentration per calendar month'),
    monthly: z
      .array(concentration('Nitrate-N concentration of drain water in a month'))
      .length(12)
      .describe('Twelve nitrate-N concentrations, January to December [mg/L; e.g. 12 mg/L]'),
    runoffExtractionRatio,
  })
  .describe('seasonal: twelve monthly concentrations');

const ratingSchema = z
  .strictObject({
    model: z.literal('rating').describe('Concentration-discharge rating C = a Q^b'),
    a: concentration('Concentration at a drain flow of 1 mm/d (give a and b, or observations)')
      .optional()
      .describe(
        'Concentration at a drain flow of 1 mm/d (give a and b, or observations) [mg/L; e.g. 12 mg/L]',
      ),
    b: z
      .number()
      .min(-3)
      .max(3)
      .optional()
      .describe('Exponent of the rating (give a and b, or observations) [-]'),
    flowRange: z
      .tuple([
        positiveRate('Smallest drain flow the rating covers'),
        positiveRate('Largest drain flow the rating covers'),
      ])
      .optional()
      .describe(
        `Daily drain flows the given rating covers; outside it the edge concentration is used and the day counted [mm/d; default [${DEFAULT_RATING_RANGE_MM.join(', ')}] (assumption)]`,
      ),
    observations: z
      .string()
      .min(1)
      .optional()
      .describe(
        'CSV of observed pairs "date,flow_mm,no3n_mg_l" (path relative to the field file) to fit a and b to',
      ),
    runoffExtractionRatio,
  })
  .superRefine((r, ctx) => {
    const given = r.a !== undefined || r.b !== undefined;
    if (r.observations !== undefined && (given || r.flowRange !== undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: ['observations'],
        message:
          'give either a and b (with an optional flowRange) or observations to fit them to, not both',
      });
    } else if (r.observations === undefined && (r.a === undefined || r.b === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: [r.a === undefined ? 'a' : 'b'],
        message: 'a rating needs both a and b, or observations to fit them to',
      });
    } else if (r.flowRange && !(r.flowRange[1] >= r.flowRange[0])) {
      ctx.addIssue({
        code: 'custom',
        path: ['flowRange'],
        message: `flowRange must be [smallest, largest]; got [${r.flowRange.join(', ')}]`,
      });
    }
  })
  .describe('rating: C = a Q^b, given or fitted to observations');

/** A rating still to be fitted to an observations file (resolved by `ratingFromObservations`). */
export interface RatingObservationsSection {
  model: 'rating';
  observations: string;
  runoffExtractionRatio: number;
}

/** The parsed `nitrate:` section. */
export type NitrateSection = NitrateConfig | RatingObservationsSection;

type SectionIn = z.output<
  typeof fixedSchema | typeof seasonalSchema | typeof ratingSchema | typeof poolSchema
>;

function toConfig(s: SectionIn): NitrateSection {
  switch (s.model) {
    case 'fixed':
      return {
        model: 'fixed',
        concentrationMgL: s.concentration,
        runoffExtractionRatio: s.runoffExtractionRatio,
      };
    case 'seasonal':
      return {
        model: 'seasonal',
        monthlyMgL: [...s.monthly],
        runoffExtractionRatio: s.runoffExtractionRatio,
      };
    case 'rating':
      if (s.observations !== undefined) {
        return {
          model: 'rating',
          observations: s.observations,
          runoffExtractionRatio: s.runoffExtractionRatio,
        };
      }
      return {
        model: 'rating',
        a: s.a as number,
        b: s.b as number,
        fitFlowRangeMm: s.flowRange
          ? [s.flowRange[0], s.flowRange[1]]
          : [...DEFAULT_RATING_RANGE_MM],
        runoffExtractionRatio: s.runoffExtractionRatio,
      };
    case 'pool':
      return poolConfig(s);
  }
}

/**
 * The default nitrate model: the `pool` balance with the corn-soybean defaults of
 * `DEFAULT_POOL_PARAMS` (sources in src/nitrate/defaults.ts).
 */
export const DEFAULT_NITRATE: NitrateConfig = { model: 'pool', ...D };

/** Deep copy of the default, so no caller can change the shared object. */
function defaultNitrate(): NitrateConfig {
  return {
    ...DEFAULT_NITRATE,
    fertilizer: D.fertilizer.map((e) => ({ ...e, ...(e.crops ? { crops: [...e.crops] } : {}) })),
    uptakeKgHa: { ...D.uptakeKgHa },
  } as NitrateConfig;
}

/** Schema of the `nitrate:` section (discriminated on `model`); absent: the default pool model. */
export const nitrateSchema = z
  .discriminatedUnion('model', [fixedSchema, seasonalSchema, ratingSchema, poolSchema])
  .transform(toConfig)
  .default(defaultNitrate)
  .describe(
    'Nitrate-N model turning drain flow into load: fixed, seasonal, rating or pool [default: pool with corn-soybean defaults]',
  );

/**
 * Resolve a rating section that names an observations file: read the pairs from the file's text
 * and fit C = a Q^b (log-space least squares); the fitted range of flows becomes the rating's
 * range. Returns the core config and the fit (a, b, R squared, n, range) for the report.
 *
 * @param section parsed section with `observations`
 * @param text    the observations CSV's text
 * @param file    its name, for error messages
 * @example ratingFromObservations(section, 'date,flow_mm,no3n_mg_l\n2024-04-01,2,12\n...', 'no3.csv')
 */
export function ratingFromObservations(
  section: RatingObservationsSection,
  text: string,
  file = section.observations,
): { config: NitrateConfig; fit: RatingFit } {
  const pairs = readRatingPairsCsv(text, file);
  const fit = fitRating(pairs, file);
  if (!(Number.isFinite(fit.a) && Number.isFinite(fit.b))) {
    throw new TilefluxError('the fitted rating is not finite; check the observations', file);
  }
  return {
    config: {
      model: 'rating',
      a: fit.a,
      b: fit.b,
      fitFlowRangeMm: [fit.flowRangeMm[0], fit.flowRangeMm[1]],
      runoffExtractionRatio: section.runoffExtractionRatio,
    },
    fit,
  };
}
