/**
 * The whole-period series of the cumulative, monthly and duration charts: against sums and an
 * empirical distribution worked by hand, and the charts of report data that keeps only the chart
 * year's days with them against the charts of the whole daily record.
 */
import { describe, expect, it } from 'vitest';
import { buildChartSpecs } from '../../src/report/charts.js';
import { yearRange } from '../../src/report/chartSeries.js';
import { periodSeriesOf, seasonDays } from '../../src/report/periodSeries.js';
import type { ReportData } from '../../src/report/types.js';
import { compareScenarios } from '../../src/scenarios/compare.js';
import { makeReportData } from './fixture.mjs';

describe('periodSeriesOf', () => {
  // Four days, two in April (the season 04-01 to 10-31) and two in March.
  const dates = ['2001-03-30', '2001-03-31', '2001-04-01', '2001-04-02'];
  const series = {
    drainflowMm: Float64Array.from([1, 2, 3, 4]),
    no3LoadKgHa: Float64Array.from([0.1, 0.2, 0.3, 0.4]),
    waterTableDepthM: Float64Array.from([0.9, 0.8, 0.2, 0.2]),
  };
  const inSeason = seasonDays(dates, { from: '04-01', to: '10-31' });
  const p = periodSeriesOf('a', dates, series, inSeason);

  it('adds up flow and load from the first day, keeping the first and the last day', () => {
    // step = max(7, ceil(4 / 520)) = 7: only day 0 and the last day are kept.
    expect(p.cumulative.dates).toEqual(['2001-03-30', '2001-04-02']);
    expect(p.cumulative.flowMm).toEqual([1, 1 + 2 + 3 + 4]);
    expect(p.cumulative.loadKgHa[1]).toBeCloseTo(1.0, 12);
    expect(p.days).toBe(4);
  });

  it('sums by calendar month and counts the (year, month) pairs', () => {
    expect(inSeason).toEqual([2, 3]);
    expect(p.monthly.flow[2]).toBe(3); // March: 1 + 2
    expect(p.monthly.flow[3]).toBe(7); // April: 3 + 4
    expect(p.monthly.count).toEqual([0, 0, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0]);
  });

  it('gives the empirical distribution of the season depths, equal depths as one point', () => {
    // Both season days stand at 0.2 m: F(0.2) = 2/2, one point.
    expect(p.duration).toEqual({ depthM: [0.2], days: [2], seasonDays: 2 });
    // Depths 0.1, 0.2, 0.2, 0.3 over four season days: F = 1/4, 3/4, 4/4 (empirical distribution).
    const all = periodSeriesOf(
      'b',
      ['2001-05-01', '2001-05-02', '2001-05-03', '2001-05-04'],
      { ...series, waterTableDepthM: Float64Array.from([0.3, 0.2, 0.1, 0.2]) },
      [0, 1, 2, 3],
    );
    expect(all.duration).toEqual({ depthM: [0.1, 0.2, 0.3], days: [1, 3, 4], seasonDays: 4 });
  });
});

describe('report data with period series', () => {
  it('draws every chart as the whole daily record does, from the chart year and the series', () => {
    const whole = makeReportData({ years: 4, compareScenarios }) as ReportData;
    const { dates, precipMm, series } = whole.daily;
    const [a, b] = yearRange(dates, whole.chartYear);
    const inSeason = seasonDays(dates, whole.measures.growingSeason);
    const cut: ReportData = {
      ...whole,
      daily: {
        dates: dates.slice(a, b),
        precipMm: precipMm.slice(a, b),
        series: series.map((s) => ({
          scenario: s.scenario,
          waterTableDepthM: s.waterTableDepthM.slice(a, b),
          outletDepthM: s.outletDepthM.slice(a, b),
          drainflowMm: s.drainflowMm.slice(a, b),
          no3LoadKgHa: s.no3LoadKgHa.slice(a, b),
          no3ConcMgL: s.no3ConcMgL.slice(a, b),
        })),
      },
      periodSeries: series.map((s) => periodSeriesOf(s.scenario, dates, s, inSeason)),
    };
    expect(cut.daily.dates.length).toBeLessThan(dates.length / 3);
    expect(JSON.stringify(buildChartSpecs(cut))).toBe(JSON.stringify(buildChartSpecs(whole)));
  });
});
