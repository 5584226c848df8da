/** Cumulative drain flow and nitrate-N load of every scenario. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import { VEGA_LITE_SCHEMA, WIDTH, CONFIG, roundTo } from '../chartTheme.js';
import { scenarioNames, scenarioColour, periodSeries, temporalX } from '../chartSeries.js';

/**
 * Cumulative drain flow and cumulative nitrate-N load over the whole period, one line per
 * scenario, as two stacked panels. Points are thinned to weekly or coarser (at most about 520
 * per scenario) with the last day always kept, so the final value is the period total.
 *
 * @example cumulativeChart(data).vconcat.length // 2
 */
export function cumulativeChart(data: ReportData): TopLevelSpec {
  const du = displayUnits(data.units);
  const names = scenarioNames(data);
  const values: Array<Record<string, string | number>> = [];
  // Days of the period: of the period series when `daily` holds only the chart year.
  const n = data.periodSeries?.[0]?.days ?? data.daily.dates.length;
  for (const name of names) {
    const c = periodSeries(data, name).cumulative;
    for (let j = 0; j < c.dates.length; j++) {
      values.push({
        date: c.dates[j],
        scenario: name,
        flow: roundTo(c.flowMm[j] * du.water.factor, 2),
        load: roundTo(c.loadKgHa[j] * du.load.factor, 3),
      });
    }
  }
  // Short periods get month ticks, long ones a tick every year or every few years.
  const years = n / 365.25;
  const ticks =
    years <= 3
      ? { interval: 'month' as const, step: years <= 1.5 ? 2 : 4 }
      : { interval: 'year' as const, step: Math.max(1, Math.ceil(years / 12)) };
  const format = years <= 3 ? '%b %Y' : '%Y';
  const panel = (field: string, title: string, xTitle: string | null) => ({
    width: WIDTH,
    height: 200,
    mark: { type: 'line' as const },
    encoding: {
      x: temporalX(format, xTitle, ticks),
      y: { field, type: 'quantitative' as const, title },
      color: scenarioColour(names),
    },
  });
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Cumulative drain flow and nitrate-N load',
      subtitle: `${data.fieldName}, ${data.period.from} to ${data.period.to}`,
    },
    config: CONFIG,
    data: { values },
    vconcat: [
      panel('flow', `Flow to date (${du.water.label})`, null),
      panel('load', `Load to date (${du.load.label})`, 'Date'),
    ],
    spacing: 16,
  };
}
