/** Growing-season water-table duration curve. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import { VEGA_LITE_SCHEMA, THRESHOLD_RULE, WIDTH, CONFIG, roundTo } from '../chartTheme.js';
import { scenarioNames, scenarioColour, periodSeries } from '../chartSeries.js';

/**
 * Water-table duration curve over the growing-season days of every year: for each scenario,
 * points (depth d, share of those days with the water table at depth d or shallower, %), an
 * empirical distribution thinned to about 200 points. Each point sits at the last of equal
 * depths, so its share is exactly the count of days no deeper than it.
 *
 * @example durationChart(data).layer.length // 2
 */
export function durationChart(data: ReportData): TopLevelSpec {
  const u = displayUnits(data.units).length;
  const names = scenarioNames(data);
  const season = data.measures.growingSeason;
  const values: Array<Record<string, string | number>> = [];
  for (const name of names) {
    const d = periodSeries(data, name).duration;
    for (let j = 0; j < d.depthM.length; j++) {
      values.push({
        scenario: name,
        depth: roundTo(d.depthM[j] * u.factor, 4),
        share: roundTo((100 * d.days[j]) / d.seasonDays, 3),
      });
    }
  }
  const threshold = roundTo(data.wetThresholdM * u.factor, 3);
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'How often the water table stands high in the growing season',
      subtitle:
        `${data.fieldName}: growing season ${season.from} to ${season.to}, ` +
        `${data.period.from} to ${data.period.to}`,
    },
    width: WIDTH,
    height: 260,
    config: CONFIG,
    layer: [
      {
        data: { values },
        mark: { type: 'line', interpolate: 'step-after' },
        encoding: {
          x: {
            field: 'depth',
            type: 'quantitative',
            title: `Water-table depth below surface (${u.label})`,
            scale: { zero: true, nice: true },
          },
          y: {
            field: 'share',
            type: 'quantitative',
            title: ['Share of growing-season days', 'at this depth or shallower (%)'],
            scale: { domain: [0, 100] },
          },
          color: scenarioColour(names),
        },
      },
      {
        data: { values: [{}] },
        mark: THRESHOLD_RULE,
        encoding: { x: { datum: threshold, type: 'quantitative' } },
      },
    ],
  };
}
