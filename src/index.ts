/**
 * tileflux as a Node library: the browser-safe core plus the file readers and writers (weather
 * CSV, field YAML, run folders) and the chart rendering and HTML report.
 */
export * from './core.js';
export * from './io/weather.js';
export * from './io/field.js';
export * from './io/tables.js';
export * from './io/runFolder.js';
export { writeRunFolder } from './report/writeRun.js';
export { sweepClimatesParallel, sweepParallel, type ParallelOptions } from './io/sweepPool.js';
export {
  buildStudyChartSpecs,
  buildSweepChartSpecs,
  climatesChart,
  CLIMATES_CAPTION,
  type StudyCharts,
  SWEEP_CHART_NAMES,
  SWEEP_CHART_CAPTIONS,
} from './report/sweepCharts.js';
export { buildSweepReportHtml } from './report/sweepReport.js';
export {
  writeCharts,
  writeReport,
  buildReportHtml,
  renderSvg,
  svgToPng,
  loadVegaBundles,
} from './report/index.js';
