/** Daily drain-flow hydrograph of the chosen year. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import { VEGA_LITE_SCHEMA, WIDTH, CONFIG, roundTo } from '../chartTheme.js';
import {
  scenarioNames,
  scenarioColour,
  dailySeries,
  yearRange,
  temporalX,
} from '../chartSeries.js';

/**
 * Daily drain flow through `data.chartYear`, one line per scenario.
 *
 * @example hydrographChart(data).mark // { type: 'line', ... }
 */
export function hydrographChart(data: ReportData): TopLevelSpec {
  const water = displayUnits(data.units).water;
  const names = scenarioNames(data);
  const dates = data.daily.dates;
  const [i0, i1] = yearRange(dates, data.chartYear);
  const values: Array<Record<string, string | number>> = [];
  for (const name of names) {
    const q = dailySeries(data, name).drainflowMm;
    for (let i = i0; i < i1; i++) {
      values.push({ date: dates[i], scenario: name, flow: roundTo(q[i] * water.factor, 4) });
    }
  }
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: `Daily drain flow, ${data.chartYear}`,
      subtitle: `${data.fieldName}: depth of water per day over the drained area`,
    },
    width: WIDTH,
    height: 240,
    config: CONFIG,
    data: { values },
    mark: { type: 'line', strokeWidth: 1.4 },
    encoding: {
      x: temporalX('%b', `Date (${data.chartYear})`, { interval: 'month', step: 1 }),
      y: {
        field: 'flow',
        type: 'quantitative',
        title: `Drain flow (${water.label}/d)`,
        scale: { zero: true },
      },
      color: scenarioColour(names),
    },
  };
}
