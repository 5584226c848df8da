/** Nitrate-N concentration by month. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import { VEGA_LITE_SCHEMA, MONTHS, WIDTH, CONFIG, roundTo } from '../chartTheme.js';
import { scenarioNames, scenarioColour, monthlySums } from '../chartSeries.js';

/**
 * Flow-weighted nitrate-N concentration of drain water by calendar month over the period:
 * C = 100 x sum(load) / sum(flow) (load in kg/ha, flow in mm, C in mg/L). Months without
 * drain flow have no point.
 *
 * @example concentrationChart(data).layer.length // 2
 */
export function concentrationChart(data: ReportData): TopLevelSpec {
  const du = displayUnits(data.units);
  const names = scenarioNames(data);
  const values: Array<Record<string, string | number>> = [];
  for (const name of names) {
    const { flow, load } = monthlySums(data, name);
    for (let m = 0; m < 12; m++) {
      if (!(flow[m] > 1e-9)) continue;
      values.push({
        month: MONTHS[m],
        scenario: name,
        conc: roundTo((100 * load[m]) / flow[m], 3),
      });
    }
  }
  const x = {
    field: 'month',
    type: 'ordinal' as const,
    title: 'Month',
    sort: MONTHS,
    axis: { labelAngle: 0 },
  };
  const y = {
    field: 'conc',
    type: 'quantitative' as const,
    title: `Nitrate-N concentration (${du.conc.label})`,
    scale: { zero: true },
  };
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Flow-weighted nitrate-N concentration through the year',
      subtitle: `${data.fieldName}: drain water, ${data.period.from} to ${data.period.to}`,
    },
    width: WIDTH,
    height: 240,
    config: CONFIG,
    data: { values },
    layer: [
      { mark: { type: 'line' }, encoding: { x, y, color: scenarioColour(names) } },
      { mark: { type: 'point' }, encoding: { x, y, color: scenarioColour(names) } },
    ],
  };
}
