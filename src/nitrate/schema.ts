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
import { dayNumber } from '../climate/calendar.js';
import { TilefluxError } from '../errors.js';
import { DECIMAL_NUMBER } from '../units/decimal.js';
import { US } from '../units/quantity.js';
import { zQuantity } from '../units/zodQuantity.js';
import { fitRating } from './fitRating.js';
import {
  DEFAULT_POOL_PARAMS as D,
  DEFAULT_RATING_RANGE_MM,
  DEFAULT_RUNOFF_EXTRACTION_RATIO,
} from './defaults.js';
import { readRatingPairsCsv } from './ratingCsv.js';
import type { NitrateConfig, RatingFit } from './types.js';

const KG_HA = new RegExp(
  String.raw`^\s*(${DECIMAL_NUMBER})\s*kg\s*(?:N\s*)?/\s*(?:ha|hectare)\s*$`,
  'i',
);
const LB_AC = new RegExp(
  String.raw`^\s*(${DECIMAL_NUMBER})\s*lbs?\s*(?:N\s*)?/\s*(?:ac|acre)\s*$`,
  'i',
);
const BARE = new RegExp(String.raw`^\s*(${DECIMAL_NUMBER})\s*$`);

/**
 * A mass of N per area: a number in kg N/ha, or "150 kg/ha", "150 kg N/ha", "134 lb/ac".
 *
 * @example zKgHa('Fertilizer N').parse('100 lb/ac') // 112.085...
 */
export function zKgHa(description: string, perYear = false) {
  const unit = perYear ? 'kg N/ha per year' : 'kg N/ha';
  return z
    .union([z.number(), z.string()])
    .transform((value, ctx) => {
      let v: number;
      let m: RegExpExecArray | null;
      if (typeof value === 'number') v = value;
      else if ((m = BARE.exec(value) ?? KG_HA.exec(value))) v = Number(m[1]);
      else if ((m = LB_AC.exec(value))) v = Number(m[1]) / US.lbAcPerKgHa;
      else v = NaN;
      if (!Number.isFinite(v) || v < 0) {
        ctx.addIssue({
          code: 'custom',
          message: `expects a mass of N per area of at least 0 such as 150, 150 kg/ha or 134 lb/ac; got ${value}`,
        });
        return z.NEVER;
      }
      return v;
    })
    .describe(`${description} [${unit}; e.g. 150, 150 kg/ha or 134 lb/ac]`);
}

const fraction = (description: string, max = 1) =>
  zQuantity('fraction', description, { min: 0, max });

const runoffExtractionRatio = fraction(
  'Nitrate concentration of surface runoff relative to the drain (profile) water: runoff meets only a thin surface layer (assumption)',
)
  .default(DEFAULT_RUNOFF_EXTRACTION_RATIO)
  .describe(
    `Nitrate concentration of surface runoff relative to the drain (profile) water [fraction; default ${DEFAULT_RUNOFF_EXTRACTION_RATIO} (assumption)]`,
  );

const concentration = (description: string) =>
  zQuantity('concentration', description, { min: 0, max: 1000 });

const positiveRate = (description: string) =>
  zQuantity('rate', description, { min: 0, exclusiveMin: true });

/** "MM-DD" (every year) or "YYYY-MM-DD" (once), a real calendar day. */
const eventDate = z
  .string()
  .refine(
    (s) =>
      (/^\d{2}-\d{2}$/.test(s) && dayNumber(`2000-${s}`) !== undefined) ||
      (/^\d{4}-\d{2}-\d{2}$/.test(s) && dayNumber(s) !== undefined),
    { message: 'expects a month-day such as "04-25" (every year) or a date such as "2024-04-25"' },
  )
  .describe('Application date: "MM-DD" every year, or "YYYY-MM-DD" once');

const fertilizerEvent = z.strictObject({
  date: eventDate,
  amount: zKgHa('N applied (fertilizer or manure N that turns to nitrate)'),
  crops: z
    .array(z.string().min(1))
    .min(1)
    .optional()
    .describe('Apply only in years in which one of these crops is grown, e.g. [corn]'),
});

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

const uptakeDefaults = D.uptakeKgHa;

const poolSchema = z
  .strictObject({
    model: z.literal('pool').describe('Daily soil nitrate-N balance of the drained profile'),
    initialPool: zKgHa('Nitrate-N in the drained profile on the first simulated day')
      .default(D.initialPoolKgHa)
      .describe(
        `Nitrate-N in the drained profile on the first simulated day [kg N/ha, or e.g. 40 kg/ha, 36 lb/ac; default ${D.initialPoolKgHa} (assumption)]`,
      ),
    mobileWater: zQuantity(
      'depthMm',
      'Water in the drained profile that the nitrate pool mixes into',
      { min: 1, max: 5000 },
    )
      .default(D.mobileWaterMm)
      .describe(
        `Water in the drained profile that the nitrate pool mixes into; its concentration is pool / water [mm, or e.g. 12 in; default ${D.mobileWaterMm} (assumption: 1.2 m x 0.25)]`,
      ),
    fertilizer: z
      .array(fertilizerEvent)
      .default(D.fertilizer.map((e) => ({ date: e.date, amount: e.amountKgHa, crops: e.crops })))
      .describe(
        'Fertilizer and manure N events [list of {date, amount (kg N/ha), crops}; default 150 kg N/ha on 04-25 in corn years (regional rate guidelines)]',
      ),
    mineralization: zKgHa('Net N mineralization a whole year at 20 degC would give', true)
      .default(D.mineralizationKgHaPerYear)
      .describe(
        `Net N mineralization a whole year at 20 degC would give [kg N/ha per year; default ${D.mineralizationKgHaPerYear} (published figure; sources in src/nitrate/defaults.ts)]`,
      ),
    mineralizationQ10: z
      .number()
      .min(1)
      .max(5)
      .default(D.mineralizationQ10)
      .describe(
        `Q10 of mineralization (rate ratio per 10 degC) [-; default ${D.mineralizationQ10} (published figure; sources in src/nitrate/defaults.ts)]`,
      ),
    uptake: z
      .record(z.string().min(1), zKgHa('Seasonal crop N uptake from the soil'))
      .default({})
      .describe(
        `Crop N demand on the soil per season, by crop, met in full while nitrate is ample; crops not named keep their default [kg N/ha; defaults ${Object.entries(
          uptakeDefaults,
        )
          .map(([k, v]) => `${k} ${v}`)
          .join(', ')} (published figure; sources in src/nitrate/defaults.ts)]`,
      ),
    uptakeHalfSaturation: zKgHa('Pool at which crops take half their daily demand')
      .default(D.uptakeHalfSaturationKgHa)
      .describe(
        `Nitrate-N pool at which crops take half their daily demand (uptake = demand x pool / (pool + this)); 0 takes the full demand while N lasts [kg N/ha; default ${D.uptakeHalfSaturationKgHa} (assumption)]`,
      ),
    uptakeMidpoint: zQuantity('fraction', 'Season fraction by which half the uptake is taken', {
      min: 0.05,
      max: 0.95,
    })
      .default(D.uptakeMidpoint)
      .describe(
        `Season fraction (0 planting, 1 harvest) by which half the uptake is taken [fraction; default ${D.uptakeMidpoint} (published figure; sources in src/nitrate/defaults.ts)]`,
      ),
    uptakeSteepness: z
      .number()
      .positive()
      .max(100)
      .default(D.uptakeSteepness)
      .describe(
        `Steepness of the logistic uptake curve [per unit season fraction; default ${D.uptakeSteepness} (assumption)]`,
      ),
    denitrificationRate: fraction('Fraction of the pool denitrified per day')
      .default(D.denitrificationMaxPerDay)
      .describe(
        `Fraction of the pool denitrified per day with the drained profile saturated, at 20 degC [1/d; default ${D.denitrificationMaxPerDay} (assumption)]`,
      ),
    denitrificationQ10: z
      .number()
      .min(1)
      .max(5)
      .default(D.denitrificationQ10)
      .describe(
        `Q10 of denitrification at and above 11 degC [-; default ${D.denitrificationQ10} (NEMIS, from memory)]`,
      ),
    denitrificationColdQ10: z
      .number()
      .min(1)
      .max(200)
      .default(D.denitrificationColdQ10 ?? D.denitrificationQ10)
      .describe(
        `Q10 of denitrification below 11 degC [-; default ${D.denitrificationColdQ10} (NEMIS, from memory)]`,
      ),
    saturationThreshold: fraction('Saturated fraction below which no denitrification happens', 0.95)
      .default(D.saturationThreshold)
      .describe(
        `Saturated fraction of the drained profile below which no denitrification happens [fraction; default ${D.saturationThreshold} (assumption)]`,
      ),
    saturationExponent: z
      .number()
      .positive()
      .max(10)
      .default(D.saturationExponent)
      .describe(
        `Exponent of the saturation response of denitrification [-; default ${D.saturationExponent} (assumption)]`,
      ),
    runoffExtractionRatio,
  })
  .describe('pool: daily nitrate-N balance');

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
      return {
        model: 'pool',
        initialPoolKgHa: s.initialPool,
        mobileWaterMm: s.mobileWater,
        fertilizer: s.fertilizer.map((e) => ({
          date: e.date,
          amountKgHa: e.amount,
          ...(e.crops ? { crops: [...e.crops] } : {}),
        })),
        mineralizationKgHaPerYear: s.mineralization,
        mineralizationQ10: s.mineralizationQ10,
        uptakeKgHa: { ...uptakeDefaults, ...s.uptake },
        uptakeHalfSaturationKgHa: s.uptakeHalfSaturation,
        uptakeMidpoint: s.uptakeMidpoint,
        uptakeSteepness: s.uptakeSteepness,
        denitrificationMaxPerDay: s.denitrificationRate,
        denitrificationQ10: s.denitrificationQ10,
        denitrificationColdQ10: s.denitrificationColdQ10,
        saturationThreshold: s.saturationThreshold,
        saturationExponent: s.saturationExponent,
        runoffExtractionRatio: s.runoffExtractionRatio,
      };
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
