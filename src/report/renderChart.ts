/**
 * Node edge of the charts: a Vega-Lite spec compiled and drawn to SVG by vega without a
 * browser (renderer 'none', then `view.toSVG()`), and SVG rasterised to PNG by resvg with the
 * DejaVu fonts (Debian's fonts-dejavu-core, installed by test/setup.sh) so text renders the same
 * on a fresh machine. System fonts are the fallback when DejaVu is missing.
 */
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import type { ResvgRenderOptions } from '@resvg/resvg-js';
import type { TopLevelSpec } from 'vega-lite';

// vega, vega-lite and resvg take about half a second to load: they are loaded on first use, so
// that runs without charts (and importing the report module) do not pay for them.
type Vega = typeof import('vega');
type VegaLite = typeof import('vega-lite');
type ResvgModule = typeof import('@resvg/resvg-js');
let vegaModules: Promise<[Vega, VegaLite]> | undefined;
let resvgModule: ResvgModule | undefined;

function loadVega(): Promise<[Vega, VegaLite]> {
  vegaModules ??= Promise.all([import('vega'), import('vega-lite')]);
  return vegaModules;
}

function resvg(): ResvgModule {
  // resvg-js is a CommonJS package with a native binding: require it synchronously, once.
  resvgModule ??= createRequire(import.meta.url)('@resvg/resvg-js') as ResvgModule;
  return resvgModule;
}

/** Where fonts-dejavu-core puts its files on Debian and Ubuntu. */
export const DEJAVU_DIR = '/usr/share/fonts/truetype/dejavu';
const DEJAVU_FILES = ['DejaVuSans.ttf', 'DejaVuSans-Bold.ttf'];

/**
 * PNG pixels per SVG pixel. 1.5 gives about 150 dpi for a chart printed 6.5 inches wide and
 * keeps rasterising six charts well under a second; the SVGs are there for sharper print.
 */
export const PNG_SCALE = 1.5;

/**
 * Compile a Vega-Lite spec and draw it to an SVG document string, headless.
 *
 * @example await renderSvg({ mark: 'point', data: { values: [{ a: 1 }] }, encoding: { x: { field: 'a', type: 'quantitative' } } })
 * // '<svg xmlns="http://www.w3.org/2000/svg" ...'
 */
export async function renderSvg(spec: object): Promise<string> {
  // vega tags the inline data objects it ingests; work on a copy so the caller's spec stays as
  // it was (it is written to .vl.json and embedded in the report).
  const [vega, vegaLite] = await loadVega();
  const vgSpec = vegaLite.compile(structuredClone(spec) as TopLevelSpec).spec;
  const view = new vega.View(vega.parse(vgSpec), { renderer: 'none' });
  try {
    return renumberIds(await view.toSVG());
  } finally {
    view.finalize();
  }
}

/**
 * vega numbers clip paths and gradients with process-wide counters, so the same chart drawn
 * twice in one process would differ. Renumber them in order of appearance within the document
 * so that the same spec always gives the same bytes.
 */
function renumberIds(svg: string): string {
  const ids = new Map<string, string>();
  return svg.replace(/(id="|url\(#)(clip|gradient|pattern)(\d+)/g, (_m, lead, kind, n) => {
    const key = `${kind}${n}`;
    let id = ids.get(key);
    if (id === undefined) {
      id = `${kind}${ids.size + 1}`;
      ids.set(key, id);
    }
    return `${lead}${id}`;
  });
}

let fontCache: ResvgRenderOptions['font'] | undefined;

/** Font options for resvg: DejaVu files when present (fast, same everywhere), else system fonts. */
export function fontOptions(fontDir = DEJAVU_DIR): NonNullable<ResvgRenderOptions['font']> {
  if (fontDir === DEJAVU_DIR && fontCache) return fontCache;
  const files = DEJAVU_FILES.map((f) => join(fontDir, f)).filter((f) => existsSync(f));
  const font =
    files.length > 0
      ? {
          fontFiles: files,
          loadSystemFonts: false,
          defaultFontFamily: 'DejaVu Sans',
          sansSerifFamily: 'DejaVu Sans',
        }
      : { loadSystemFonts: true };
  if (fontDir === DEJAVU_DIR) fontCache = font;
  return font;
}

function resvgOptions(scale: number, fontDir?: string): ResvgRenderOptions {
  return {
    font: fontOptions(fontDir),
    background: 'white',
    fitTo: { mode: 'zoom', value: scale },
  };
}

/**
 * Rasterise an SVG to raw RGBA pixels (what `svgToPng` encodes), for checks on the image.
 *
 * @example rasterize(svg).width // 2 x the SVG width
 */
export function rasterize(
  svg: string,
  scale = PNG_SCALE,
  fontDir?: string,
): { width: number; height: number; pixels: Uint8Array } {
  const img = new (resvg().Resvg)(svg, resvgOptions(scale, fontDir)).render();
  return { width: img.width, height: img.height, pixels: new Uint8Array(img.pixels) };
}

/**
 * Rasterise an SVG to a PNG file's bytes on a white background.
 *
 * @example svgToPng(svg).subarray(1, 4) // 'PNG' in ASCII
 */
export function svgToPng(svg: string, scale = PNG_SCALE, fontDir?: string): Uint8Array {
  return new Uint8Array(new (resvg().Resvg)(svg, resvgOptions(scale, fontDir)).render().asPng());
}

/**
 * Same as `svgToPng`, off the main thread (resvg's worker pool), so several charts rasterise
 * at once.
 *
 * @example await svgToPngAsync(svg)
 */
export async function svgToPngAsync(
  svg: string,
  scale = PNG_SCALE,
  fontDir?: string,
): Promise<Uint8Array> {
  const img = await resvg().renderAsync(svg, resvgOptions(scale, fontDir));
  return new Uint8Array(img.asPng());
}
