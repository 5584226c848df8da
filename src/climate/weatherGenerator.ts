/**
 * Stochastic daily weather generator after Richardson (1981, "Stochastic simulation of daily
 * precipitation, temperature, and solar radiation", Water Resources Research 17(1): 182-190):
 *
 * - wet or dry days from a first-order, two-state Markov chain with monthly transition
 *   probabilities P(wet | dry yesterday) and P(wet | wet yesterday);
 * - wet-day amounts from a two-parameter gamma distribution per month (the gamma option of the
 *   WGEN program, Richardson and Wright, 1984; from memory);
 * - Tmax and Tmin as seasonal means and standard deviations given by annual harmonics plus a
 *   first-order autoregressive daily anomaly, with Tmax conditioned on the day being wet or dry
 *   (Richardson's scheme, simplified to one lag-1 correlation and one Tmax-Tmin correlation).
 *
 * Seeded and deterministic (random.ts): the same seed and parameters give the same record.
 * Solar radiation, humidity and wind are not generated, so reference ET of a generated record
 * comes from Hargreaves (FAO-56 Eq. 52).
 */
import { TilefluxError } from '../errors.js';
import { consecutiveDates, dayIndexOf, dayOfYearSeries, isLeapYear } from './calendar.js';
import { gammaVariate, normalSampler, sfc32 } from './random.js';
import type { WeatherSeries } from './weatherSeries.js';

/** Seasonal cycle of one temperature: value(d) = mean + amplitude cos(2 pi (d - warmest) / 365.25). */
export interface TemperatureHarmonics {
  /** Annual mean of the daily value, degC. */
  meanC: number;
  /** Half the seasonal swing of the mean, degC. */
  amplitudeC: number;
  /** Annual mean of the day-to-day standard deviation, degC. */
  sdMeanC: number;
  /** Seasonal swing of the standard deviation, degC (negative: more variable in winter). */
  sdAmplitudeC: number;
}

/** Parameters of the weather generator. Monthly arrays run January to December. */
export interface GeneratorParams {
  /** P(wet today | dry yesterday), per month. */
  pWetGivenDry: readonly number[];
  /** P(wet today | wet yesterday), per month. */
  pWetGivenWet: readonly number[];
  /** Gamma shape of wet-day amounts, per month (dimensionless). */
  gammaShape: readonly number[];
  /** Gamma scale of wet-day amounts, per month, mm. Mean wet-day amount = shape * scale. */
  gammaScaleMm: readonly number[];
  /** Seasonal cycle of daily maximum temperature (unconditional on wet/dry). */
  tmax: TemperatureHarmonics;
  /** Seasonal cycle of daily minimum temperature. */
  tmin: TemperatureHarmonics;
  /** Day of year on which the harmonics peak (warmest), 1-366. */
  warmestDayOfYear: number;
  /** Mean Tmax of dry days minus that of wet days, degC (clouds cool wet days). */
  tmaxDryMinusWetC: number;
  /** Day-to-day (lag-1) correlation of the temperature anomalies. */
  lag1Correlation: number;
  /** Same-day correlation of the Tmax and Tmin anomalies. */
  tmaxTminCorrelation: number;
  /**
   * Monthly corrections added to the Tmax and Tmin harmonics, degC (January first; none when
   * absent): a fitted record's monthly means beyond one harmonic, and temperature deltas.
   */
  tmaxMonthlyOffsetC?: readonly number[];
  tminMonthlyOffsetC?: readonly number[];
}

/**
 * An invented humid-continental site (tileflux's demo climate, not any real station): about
 * 905 mm of precipitation a year with a late-spring to summer maximum, roughly 110 wet days,
 * cold snowy winters (January mean Tmax about -2 degC, Tmin about -11.5 degC) and warm summers
 * (July mean Tmax about 28 degC). Values chosen to resemble the published ranges of such
 * climates (from memory), not fitted to any record.
 */
export const DEFAULT_GENERATOR: GeneratorParams = {
  pWetGivenDry: [0.22, 0.22, 0.24, 0.27, 0.28, 0.27, 0.24, 0.23, 0.22, 0.22, 0.24, 0.23],
  pWetGivenWet: [0.48, 0.47, 0.47, 0.48, 0.47, 0.45, 0.42, 0.42, 0.44, 0.45, 0.48, 0.49],
  gammaShape: [0.78, 0.78, 0.75, 0.72, 0.7, 0.68, 0.66, 0.66, 0.68, 0.72, 0.76, 0.78],
  gammaScaleMm: [5.8, 5.9, 8.0, 11.5, 14.0, 17.1, 16.7, 16.9, 14.8, 11.0, 8.6, 6.3],
  tmax: { meanC: 13, amplitudeC: 15, sdMeanC: 4, sdAmplitudeC: -1 },
  tmin: { meanC: 2, amplitudeC: 13.5, sdMeanC: 4, sdAmplitudeC: -1.2 },
  warmestDayOfYear: 200,
  tmaxDryMinusWetC: 2,
  lag1Correlation: 0.65,
  tmaxTminCorrelation: 0.8,
};

/**
 * Long-run probability that a day of a month is wet: the stationary state of the two-state
 * Markov chain, p01 / (1 + p01 - p11) (Richardson, 1981).
 *
 * @example stationaryWetProbability(0.25, 0.5) // 0.25 / 0.75 = 0.333
 */
export function stationaryWetProbability(pWetGivenDry: number, pWetGivenWet: number): number {
  return pWetGivenDry / (1 + pWetGivenDry - pWetGivenWet);
}

/**
 * The parameters for a site in the other hemisphere: a negative latitude shifts the seasons by
 * half a year (monthly values move six months, the warmest day moves 182.6 days).
 *
 * @example forHemisphere(DEFAULT_GENERATOR, -35).warmestDayOfYear // 17.4 (mid-January)
 */
export function forHemisphere(p: GeneratorParams, latitudeDeg: number): GeneratorParams {
  if (latitudeDeg >= 0) return p;
  const shift = (a: readonly number[]) => a.map((_, m) => a[(m + 6) % 12]);
  return {
    ...p,
    pWetGivenDry: shift(p.pWetGivenDry),
    pWetGivenWet: shift(p.pWetGivenWet),
    gammaShape: shift(p.gammaShape),
    gammaScaleMm: shift(p.gammaScaleMm),
    ...(p.tmaxMonthlyOffsetC && { tmaxMonthlyOffsetC: shift(p.tmaxMonthlyOffsetC) }),
    ...(p.tminMonthlyOffsetC && { tminMonthlyOffsetC: shift(p.tminMonthlyOffsetC) }),
    warmestDayOfYear: ((p.warmestDayOfYear + 182.625 - 1) % 365.25) + 1,
  };
}

/** Options of generateWeather. */
export interface GenerateOptions {
  /** Whole calendar years to generate, 1 to 2000. */
  years: number;
  /** Seed of the random stream: a non-negative integer. */
  seed: number;
  /** First calendar year (default 1991). */
  startYear?: number;
  /** Climate parameters (default DEFAULT_GENERATOR). */
  params?: GeneratorParams;
}

/**
 * Generate `years` whole calendar years of daily precipitation, Tmax and Tmin (Richardson, 1981).
 * Each day draws, in a fixed order: the wet/dry state, the wet-day amount (wet days only), then
 * the two temperature anomalies. If a draw puts Tmin above Tmax (rare, winter wet days) the two
 * are swapped, which keeps their mean.
 *
 * @example generateWeather({ years: 30, seed: 7 }).dates.length // 10958 (1991-2020)
 */
export function generateWeather(o: GenerateOptions): WeatherSeries {
  const p = o.params ?? DEFAULT_GENERATOR;
  checkGeneratorParams(p);
  const startYear = o.startYear ?? 1991;
  if (!Number.isInteger(o.years) || o.years < 1 || o.years > 2000) {
    throw new TilefluxError(`years must be a whole number from 1 to 2000; got ${o.years}`);
  }
  if (!Number.isInteger(startYear) || startYear < 1 || startYear + o.years - 1 > 9999) {
    throw new TilefluxError(
      `start year must be a whole number from 1 to ${9999 - o.years + 1}; got ${startYear}`,
    );
  }
  if (!Number.isSafeInteger(o.seed) || o.seed < 0) {
    throw new TilefluxError(`seed must be a whole number of 0 or more; got ${o.seed}`);
  }
  let n = 0;
  for (let y = startYear; y < startYear + o.years; y++) n += isLeapYear(y) ? 366 : 365;
  const first = `${String(startYear).padStart(4, '0')}-01-01`;
  const dates = consecutiveDates(first, n);
  const doy = dayOfYearSeries(dates);
  const month = dayIndexOf(dates).month;
  const u = sfc32(o.seed);
  const z = normalSampler(u);
  const precipMm = new Float64Array(n);
  const tmaxC = new Float64Array(n);
  const tminC = new Float64Array(n);

  const piWet = p.pWetGivenDry.map((p01, m) => stationaryWetProbability(p01, p.pWetGivenWet[m]));
  const rho = p.lag1Correlation;
  const innov = Math.sqrt(1 - rho * rho);
  const c = p.tmaxTminCorrelation;
  const cOrth = Math.sqrt(1 - c * c);
  const omega = (2 * Math.PI) / 365.25;
  const tmaxOffset = p.tmaxMonthlyOffsetC ?? new Array<number>(12).fill(0);
  const tminOffset = p.tminMonthlyOffsetC ?? new Array<number>(12).fill(0);

  // Start in the stationary state, so that the first days are not special.
  let wet = u() < piWet[0];
  let a1 = z();
  let a2 = c * a1 + cOrth * z();
  for (let i = 0; i < n; i++) {
    const m = month[i] - 1;
    if (i > 0) wet = u() < (wet ? p.pWetGivenWet[m] : p.pWetGivenDry[m]);
    precipMm[i] = wet ? gammaVariate(u, z, p.gammaShape[m], p.gammaScaleMm[m]) : 0;
    if (i > 0) {
      const e1 = z();
      const e2 = c * e1 + cOrth * z();
      a1 = rho * a1 + innov * e1;
      a2 = rho * a2 + innov * e2;
    }
    const h = Math.cos(omega * (doy[i] - p.warmestDayOfYear));
    // Dry and wet means straddle the harmonic so that its unconditional mean stays the harmonic.
    const wetShift = (wet ? piWet[m] - 1 : piWet[m]) * p.tmaxDryMinusWetC;
    let tmax =
      tmaxOffset[m] +
      p.tmax.meanC +
      p.tmax.amplitudeC * h +
      wetShift +
      (p.tmax.sdMeanC + p.tmax.sdAmplitudeC * h) * a1;
    let tmin =
      tminOffset[m] +
      p.tmin.meanC +
      p.tmin.amplitudeC * h +
      (p.tmin.sdMeanC + p.tmin.sdAmplitudeC * h) * a2;
    if (tmin > tmax) [tmax, tmin] = [tmin, tmax];
    tmaxC[i] = tmax;
    tminC[i] = tmin;
  }
  return { dates, precipMm, tmaxC, tminC };
}

/** Reject parameters the generator cannot use, naming the parameter and the accepted range. */
export function checkGeneratorParams(p: GeneratorParams): void {
  const monthly: Array<[keyof GeneratorParams, string]> = [
    ['pWetGivenDry', 'a probability from 0 to 1'],
    ['pWetGivenWet', 'a probability from 0 to 1'],
    ['gammaShape', 'a positive number'],
    ['gammaScaleMm', 'a positive number of mm'],
  ];
  for (const [key, accepted] of monthly) {
    const a = p[key] as readonly number[];
    if (!Array.isArray(a) || a.length !== 12) {
      throw new TilefluxError(`generator parameter ${key} needs 12 monthly values`);
    }
    a.forEach((v, m) => {
      const probability = key.startsWith('pWet');
      const ok = Number.isFinite(v) && (probability ? v >= 0 && v <= 1 : v > 0);
      if (!ok) {
        throw new TilefluxError(
          `generator parameter ${key}[${m + 1}] = ${v}; expected ${accepted}`,
        );
      }
    });
  }
  p.pWetGivenDry.forEach((p01, m) => {
    if (p01 === 0 && p.pWetGivenWet[m] === 1) {
      throw new TilefluxError(
        `generator month ${m + 1}: pWetGivenDry 0 with pWetGivenWet 1 has no long-run wet frequency`,
      );
    }
  });
  for (const key of ['tmaxMonthlyOffsetC', 'tminMonthlyOffsetC'] as const) {
    const a = p[key];
    if (a !== undefined && (a.length !== 12 || !a.every(Number.isFinite))) {
      throw new TilefluxError(`generator parameter ${key} needs 12 finite monthly values, degC`);
    }
  }
  for (const key of ['tmax', 'tmin'] as const) {
    const h = p[key];
    if (![h.meanC, h.amplitudeC, h.sdMeanC, h.sdAmplitudeC].every(Number.isFinite)) {
      throw new TilefluxError(`generator parameter ${key} needs finite numbers`);
    }
    if (h.sdMeanC - Math.abs(h.sdAmplitudeC) <= 0) {
      throw new TilefluxError(
        `generator parameter ${key}: sdMeanC must exceed |sdAmplitudeC| so the spread stays positive`,
      );
    }
  }
  if (!(Math.abs(p.lag1Correlation) < 1) || !(Math.abs(p.tmaxTminCorrelation) <= 1)) {
    throw new TilefluxError('generator correlations must lie between -1 and 1');
  }
  if (!Number.isFinite(p.warmestDayOfYear) || !Number.isFinite(p.tmaxDryMinusWetC)) {
    throw new TilefluxError(
      'generator parameters warmestDayOfYear and tmaxDryMinusWetC must be numbers',
    );
  }
}
