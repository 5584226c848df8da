/**
 * Data that flows into and out of the daily water-balance engine. Everything is in the core's
 * units (m, mm, days, m/d, mm/d) and every daily series is a columnar Float64Array, one value per
 * day, aligned with `dates`.
 */

import type { DayIndex } from '../climate/calendar.js';
import type { SeepageParams } from './seepage.js';

/** Daily forcing for one run, shared by every scenario over the same weather. */
export interface EngineForcing {
  /** ISO dates YYYY-MM-DD, consecutive. */
  dates: string[];
  /**
   * The same dates as integer calendar fields (`dayIndexOf(dates)`), computed once and shared by
   * every run over this forcing; computed by the engine when absent.
   */
  days?: DayIndex;
  /** Precipitation, mm/d (rain + snowfall). */
  precipMm: Float64Array;
  /** Rain reaching the surface, mm/d. */
  rainMm: Float64Array;
  /** Snowfall, mm/d of water. */
  snowfallMm: Float64Array;
  /** Snowmelt reaching the surface, mm/d. */
  snowmeltMm: Float64Array;
  /** Snow water equivalent at the end of each day, mm. */
  sweMm: Float64Array;
  /** Reference evapotranspiration ET0, mm/d. */
  refEtMm: Float64Array;
  /** Mean air temperature, degC (for nitrate processes). */
  tmeanC: Float64Array;
}

/** Daily crop calendar resolved for one scenario (FAO-56 single crop coefficient curve). */
export interface CropCalendar {
  /** Crop coefficient Kc (bare-soil value between seasons). */
  kc: Float64Array;
  /** FAO-56 depletion fraction p for the water-stress coefficient Ks (Eq. 84). */
  depletionFraction: Float64Array;
  /** Crop code per day: 0 none (bare soil), else the index+1 into `crops`. */
  crop: Uint8Array;
  /** Fraction of the season elapsed (0 at planting, 1 at harvest); -1 outside a season. */
  seasonFraction: Float64Array;
  /** Names of the crops referenced by `crop`. */
  crops: string[];
  /**
   * Effective rooting depth of the day, m (grows with the crop; bare-soil depth between
   * seasons). Without it the engine uses `EngineParams.rootZoneDepthM` every day.
   */
  rootDepthM?: Float64Array;
}

/** Drainable porosity as layers: `values[i]` applies from `depthsM[i-1]` (or 0) to `depthsM[i]`. */
export interface PorosityProfile {
  depthsM: number[];
  values: number[];
}

/** Physical parameters of one drained field and layout, all SI, already validated. */
export interface EngineParams {
  drainDepthM: number;
  spacingM: number;
  drainRadiusM: number;
  /** Depth of the restrictive (impermeable) layer below the surface, m. */
  barrierDepthM: number;
  kAboveMPerDay: number;
  kBelowMPerDay: number;
  porosity: PorosityProfile;
  rootZoneDepthM: number;
  fieldCapacity: number;
  wiltingPoint: number;
  surfaceStorageMm: number;
  /** Constant deep seepage rate while the water table is above the barrier, mm/d. */
  seepageMmPerDay: number;
  /** Seepage conductance: extra seepage per m of head above the barrier, mm/d per m. */
  seepageConductanceMmPerDayPerM: number;
  /** Vertical leakage to a regional head and lateral seepage to the field edge (seepage.ts). */
  seepage?: SeepageParams;
  /** Largest drain outflow the pipes carry, mm/d (Infinity when not limited). */
  capacityMmPerDay: number;
  /** Decay length of upward (capillary) supply below the root zone, m. */
  capillaryDecayM: number;
  initialWaterTableDepthM: number;
  /** Minimum internal sub-steps per day (more are taken when the drains react fast). */
  substepsPerDay: number;
  equivalentDepthMethod: 'vdmw' | 'moody';
}

/** Daily results of one engine run (end-of-day states, daily fluxes in mm). */
/**
 * The daily columns of an engine result: what a later run of the same length may write into
 * (`simulate`'s `reuse`), so that a sweep allocates them once per worker instead of per design.
 */
export type EngineColumns = Omit<EngineResult, 'dates' | 'substepsPerDay' | 'equivalentDepthM'>;

export interface EngineResult {
  dates: string[];
  etMm: Float64Array;
  /** Potential crop ET, Kc x ET0 (0 under snow cover), mm. */
  cropEtMm: Float64Array;
  runoffMm: Float64Array;
  infiltrationMm: Float64Array;
  drainflowMm: Float64Array;
  seepageMm: Float64Array;
  /** The part of `seepageMm` that left laterally to the field edge, mm. */
  lateralSeepageMm: Float64Array;
  waterTableDepthM: Float64Array;
  /** Effective outlet depth in force that day (drain depth when free), m. */
  outletDepthM: Float64Array;
  pondedMm: Float64Array;
  /** Root-zone depletion below field capacity, mm. */
  rootZoneDepletionMm: Float64Array;
  /** FAO-56 water-stress coefficient Ks (daily mean). */
  ks: Float64Array;
  /** Soil water relative to a profile saturated to the surface at field capacity, mm (<= 0). */
  soilStorageMm: Float64Array;
  /** Saturated share of the top metre of the profile (ACTIVE_ZONE_M), in [0, 1]: (1 m - depth) / 1 m. */
  saturatedFraction: Float64Array;
  /** Daily water-balance residual, mm. */
  balanceErrorMm: Float64Array;
  /** 1 on days when the pipe capacity held drain flow below what the soil would give, else 0. */
  capacityLimited: Uint8Array;
  /** Internal sub-steps per day actually used. */
  substepsPerDay: number;
  /** Equivalent depth used at the drain level (free outlet), m. */
  equivalentDepthM: number;
}
