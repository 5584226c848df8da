/**
 * Vega-Lite chart specs of a scenario comparison. Pure: report data in, plain JSON specs out
 * (data inlined as `values`), so a spec can be written to disk, diffed, rendered in Node or
 * embedded in the HTML report. Daily values are kept to the chosen year, cumulative series are
 * thinned, and monthly and annual figures are aggregated here, so every spec stays small.
 *
 * Colours, fonts and layout are our own; white background and dark text so that charts stay
 * readable in print.
 */
import type { TopLevelSpec } from 'vega-lite';
import { TilefluxError } from '../errors.js';
import { inWindow } from '../scenarios/annual.js';
import type { ReportData } from './types.js';
import { displayUnits } from './units.js';

/** The Vega-Lite v6 schema URL every spec declares. */
export const VEGA_LITE_SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

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

/**
 * Our own palette: eight well-separated, print-safe colours on white, dark enough for thin
 * lines. Scenarios take them in order (cycling beyond eight).
 */
export const PALETTE = [
  '#1f5f8b',
  '#d1603d',
  '#4c9a2a',
  '#7b4fa0',
  '#c79a00',
  '#3aa6a0',
  '#9c4f6e',
  '#2e2e2e',
];
const THRESHOLD_COLOUR = '#8c1c13';
/** Precipitation bars and the fieldwork-window bands: neutral, so scenario colours stay clear. */
/**
 * The dotted line of the wet threshold. The threshold is named in text (a label beside the line
 * or the figure's caption), so the line is left out of the accessibility tree, where an unnamed
 * graphic would be a barrier.
 */
const THRESHOLD_RULE = {
  type: 'rule' as const,
  color: THRESHOLD_COLOUR,
  strokeDash: [2, 3],
  strokeWidth: 1.5,
  aria: false,
};
const RAIN_COLOUR = '#6f8fa8';
const WINDOW_FILL = '#8a8a8a';
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
export const CHART_WIDTH = 640;
const WIDTH = CHART_WIDTH;

type Config = NonNullable<TopLevelSpec['config']>;

/** Shared look: DejaVu Sans first (installed with the tests; used for PNG rendering). */
export const CONFIG: Config = {
  background: 'white',
  font: 'DejaVu Sans, Verdana, Arial, sans-serif',
  padding: 10,
  title: {
    fontSize: 15,
    fontWeight: 'bold',
    anchor: 'start',
    color: '#1a1a1a',
    subtitleFontSize: 11,
    subtitleColor: '#4a4a4a',
    offset: 10,
  },
  axis: {
    labelFontSize: 11,
    titleFontSize: 12,
    titleFontWeight: 'normal',
    labelColor: '#333333',
    titleColor: '#1a1a1a',
    gridColor: '#e2e2e2',
    domainColor: '#707070',
    tickColor: '#707070',
  },
  legend: { labelFontSize: 11, titleFontSize: 12, titleFontWeight: 'normal', orient: 'right' },
  header: { labelFontSize: 12, titleFontSize: 12 },
  view: { stroke: null },
  line: { strokeWidth: 1.8 },
  point: { size: 40, filled: true },
};

/** Round to a fixed number of decimals, keeping the inlined data short and deterministic. */
export function roundTo(x: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(x * f) / f;
}

function scenarioNames(data: ReportData): string[] {
  return data.scenarios.map((s) => s.name);
}

/** Scenario colour encoding: a fixed colour per scenario, in the order they were given. */
function scenarioColour(names: string[], legend = true) {
  return {
    field: 'scenario',
    type: 'nominal' as const,
    title: 'Scenario',
    sort: names,
    scale: { domain: names, range: names.map((_, i) => PALETTE[i % PALETTE.length]) },
    ...(legend ? {} : { legend: null }),
  };
}

function dailySeries(data: ReportData, name: string) {
  const s = data.daily.series.find((x) => x.scenario === name);
  if (!s) throw new Error(`report data has no daily series for scenario "${name}"`);
  return s;
}

/** First and one-past-last index of a calendar year in the ISO dates. */
function yearRange(dates: readonly string[], year: number): [number, number] {
  const prefix = `${String(year).padStart(4, '0')}-`;
  let i0 = -1;
  let i1 = -1;
  for (let i = 0; i < dates.length; i++) {
    if (dates[i].startsWith(prefix)) {
      if (i0 < 0) i0 = i;
      i1 = i + 1;
    }
  }
  if (i0 < 0) {
    throw new TilefluxError(
      `chart year ${year} is outside the weather period ` +
        `(${dates[0] ?? '?'} to ${dates[dates.length - 1] ?? '?'}); choose a year inside it`,
      '--year',
    );
  }
  return [i0, i1];
}

/** Month index 0-11 of an ISO date. */
function monthOf(iso: string): number {
  return (iso.charCodeAt(5) - 48) * 10 + (iso.charCodeAt(6) - 48) - 1;
}

/** The ISO date one day after `iso` (UTC). */
function nextDay(iso: string): string {
  const t = Date.parse(`${iso}T00:00:00Z`) + 86_400_000;
  return new Date(t).toISOString().slice(0, 10);
}

/**
 * The fieldwork windows of `year` as bands from the first day to the end of the last day; a
 * window that wraps past the new year gives two bands inside the year.
 */
function windowBands(data: ReportData, year: number): Array<Record<string, string>> {
  const y = String(year).padStart(4, '0');
  const bands: Array<Record<string, string>> = [];
  const windows: Array<[string, { from: string; to: string }]> = [
    ['Spring fieldwork', data.measures.springWindow],
    ['Fall fieldwork', data.measures.fallWindow],
  ];
  for (const [label, w] of windows) {
    const parts: Array<[string, string]> =
      w.from <= w.to
        ? [[w.from, w.to]]
        : [
            ['01-01', w.to],
            [w.from, '12-31'],
          ];
    for (const [a, b] of parts) {
      bands.push({ start: `${y}-${a}`, end: nextDay(`${y}-${b}`), window: label });
    }
  }
  return bands;
}

export function temporalX(
  format: string,
  title: string | null,
  tickCount: { interval: 'month' | 'year'; step: number },
) {
  return {
    field: 'date',
    type: 'temporal' as const,
    title,
    // UTC keeps dates on their day whatever the time zone of the machine drawing the chart.
    scale: { type: 'utc' as const },
    axis: { format, tickCount, labelOverlap: true },
  };
}

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
  const dates = data.daily.dates;
  const n = dates.length;
  const step = Math.max(7, Math.ceil(n / 520));
  const values: Array<Record<string, string | number>> = [];
  for (const name of names) {
    const s = dailySeries(data, name);
    let flow = 0;
    let load = 0;
    for (let i = 0; i < n; i++) {
      flow += s.drainflowMm[i];
      load += s.no3LoadKgHa[i];
      if (i % step === 0 || i === n - 1) {
        values.push({
          date: dates[i],
          scenario: name,
          flow: roundTo(flow * du.water.factor, 2),
          load: roundTo(load * du.load.factor, 3),
        });
      }
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

/** Two stacked grouped-bar panels (flow and load) over an ordinal x field. */
function groupedBars(
  names: string[],
  xField: string,
  xTitle: string,
  xSort: Array<string | number>,
  panels: Array<[field: string, title: string]>,
  labelAngle: number,
) {
  return panels.map(([field, title]) => ({
    width: WIDTH,
    height: 200,
    mark: { type: 'bar' as const },
    encoding: {
      x: {
        field: xField,
        type: 'ordinal' as const,
        title: xTitle,
        sort: xSort,
        axis: { labelAngle },
      },
      xOffset: { field: 'scenario', type: 'nominal' as const, sort: names },
      y: { field, type: 'quantitative' as const, title },
      color: scenarioColour(names),
    },
  }));
}

/**
 * Annual drain flow and nitrate-N load by scenario: grouped bars, one group per calendar year.
 *
 * @example annualChart(data).vconcat.length // 2
 */
export function annualChart(data: ReportData): TopLevelSpec {
  const du = displayUnits(data.units);
  const names = scenarioNames(data);
  const rows = data.annual
    .filter((r) => names.includes(r.scenario))
    .sort((a, b) => names.indexOf(a.scenario) - names.indexOf(b.scenario) || a.year - b.year);
  const values = rows.map((r) => ({
    year: r.year,
    scenario: r.scenario,
    flow: roundTo(r.drainflow_mm * du.water.factor, 2),
    load: roundTo(r.no3n_load_kg_ha * du.load.factor, 3),
  }));
  const years = [...new Set(rows.map((r) => r.year))].sort((a, b) => a - b);
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Annual drain flow and nitrate-N load',
      subtitle: `${data.fieldName}, ${years[0]} to ${years[years.length - 1]}`,
    },
    config: CONFIG,
    data: { values },
    vconcat: groupedBars(
      names,
      'year',
      'Year',
      years,
      [
        ['flow', `Drain flow (${du.water.label}/yr)`],
        ['load', `Nitrate-N load (${du.load.label}/yr)`],
      ],
      years.length > 12 ? -90 : 0,
    ),
    spacing: 16,
  };
}

/**
 * Sums of daily drain flow and load per calendar month for one scenario, and the number of
 * (year, month) pairs in the period for each month.
 */
function monthlySums(data: ReportData, name: string) {
  const s = dailySeries(data, name);
  const flow = new Float64Array(12);
  const load = new Float64Array(12);
  const count = new Array<number>(12).fill(0);
  const dates = data.daily.dates;
  let previous = -1;
  for (let i = 0; i < dates.length; i++) {
    const m = monthOf(dates[i]);
    flow[m] += s.drainflowMm[i];
    load[m] += s.no3LoadKgHa[i];
    // Dates are consecutive: a new (year, month) pair starts whenever the month changes.
    if (m !== previous) count[m]++;
    previous = m;
  }
  return { flow, load, count };
}

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

/**
 * Load against wetness: one labelled point per scenario at its mean annual growing-season wet
 * days and mean annual nitrate-N load (from the comparison table).
 *
 * @example tradeoffChart(data).layer.length // 2
 */
export function tradeoffChart(data: ReportData): TopLevelSpec {
  const du = displayUnits(data.units);
  const names = scenarioNames(data);
  const points = names.map((name) => {
    const c = data.comparison.find((r) => r.scenario === name);
    if (!c) throw new Error(`report data has no comparison row for scenario "${name}"`);
    return {
      scenario: name,
      label: c.is_baseline ? `${name} (baseline)` : name,
      wet: roundTo(c.wet_days, 2),
      load: roundTo(c.no3n_load_kg_ha * du.load.factor, 3),
    };
  });
  // Both axes start at zero and end on a round number; the wetness axis has room on the right
  // for the labels and a minimum span so that all-dry scenarios still get a readable axis.
  const wetMax = niceCeil(Math.max(5, 1.3 * Math.max(...points.map((v) => v.wet))));
  const loadMax = niceCeil(Math.max(1, 1.1 * Math.max(...points.map((v) => v.load))));
  const values = placeLabels(points, wetMax, loadMax);
  const x = {
    field: 'wet',
    type: 'quantitative' as const,
    title: 'Wet days in the growing season (days per year)',
    scale: { domain: [0, wetMax], nice: false },
  };
  const y = {
    field: 'load',
    type: 'quantitative' as const,
    title: `Nitrate-N load (${du.load.label} per year)`,
    scale: { domain: [0, loadMax], nice: false },
  };
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Nitrate-N load against field wetness',
      subtitle: `${data.fieldName}: mean annual values, ${data.period.years} years`,
    },
    width: TRADEOFF_SIZE.width,
    height: TRADEOFF_SIZE.height,
    config: CONFIG,
    data: { values },
    layer: [
      {
        mark: { type: 'point', size: 140, filled: true, opacity: 1 },
        encoding: { x, y, color: scenarioColour(names, false) },
      },
      {
        mark: { type: 'text', align: 'center', baseline: 'middle', fontSize: LABEL_FONT },
        encoding: {
          x: { ...x, field: 'labelWet' },
          y: { ...y, field: 'labelLoad' },
          text: { field: 'label' },
          color: scenarioColour(names, false),
        },
      },
    ],
  };
}

/** Plot size of the trade-off chart, px. */
const TRADEOFF_SIZE = { width: 520, height: 320 };
const LABEL_FONT = 12;

/** The smallest of 1, 2, 2.5, 5 x 10^k at or above x (a round axis end). */
export function niceCeil(x: number): number {
  const p = 10 ** Math.floor(Math.log10(x));
  for (const m of [1, 2, 2.5, 5, 10]) if (m * p >= x * (1 - 1e-12)) return m * p;
  return 10 * p;
}

/** A label's box in plot pixels (y downward). */
interface Box {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

/**
 * Put each point's label where it overlaps no other label and no point: to the right, left,
 * above or below the point, the first that is free (right if none is). Label widths are
 * estimated at 0.62 em per character (DejaVu Sans averages about 0.6, from memory). Returns
 * the points with the label's centre in data units (labelWet, labelLoad).
 */
export function placeLabels<P extends { label: string; wet: number; load: number }>(
  points: readonly P[],
  wetMax: number,
  loadMax: number,
): Array<P & { labelWet: number; labelLoad: number }> {
  const { width, height } = TRADEOFF_SIZE;
  const px = (p: P) => ({ x: (p.wet / wetMax) * width, y: height - (p.load / loadMax) * height });
  const R = 7; // point radius, px (size 140 -> about 6.7 px)
  const pointBoxes = points.map((p) => {
    const c = px(p);
    return { x0: c.x - R, x1: c.x + R, y0: c.y - R, y1: c.y + R };
  });
  const placed: Box[] = [];
  return points.map((p) => {
    const c = px(p);
    const w = 0.62 * LABEL_FONT * p.label.length;
    const h = LABEL_FONT + 2;
    const gap = R + 4;
    const candidates = [
      { cx: c.x + gap + w / 2, cy: c.y },
      { cx: c.x - gap - w / 2, cy: c.y },
      { cx: c.x, cy: c.y - gap - h / 2 },
      { cx: c.x, cy: c.y + gap + h / 2 },
      { cx: c.x + gap + w / 2, cy: c.y - h },
      { cx: c.x + gap + w / 2, cy: c.y + h },
    ];
    const boxOf = (k: (typeof candidates)[number]): Box => ({
      x0: k.cx - w / 2,
      x1: k.cx + w / 2,
      y0: k.cy - h / 2,
      y1: k.cy + h / 2,
    });
    const free = candidates.find((k) => {
      const b = boxOf(k);
      return (
        b.x0 >= 0 &&
        b.x1 <= width &&
        b.y0 >= 0 &&
        b.y1 <= height &&
        !placed.some((o) => overlaps(b, o)) &&
        !pointBoxes.some((o) => overlaps(b, o))
      );
    });
    const best = free ?? candidates[0];
    placed.push(boxOf(best));
    return {
      ...p,
      labelWet: roundTo((best.cx / width) * wetMax, 4),
      labelLoad: roundTo(((height - best.cy) / height) * loadMax, 4),
    };
  });
}

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
