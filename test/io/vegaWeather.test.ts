import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { readWeatherFile } from '../../src/io/weather.js';
import { summarizeWeather } from '../../src/climate/weatherSummary.js';

// Real daily weather from the vega-datasets package (data/weather.csv: Seattle and New York,
// 2012-2015; columns location,date,precipitation,temp_max,temp_min,wind,weather; precipitation
// in mm, temperatures in degC). Expected values are computed here from the raw file with a plain
// split, independently of the reader.
const path = join(
  import.meta.dirname,
  '..',
  '..',
  'node_modules',
  'vega-datasets',
  'data',
  'weather.csv',
);
const raw = readFileSync(path, 'utf8')
  .trim()
  .split('\n')
  .slice(1)
  .map((l) => l.split(','));

function independent(location: string) {
  const rows = raw.filter((r) => r[0] === location);
  const byYear = new Map<number, number>();
  for (const r of rows) {
    const y = Number(r[1].slice(0, 4));
    byYear.set(y, (byYear.get(y) ?? 0) + Number(r[2]));
  }
  return { rows, byYear };
}

const mapping = { date: 'date', precip: 'precipitation', tmax: 'temp_max', tmin: 'temp_min' };

describe.each(['New York', 'Seattle'])('vega-datasets weather.csv, %s', (location) => {
  const r = readWeatherFile(path, {
    columns: mapping,
    where: { column: 'location', value: location },
  });
  const ind = independent(location);

  it('has 1461 days, 2012-01-01 to 2015-12-31, none filled', () => {
    // 2012-2015: 366 + 365 + 365 + 365 = 1461 days (calendar fact; 2012 is a leap year).
    expect(r.series.dates.length).toBe(1461);
    expect(ind.rows.length).toBe(1461);
    expect(r.series.dates[0]).toBe('2012-01-01');
    expect(r.series.dates.at(-1)).toBe('2015-12-31');
    expect(r.filledDays).toBe(0);
    expect(r.unitsUsed).toEqual({ precip: 'mm', tmax: 'degC', tmin: 'degC' });
  });

  it('reads every value as in the raw file', () => {
    ind.rows.forEach((row, i) => {
      expect(r.series.dates[i]).toBe(row[1]);
      expect(r.series.precipMm[i]).toBe(Number(row[2]));
      expect(r.series.tmaxC[i]).toBe(Number(row[3]));
      expect(r.series.tminC[i]).toBe(Number(row[4]));
    });
  });

  it('gives the annual precipitation totals of the raw file', () => {
    const s = summarizeWeather(r.series, 42);
    expect(s.completeYears).toEqual([2012, 2013, 2014, 2015]);
    for (const t of s.precipByYear) {
      expect(t.mm).toBeCloseTo(ind.byYear.get(t.year)!, 6);
    }
    const totals = [...ind.byYear.values()];
    expect(s.precipMeanMmYr).toBeCloseTo(totals.reduce((a, b) => a + b, 0) / 4, 6);
    expect(s.precipMin!.mm).toBeCloseTo(Math.min(...totals), 6);
    expect(s.precipMax!.mm).toBeCloseTo(Math.max(...totals), 6);
  });
});
