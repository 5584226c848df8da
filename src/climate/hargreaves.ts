/**
 * Hargreaves reference evapotranspiration from air temperature alone, FAO-56 (Allen et al.,
 * 1998) Chapter 3, Eq. 52 (Hargreaves and Samani, 1985). FAO-56 gives it as an alternative
 * when only maximum and minimum temperature are available.
 */
import { MM_PER_MJ_M2 } from './extraterrestrialRadiation.js';

/**
 * Hargreaves ET0, mm/d: ET0 = 0.0023 (Tmean + 17.8) (Tmax - Tmin)^0.5 Ra, with Ra converted to
 * equivalent evaporation (mm/d) by the factor 0.408 (FAO-56 Eq. 20 and 52) and Tmean the mean of
 * Tmax and Tmin. Below a mean of -17.8 degC the formula turns negative; it is floored at zero,
 * since reference ET cannot add water.
 *
 * @param tmaxC daily maximum temperature, degC
 * @param tminC daily minimum temperature, degC (not above tmaxC)
 * @param raMJm2 extraterrestrial radiation, MJ m-2 d-1 (see extraterrestrialRadiation)
 * @example hargreavesRefEt(30, 18, 40) // 0.0023 * 41.8 * sqrt(12) * 40 * 0.408 = 5.43 mm/d
 */
export function hargreavesRefEt(tmaxC: number, tminC: number, raMJm2: number): number {
  const tmean = 0.5 * (tmaxC + tminC);
  const range = tmaxC > tminC ? tmaxC - tminC : 0;
  const et0 = 0.0023 * (tmean + 17.8) * Math.sqrt(range) * MM_PER_MJ_M2 * raMJm2;
  return et0 > 0 ? et0 : 0;
}
