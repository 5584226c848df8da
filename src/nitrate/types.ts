/**
 * Data that flows into and out of the nitrate stage. Core units throughout: mm of water per day,
 * mg N/L for concentrations, kg N/ha for masses, degC for temperature. Daily series are columnar
 * Float64Arrays aligned with `dates` (DEVELOPERS.md, Layout).
 */
import type { DayIndex } from '../climate/calendar.js';
import type { CropCalendar } from '../engine/types.js';

/**
 * A fertilizer or manure application of nitrate-forming N.
 *
 * `date` is "MM-DD" (every year) or "YYYY-MM-DD" (once). With `crops`, the event applies only in
 * calendar years in which one of those crops is grown (names compared without regard to case),
 * e.g. `{ date: '04-20', amountKgHa: 150, crops: ['corn'] }` fertilizes corn years only.
 */
export interface FertilizerEvent {
  date: string;
  amountKgHa: number;
  crops?: string[];
}

/**
 * Parameters of the `pool` model: a daily nitrate-N balance of the drained profile. Each default,
 * with its source, is in `DEFAULT_POOL_PARAMS` (src/nitrate/defaults.ts).
 */
export interface PoolParams {
  /** Nitrate-N in the drained profile on the first day, kg N/ha. */
  initialPoolKgHa: number;
  /** Water the pool mixes into (the mobile water of the drained profile), mm. */
  mobileWaterMm: number;
  fertilizer: FertilizerEvent[];
  /** Net mineralization a whole year at 20 degC would give, kg N/ha per year. */
  mineralizationKgHaPerYear: number;
  /** Q10 of net mineralization. */
  mineralizationQ10: number;
  /** Crop N demand on the soil pool over a whole season, kg N/ha, keyed by crop name. */
  uptakeKgHa: Record<string, number>;
  /** Pool at which the crop takes half its daily demand (Michaelis-Menten), kg N/ha; 0: all. */
  uptakeHalfSaturationKgHa: number;
  /** Season fraction (0 planting, 1 harvest) at which half of the season's uptake is taken. */
  uptakeMidpoint: number;
  /** Steepness of the logistic uptake curve (per unit season fraction). */
  uptakeSteepness: number;
  /** Fraction of the pool denitrified per day at a saturated profile and 20 degC, 1/d. */
  denitrificationMaxPerDay: number;
  /** Q10 of denitrification. */
  denitrificationQ10: number;
  /** Q10 of denitrification below 11 degC (absent: denitrificationQ10 throughout). */
  denitrificationColdQ10?: number;
  /** Saturated fraction of the drained profile below which no denitrification happens (0..1). */
  saturationThreshold: number;
  /** Exponent of the saturation response above the threshold. */
  saturationExponent: number;
  /** Concentration of runoff relative to the profile water (0..1). */
  runoffExtractionRatio: number;
}

/** Keys every concentration model may carry. */
export interface RunoffOption {
  /** Runoff concentration relative to drain water (0..1); default 0.1 (assumption). */
  runoffExtractionRatio?: number;
}

/** Which concentration model turns flow into load, with its parameters (core units). */
export type NitrateConfig =
  | ({ model: 'fixed'; concentrationMgL: number } & RunoffOption)
  | ({ model: 'seasonal'; monthlyMgL: number[] } & RunoffOption)
  | ({
      model: 'rating';
      /** C = a Q^b: concentration (mg/L) at a drain flow of 1 mm/d. */
      a: number;
      b: number;
      /** Daily drain flows (mm) the rating covers; flows outside are clamped and counted. */
      fitFlowRangeMm: [number, number];
    } & RunoffOption)
  | ({ model: 'pool' } & PoolParams);

/** Daily series the nitrate models need, taken from an engine run and its forcing. */
export interface NitrateInput {
  dates: string[];
  drainflowMm: Float64Array;
  runoffMm: Float64Array;
  seepageMm: Float64Array;
  tmeanC: Float64Array;
  /** Saturated fraction of the drained profile, 0..1 (EngineResult.saturatedFraction). */
  saturatedFraction: Float64Array;
  /** Midpoint water-table depth, m (not used by the present models; denitrification uses the
   * saturated fraction). */
  waterTableDepthM: Float64Array;
  calendar: CropCalendar;
  /** `dayIndexOf(dates)`, when the caller has it already. */
  days?: DayIndex;
}

/** Daily terms of the `pool` model, kg N/ha per day (pool: end-of-day state). */
export interface PoolSeries {
  poolKgHa: Float64Array;
  /** Concentration of the profile's mobile water at the end of the day, mg N/L. */
  profileConcMgL: Float64Array;
  fertilizerKgHa: Float64Array;
  mineralizationKgHa: Float64Array;
  uptakeKgHa: Float64Array;
  denitrificationKgHa: Float64Array;
  /** start + inputs - outputs - end, kg N/ha (rounding only). */
  balanceErrorKgHa: Float64Array;
}

/** Daily nitrate-N results of one run. */
export interface NitrateResult {
  /**
   * Mean concentration of the day's drain flow, mg N/L. On a day without drain flow: the
   * concentration drain water would have had (model value; pool: the profile water).
   */
  concMgL: Float64Array;
  /** Drain load, kg N/ha = drain flow (mm) x concMgL / 100. */
  loadKgHa: Float64Array;
  runoffLoadKgHa: Float64Array;
  seepageLoadKgHa: Float64Array;
  /** Present for the `pool` model only. */
  pool?: PoolSeries;
  /** `rating`: days with a drain flow outside the fitted range (clamped to the range edge). */
  outOfRangeDays: number;
}

/** Result of fitting C = a Q^b to observed pairs. */
export interface RatingFit {
  a: number;
  b: number;
  /** Coefficient of determination of the log-space regression. */
  rSquared: number;
  /** Pairs used (flow and concentration both positive). */
  n: number;
  /** Pairs left out because a flow or a concentration was zero or negative. */
  skipped: number;
  /** Smallest and largest flow among the pairs used, mm/d. */
  flowRangeMm: [number, number];
}

/** Observed pairs read from a `date,flow_mm,no3n_mg_l` CSV. */
export interface RatingPairs {
  dates: string[];
  flowMm: number[];
  concMgL: number[];
  /** Rows without a flow or a concentration (an empty cell: no sample that day). */
  skippedRows: number;
}
