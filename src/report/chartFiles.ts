/**
 * The chart files of an output folder: each Vega-Lite spec as `.vl.json`, and on request drawn
 * to `.svg` by vega and rasterised to `.png` by resvg. Drawing and writing are apart: every chart
 * is drawn first (in this thread, or on a chart thread of chartThreads.ts, which loads this
 * module and the renderers only), then the files are written, by this thread alone. So a failing chart
 * writes nothing, and no drawing is still under way once writeCharts has returned or thrown.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { PNG_SCALE, renderSvg, svgToPngAsync } from './renderChart.js';

/** One chart drawn: its SVG document and its PNG bytes. */
export interface DrawnChart {
  name: string;
  svg: string;
  png: Uint8Array;
}

/** Draws named specs at a PNG scale (PNG pixels per SVG pixel), in the order given. */
export type ChartDrawer = (
  specs: Record<string, object>,
  pngScale: number,
) => Promise<DrawnChart[]>;

/** Chart names double as file stems: keep them to safe characters. */
const SAFE_NAME = /^[a-z0-9][a-z0-9-]*$/;

/**
 * Draw every chart in this thread: SVGs one after another (vega is single-threaded), PNGs in
 * parallel on resvg's worker pool. Every PNG has settled before this resolves or rejects.
 *
 * @example await drawCharts({ tradeoff: spec }, PNG_SCALE) // [{ name: 'tradeoff', svg, png }]
 */
export async function drawCharts(
  specs: Record<string, object>,
  pngScale: number,
): Promise<DrawnChart[]> {
  const svgs: string[] = [];
  const pngs: Array<Promise<Uint8Array>> = [];
  let failure: { reason: unknown } | undefined;
  for (const spec of Object.values(specs)) {
    try {
      const svg = await renderSvg(spec);
      svgs.push(svg);
      pngs.push(svgToPngAsync(svg, pngScale));
    } catch (reason) {
      failure = { reason };
      break;
    }
  }
  const settled = await Promise.allSettled(pngs);
  if (failure) throw failure.reason;
  const names = Object.keys(specs);
  return settled.map((r, k) => {
    if (r.status === 'rejected') throw r.reason;
    return { name: names[k], svg: svgs[k], png: r.value };
  });
}

/** How `writeCharts` writes: images or specs only, the PNG scale, the drawer. */
export interface ChartFileOptions {
  /**
   * Draw each chart to SVG and PNG beside its spec (default true). Without images only the
   * `.vl.json` specs are written and vega is never loaded: drawing is most of a short run's
   * time, and the HTML reports draw the specs themselves.
   */
  images?: boolean | undefined;
  /** PNG pixels per SVG pixel (default PNG_SCALE). */
  pngScale?: number;
  /** Draws the charts (default: in this thread, `drawCharts`). */
  draw?: ChartDrawer | undefined;
}

/**
 * Write every chart into `<dir>/charts/` as `<name>.vl.json` (the spec) and, unless
 * `opts.images` is false, `<name>.svg` and `<name>.png`, creating the folder. With images, all
 * charts are drawn before any file is written. Returns the paths written, in order.
 *
 * @example await writeCharts(tmpDir, buildChartSpecs(data)) // ['<tmp>/charts/water-table.vl.json', ...]
 */
export async function writeCharts(
  dir: string,
  specs: Record<string, object>,
  opts: ChartFileOptions = {},
): Promise<string[]> {
  for (const name of Object.keys(specs)) {
    if (!SAFE_NAME.test(name)) throw new Error(`chart name "${name}" is not a safe file stem`);
  }
  let drawn: Map<string, DrawnChart> | undefined;
  if (opts.images !== false) {
    const charts = await (opts.draw ?? drawCharts)(specs, opts.pngScale ?? PNG_SCALE);
    drawn = new Map(charts.map((c) => [c.name, c]));
  }
  const out = join(dir, 'charts');
  mkdirSync(out, { recursive: true });
  const written: string[] = [];
  for (const name of Object.keys(specs)) {
    const base = join(out, name);
    writeFileSync(`${base}.vl.json`, JSON.stringify(specs[name], null, 2) + '\n');
    written.push(`${base}.vl.json`);
    if (drawn === undefined) continue;
    const chart = drawn.get(name);
    if (chart === undefined) throw new Error(`chart "${name}" was not drawn`);
    writeFileSync(`${base}.svg`, chart.svg);
    writeFileSync(`${base}.png`, chart.png);
    written.push(`${base}.svg`, `${base}.png`);
  }
  return written;
}
