import { describe, it, expect } from 'vitest';
import {
  DEFAULT_GENERATOR,
  forHemisphere,
  generateWeather,
  stationaryWetProbability,
  type GeneratorParams,
} from '../../src/climate/weatherGenerator.js';
import type { WeatherSeries } from '../../src/climate/weatherSeries.js';

// Expected values are derived from the parameters with the theory of the model (Richardson,
// 1981): the long-run wet-day probability of a two-state Markov chain is p01 / (1 + p01 - p11)
// (standard result for a two-state chain), the mean wet-day amount of a gamma distribution is
// shape * scale, and the mean temperature of a day is the harmonic mean + amplitude * cos(...).
// Tolerances are 4.5 standard errors estimated from the year-to-year spread of the generated
// record itself (years are nearly independent), so a correct generator fails rarely (about 1 in
// 10^5 per check) while a wrong mean of a few percent is caught.

const YEARS = 200;
const p = DEFAULT_GENERATOR;

/**
 * The 200 generated years, made afresh inside each test that needs them (about 0.1 s): a record
 * built at module load, or memoised, would hide which tests reach the generator from mutation
 * testing's per-test coverage.
 */
const generated = () => generateWeather({ years: YEARS, seed: 2718, startYear: 1801 });

/** For each month of record w, one value per year. */
function perYear(w: WeatherSeries, f: (i: number) => number, agg: 'sum' | 'mean'): number[][] {
  const out = Array.from({ length: 12 }, () => new Array<number>(YEARS).fill(0));
  const count = Array.from({ length: 12 }, () => new Array<number>(YEARS).fill(0));
  for (let i = 0; i < w.dates.length; i++) {
    const y = Number(w.dates[i].slice(0, 4)) - 1801;
    const m = Number(w.dates[i].slice(5, 7)) - 1;
    out[m][y] += f(i);
    count[m][y]++;
  }
  if (agg === 'mean') out.forEach((row, m) => row.forEach((_, y) => (row[y] /= count[m][y])));
  return out;
}

function meanAndSe(xs: number[]) {
  const mean = xs.reduce((a, b) => a + b, 0) / xs.length;
  const sd = Math.sqrt(xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (xs.length - 1));
  return { mean, se: sd / Math.sqrt(xs.length) };
}

/** Mean number of days of month m (1-based) over the simulated years 1801-2000. */
function meanDays(m: number): number {
  let days = 0;
  for (let y = 1801; y <= 2000; y++) days += new Date(Date.UTC(y, m, 0)).getUTCDate();
  return days / YEARS;
}

/** Mean of cos(2 pi (doy - peak) / 365.25) over the days of month m in the simulated years. */
function meanCos(m: number, peak: number): number {
  let s = 0;
  let n = 0;
  for (let y = 1801; y <= 2000; y++) {
    const jan1 = Date.UTC(y, 0, 1);
    for (let d = 1; d <= new Date(Date.UTC(y, m, 0)).getUTCDate(); d++) {
      const doy = (Date.UTC(y, m - 1, d) - jan1) / 86_400_000 + 1;
      s += Math.cos((2 * Math.PI * (doy - peak)) / 365.25);
      n++;
    }
  }
  return s / n;
}

describe('Richardson weather generator', () => {
  it('gives the same record for the same seed and a different one for another seed', () => {
    const a = generateWeather({ years: 3, seed: 99 });
    const b = generateWeather({ years: 3, seed: 99 });
    const c = generateWeather({ years: 3, seed: 100 });
    expect(a.dates).toEqual(b.dates);
    expect(Buffer.from(a.precipMm.buffer).equals(Buffer.from(b.precipMm.buffer))).toBe(true);
    expect(Buffer.from(a.tmaxC.buffer).equals(Buffer.from(b.tmaxC.buffer))).toBe(true);
    expect(Buffer.from(a.tminC.buffer).equals(Buffer.from(b.tminC.buffer))).toBe(true);
    expect(Buffer.from(a.precipMm.buffer).equals(Buffer.from(c.precipMm.buffer))).toBe(false);
  });

  it('covers whole calendar years from the start year, day after day', () => {
    const w = generated();
    expect(w.dates[0]).toBe('1801-01-01');
    expect(w.dates.at(-1)).toBe('2000-12-31');
    // 1801-2000: 50 years divisible by 4 (1804..2000), less 1900, gives 49 leap years.
    expect(w.dates.length).toBe(200 * 365 + 49);
    // Counted in a plain loop, one expect at the end: 73,000 expect calls took 20 s.
    const bad: string[] = [];
    for (let i = 0; i < w.dates.length; i++) {
      if (!(w.tminC[i] <= w.tmaxC[i]) || !(w.precipMm[i] >= 0)) bad.push(w.dates[i]);
    }
    expect(bad).toEqual([]);
  });

  it('matches the monthly wet-day frequency p01 / (1 + p01 - p11)', () => {
    const w = generated();
    const wet = perYear(w, (i) => (w.precipMm[i] > 0 ? 1 : 0), 'mean');
    for (let m = 0; m < 12; m++) {
      const expected = stationaryWetProbability(p.pWetGivenDry[m], p.pWetGivenWet[m]);
      const { mean, se } = meanAndSe(wet[m]);
      expect(Math.abs(mean - expected), `month ${m + 1}`).toBeLessThan(4.5 * se);
    }
  });

  it('matches monthly mean precipitation: days * wet probability * shape * scale', () => {
    const w = generated();
    const totals = perYear(w, (i) => w.precipMm[i], 'sum');
    let annual = 0;
    for (let m = 0; m < 12; m++) {
      const pi = p.pWetGivenDry[m] / (1 + p.pWetGivenDry[m] - p.pWetGivenWet[m]);
      const expected = meanDays(m + 1) * pi * p.gammaShape[m] * p.gammaScaleMm[m];
      annual += expected;
      const { mean, se } = meanAndSe(totals[m]);
      expect(Math.abs(mean - expected), `month ${m + 1}`).toBeLessThan(4.5 * se);
    }
    // The invented site is meant to get 850 to 950 mm a year.
    expect(annual).toBeGreaterThan(850);
    expect(annual).toBeLessThan(950);
  });

  it('matches monthly mean Tmax and Tmin from the harmonics', () => {
    const w = generated();
    const tmax = perYear(w, (i) => w.tmaxC[i], 'mean');
    const tmin = perYear(w, (i) => w.tminC[i], 'mean');
    for (let m = 0; m < 12; m++) {
      const c = meanCos(m + 1, p.warmestDayOfYear);
      const eMax = p.tmax.meanC + p.tmax.amplitudeC * c;
      const eMin = p.tmin.meanC + p.tmin.amplitudeC * c;
      const a = meanAndSe(tmax[m]);
      const b = meanAndSe(tmin[m]);
      expect(Math.abs(a.mean - eMax), `Tmax month ${m + 1}`).toBeLessThan(4.5 * a.se);
      expect(Math.abs(b.mean - eMin), `Tmin month ${m + 1}`).toBeLessThan(4.5 * b.se);
    }
  });

  it('has cold winters and warm summers at the default site', () => {
    const w = generated();
    const tmax = perYear(w, (i) => w.tmaxC[i], 'mean').map((r) => meanAndSe(r).mean);
    expect(tmax[0]).toBeLessThan(0);
    expect(tmax[6]).toBeGreaterThan(25);
  });

  it('shifts the seasons for the southern hemisphere', () => {
    const south = forHemisphere(p, -35);
    expect(south.pWetGivenDry[0]).toBe(p.pWetGivenDry[6]);
    expect(south.gammaScaleMm[6]).toBe(p.gammaScaleMm[0]);
    expect(Math.abs(south.warmestDayOfYear - (p.warmestDayOfYear + 182.625 - 365.25))).toBeLessThan(
      1e-9,
    );
    expect(forHemisphere(p, 10)).toBe(p);
  });

  it('rejects bad options and parameters with a message', () => {
    expect(() => generateWeather({ years: 0, seed: 1 })).toThrow(/years must be a whole number/);
    expect(() => generateWeather({ years: 2, seed: -1 })).toThrow(/seed must be/);
    const bad: GeneratorParams = { ...p, pWetGivenWet: [...p.pWetGivenWet.slice(0, 11), 1.2] };
    expect(() => generateWeather({ years: 1, seed: 1, params: bad })).toThrow(/pWetGivenWet\[12\]/);
  });
});
