/**
 * FAO Penman-Monteith reference evapotranspiration for daily time steps, FAO Irrigation and
 * Drainage Paper 56 (Allen, Pereira, Raes and Smith, 1998), Chapter 2 Eq. 6 and Chapter 3
 * Eq. 7-39.
 */
import { MM_PER_MJ_M2 } from './extraterrestrialRadiation.js';

/** Stefan-Boltzmann constant for daily periods, MJ K-4 m-2 d-1 (FAO-56, Eq. 39). */
export const STEFAN_BOLTZMANN_MJ_K4_M2_D = 4.903e-9;

/**
 * Atmospheric pressure from elevation, kPa (FAO-56 Eq. 7).
 *
 * @example atmosphericPressure(1800) // 81.8 (FAO-56 Example 2)
 */
export function atmosphericPressure(elevationM: number): number {
  return 101.3 * Math.pow((293 - 0.0065 * elevationM) / 293, 5.26);
}

/**
 * Psychrometric constant gamma, kPa/degC (FAO-56 Eq. 8).
 *
 * @example psychrometricConstant(81.8) // 0.054 (FAO-56 Example 2)
 */
export function psychrometricConstant(pressureKPa: number): number {
  return 0.665e-3 * pressureKPa;
}

/**
 * Saturation vapour pressure e deg(T), kPa (FAO-56 Eq. 11).
 *
 * @example saturationVapourPressure(24.5) // 3.075 (FAO-56 Example 3)
 */
export function saturationVapourPressure(tC: number): number {
  return 0.6108 * Math.exp((17.27 * tC) / (tC + 237.3));
}

/**
 * Slope of the saturation vapour pressure curve Delta, kPa/degC (FAO-56 Eq. 13).
 *
 * @example vapourPressureSlope(16.9) // 0.122 (FAO-56 Example 18)
 */
export function vapourPressureSlope(tC: number): number {
  const t = tC + 237.3;
  return (4098 * saturationVapourPressure(tC)) / (t * t);
}

/**
 * Mean saturation vapour pressure of a day, kPa: the mean of e deg at Tmax and Tmin
 * (FAO-56 Eq. 12), not e deg at the mean temperature.
 *
 * @example meanSaturationVapourPressure(21.5, 12.3) // 1.997 (FAO-56 Example 18)
 */
export function meanSaturationVapourPressure(tmaxC: number, tminC: number): number {
  return 0.5 * (saturationVapourPressure(tmaxC) + saturationVapourPressure(tminC));
}

/**
 * Actual vapour pressure from daily mean relative humidity, kPa (FAO-56 Eq. 19). FAO-56 calls
 * this the least reliable of its humidity options; it is used when only RHmean is given.
 *
 * @example vapourPressureFromRhMean(68, 25, 18) // 0.68 * (3.168 + 2.064) / 2 = 1.78
 */
export function vapourPressureFromRhMean(rhMeanPct: number, tmaxC: number, tminC: number): number {
  return (rhMeanPct / 100) * meanSaturationVapourPressure(tmaxC, tminC);
}

/**
 * Clear-sky solar radiation Rso, MJ m-2 d-1 (FAO-56 Eq. 37).
 *
 * @example clearSkyRadiation(41.09, 100) // 30.90 (FAO-56 Example 18)
 */
export function clearSkyRadiation(raMJm2: number, elevationM: number): number {
  return (0.75 + 2e-5 * elevationM) * raMJm2;
}

/**
 * Net outgoing longwave radiation Rnl, MJ m-2 d-1 (FAO-56 Eq. 39). Rs/Rso is limited to 1.0,
 * as FAO-56 prescribes.
 *
 * @example netLongwaveRadiation(21.5, 12.3, 1.409, 22.07, 30.90) // 3.71 (FAO-56 Example 18)
 */
export function netLongwaveRadiation(
  tmaxC: number,
  tminC: number,
  eaKPa: number,
  rsMJm2: number,
  rsoMJm2: number,
): number {
  const tmaxK = tmaxC + 273.16;
  const tminK = tminC + 273.16;
  const ratio = rsoMJm2 > 0 ? Math.min(1, rsMJm2 / rsoMJm2) : 1;
  const radiative = (STEFAN_BOLTZMANN_MJ_K4_M2_D * (tmaxK ** 4 + tminK ** 4)) / 2;
  return radiative * (0.34 - 0.14 * Math.sqrt(Math.max(0, eaKPa))) * (1.35 * ratio - 0.35);
}

/** Inputs of one day of FAO Penman-Monteith. */
export interface PenmanMonteithDay {
  /** Daily maximum and minimum air temperature at 2 m, degC. */
  tmaxC: number;
  tminC: number;
  /** Actual vapour pressure, kPa (from humidity: FAO-56 Eq. 17-19). */
  eaKPa: number;
  /** Incoming solar radiation Rs, MJ m-2 d-1. */
  rsMJm2: number;
  /** Extraterrestrial radiation Ra, MJ m-2 d-1 (FAO-56 Eq. 21). */
  raMJm2: number;
  /** Wind speed at 2 m, m/s. */
  u2Ms: number;
  /** Station elevation above sea level, m. */
  elevationM: number;
  /** Soil heat flux G, MJ m-2 d-1; FAO-56 Eq. 42 takes it as 0 for daily steps. */
  soilHeatFluxMJm2?: number;
}

/**
 * FAO Penman-Monteith reference evapotranspiration ET0, mm/d (FAO-56 Eq. 6):
 *
 *   ET0 = [0.408 Delta (Rn - G) + gamma 900/(T + 273) u2 (es - ea)] / [Delta + gamma (1 + 0.34 u2)]
 *
 * with T the mean of Tmax and Tmin (Eq. 9), es from Eq. 12, net radiation Rn = Rns - Rnl with
 * albedo 0.23 (Eq. 38-40) and Rso from Eq. 37. The result is floored at zero.
 *
 * @example penmanMonteithRefEt({ tmaxC: 21.5, tminC: 12.3, eaKPa: 1.409, rsMJm2: 22.07,
 *   raMJm2: 41.09, u2Ms: 2.078, elevationM: 100 }) // 3.9 (FAO-56 Example 18, 50 deg 48 min N, 6 July)
 */
export function penmanMonteithRefEt(d: PenmanMonteithDay): number {
  const t = 0.5 * (d.tmaxC + d.tminC);
  const delta = vapourPressureSlope(t);
  const gamma = psychrometricConstant(atmosphericPressure(d.elevationM));
  const es = meanSaturationVapourPressure(d.tmaxC, d.tminC);
  const vpd = es > d.eaKPa ? es - d.eaKPa : 0;
  const rns = (1 - 0.23) * d.rsMJm2;
  const rso = clearSkyRadiation(d.raMJm2, d.elevationM);
  const rnl = netLongwaveRadiation(d.tmaxC, d.tminC, d.eaKPa, d.rsMJm2, rso);
  const rn = rns - rnl;
  const g = d.soilHeatFluxMJm2 ?? 0;
  const et0 =
    (MM_PER_MJ_M2 * delta * (rn - g) + gamma * (900 / (t + 273)) * d.u2Ms * vpd) /
    (delta + gamma * (1 + 0.34 * d.u2Ms));
  return et0 > 0 ? et0 : 0;
}
