/**
 * The `pool` model's part of the `nitrate:` section: the daily soil nitrate-N balance
 * (fertilizer, mineralization, crop uptake, denitrification, leaching with drain flow), each
 * parameter with its unit, default and the default's standing (published figure, assumption).
 * `poolConfig` turns a parsed section into the core's `PoolParams`-based `NitrateConfig`.
 */
import { z } from 'zod';
import { zQuantity } from '../units/zodQuantity.js';
import { DEFAULT_POOL_PARAMS as D } from './defaults.js';
import { fertilizerEvent, fraction, runoffExtractionRatio, zKgHa } from './schemaValues.js';
import type { NitrateConfig } from './types.js';

const uptakeDefaults = D.uptakeKgHa;

export const poolSchema = z
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

/** The core config of a parsed `pool` section (crops not named in `uptake` keep their default). */
export function poolConfig(s: z.output<typeof poolSchema>): NitrateConfig {
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
