import { describe, it, expect } from 'vitest';
import { summarizeWeather } from '../../src/climate/weatherSummary.js';
import { consecutiveDates } from '../../src/climate/calendar.js';
import type { WeatherSeries } from '../../src/climate/weatherSeries.js';

function record(
  first: string,
  days: number,
  rule: (date: string) => [number, number, number],
): WeatherSeries {
  const dates = consecutiveDates(first, days);
  const rows = dates.map(rule);
  return {
    dates,
    precipMm: Float64Array.from(rows.map((r) => r[0])),
    tmaxC: Float64Array.from(rows.map((r) => r[1])),
    tminC: Float64Array.from(rows.map((r) => r[2])),
  };
}

describe('summarizeWeather', () => {
  // 2021-07-01 .. 2024-03-31: complete years 2022 and 2023 only.
  // Every day 2 mm; on 1 January also 100 mm in 2022, 300 mm in 2023 (all as snow: cold day);
  // a warm day every day otherwise.
  // Summarised inside each test, so mutation testing sees which tests reach the summary.
  const summary = () =>
    summarizeWeather(
      record('2021-07-01', 1005, (d) => {
        const jan1 = d.endsWith('-01-01');
        const extra = d === '2022-01-01' ? 100 : d === '2023-01-01' ? 300 : 0;
        return jan1 ? [2 + extra, -5, -10] : [2, 20, 10];
      }),
      42,
    );

  it('uses complete calendar years only for the annual figures', () => {
    const s = summary();
    expect(s.firstDate).toBe('2021-07-01');
    expect(s.lastDate).toBe('2024-03-31');
    expect(s.days).toBe(1005);
    expect(s.completeYears).toEqual([2022, 2023]);
    // 2022: 365 * 2 + 100 = 830; 2023: 365 * 2 + 300 = 1030 (hand calculation).
    expect(s.precipByYear).toEqual([
      { year: 2022, mm: 830 },
      { year: 2023, mm: 1030 },
    ]);
    expect(s.precipMeanMmYr).toBeCloseTo(930, 9);
    expect(s.precipMin).toEqual({ year: 2022, mm: 830 });
    expect(s.precipMax).toEqual({ year: 2023, mm: 1030 });
    expect(s.annualBasis).toBe('complete years');
    expect(s.refEtMethod).toBe('Hargreaves');
  });

  it('gives the share of precipitation that fell as snow', () => {
    // Snow falls on the three 1 January days (mean -7.5 degC): 2022: 102, 2023: 302, 2024: 2 mm;
    // total precipitation 1005 * 2 + 400 = 2410 mm.
    const s = summary();
    expect(s.snowSharePercent).toBeCloseTo((100 * (102 + 302 + 2)) / 2410, 9);
  });

  it('scales the daily mean when no complete year is present', () => {
    const short = record('2024-03-01', 10, () => [3, 15, 5]);
    const t = summarizeWeather(short, 42);
    expect(t.completeYears).toEqual([]);
    expect(t.annualBasis).toBe('daily mean x 365.25');
    expect(t.precipMeanMmYr).toBeCloseTo(3 * 365.25, 9);
    expect(t.precipMin).toBeUndefined();
  });

  it('averages reference ET over complete years, from a ref_et column (hand sums)', () => {
    // 2021-12-31 .. 2024-01-01: complete years 2022 and 2023. ref_et 3 mm/d in 2022,
    // 4 mm/d in 2023, 9 mm/d on the two partial-year days: (3 * 365 + 4 * 365) / 2 = 1277.5.
    const w = record('2021-12-31', 732, () => [1, 20, 10]);
    w.refEtMm = Float64Array.from(w.dates, (d) =>
      d.startsWith('2022') ? 3 : d.startsWith('2023') ? 4 : 9,
    );
    const s = summarizeWeather(w, 42);
    expect(s.refEtMethod).toBe('ref_et column');
    expect(s.completeYears).toEqual([2022, 2023]);
    expect(s.refEtMeanMmYr).toBeCloseTo(1277.5, 9);
  });

  it('scales the daily mean reference ET when no complete year is present', () => {
    // Ten days: ref_et 1, 2, ..., 10 mm/d, mean 5.5 mm/d, so 5.5 * 365.25 mm/yr.
    const w = record('2024-03-01', 10, () => [3, 15, 5]);
    w.refEtMm = Float64Array.from({ length: 10 }, (_, i) => i + 1);
    expect(summarizeWeather(w, 42).refEtMeanMmYr).toBeCloseTo(5.5 * 365.25, 9);
  });

  it('names the driest and wettest complete year, the earliest of equal years', () => {
    // 2 mm every day; 1 January adds 100 mm in 2021 and 2023: 830, 730, 830 mm.
    const wetEnds = record('2021-01-01', 365 * 3, (d) =>
      d === '2021-01-01' || d === '2023-01-01' ? [102, 20, 10] : [2, 20, 10],
    );
    const a = summarizeWeather(wetEnds, 42);
    expect(a.precipMin).toEqual({ year: 2022, mm: 730 });
    expect(a.precipMax).toEqual({ year: 2021, mm: 830 });
    // 1 January 2022 adds 100 mm instead: 730, 830, 730 mm.
    const wetMiddle = record('2021-01-01', 365 * 3, (d) =>
      d === '2022-01-01' ? [102, 20, 10] : [2, 20, 10],
    );
    const b = summarizeWeather(wetMiddle, 42);
    expect(b.precipMin).toEqual({ year: 2021, mm: 730 });
    expect(b.precipMax).toEqual({ year: 2022, mm: 830 });
  });

  it('refuses a record without days', () => {
    const empty = record('2024-01-01', 0, () => [0, 0, 0]);
    expect(() => summarizeWeather(empty, 42)).toThrow('summarizeWeather: the record has no days');
  });

  it('gives a snow share of 0, not a division by zero, for a record without precipitation', () => {
    const dry = record('2024-01-01', 30, () => [0, -2, -12]);
    expect(summarizeWeather(dry, 42).snowSharePercent).toBe(0);
  });
});
