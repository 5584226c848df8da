/**
 * Daily crop coefficients for a rotation: the FAO-56 single crop coefficient curve (Allen et al.
 * 1998, FAO-56 chapter 6, Fig. 25 and Eq. 66): Kc ini during the initial stage, a straight line
 * to Kc mid over the development stage, Kc mid in mid-season, a straight line to Kc end over the
 * late season, Kc end from maturity to harvest, and bare soil between harvest and planting.
 */
import { dayIndexOf, type DayIndex } from '../climate/calendar.js';
import { BARE_SOIL_DEPLETION, BARE_SOIL_KC, MIN_ROOT_DEPTH_M, type CropParams } from './crops.js';
import type { CropCalendar } from './types.js';

const CUMULATIVE_DAYS = [0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334];

/** Day of year (1-based) of "MM-DD" in `year` (Gregorian leap years). */
export function monthDayOfYear(year: number, mmdd: string): number {
  const m = (mmdd.charCodeAt(0) - 48) * 10 + (mmdd.charCodeAt(1) - 48);
  const d = (mmdd.charCodeAt(3) - 48) * 10 + (mmdd.charCodeAt(4) - 48);
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  return CUMULATIVE_DAYS[m - 1] + d + (leap && m > 2 ? 1 : 0);
}

/**
 * FAO-56 Kc on day `t` after planting (0-based) for a crop.
 * @example kcOnDay(CROPS.corn, 90) // 1.2 (mid-season)
 */
export function kcOnDay(c: CropParams, t: number): number {
  const [ini, dev, mid, late] = c.stagesDays;
  if (t < ini) return c.kcIni;
  if (t < ini + dev) return c.kcIni + ((t - ini) / dev) * (c.kcMid - c.kcIni);
  if (t < ini + dev + mid) return c.kcMid;
  if (t < ini + dev + mid + late)
    return c.kcMid + ((t - ini - dev - mid) / late) * (c.kcEnd - c.kcMid);
  return c.kcEnd;
}

/**
 * Calendar year in which a rotation grows its first crop unless the field file says otherwise:
 * with the default corn-soybean rotation, corn in even years (a convention, so that the crop of
 * a year never depends on where a run or its warm-up starts).
 */
export const DEFAULT_ROTATION_FIRST_YEAR = 2000;

/**
 * The crop a rotation grows in a calendar year: the rotation is anchored to calendar years,
 * `rotation[0]` in `firstYear` and in every year a whole number of rotations from it (before
 * and after), whatever year a run starts in.
 *
 * @example rotationCrop(['corn', 'soybean'], 2000, 2013) // 'soybean'
 */
export function rotationCrop(rotation: readonly string[], firstYear: number, year: number): string {
  const k = rotation.length;
  return rotation[(((year - firstYear) % k) + k) % k];
}

/**
 * Effective rooting depth on day `t` after planting (0-based), m: FAO-56's linear growth from
 * Zr,min at planting to Zr,max at the start of mid-season (chapter 8; from memory), then held.
 * @example rootDepthOnDay(CROPS.corn, 35) // 0.75 (half-way through the 70 days to mid-season)
 */
export function rootDepthOnDay(c: CropParams, t: number): number {
  const [ini, dev] = c.stagesDays;
  const grow = ini + dev;
  const zMax = Math.max(MIN_ROOT_DEPTH_M, c.maxRootDepth);
  if (t >= grow) return zMax;
  return MIN_ROOT_DEPTH_M + ((t < 0 ? 0 : t) / grow) * (zMax - MIN_ROOT_DEPTH_M);
}

/** How the calendar sets the daily rooting depth. */
export interface RootOptions {
  /** One depth for every day (a field file's soil.rootZoneDepth), m. */
  fixedM?: number;
  /** Deepest roots can reach (the restrictive layer), m. */
  capM?: number;
}

/**
 * Resolve a rotation into daily Kc, depletion fraction, crop code and season progress.
 * The rotation advances each calendar year and is anchored to calendar years (`rotationCrop`),
 * so the same year grows the same crop in runs that start in different years.
 *
 * @param dates     ISO dates of the run
 * @param rotation  crop names in order, e.g. ['corn', 'soybean']
 * @param crops     parameters of every crop named in the rotation
 * @param days      `dayIndexOf(dates)`, when the caller has it already
 * @param firstYear a calendar year in which the rotation's first crop is grown
 */
export function cropCalendar(
  dates: readonly string[],
  rotation: readonly string[],
  crops: Record<string, CropParams>,
  days: DayIndex = dayIndexOf(dates),
  firstYear: number = DEFAULT_ROTATION_FIRST_YEAR,
  roots: RootOptions = {},
): CropCalendar {
  const n = dates.length;
  const kc = new Float64Array(n);
  const rootDepthM = new Float64Array(n);
  const cap = roots.capM ?? Infinity;
  const depletionFraction = new Float64Array(n);
  const crop = new Uint8Array(n);
  const seasonFraction = new Float64Array(n);
  const names = [...new Set(rotation)];
  if (n === 0) return { kc, depletionFraction, crop, seasonFraction, crops: names, rootDepthM };
  let cachedYear = NaN;
  let plant = 0;
  let harvest = 0;
  let params: CropParams = crops[rotation[0]];
  let code = 0;
  for (let i = 0; i < n; i++) {
    const year = days.year[i];
    if (year !== cachedYear) {
      cachedYear = year;
      const name = rotationCrop(rotation, firstYear, year);
      params = crops[name];
      code = names.indexOf(name) + 1;
      plant = monthDayOfYear(year, params.planting);
      harvest = monthDayOfYear(year, params.harvest);
    }
    const m = days.month[i];
    const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
    const doy = CUMULATIVE_DAYS[m - 1] + days.dayOfMonth[i] + (leap && m > 2 ? 1 : 0);
    if (doy >= plant && doy < harvest) {
      kc[i] = kcOnDay(params, doy - plant);
      depletionFraction[i] = params.depletionFraction;
      crop[i] = code;
      seasonFraction[i] = (doy - plant) / (harvest - plant);
      rootDepthM[i] = rootDepthOnDay(params, doy - plant);
    } else {
      kc[i] = BARE_SOIL_KC;
      depletionFraction[i] = BARE_SOIL_DEPLETION;
      crop[i] = 0;
      seasonFraction[i] = -1;
      rootDepthM[i] = MIN_ROOT_DEPTH_M;
    }
    if (roots.fixedM !== undefined) rootDepthM[i] = roots.fixedM;
    if (rootDepthM[i] > cap) rootDepthM[i] = cap;
  }
  return { kc, depletionFraction, crop, seasonFraction, crops: names, rootDepthM };
}
