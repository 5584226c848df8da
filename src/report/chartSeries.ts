/**
 * Series helpers of the run charts: scenario names and colours, a scenario's daily series, the
 * days of one year, fieldwork-window bands, the temporal axis, grouped bars and monthly sums.
 * Pure.
 */
import { SettingError } from '../errors.js';
import { PALETTE, WIDTH } from './chartTheme.js';
import { monthOf, periodSeriesOf, seasonDays } from './periodSeries.js';
import type { ReportData, ScenarioPeriodSeries } from './types.js';

export function scenarioNames(data: ReportData): string[] {
  return data.scenarios.map((s) => s.name);
}
/** Scenario colour encoding: a fixed colour per scenario, in the order they were given. */
export function scenarioColour(names: string[], legend = true) {
  return {
    field: 'scenario',
    type: 'nominal' as const,
    title: 'Scenario',
    sort: names,
    scale: { domain: names, range: names.map((_, i) => PALETTE[i % PALETTE.length]) },
    ...(legend ? {} : { legend: null }),
  };
}
export function dailySeries(data: ReportData, name: string) {
  const s = data.daily.series.find((x) => x.scenario === name);
  if (!s) throw new Error(`report data has no daily series for scenario "${name}"`);
  return s;
}
/** First and one-past-last index of a calendar year in the ISO dates. */
export function yearRange(dates: readonly string[], year: number): [number, number] {
  const prefix = `${String(year).padStart(4, '0')}-`;
  let i0 = -1;
  let i1 = -1;
  for (let i = 0; i < dates.length; i++) {
    if (dates[i].startsWith(prefix)) {
      if (i0 < 0) i0 = i;
      i1 = i + 1;
    }
  }
  if (i0 < 0) {
    throw new SettingError(
      (n) =>
        `${n('chartYear')}: chart year ${year} is outside the weather period ` +
        `(${dates[0] ?? '?'} to ${dates[dates.length - 1] ?? '?'}); choose a year inside it`,
    );
  }
  return [i0, i1];
}
export { monthOf };
/** The ISO date one day after `iso` (UTC). */
export function nextDay(iso: string): string {
  const t = Date.parse(`${iso}T00:00:00Z`) + 86_400_000;
  return new Date(t).toISOString().slice(0, 10);
}
/**
 * The fieldwork windows of `year` as bands from the first day to the end of the last day; a
 * window that wraps past the new year gives two bands inside the year.
 */
export function windowBands(data: ReportData, year: number): Array<Record<string, string>> {
  const y = String(year).padStart(4, '0');
  const bands: Array<Record<string, string>> = [];
  const windows: Array<[string, { from: string; to: string }]> = [
    ['Spring fieldwork', data.measures.springWindow],
    ['Fall fieldwork', data.measures.fallWindow],
  ];
  for (const [label, w] of windows) {
    const parts: Array<[string, string]> =
      w.from <= w.to
        ? [[w.from, w.to]]
        : [
            ['01-01', w.to],
            [w.from, '12-31'],
          ];
    for (const [a, b] of parts) {
      bands.push({ start: `${y}-${a}`, end: nextDay(`${y}-${b}`), window: label });
    }
  }
  return bands;
}
export function temporalX(
  format: string,
  title: string | null,
  tickCount: { interval: 'month' | 'year'; step: number },
) {
  return {
    field: 'date',
    type: 'temporal' as const,
    title,
    // UTC keeps dates on their day whatever the time zone of the machine drawing the chart.
    scale: { type: 'utc' as const },
    axis: { format, tickCount, labelOverlap: true },
  };
}
/** Two stacked grouped-bar panels (flow and load) over an ordinal x field. */
export function groupedBars(
  names: string[],
  xField: string,
  xTitle: string,
  xSort: Array<string | number> | 'ascending',
  panels: Array<[field: string, title: string]>,
  labelAngle: number,
) {
  return panels.map(([field, title]) => ({
    width: WIDTH,
    height: 200,
    mark: { type: 'bar' as const },
    encoding: {
      x: {
        field: xField,
        type: 'ordinal' as const,
        title: xTitle,
        sort: xSort,
        axis: { labelAngle },
      },
      xOffset: { field: 'scenario', type: 'nominal' as const, sort: names },
      y: { field, type: 'quantitative' as const, title },
      color: scenarioColour(names),
    },
  }));
}
const periodCache = new WeakMap<ReportData, Map<string, ScenarioPeriodSeries>>();

/**
 * The whole-period series of a scenario: the report data's own (`periodSeries`, a long run's
 * report) or computed once from its daily series over the whole period.
 */
export function periodSeries(data: ReportData, name: string): ScenarioPeriodSeries {
  const given = data.periodSeries?.find((p) => p.scenario === name);
  if (given) return given;
  if (data.periodSeries) throw new Error(`report data has no period series for scenario "${name}"`);
  let byName = periodCache.get(data);
  if (!byName) periodCache.set(data, (byName = new Map()));
  let p = byName.get(name);
  if (!p) {
    const dates = data.daily.dates;
    const inSeason = seasonDays(dates, data.measures.growingSeason);
    byName.set(name, (p = periodSeriesOf(name, dates, dailySeries(data, name), inSeason)));
  }
  return p;
}

/**
 * Sums of daily drain flow and load per calendar month for one scenario, and the number of
 * (year, month) pairs in the period for each month.
 */
export function monthlySums(data: ReportData, name: string) {
  return periodSeries(data, name).monthly;
}
