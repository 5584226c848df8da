/**
 * The look shared by every chart: Vega-Lite schema, palette, colours of rain, windows and
 * thresholds, fonts and sizes (our own; white background and dark text so that charts stay
 * readable in print), and rounding of inlined values.
 */
import type { TopLevelSpec } from 'vega-lite';

/** The Vega-Lite v6 schema URL every spec declares. */
export const VEGA_LITE_SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';
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
export const THRESHOLD_COLOUR = '#8c1c13';
/** Precipitation bars and the fieldwork-window bands: neutral, so scenario colours stay clear. */
/**
 * The dotted line of the wet threshold. The threshold is named in text (a label beside the line
 * or the figure's caption), so the line is left out of the accessibility tree, where an unnamed
 * graphic would be a barrier.
 */
export const THRESHOLD_RULE = {
  type: 'rule' as const,
  color: THRESHOLD_COLOUR,
  strokeDash: [2, 3],
  strokeWidth: 1.5,
  aria: false,
};
export const RAIN_COLOUR = '#6f8fa8';
export const WINDOW_FILL = '#8a8a8a';
export const MONTHS = [
  'Jan',
  'Feb',
  'Mar',
  'Apr',
  'May',
  'Jun',
  'Jul',
  'Aug',
  'Sep',
  'Oct',
  'Nov',
  'Dec',
];
export const CHART_WIDTH = 640;
export const WIDTH = CHART_WIDTH;
export type Config = NonNullable<TopLevelSpec['config']>;
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
/** The charts round their inlined data with `roundTo`, keeping it short and deterministic. */
export { roundTo } from '../units/decimal.js';
