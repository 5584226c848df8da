/**
 * Nitrate stage: concentration models (`fixed`, `seasonal`, `rating`, `pool`) turning a run's
 * daily drain flow into nitrate-N concentration and load (README, Nitrate models).
 */
export type {
  FertilizerEvent,
  NitrateConfig,
  NitrateInput,
  NitrateResult,
  PoolParams,
  PoolSeries,
  RatingFit,
  RatingPairs,
} from './types.js';
export { simulateNitrate } from './simulate.js';
export { simulatePool, poolForcingOf, type PoolForcing } from './pool.js';
export { fitRating } from './fitRating.js';
export { readRatingPairsCsv } from './ratingCsv.js';
export { ratingConcentration } from './rating.js';
export { seasonalConcentration } from './seasonal.js';
export { loadKgHa, concentrationMgL } from './load.js';
export { annualNitrate, flowWeightedMeanMgL, type AnnualNitrate } from './annual.js';
export {
  DEFAULT_POOL_PARAMS,
  DEFAULT_RATING_RANGE_MM,
  DEFAULT_RUNOFF_EXTRACTION_RATIO,
} from './defaults.js';
export {
  nitrateSchema,
  DEFAULT_NITRATE,
  ratingFromObservations,
  type NitrateSection,
  type RatingObservationsSection,
} from './schema.js';
export { zKgHa } from './schemaValues.js';
