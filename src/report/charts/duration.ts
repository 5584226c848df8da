/** Growing-season water-table duration curve. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import { inWindow } from '../../scenarios/annual.js';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import { VEGA_LITE_SCHEMA, THRESHOLD_RULE, WIDTH, CONFIG, roundTo } from '../chartTheme.js';
import { scenarioNames, scenarioColour, dailySeries } from '../chartSeries.js';

/** Points of a duration curve: at most this many per scenario (plus the deepest day). */
const DURATION_POINTS = 200;
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
  const dates = data.daily.dates;
  const season = data.measures.growingSeason;
  const inSeason: number[] = [];
  for (let i = 0; i < dates.length; i++)
    if (inWindow(dates[i].slice(5, 10), season)) inSeason.push(i);
  const n = inSeason.length;
  const values: Array<Record<string, string | number>> = [];
  for (const name of names) {
    const wt = dailySeries(data, name).waterTableDepthM;
    const sorted = Float64Array.from(inSeason, (i) => wt[i]).sort();
    let last = -1;
    for (let k = 1; k <= DURATION_POINTS && n > 0; k++) {
      let idx = Math.ceil((k / DURATION_POINTS) * n) - 1;
      while (idx + 1 < n && sorted[idx + 1] === sorted[idx]) idx++;
      if (idx === last) continue;
      last = idx;
      values.push({
        scenario: name,
        depth: roundTo(sorted[idx] * u.factor, 4),
        share: roundTo((100 * (idx + 1)) / n, 3),
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
