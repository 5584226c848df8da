/**
 * Vega-Lite chart specs of a scenario comparison. Pure: report data in, plain JSON specs out
 * (data inlined as `values`), so a spec can be written to disk, diffed, rendered in Node or
 * embedded in the HTML report. Daily values are kept to the chosen year, cumulative series are
 * thinned, and monthly and annual figures are aggregated here, so every spec stays small.
 *
 * This file names the charts, their captions and builders; each chart is built in its own file
 * under charts/, on the look of chartTheme.ts and the series helpers of chartSeries.ts.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from './types.js';
import { waterTableChart } from './charts/waterTable.js';
import { cumulativeChart } from './charts/cumulative.js';
import { annualChart } from './charts/annual.js';
import { monthlyChart } from './charts/monthly.js';
import { tradeoffChart, niceCeil, placeLabels } from './charts/tradeoff.js';
import { concentrationChart } from './charts/concentration.js';
import { durationChart } from './charts/duration.js';
import { hydrographChart } from './charts/hydrograph.js';

export {
  annualChart,
  concentrationChart,
  cumulativeChart,
  durationChart,
  hydrographChart,
  monthlyChart,
  niceCeil,
  placeLabels,
  tradeoffChart,
  waterTableChart,
};

/** Names of the charts (file stems in `charts/`), in report order. */
export const CHART_NAMES = [
  'water-table',
  'cumulative',
  'annual',
  'monthly',
  'tradeoff',
  'concentration',
  'duration',
  'hydrograph',
] as const;
export type ChartName = (typeof CHART_NAMES)[number];
/** One-sentence captions that say what each chart shows and how to read it. */
export const CHART_CAPTIONS: Readonly<Record<ChartName, string>> = {
  'water-table':
    'Daily water-table depth midway between the drains in the chosen year, under the daily ' +
    'precipitation (bars from the top). Solid lines: water table; dashed lines: outlet level in ' +
    'force; dotted line: wet threshold; grey bands: the spring and fall fieldwork windows. ' +
    'Higher on the chart is closer to the surface.',
  cumulative:
    'Drain flow and nitrate-N load added up from the first day of the period (weekly or ' +
    'coarser points). A flatter line sends less downstream.',
  annual: 'Drain flow and nitrate-N load of each calendar year, scenarios side by side.',
  monthly:
    'Mean drain flow and nitrate-N load of each calendar month over the period: when the ' +
    'water and the nitrate leave the field.',
  tradeoff:
    'Mean annual nitrate-N load against growing-season wet days: the trade-off at a glance. ' +
    'Lower is less nitrate; further left is a drier field.',
  concentration:
    'Flow-weighted nitrate-N concentration of drain water in each calendar month over the ' +
    'period (total load / total flow).',
  duration:
    'Water-table duration curve: the share of growing-season days, over all years, on which ' +
    'the water table midway between the drains stood at each depth or shallower. A curve ' +
    'further right at the wet threshold (dotted) means more wet days.',
  hydrograph:
    'Daily drain flow in the chosen year, one line per scenario: when the drains run and how ' +
    'high the peaks are.',
};
const BUILDERS: Readonly<Record<ChartName, (data: ReportData) => TopLevelSpec>> = {
  'water-table': waterTableChart,
  cumulative: cumulativeChart,
  annual: annualChart,
  monthly: monthlyChart,
  tradeoff: tradeoffChart,
  concentration: concentrationChart,
  duration: durationChart,
  hydrograph: hydrographChart,
};
/**
 * Every chart of the report, keyed by name in CHART_NAMES order.
 *
 * @example Object.keys(buildChartSpecs(data)) // ['water-table', 'cumulative', ...]
 */
export function buildChartSpecs(data: ReportData): Record<ChartName, TopLevelSpec> {
  const n = data.daily.dates.length;
  for (const s of data.daily.series) {
    for (const [k, v] of Object.entries(s)) {
      if (v instanceof Float64Array && v.length !== n) {
        throw new Error(
          `daily series ${k} of "${s.scenario}" has ${v.length} values for ${n} dates`,
        );
      }
    }
  }
  const out = {} as Record<ChartName, TopLevelSpec>;
  for (const name of CHART_NAMES) out[name] = BUILDERS[name](data);
  return out;
}
