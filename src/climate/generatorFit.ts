/**
 * Fitting the weather generator (weatherGenerator.ts, after Richardson, 1981, "Stochastic
 * simulation of daily precipitation, temperature, and solar radiation", Water Resources Research
 * 17(1): 182-190) to a daily record:
 *
 * - a day is wet with 0.1 mm or more (the usual trace threshold; common practice);
 * - P(wet | dry yesterday) and P(wet | wet yesterday) per month by counting the record's
 *   transitions, each counted in the month of the second day;
 * - wet-day amounts per month: a two-parameter gamma by maximum likelihood with Thom's (1958)
 *   approximation of the shape, A = ln(mean) - mean(ln x), shape = (1 + sqrt(1 + 4A/3)) / (4A),
 *   scale = mean / shape (from memory), which keeps the record's mean wet-day amount;
 * - Tmax and Tmin: an annual harmonic each with one warmest day (least squares), monthly offsets
 *   so that the expected monthly means equal the record's, the mean Tmax difference of dry and
 *   wet days, a harmonic of the day-to-day spread fitted to the monthly spreads, and the lag-1
 *   and same-day Tmax-Tmin correlations of the standardised anomalies.
 */
import { TilefluxError } from '../errors.js';
import { dayIndexOf, dayOfYearSeries } from './calendar.js';
import { stationaryWetProbability, type GeneratorParams } from './weatherGenerator.js';
import type { WeatherSeries } from './weatherSeries.js';

/** Precipitation from which a day counts as wet, mm (common practice). */
export const WET_DAY_MM = 0.1;

const OMEGA = (2 * Math.PI) / 365.25;
const MONTH_NAMES = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ');

/** Month index 0-11 of every day of a series. */
export function monthIndexSeries(dates: readonly string[]): Uint8Array {
  return dayIndexOf(dates).month.map((m) => m - 1);
}

/**
 * Least-squares fit of x = a + b cos(omega d) + c sin(omega d) (d = day of year), by the normal
 * equations. Returns [a, b, c].
 */
function harmonicFit(x: Float64Array, doy: Uint16Array): [number, number, number] {
  // Sums for the 3x3 normal equations.
  let n = 0;
  let sc = 0;
  let ss = 0;
  let scc = 0;
  let sss = 0;
  let scs = 0;
  let sx = 0;
  let sxc = 0;
  let sxs = 0;
  for (let i = 0; i < x.length; i++) {
    const c = Math.cos(OMEGA * doy[i]);
    const s = Math.sin(OMEGA * doy[i]);
    n++;
    sc += c;
    ss += s;
    scc += c * c;
    sss += s * s;
    scs += c * s;
    sx += x[i];
    sxc += x[i] * c;
    sxs += x[i] * s;
  }
  const m = [
    [n, sc, ss],
    [sc, scc, scs],
    [ss, scs, sss],
  ];
  const r = [sx, sxc, sxs];
  const det = (a: number[][]) =>
    a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1]) -
    a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0]) +
    a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0]);
  const d = det(m);
  const solve = (k: number) => det(m.map((row, i) => row.map((v, j) => (j === k ? r[i] : v))));
  return [solve(0) / d, solve(1) / d, solve(2) / d];
}

/** Pearson correlation of two equally long arrays. */
function correlation(a: Float64Array, b: Float64Array): number {
  const n = a.length;
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i];
    mb += b[i];
  }
  ma /= n;
  mb /= n;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < n; i++) {
    sab += (a[i] - ma) * (b[i] - mb);
    saa += (a[i] - ma) ** 2;
    sbb += (b[i] - mb) ** 2;
  }
  return sab / Math.sqrt(saa * sbb);
}

/**
 * Estimate generator parameters from a gap-free daily record of at least one year (every month
 * needs at least 3 wet days and 3 dry days in the record). Throws a TilefluxError naming the
 * month that cannot be fitted.
 *
 * @example generateWeather({ years: 500, seed: 1, params: fitGenerator(series) })
 */
export function fitGenerator(w: WeatherSeries): GeneratorParams {
  const n = w.dates.length;
  if (n < 365) {
    throw new TilefluxError(
      `a generator needs at least one year of daily weather to fit; the record has ${n} days`,
    );
  }
  const month = monthIndexSeries(w.dates);
  const doy = dayOfYearSeries(w.dates);
  const wet = new Uint8Array(n);
  for (let i = 0; i < n; i++) wet[i] = w.precipMm[i] >= WET_DAY_MM ? 1 : 0;

  // Precipitation: transitions and wet-day amounts per month.
  const fromDry = new Float64Array(12);
  const dryToWet = new Float64Array(12);
  const fromWet = new Float64Array(12);
  const wetToWet = new Float64Array(12);
  const wetDays = new Float64Array(12);
  const sumAmount = new Float64Array(12);
  const sumLogAmount = new Float64Array(12);
  for (let i = 0; i < n; i++) {
    const m = month[i];
    if (wet[i]) {
      wetDays[m]++;
      sumAmount[m] += w.precipMm[i];
      sumLogAmount[m] += Math.log(w.precipMm[i]);
    }
    if (i === 0) continue;
    if (wet[i - 1]) {
      fromWet[m]++;
      wetToWet[m] += wet[i];
    } else {
      fromDry[m]++;
      dryToWet[m] += wet[i];
    }
  }
  const pWetGivenDry: number[] = [];
  const pWetGivenWet: number[] = [];
  const gammaShape: number[] = [];
  const gammaScaleMm: number[] = [];
  for (let m = 0; m < 12; m++) {
    if (wetDays[m] < 3 || fromDry[m] < 3 || fromWet[m] < 1) {
      throw new TilefluxError(
        `the record has too few wet or dry days in ${MONTH_NAMES[m]} to fit the generator ` +
          `(${wetDays[m]} wet days of ${WET_DAY_MM} mm or more); give a longer record`,
      );
    }
    pWetGivenDry.push(dryToWet[m] / fromDry[m]);
    pWetGivenWet.push(wetToWet[m] / fromWet[m]);
    const mean = sumAmount[m] / wetDays[m];
    const a = Math.log(mean) - sumLogAmount[m] / wetDays[m];
    const shape = a > 1e-6 ? (1 + Math.sqrt(1 + (4 * a) / 3)) / (4 * a) : 50;
    gammaShape.push(shape);
    gammaScaleMm.push(mean / shape);
  }
  const piWet = pWetGivenDry.map((p01, m) => stationaryWetProbability(p01, pWetGivenWet[m]));

  // Temperature: harmonics with one warmest day, then monthly offsets.
  const meanT = new Float64Array(n);
  for (let i = 0; i < n; i++) meanT[i] = (w.tmaxC[i] + w.tminC[i]) / 2;
  const [, bMean, cMean] = harmonicFit(meanT, doy);
  const phase = Math.atan2(cMean, bMean);
  let warmestDayOfYear = phase / OMEGA;
  if (warmestDayOfYear < 1) warmestDayOfYear += 365.25;
  const h = new Float64Array(n);
  for (let i = 0; i < n; i++) h[i] = Math.cos(OMEGA * (doy[i] - warmestDayOfYear));

  const fitOne = (x: Float64Array, shiftByWet: number) => {
    const [a, b, c] = harmonicFit(x, doy);
    const amplitudeC = b * Math.cos(phase) + c * Math.sin(phase);
    // Monthly offsets: record mean minus the harmonic's mean over the same days.
    const sumX = new Float64Array(12);
    const sumH = new Float64Array(12);
    const count = new Float64Array(12);
    for (let i = 0; i < n; i++) {
      sumX[month[i]] += x[i];
      sumH[month[i]] += a + amplitudeC * h[i];
      count[month[i]]++;
    }
    const offsets = Array.from(sumX, (s, m) => (s - sumH[m]) / count[m]);
    const anomaly = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      anomaly[i] = x[i] - (a + amplitudeC * h[i] + offsets[month[i]]);
    }
    // Dry minus wet mean anomaly, then anomalies without the wet/dry shift (generator's form).
    let dry = 0;
    let dryN = 0;
    let wetS = 0;
    let wetN = 0;
    for (let i = 0; i < n; i++) {
      if (wet[i]) {
        wetS += anomaly[i];
        wetN++;
      } else {
        dry += anomaly[i];
        dryN++;
      }
    }
    const dryMinusWet = shiftByWet && wetN > 0 && dryN > 0 ? dry / dryN - wetS / wetN : 0;
    for (let i = 0; i < n; i++) {
      const p = piWet[month[i]];
      anomaly[i] -= (wet[i] ? p - 1 : p) * dryMinusWet;
    }
    // Spread: monthly RMS anomalies, fitted as sdMean + sdAmplitude cos(...) at mid-month.
    const sq = new Float64Array(12);
    const hm = new Float64Array(12);
    for (let i = 0; i < n; i++) {
      sq[month[i]] += anomaly[i] * anomaly[i];
      hm[month[i]] += h[i];
    }
    const sd = Array.from(sq, (s, m) => Math.sqrt(s / count[m]));
    const hMonth = Array.from(hm, (s, m) => s / count[m]);
    const hBar = hMonth.reduce((p, q) => p + q, 0) / 12;
    const sdBar = sd.reduce((p, q) => p + q, 0) / 12;
    let sxy = 0;
    let sxx = 0;
    for (let m = 0; m < 12; m++) {
      sxy += (hMonth[m] - hBar) * (sd[m] - sdBar);
      sxx += (hMonth[m] - hBar) ** 2;
    }
    let sdAmplitudeC = sxx > 0 ? sxy / sxx : 0;
    const sdMeanC = sdBar - sdAmplitudeC * hBar;
    sdAmplitudeC = Math.max(-0.9 * sdMeanC, Math.min(0.9 * sdMeanC, sdAmplitudeC));
    const z = new Float64Array(n);
    for (let i = 0; i < n; i++) z[i] = anomaly[i] / (sdMeanC + sdAmplitudeC * h[i]);
    return {
      harmonics: { meanC: a, amplitudeC, sdMeanC, sdAmplitudeC },
      offsets,
      dryMinusWet,
      z,
    };
  };
  const tmax = fitOne(w.tmaxC, 1);
  const tmin = fitOne(w.tminC, 0);
  const lag = (z: Float64Array) => correlation(z.subarray(1), z.subarray(0, n - 1));
  const clamp = (r: number) => Math.max(-0.99, Math.min(0.99, r));
  return {
    pWetGivenDry,
    pWetGivenWet,
    gammaShape,
    gammaScaleMm,
    tmax: tmax.harmonics,
    tmin: tmin.harmonics,
    warmestDayOfYear,
    tmaxDryMinusWetC: tmax.dryMinusWet,
    lag1Correlation: clamp((lag(tmax.z) + lag(tmin.z)) / 2),
    tmaxTminCorrelation: clamp(correlation(tmax.z, tmin.z)),
    tmaxMonthlyOffsetC: tmax.offsets,
    tminMonthlyOffsetC: tmin.offsets,
  };
}

/**
 * Delta changes of a climate, per month (January first): precipitation in percent, applied to
 * the intensity (every wet-day amount scales; the number and sequence of wet days stay), and
 * temperature in degC, added to Tmax and Tmin alike.
 */
export interface ClimateChange {
  precipChangePct: readonly number[];
  tempChangeC: readonly number[];
}

/**
 * Generator parameters under a delta change: gamma scale x (1 + change/100) per month, so mean
 * wet-day amount and monthly mean precipitation change by that percentage while wet-day
 * frequency does not; Tmax and Tmin monthly offsets + the temperature change.
 *
 * @example changeClimate(DEFAULT_GENERATOR, { precipChangePct: Array(12).fill(10), tempChangeC: Array(12).fill(2) })
 */
export function changeClimate(p: GeneratorParams, c: ClimateChange): GeneratorParams {
  for (const [key, a, lo] of [
    ['precipChangePct', c.precipChangePct, -100],
    ['tempChangeC', c.tempChangeC, -Infinity],
  ] as const) {
    if (a.length !== 12 || !a.every((x) => Number.isFinite(x) && x > lo)) {
      throw new TilefluxError(
        `${key} needs 12 monthly values${lo > -Infinity ? ` above ${lo}` : ''}; got ${a.join(', ')}`,
      );
    }
  }
  const offsets = (o: readonly number[] | undefined) =>
    Array.from({ length: 12 }, (_, m) => (o?.[m] ?? 0) + c.tempChangeC[m]);
  return {
    ...p,
    gammaScaleMm: p.gammaScaleMm.map((s, m) => s * (1 + c.precipChangePct[m] / 100)),
    tmaxMonthlyOffsetC: offsets(p.tmaxMonthlyOffsetC),
    tminMonthlyOffsetC: offsets(p.tminMonthlyOffsetC),
  };
}
