/**
 * Vega-Lite charts of a fit: observed against simulated drain flow (hydrograph, scatter with the
 * 1:1 line, flow-duration curves, cumulative volume) and water-table depth. Pure: series in,
 * plain JSON specs out, same look as the run charts.
 */
import type { TopLevelSpec } from 'vega-lite';
import { CONFIG, CHART_WIDTH, PALETTE, VEGA_LITE_SCHEMA, roundTo } from './chartTheme.js';
import { temporalX } from './chartSeries.js';

/** What the fit charts and the fit report show; SI units, days aligned with `dates`. */
export interface FitSeries {
  fieldName: string;
  dates: string[];
  /** 'calibration', 'validation' or '' (not compared) for each day. */
  period: string[];
  observedFlowMm?: Float64Array;
  simulatedFlowMm: Float64Array;
  observedWaterTableM?: Float64Array;
  simulatedWaterTableM: Float64Array;
}

export const FIT_CHART_CAPTIONS: Readonly<Record<string, string>> = {
  'fit-hydrograph':
    'Observed and simulated daily drain flow over the compared days; the shaded band is the ' +
    'validation period.',
  'fit-scatter':
    'Simulated against observed daily drain flow; points on the dashed 1:1 line are exact, ' +
    'points below it are days the model underestimates.',
  'fit-duration':
    'Flow-duration curves: the share of compared days on which each flow is equalled or ' +
    'exceeded, observed and simulated (symmetric log scale). The low end shows recessions and ' +
    'dry spells, the high end peaks and the pipe capacity.',
  'fit-water-table':
    'Observed (points) and simulated (line) water-table depth midway between drains. Higher on ' +
    'the chart is closer to the surface.',
  'fit-cumulative':
    'Observed and simulated drain flow added up over the days with a flow observation: the ' +
    'gap at the end is the volume error.',
};

const SERIES_COLOUR = {
  field: 'series',
  type: 'nominal' as const,
  title: null,
  scale: { domain: ['observed', 'simulated'], range: ['#2e2e2e', PALETTE[1]] },
};

function ticksFor(n: number) {
  const years = n / 365.25;
  return years <= 3
    ? { format: '%b %Y', ticks: { interval: 'month' as const, step: years <= 1.5 ? 2 : 4 } }
    : {
        format: '%Y',
        ticks: { interval: 'year' as const, step: Math.max(1, Math.ceil(years / 12)) },
      };
}

/** Indices of the compared days (calibration or validation). */
function compared(s: FitSeries): number[] {
  const out: number[] = [];
  for (let i = 0; i < s.dates.length; i++) if (s.period[i]) out.push(i);
  return out;
}

/** The validation period as one shaded band (first and last validation day), if any. */
function validationBand(s: FitSeries) {
  const first = s.period.indexOf('validation');
  if (first < 0) return [];
  const last = s.period.lastIndexOf('validation');
  return [
    {
      data: { values: [{ from: s.dates[first], to: s.dates[last] }] },
      mark: { type: 'rect' as const, color: '#eef3f6' },
      encoding: {
        x: { field: 'from', type: 'temporal' as const, scale: { type: 'utc' as const } },
        x2: { field: 'to' },
      },
    },
  ];
}

/**
 * Daily observed and simulated drain flow over the compared days.
 * @example fitHydrograph(series).layer.length // 2 or 3
 */
export function fitHydrograph(s: FitSeries): TopLevelSpec {
  const idx = compared(s);
  const values: Array<Record<string, string | number>> = [];
  for (const i of idx) {
    const o = s.observedFlowMm?.[i];
    if (o !== undefined && Number.isFinite(o))
      values.push({ date: s.dates[i], series: 'observed', flow: roundTo(o, 3) });
    values.push({ date: s.dates[i], series: 'simulated', flow: roundTo(s.simulatedFlowMm[i], 3) });
  }
  const { format, ticks } = ticksFor(idx.length);
  return overDays(s, 'Drain flow, observed and simulated', [
    {
      data: { values },
      mark: { type: 'line', strokeWidth: 1.1 },
      encoding: {
        x: temporalX(format, 'Date', ticks),
        y: { field: 'flow', type: 'quantitative', title: 'Drain flow (mm/d)' },
        color: SERIES_COLOUR,
      },
    },
  ]);
}

/** One line per series (observed, simulated) from inline values. */
function lines(
  s: FitSeries,
  text: string,
  height: number,
  values: object[],
  encoding: object,
): TopLevelSpec {
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: { text, subtitle: s.fieldName },
    width: CHART_WIDTH,
    height,
    config: CONFIG,
    data: { values },
    mark: { type: 'line' },
    encoding,
  } as TopLevelSpec;
}

/** A daily chart of the fit: title, shared look, the validation band under the layers. */
function overDays(s: FitSeries, text: string, layers: object[]): TopLevelSpec {
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: { text, subtitle: s.fieldName },
    width: CHART_WIDTH,
    height: 260,
    config: CONFIG,
    layer: [...validationBand(s), ...layers],
  } as TopLevelSpec;
}

/**
 * Simulated against observed daily flow with the 1:1 line, coloured by period.
 * @example fitScatter(series).layer.length // 2
 */
export function fitScatter(s: FitSeries): TopLevelSpec {
  const values: Array<Record<string, string | number>> = [];
  let top = 0;
  for (const i of compared(s)) {
    const o = s.observedFlowMm![i];
    if (!Number.isFinite(o)) continue;
    const m = s.simulatedFlowMm[i];
    top = Math.max(top, o, m);
    values.push({ observed: roundTo(o, 3), simulated: roundTo(m, 3), period: s.period[i] });
  }
  const axis = (field: string, title: string) => ({
    field,
    type: 'quantitative' as const,
    title,
    scale: { domain: [0, roundTo(top, 3)] },
  });
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: { text: 'Simulated against observed daily drain flow', subtitle: s.fieldName },
    width: 380,
    height: 380,
    config: CONFIG,
    layer: [
      {
        data: { values },
        mark: { type: 'point', size: 14, opacity: 0.55 },
        encoding: {
          x: axis('observed', 'Observed (mm/d)'),
          y: axis('simulated', 'Simulated (mm/d)'),
          color: {
            field: 'period',
            type: 'nominal',
            title: 'Period',
            scale: { domain: ['calibration', 'validation'], range: [PALETTE[0], PALETTE[1]] },
          },
        },
      },
      {
        data: { values: [{ a: 0 }, { a: roundTo(top, 3) }] },
        mark: { type: 'line', color: '#707070', strokeDash: [5, 4], strokeWidth: 1.2 },
        encoding: {
          x: { field: 'a', type: 'quantitative' },
          y: { field: 'a', type: 'quantitative' },
        },
      },
    ],
  };
}

/**
 * Flow-duration curves of observed and simulated flow on the days with a flow observation
 * (Weibull plotting position i / (n + 1)), thinned to about 200 points each.
 * @example fitDuration(series).mark // 'line'
 */
export function fitDuration(s: FitSeries): TopLevelSpec {
  const o: number[] = [];
  const m: number[] = [];
  for (const i of compared(s)) {
    const x = s.observedFlowMm![i];
    if (!Number.isFinite(x)) continue;
    o.push(x);
    m.push(s.simulatedFlowMm[i]);
  }
  const values: Array<Record<string, string | number>> = [];
  for (const [series, xs] of [
    ['observed', o],
    ['simulated', m],
  ] as const) {
    const sorted = [...xs].sort((a, b) => b - a);
    const n = sorted.length;
    const step = Math.max(1, Math.floor(n / 200));
    for (let i = 0; i < n; i++) {
      if (i % step !== 0 && i !== n - 1) continue;
      values.push({
        series,
        exceeded: roundTo((100 * (i + 1)) / (n + 1), 2),
        flow: roundTo(sorted[i], 4),
      });
    }
  }
  return lines(s, 'Flow-duration curves', 260, values, {
    x: {
      field: 'exceeded',
      type: 'quantitative',
      title: 'Days on which the flow is equalled or exceeded (%)',
      scale: { domain: [0, 100] },
    },
    y: {
      field: 'flow',
      type: 'quantitative',
      title: 'Drain flow (mm/d)',
      scale: { type: 'symlog', constant: 0.1 },
    },
    color: SERIES_COLOUR,
  });
}

/**
 * Observed (points) and simulated (line) water-table depth over the compared days.
 * @example fitWaterTable(series).layer.length // 2 or 3
 */
export function fitWaterTable(s: FitSeries): TopLevelSpec {
  const idx = compared(s);
  const sim = idx.map((i) => ({
    date: s.dates[i],
    series: 'simulated',
    depth: roundTo(s.simulatedWaterTableM[i], 3),
  }));
  const obs = s.observedWaterTableM
    ? idx
        .filter((i) => Number.isFinite(s.observedWaterTableM![i]))
        .map((i) => ({
          date: s.dates[i],
          series: 'observed',
          depth: roundTo(s.observedWaterTableM![i], 3),
        }))
    : [];
  const { format, ticks } = ticksFor(idx.length);
  const x = temporalX(format, 'Date', ticks);
  const y = {
    field: 'depth',
    type: 'quantitative' as const,
    title: 'Depth below surface (m)',
    scale: { reverse: true, zero: true },
  };
  return overDays(s, 'Water-table depth midway between drains', [
    { data: { values: sim }, mark: { type: 'line' }, encoding: { x, y, color: SERIES_COLOUR } },
    {
      data: { values: obs },
      mark: { type: 'point', size: 12, filled: true },
      encoding: { x, y, color: SERIES_COLOUR },
    },
  ]);
}

/**
 * Observed and simulated flow added up over the days with a flow observation (weekly points).
 * @example fitCumulative(series).mark // 'line'
 */
export function fitCumulative(s: FitSeries): TopLevelSpec {
  const idx = compared(s).filter((i) => Number.isFinite(s.observedFlowMm![i]));
  const values: Array<Record<string, string | number>> = [];
  let o = 0;
  let m = 0;
  idx.forEach((i, k) => {
    o += s.observedFlowMm![i];
    m += s.simulatedFlowMm[i];
    if (k % 7 === 0 || k === idx.length - 1) {
      values.push({ date: s.dates[i], series: 'observed', volume: roundTo(o, 2) });
      values.push({ date: s.dates[i], series: 'simulated', volume: roundTo(m, 2) });
    }
  });
  const { format, ticks } = ticksFor(idx.length);
  return lines(s, 'Cumulative drain flow on the observed days', 240, values, {
    x: temporalX(format, 'Date', ticks),
    y: { field: 'volume', type: 'quantitative', title: 'Flow to date (mm)' },
    color: SERIES_COLOUR,
  });
}

/**
 * Every chart that the observations support: flow charts need flow observations; the
 * water-table chart is always drawn (points only where wells were read).
 * @example Object.keys(buildFitChartSpecs(series)) // ['fit-hydrograph', ...]
 */
export function buildFitChartSpecs(s: FitSeries): Record<string, TopLevelSpec> {
  const specs: Record<string, TopLevelSpec> = {};
  if (s.observedFlowMm) {
    specs['fit-hydrograph'] = fitHydrograph(s);
    specs['fit-scatter'] = fitScatter(s);
    specs['fit-duration'] = fitDuration(s);
    specs['fit-cumulative'] = fitCumulative(s);
  }
  specs['fit-water-table'] = fitWaterTable(s);
  return specs;
}
