/**
 * Crop parameters for the FAO-56 single crop coefficient curve (Allen et al. 1998, FAO
 * Irrigation and Drainage Paper 56, chapter 6).
 *
 * Kc values: FAO-56 Table 12 (maize grain 0.30/1.20/0.60, soybeans 0.40/1.15/0.50, spring
 * small grains 0.30/1.15/0.25) (from memory). Stage lengths: FAO-56 Table 11 entries for
 * temperate continental planting (maize 30/40/50/30 d, soybeans 20/30/60/25 d for May planting
 * in the central USA, spring wheat 20/25/60/30 d) (from memory). Depletion fractions p: FAO-56
 * Table 22 (maize 0.55, soybean 0.50, wheat 0.55) (from memory). Planting and harvest dates are
 * typical of the humid continental corn belt (common practice) and can be set per crop.
 * Maximum effective rooting depths: FAO-56 Table 22 ranges (maize 1.0-1.7 m, soybean 0.6-1.3 m,
 * small grains 1.0-1.5 m; from memory), of which the middle is taken: the table's note gives the
 * larger values for unrestricted soils and rainfed modelling and the smaller for irrigation
 * scheduling, and a drained soil with a seasonal water table lies between.
 */

export interface CropParams {
  kcIni: number;
  kcMid: number;
  kcEnd: number;
  /** Stage lengths in days: initial, development, mid-season, late season. */
  stagesDays: [number, number, number, number];
  /** FAO-56 soil water depletion fraction for no stress (Table 22). */
  depletionFraction: number;
  /** Planting and harvest dates, "MM-DD". */
  planting: string;
  harvest: string;
  /** Maximum effective rooting depth, m (FAO-56 Table 22), reached at the start of mid-season. */
  maxRootDepth: number;
}

/** Built-in crops; field files may override any value per crop. */
export const CROPS: Readonly<Record<string, CropParams>> = {
  corn: {
    kcIni: 0.3,
    kcMid: 1.2,
    kcEnd: 0.6,
    stagesDays: [30, 40, 50, 30],
    depletionFraction: 0.55,
    planting: '05-01',
    harvest: '10-15',
    maxRootDepth: 1.35,
  },
  soybean: {
    kcIni: 0.4,
    kcMid: 1.15,
    kcEnd: 0.5,
    stagesDays: [20, 30, 60, 25],
    depletionFraction: 0.5,
    planting: '05-15',
    harvest: '10-05',
    maxRootDepth: 0.95,
  },
  'small grains': {
    kcIni: 0.3,
    kcMid: 1.15,
    kcEnd: 0.25,
    stagesDays: [20, 25, 60, 30],
    depletionFraction: 0.55,
    planting: '04-10',
    harvest: '08-10',
    maxRootDepth: 1.25,
  },
};

/**
 * Kc of bare or residue-covered soil between seasons. FAO-56 (Allen et al. 1998, chapter 6,
 * Kc ini and its Fig. 29; from memory) gives Kc ini of 0.3 to 0.5 for bare soil wetted every
 * few days at moderate ET0; we take 0.35 (assumption).
 */
export const BARE_SOIL_KC = 0.35;
/** Depletion fraction used between seasons (bare soil evaporation dries only the top layer). */
export const BARE_SOIL_DEPLETION = 0.5;

/**
 * Rooting depth at planting and of bare soil between seasons, m: FAO-56 chapter 8 starts root
 * growth at Zr,min of 0.15-0.20 m, the depth of the soil that seeds and evaporation draw from
 * (from memory); 0.15 m is taken.
 */
export const MIN_ROOT_DEPTH_M = 0.15;
