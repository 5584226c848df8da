/** The water table of the chosen year under its precipitation, with the fieldwork windows shaded and the outlet level drawn. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import {
  VEGA_LITE_SCHEMA,
  THRESHOLD_COLOUR,
  THRESHOLD_RULE,
  RAIN_COLOUR,
  WINDOW_FILL,
  WIDTH,
  CONFIG,
  roundTo,
} from '../chartTheme.js';
import {
  scenarioNames,
  scenarioColour,
  dailySeries,
  yearRange,
  nextDay,
  windowBands,
  temporalX,
} from '../chartSeries.js';

/**
 * Water-table depth midway between the drains through `data.chartYear`, one line per scenario,
 * with the outlet level in force (dashed) and the wet threshold (dotted); depth increases
 * downward (reversed axis, surface at the top).
 *
 * @example waterTableChart(data).layer.length // 3
 */
export function waterTableChart(data: ReportData): TopLevelSpec {
  const u = displayUnits(data.units).length;
  const names = scenarioNames(data);
  const dates = data.daily.dates;
  const [i0, i1] = yearRange(dates, data.chartYear);
  const table: Array<Record<string, string | number>> = [];
  // The outlet level changes only on schedule dates: keep its change points and draw it as
  // steps, which keeps the inlined data small.
  const outlet: Array<Record<string, string | number>> = [];
  for (const name of names) {
    const s = dailySeries(data, name);
    for (let i = i0; i < i1; i++) {
      const depth = roundTo(s.waterTableDepthM[i] * u.factor, 3);
      table.push({ date: dates[i], scenario: name, depth });
      const level = s.outletDepthM[i];
      if (i === i0 || i === i1 - 1 || level !== s.outletDepthM[i - 1]) {
        outlet.push({ date: dates[i], scenario: name, depth: roundTo(level * u.factor, 3) });
      }
    }
  }
  const threshold = roundTo(data.wetThresholdM * u.factor, 3);
  const x = temporalX('%b', `Date (${data.chartYear})`, { interval: 'month', step: 1 });
  const y = {
    field: 'depth',
    type: 'quantitative' as const,
    title: `Depth below surface (${u.label})`,
    scale: { reverse: true, zero: true, nice: true },
  };
  // Which line a point belongs to, added by a constant (our own text, never user input).
  const line = (label: string) => [{ calculate: `'${label}'`, as: 'line' }];
  const dash = {
    field: 'line',
    type: 'nominal' as const,
    title: 'Line',
    scale: {
      domain: ['Water table', 'Outlet level'],
      range: [
        [1, 0],
        [7, 4],
      ],
    },
  };
  const water = displayUnits(data.units).water;
  const rain: Array<Record<string, string | number>> = [];
  for (let i = i0; i < i1; i++) {
    const p = data.daily.precipMm[i];
    if (p > 0) {
      rain.push({ date: dates[i], end: nextDay(dates[i]), precip: roundTo(p * water.factor, 3) });
    }
  }
  const xRain = { ...x, title: null, axis: { ...x.axis, labels: false, ticks: false } };
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: `Water-table depth midway between drains, ${data.chartYear}`,
      subtitle: `${data.fieldName}: wet when shallower than ${threshold} ${u.label}; grey bands: fieldwork windows`,
    },
    config: CONFIG,
    spacing: 4,
    resolve: { scale: { x: 'shared' } },
    vconcat: [
      {
        width: WIDTH,
        height: 60,
        data: { values: rain },
        mark: { type: 'bar', color: RAIN_COLOUR, clip: true },
        encoding: {
          x: xRain,
          x2: { field: 'end' },
          y: {
            field: 'precip',
            type: 'quantitative',
            title: [`Precipitation`, `(${water.label}/d)`],
            // Bars hang from the top, as in a hydrograph.
            scale: { reverse: true, zero: true, nice: true },
            axis: { tickCount: 3 },
          },
        },
      },
      {
        width: WIDTH,
        height: 280,
        layer: [
          {
            data: { values: windowBands(data, data.chartYear) },
            mark: { type: 'rect', color: WINDOW_FILL, opacity: 0.14 },
            encoding: { x: { ...x, field: 'start' }, x2: { field: 'end' } },
          },
          {
            data: { values: windowBands(data, data.chartYear) },
            mark: { type: 'text', align: 'left', baseline: 'top', dx: 3, dy: 3, fontSize: 10 },
            encoding: {
              x: { ...x, field: 'start' },
              y: { value: 0 },
              text: { field: 'window' },
              color: { value: '#4a4a4a' },
            },
          },
          {
            data: { values: table },
            transform: line('Water table'),
            mark: { type: 'line', clip: true },
            encoding: { x, y, color: scenarioColour(names), strokeDash: dash },
          },
          {
            data: { values: outlet },
            transform: line('Outlet level'),
            mark: { type: 'line', interpolate: 'step-after', clip: true, strokeWidth: 1.4 },
            encoding: { x, y, color: scenarioColour(names), strokeDash: dash },
          },
          {
            data: { values: [{}] },
            mark: THRESHOLD_RULE,
            encoding: { y: { datum: threshold, type: 'quantitative' } },
          },
          {
            data: { values: [{}] },
            mark: {
              type: 'text',
              align: 'right',
              baseline: 'bottom',
              dx: -4,
              dy: -4,
              fontSize: 10,
            },
            encoding: {
              x: { value: WIDTH },
              y: { datum: threshold, type: 'quantitative' },
              text: { value: `Wet threshold ${threshold} ${u.label}` },
              color: { value: THRESHOLD_COLOUR },
            },
          },
        ],
      },
    ],
  } as TopLevelSpec;
}
