import { describe, it, expect } from 'vitest';
import { join } from 'node:path';
import { readWeatherFile } from '../../src/io/weather.js';
import {
  changeClimate,
  fitGenerator,
  generateWeather,
  recordStatistics,
  type WeatherSeries,
} from '../../src/climate/index.js';

// The fitted generator against the record it was fitted to, on real open data (vega-datasets
// data/weather.csv: Seattle and New York, 2012-2015, mm and degC) and on the 30-year synthetic
// demo record. Statistics are computed here with plain loops, independently of the library.
//
// The tests, per calendar month:
// - mean monthly precipitation of 500 generated years lies within 3 standard errors of the
//   record's, the standard error being the generated series' own sampling error (standard
//   deviation of its monthly totals over the 500 years / sqrt(500)); with 36 such comparisons a
//   fit that reproduced the record only on average would fail some;
// - wet-day frequency (share of days with 0.1 mm or more) within 0.03;
// - mean Tmax and Tmin within 0.5 degC.

const root = join(import.meta.dirname, '..', '..');
const vega = join(root, 'node_modules', 'vega-datasets', 'data', 'weather.csv');
const columns = { date: 'date', precip: 'precipitation', tmax: 'temp_max', tmin: 'temp_min' };
const records: Array<[string, () => WeatherSeries]> = [
  [
    'Seattle',
    () =>
      readWeatherFile(vega, { columns, where: { column: 'location', value: 'Seattle' } }).series,
  ],
  [
    'New York',
    () =>
      readWeatherFile(vega, { columns, where: { column: 'location', value: 'New York' } }).series,
  ],
  [
    'demo (30 synthetic years)',
    () => readWeatherFile(join(root, 'data-demo', 'weather.csv')).series,
  ],
];

/** Per month: monthly totals by year, wet days, days, Tmax and Tmin sums. */
function monthly(w: WeatherSeries) {
  const totals = Array.from({ length: 12 }, () => new Map<string, number>());
  const days = new Array(12).fill(0);
  const wet = new Array(12).fill(0);
  const tmax = new Array(12).fill(0);
  const tmin = new Array(12).fill(0);
  w.dates.forEach((d, i) => {
    const m = Number(d.slice(5, 7)) - 1;
    const y = d.slice(0, 4);
    totals[m].set(y, (totals[m].get(y) ?? 0) + w.precipMm[i]);
    days[m]++;
    if (w.precipMm[i] >= 0.1) wet[m]++;
    tmax[m] += w.tmaxC[i];
    tmin[m] += w.tminC[i];
  });
  return Array.from({ length: 12 }, (_, m) => {
    const t = [...totals[m].values()];
    const mean = t.reduce((a, b) => a + b, 0) / t.length;
    const sd = Math.sqrt(t.reduce((a, b) => a + (b - mean) ** 2, 0) / (t.length - 1));
    return {
      precipMean: mean,
      precipSe: sd / Math.sqrt(t.length),
      wetFraction: wet[m] / days[m],
      tmax: tmax[m] / days[m],
      tmin: tmin[m] / days[m],
    };
  });
}

describe.each(records)('generator fitted to %s', (_name, load) => {
  // One test per record, so the 500 years are generated once inside it: built at module load
  // or shared between tests, they would hide which tests reach the fit from mutation testing's
  // per-test coverage.
  it('reproduces monthly precipitation (3 standard errors of 500 years), wet days and Tmax/Tmin', () => {
    const record = load();
    const generated = generateWeather({ years: 500, seed: 11, params: fitGenerator(record) });
    const rec = monthly(record);
    const gen = monthly(generated);
    const z = rec.map((r, m) => Math.abs(gen[m].precipMean - r.precipMean) / gen[m].precipSe);
    expect(Math.max(...z), 'monthly mean precipitation, z').toBeLessThan(3);
    const diff = rec.map((r, m) => Math.abs(gen[m].wetFraction - r.wetFraction));
    expect(Math.max(...diff), 'wet-day frequency').toBeLessThan(0.03);
    for (let m = 0; m < 12; m++) {
      expect(Math.abs(gen[m].tmax - rec[m].tmax), `Tmax month ${m + 1}`).toBeLessThan(0.5);
      expect(Math.abs(gen[m].tmin - rec[m].tmin), `Tmin month ${m + 1}`).toBeLessThan(0.5);
    }
  });
});

describe('climate deltas', () => {
  // One test, so the two 300-year records are generated inside it (see above).
  it('+20 % in Dec-Feb scales amounts and keeps wet days; +2 degC moves every monthly mean by 2', () => {
    const params = fitGenerator(records[2][1]());
    const base = monthly(generateWeather({ years: 300, seed: 5, params }));
    const changed = monthly(
      generateWeather({
        years: 300,
        seed: 5,
        params: changeClimate(params, {
          precipChangePct: [20, 20, 0, 0, 0, 0, 0, 0, 0, 0, 0, 20],
          tempChangeC: new Array(12).fill(2),
        }),
      }),
    );
    // The same seed draws the same wet/dry sequence and the same gamma variates: every wet-day
    // amount is 1.2 times the base one, so monthly means are exactly 1.2 times (and 1 elsewhere).
    for (const m of [0, 1, 11]) {
      expect(changed[m].precipMean / base[m].precipMean).toBeCloseTo(1.2, 9);
    }
    expect(changed[6].precipMean / base[6].precipMean).toBeCloseTo(1, 9);
    for (let m = 0; m < 12; m++) {
      expect(Math.abs(changed[m].wetFraction - base[m].wetFraction)).toBeLessThan(0.002);
    }
    // Temperatures: the same draws, shifted by exactly 2 degC.
    for (let m = 0; m < 12; m++) {
      expect(changed[m].tmax - base[m].tmax).toBeCloseTo(2, 9);
      expect(changed[m].tmin - base[m].tmin).toBeCloseTo(2, 9);
    }
  });
});

describe('recordStatistics', () => {
  it('monthly means, wet days and annual totals of a hand-made record', () => {
    // Two days in January 2001: 0.05 mm (dry: below 0.1 mm) and 3 mm.
    const s = recordStatistics({
      dates: ['2001-01-01', '2001-01-02'],
      precipMm: Float64Array.of(0.05, 3),
      tmaxC: Float64Array.of(2, 4),
      tminC: Float64Array.of(-2, 0),
    });
    expect(s.precipMonthMm[0]).toBeCloseTo(((0.05 + 3) / 2) * 31, 12);
    expect(s.wetDayFraction[0]).toBe(0.5);
    expect(s.tmaxMonthC[0]).toBe(3);
    expect(s.annualTotalsMm).toEqual([]);
    expect(s.maxDailyPrecipDate).toBe('2001-01-02');
  });
});
