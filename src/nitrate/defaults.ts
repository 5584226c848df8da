/**
 * Default nitrate parameters: a corn-soybean rotation on a drained mineral soil of the humid
 * U.S. corn belt. Each value carries its source; "(from memory)" marks a published figure
 * recalled without the document at hand, "(assumption)" a value of our own choosing. They are
 * planning defaults, not measurements: a field with its own soil tests, yields and drain-water
 * samples should use them instead.
 *
 * What the defaults aim at: drained Midwest corn-soybean fields typically show annual
 * flow-weighted nitrate-N concentrations of roughly 10 to 20 mg/L and loads of roughly 10 to
 * 60 kg N/ha (Randall & Mulla 2001, J. Environ. Qual. 30: 337-344; Dinnes et al. 2002, Agron. J.
 * 94: 153-171; Christianson & Harmel 2015, Agric. Water Manage. 159: 277-289 (all from memory)).
 */
import type { PoolParams } from './types.js';

/** Runoff concentration relative to the profile or drain water (assumption). */
export const DEFAULT_RUNOFF_EXTRACTION_RATIO = 0.1;

/** Concentration of the `fixed` model when none is given, mg N/L (middle of the 10-20 mg/L above). */
export const DEFAULT_FIXED_MG_L = 15;

/**
 * Flows a user-given rating covers when no range is stated, mm/d (assumption: from a trickle to
 * about twice a 1/2 in/d drainage coefficient, the span of daily flows of drained fields).
 */
export const DEFAULT_RATING_RANGE_MM: [number, number] = [0.1, 25];

export const DEFAULT_POOL_PARAMS: PoolParams = {
  // Spring profile nitrate-N of a few tens of kg/ha in the top 1.2 m (assumption); with the
  // warm-up years of a run its value hardly matters.
  initialPoolKgHa: 40,
  // A 1.2 m drained profile holding about 0.25 m3/m3 of water that exchanges with the flow
  // paths to the drains (assumption).
  mobileWaterMm: 300,
  // Spring pre-plant N for corn after soybean: about 140-150 kg N/ha, the maximum-return-to-N
  // rate of regional corn-belt N-rate guidelines (Sawyer et al. 2006, university extension
  // guidelines on corn N rates (from memory)); a week before the corn planting date (common
  // practice). None on soybean.
  fertilizer: [{ date: '04-25', amountKgHa: 150, crops: ['corn'] }],
  // Net mineralization of 100-150 kg N/ha per year in Midwest mollisols (Dinnes et al. 2002
  // (from memory)): 150 at 20 degC gives about 100 a year in a corn-belt temperature regime.
  mineralizationKgHaPerYear: 150,
  // Q10 about 2 between 5 and 35 degC (Stanford, Frere & Schwaninger 1973, Soil Sci. 115:
  // 321-323 (from memory)).
  mineralizationQ10: 2,
  // Uptake from the soil pool per season: corn about 180 kg N/ha at 11-12 Mg/ha grain (Bender et
  // al. 2013, Agron. J. 105: 161-170 (from memory)); soybean takes about half its 200-250 kg N/ha
  // from the soil and fixes the rest (Salvagiotti et al. 2008, Field Crops Res. 108: 1-13
  // (from memory)); small grains about 90 (assumption: 3.5 Mg/ha at about 25 kg N/Mg).
  uptakeKgHa: { corn: 180, soybean: 110, 'small grains': 90 },
  // Uptake slows as the pool runs short: half the demand is met with 15 kg N/ha left in the
  // profile, so crops leave a residual of the order of 10-30 kg N/ha as N-limited crops do at
  // harvest (assumption; residual soil nitrate after harvest of a few tens of kg N/ha is
  // common in corn-belt soil tests (from memory)). Soybean meets the rest by fixation.
  uptakeHalfSaturationKgHa: 15,
  // Half the uptake by silking, about 40 % of the planting-to-harvest span (after Bender et al.
  // 2013 (from memory)); steepness 10 spreads most uptake over the middle half of the season
  // (assumption).
  uptakeMidpoint: 0.4,
  uptakeSteepness: 10,
  // 5 % of the pool per day with the drained profile saturated at 20 degC (assumption), so that
  // a freely drained field loses of the order of 10-20 kg N/ha a year to denitrification
  // (David et al. 2009, Biogeochemistry 93: 7-30, for a drained corn-belt field (from memory)).
  denitrificationMaxPerDay: 0.05,
  // Temperature response of the NEMIS model (Henault & Germon 2000, Eur. J. Soil Sci. 51:
  // 257-270, from memory; one of the forms Heinen 2006, Geoderma 133: 444-463, reviews): Q10 2.1
  // from 11 degC up, 89 below. A single Q10 of 2 overstated winter denitrification several-fold,
  // and winter is when a control structure holds the water table up; field syntheses of
  // controlled drainage find load cuts that come mostly from less flow, with little change in
  // concentration (a 2016 meta-analysis and a 2022 synthesis of Midwest and Southeast sites,
  // from memory).
  denitrificationQ10: 2.1,
  denitrificationColdQ10: 89,
  // No threshold: the saturated fraction is that of the top metre of the profile (the engine's
  // active zone), which is aerated when drained. Exponent 2: organic carbon, and with it
  // denitrification, concentrates near the surface, so saturation of the upper profile counts
  // more than the lower (assumption).
  saturationThreshold: 0,
  saturationExponent: 2,
  runoffExtractionRatio: DEFAULT_RUNOFF_EXTRACTION_RATIO,
};
