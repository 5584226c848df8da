/**
 * Temperature-index (degree-day) snow model on daily values: precipitation falls as snow when
 * the day's mean air temperature is at or below a threshold, accumulates as snow water
 * equivalent (SWE), and melts at a fixed rate per degree-day above a base temperature. This is
 * the classical degree-day method (reviewed by Rango and Martinec, 1995, "Revisiting the
 * degree-day method for snowmelt computations", Water Resources Bulletin 31(4): 657-669;
 * citation from memory).
 */
import { TilefluxError } from '../errors.js';

/** Parameters of the degree-day snow model. */
export interface SnowParams {
  /** Daily mean air temperature at or below which precipitation is snow, degC. */
  rainSnowThresholdC: number;
  /** Daily mean air temperature above which snow melts, degC. */
  meltBaseC: number;
  /** Melt per degree-day above the base, mm/(degC d). */
  degreeDayMmPerCDay: number;
}

/**
 * Defaults for open farmland:
 * - rain/snow threshold 1 degC daily mean: published thresholds for daily mean air temperature
 *   mostly lie between 0 and 2 degC (from memory);
 * - melt base 0 degC: the melting point, the usual choice (common practice);
 * - degree-day factor 2.5 mm/(degC d): open-site factors mostly range 2 to 5 mm/(degC d), lower
 *   early in the melt season and higher for ripe, dense snow (from memory; Rango and Martinec,
 *   1995).
 */
export const DEFAULT_SNOW: SnowParams = {
  rainSnowThresholdC: 1,
  meltBaseC: 0,
  degreeDayMmPerCDay: 2.5,
};

/** Daily results of the snow model, all mm (SWE at the end of each day). */
export interface SnowResult {
  rainMm: Float64Array;
  snowfallMm: Float64Array;
  meltMm: Float64Array;
  sweMm: Float64Array;
}

/**
 * Run the degree-day snow model. Each day, with T = (Tmax + Tmin) / 2:
 * precipitation is snowfall if T <= threshold, else rain; snowfall is added to the pack; then
 * melt = min(pack, factor * max(0, T - base)). Water leaving the pack is
 * rain + melt, and snowfall = melt + change in SWE holds exactly over any period.
 *
 * @param precipMm daily precipitation, mm
 * @param tmaxC daily maximum temperature, degC
 * @param tminC daily minimum temperature, degC
 * @param p model parameters (default DEFAULT_SNOW)
 * @param initialSweMm snow water equivalent before the first day, mm (default 0)
 * @example snowModel(Float64Array.of(10, 0), Float64Array.of(0, 8), Float64Array.of(-6, 2))
 *   // day 1: 10 mm snow, SWE 10; day 2: T = 5, melt min(10, 2.5 * 5) = 10, SWE 0
 */
export function snowModel(
  precipMm: Float64Array,
  tmaxC: Float64Array,
  tminC: Float64Array,
  p: SnowParams = DEFAULT_SNOW,
  initialSweMm = 0,
): SnowResult {
  checkSnowParams(p, initialSweMm);
  const n = precipMm.length;
  if (tmaxC.length !== n || tminC.length !== n) {
    throw new RangeError('snowModel: precipitation and temperature series differ in length');
  }
  const rainMm = new Float64Array(n);
  const snowfallMm = new Float64Array(n);
  const meltMm = new Float64Array(n);
  const sweMm = new Float64Array(n);
  const threshold = p.rainSnowThresholdC;
  const base = p.meltBaseC;
  const factor = p.degreeDayMmPerCDay;
  let swe = initialSweMm;
  for (let i = 0; i < n; i++) {
    const t = 0.5 * (tmaxC[i] + tminC[i]);
    const precip = precipMm[i];
    if (t <= threshold) {
      snowfallMm[i] = precip;
      swe += precip;
    } else {
      rainMm[i] = precip;
    }
    if (t > base && swe > 0) {
      const potential = factor * (t - base);
      const melt = potential < swe ? potential : swe;
      meltMm[i] = melt;
      swe -= melt;
    }
    sweMm[i] = swe;
  }
  return { rainMm, snowfallMm, meltMm, sweMm };
}

function checkSnowParams(p: SnowParams, initialSweMm: number): void {
  const bad = (what: string, v: number, accepted: string) =>
    new TilefluxError(`snow ${what} ${v} is not accepted; expected ${accepted}`);
  if (!Number.isFinite(p.rainSnowThresholdC) || Math.abs(p.rainSnowThresholdC) > 10) {
    throw bad('rain/snow threshold', p.rainSnowThresholdC, 'a temperature between -10 and 10 degC');
  }
  if (!Number.isFinite(p.meltBaseC) || Math.abs(p.meltBaseC) > 10) {
    throw bad('melt base', p.meltBaseC, 'a temperature between -10 and 10 degC');
  }
  if (!(p.degreeDayMmPerCDay >= 0 && p.degreeDayMmPerCDay <= 20)) {
    throw bad('degree-day factor', p.degreeDayMmPerCDay, '0 to 20 mm/(degC d)');
  }
  if (!(initialSweMm >= 0 && Number.isFinite(initialSweMm))) {
    throw bad('initial water equivalent', initialSweMm, 'a depth of 0 mm or more');
  }
}
