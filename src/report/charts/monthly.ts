/** Mean monthly drain flow and load. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import { VEGA_LITE_SCHEMA, MONTHS, CONFIG, roundTo } from '../chartTheme.js';
import { scenarioNames, groupedBars, monthlySums } from '../chartSeries.js';

/**
 * Monthly distribution of drain flow and nitrate-N load: for each calendar month, the mean over
 * the years of that month's total, scenarios side by side.
 *
 * @example monthlyChart(data).vconcat.length // 2
 */
export function monthlyChart(data: ReportData): TopLevelSpec {
  const du = displayUnits(data.units);
  const names = scenarioNames(data);
  const values: Array<Record<string, string | number>> = [];
  for (const name of names) {
    const { flow, load, count } = monthlySums(data, name);
    for (let m = 0; m < 12; m++) {
      if (count[m] === 0) continue;
      values.push({
        month: MONTHS[m],
        scenario: name,
        flow: roundTo((flow[m] / count[m]) * du.water.factor, 2),
        load: roundTo((load[m] / count[m]) * du.load.factor, 3),
      });
    }
  }
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Drain flow and nitrate-N load by calendar month',
      subtitle: `${data.fieldName}: mean of each month's total, ${data.period.from} to ${data.period.to}`,
    },
    config: CONFIG,
    data: { values },
    vconcat: groupedBars(
      names,
      'month',
      'Month',
      MONTHS,
      [
        ['flow', `Drain flow (${du.water.label}/month)`],
        ['load', `Load (${du.load.label}/month)`],
      ],
      0,
    ),
    spacing: 16,
  };
}
