/**
 * The explorer's charts, drawn with the report's own Vega-Lite builders (same palette, formats
 * and captions): the water table through the chosen year under its precipitation with the
 * outlet level, cumulative drain flow and nitrate-N, year-by-year bars and the growing-season
 * water-table duration curve, for designs A and B.
 */
import type { TopLevelSpec } from 'vega-lite';
import {
  annualChart,
  CHART_CAPTIONS,
  cumulativeChart,
  durationChart,
  waterTableChart,
} from '../../report/charts.js';
import type { ReportData } from '../../report/types.js';
import type { ComparisonRow } from '../../scenarios/compare.js';
import type { DesignRun, PreparedField } from '../../scenarios/prepared.js';
import type { AnnualRow } from '../../scenarios/types.js';
import type { ExplorerData } from './model.js';

/** The charts the page draws, in page order. */
export const EXPLORER_CHARTS = ['water-table', 'cumulative', 'annual', 'duration'] as const;
export type ExplorerChart = (typeof EXPLORER_CHARTS)[number];

/** The year with the most precipitation in the annual rows (the report's default chart year). */
export function wettestYearOf(annual: readonly AnnualRow[]): number {
  let best = annual[0];
  for (const r of annual) if (r.precip_mm > best.precip_mm) best = r;
  return best.year;
}

/**
 * The chart specs of both designs' runs; `year` picks the water-table year (the wettest year
 * when absent or outside the period).
 */
export function explorerChartSpecs(
  prepared: PreparedField,
  data: ExplorerData,
  runs: readonly [DesignRun, DesignRun],
  rows: ComparisonRow[],
  year: number | null,
): { specs: Record<ExplorerChart, TopLevelSpec>; year: number } {
  const a = prepared.reportStart;
  const b = prepared.forcing.dates.length;
  const annual = [...runs[0].annual, ...runs[1].annual];
  const years = runs[0].annual.map((r) => r.year);
  const chartYear = year !== null && years.includes(year) ? year : wettestYearOf(runs[0].annual);
  const names = [data.a.name, data.b.name];
  const wetness = data.a.field.wetness;
  const report: ReportData = {
    title: data.title,
    generatedBy: data.generatedBy,
    fieldName: data.fieldName,
    weatherFile: data.weatherFile,
    climate: { precipMmPerYr: NaN, refEtMmPerYr: NaN, tmeanC: NaN },
    period: { from: prepared.from, to: prepared.to, years: years.length },
    baseline: names[0],
    scenarios: names.map((name, k) => ({
      name,
      description: '',
      drainDepthM: NaN,
      spacingM: rows[k].spacing_m,
      outlet: '',
    })),
    comparison: rows,
    annual,
    daily: {
      dates: prepared.forcing.dates.slice(a, b),
      precipMm: prepared.forcing.precipMm.slice(a, b),
      series: runs.map((r, k) => ({
        scenario: names[k],
        waterTableDepthM: r.engine.waterTableDepthM.slice(a, b),
        outletDepthM: r.engine.outletDepthM.slice(a, b),
        drainflowMm: r.engine.drainflowMm.slice(a, b),
        no3LoadKgHa: r.nitrate.loadKgHa.slice(a, b),
        no3ConcMgL: r.nitrate.concMgL.slice(a, b),
      })),
    },
    wetThresholdM: wetness.threshold,
    measures: wetness,
    chartYear,
    chartYearReason: year === chartYear ? 'given' : 'wettest',
    windows: [],
    balances: [],
    methods: [],
    units: data.units,
  };
  // The description becomes the drawing's accessible name (aria-label of its svg).
  const described = (name: ExplorerChart, spec: TopLevelSpec) =>
    ({ ...spec, description: CHART_CAPTIONS[name] }) as TopLevelSpec;
  return {
    year: chartYear,
    specs: {
      'water-table': described('water-table', waterTableChart(report)),
      cumulative: described('cumulative', cumulativeChart(report)),
      annual: described('annual', annualChart(report)),
      duration: described('duration', durationChart(report)),
    },
  };
}
