/**
 * The report stage: chart specs, their SVG and PNG renderings, and the offline HTML report,
 * plus the writers that put them into a run's output folder (`charts/`, `report.html`).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { buildReportHtml } from './html.js';
import { PNG_SCALE, renderSvg, svgToPngAsync } from './renderChart.js';
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
// SVG and PNG renderings of a spec
export {
  renderSvg,
  svgToPng,
  svgToPngAsync,
  rasterize,
  fontOptions,
  PNG_SCALE,
} from './renderChart.js';

/** Chart names double as file stems: keep them to safe characters. */
const SAFE_NAME = /^[a-z0-9][a-z0-9-]*$/;

/**
 * Write every chart into `<dir>/charts/` as `<name>.vl.json` (the spec), `<name>.svg` and
 * `<name>.png` (at `opts.pngScale` PNG pixels per SVG pixel, default PNG_SCALE), creating the
 * folder. SVGs are drawn one after another (vega is single-threaded);
 * PNGs rasterise in parallel on resvg's worker pool. Returns the paths written, in order.
 *
 * @example await writeCharts(tmpDir, buildChartSpecs(data)) // ['<tmp>/charts/water-table.vl.json', ...]
 */
export async function writeCharts(
  dir: string,
  specs: Record<string, object>,
  opts: { pngScale?: number } = {},
): Promise<string[]> {
  const out = join(dir, 'charts');
  mkdirSync(out, { recursive: true });
  const written: string[] = [];
  const pngs: Array<Promise<void>> = [];
  // Every PNG has landed or failed before this returns or throws: none may still be on its way
  // when the caller removes a half-written folder.
  const settled = () => Promise.allSettled(pngs);
  try {
    for (const [name, spec] of Object.entries(specs)) {
      if (!SAFE_NAME.test(name)) throw new Error(`chart name "${name}" is not a safe file stem`);
      const base = join(out, name);
      writeFileSync(`${base}.vl.json`, JSON.stringify(spec, null, 2) + '\n');
      const svg = await renderSvg(spec);
      writeFileSync(`${base}.svg`, svg);
      pngs.push(
        svgToPngAsync(svg, opts.pngScale ?? PNG_SCALE).then((png) =>
          writeFileSync(`${base}.png`, png),
        ),
      );
      written.push(`${base}.vl.json`, `${base}.svg`, `${base}.png`);
    }
  } catch (err) {
    await settled();
    throw err;
  }
  const failed = (await settled()).find((r) => r.status === 'rejected');
  if (failed) throw failed.reason;
  return written;
}

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
