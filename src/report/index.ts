/**
 * The report stage: chart specs, their SVG and PNG renderings, and the offline HTML report,
 * plus the writers that put them into a run's output folder (`charts/`, `report.html`).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { buildReportHtml } from './html.js';
import type { ReportData } from './types.js';

// Chart specs of a run, by name (core.ts also lists the builder of each chart)
export { buildChartSpecs, CHART_NAMES, type ChartName, CHART_CAPTIONS } from './charts.js';
// The report's data, its units and numbers, its summary lines
export type { ScenarioDailySeries, ReportData } from './types.js';
export { displayUnits, type DisplayUnit, type DisplayUnits } from './units.js';
export { fixed, signed } from './format.js';
export { cropConditionLines, headlineLines } from './summary.js';
// The HTML report, and the vega bundles it embeds
export { buildReportHtml, escapeHtml, jsonForScript, BALANCE_TOLERANCE } from './html.js';
export { loadVegaBundles, type VegaBundles } from './vegaBundles.js';
// The chart files of a folder, drawn in this thread or on a worker thread
export {
  writeCharts,
  drawCharts,
  type ChartDrawer,
  type ChartFileOptions,
  type DrawnChart,
} from './chartFiles.js';
export { startChartThreads, type ChartThreads } from './chartThreads.js';
// SVG and PNG renderings of a spec
export {
  renderSvg,
  svgToPng,
  svgToPngAsync,
  rasterize,
  fontOptions,
  PNG_SCALE,
} from './renderChart.js';

/**
 * Write the HTML report to `<dir>/report.html` and return its path.
 *
 * @example writeReport(tmpDir, data, specs) // '<tmp>/report.html'
 */
export function writeReport(dir: string, data: ReportData, specs: Record<string, object>): string {
  mkdirSync(dir, { recursive: true });
  const path = join(dir, 'report.html');
  writeFileSync(path, buildReportHtml(data, specs));
  return path;
}
