/**
 * The browser-safe core of tileflux: units, climate forcing, drain design equations, the daily
 * engine, nitrate models, scenario runs and comparison, and the Vega-Lite chart specs. Nothing
 * here imports Node, so it runs in a browser, a worker thread or a notebook kernel.
 */
export * from './errors.js';
export * from './version.js';
export * from './units/quantity.js';
export * from './units/zodQuantity.js';
export * from './climate/index.js';
export * from './drainage/index.js';
export * from './engine/types.js';
export * from './engine/crops.js';
export * from './engine/cropCalendar.js';
export * from './engine/outletSchedule.js';
export * from './engine/porosityProfile.js';
export * from './engine/simulate.js';
export * from './nitrate/index.js';
export * from './scenarios/types.js';
export * from './scenarios/fieldSchema.js';
export * from './scenarios/resolve.js';
export * from './scenarios/annual.js';
export * from './scenarios/run.js';
export {
  prepareField,
  runDesign,
  type PreparedField,
  type DesignSpec,
  type DesignRun,
} from './scenarios/prepared.js';
export * from './scenarios/compare.js';
export * from './scenarios/starter.js';
export * from './scenarios/sweepSchema.js';
export * from './scenarios/sweep.js';
export * from './scenarios/sweepClimates.js';
export * from './scenarios/economics.js';
export * from './scenarios/sampling.js';
export * from './scenarios/frontier.js';
export * from './report/charts.js';
export { CHART_WIDTH, CONFIG, PALETTE, VEGA_LITE_SCHEMA, roundTo } from './report/chartTheme.js';
export { temporalX } from './report/chartSeries.js';
export * from './report/types.js';
export { fixed, signed } from './report/format.js';
