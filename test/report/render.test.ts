import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { compareScenarios } from '../../src/scenarios/compare.js';
import { annualChart, buildChartSpecs, CHART_NAMES } from '../../src/report/charts.js';
import { writeCharts } from '../../src/report/index.js';
import {
  DEJAVU_DIR,
  fontOptions,
  PNG_SCALE,
  rasterize,
  renderSvg,
  svgToPng,
} from '../../src/report/renderChart.js';
import type { ReportData } from '../../src/report/types.js';
import { makeReportData } from './fixture.mjs';

const data = makeReportData({ years: 3, compareScenarios }) as ReportData;
const specs = buildChartSpecs(data);

/** The same SVG with every text element removed: marks and axes stay, words go. */
function withoutText(svg: string): string {
  return svg.replace(/<text\b[^>]*>[\s\S]*?<\/text>/g, '');
}

/** Pixels whose RGBA differs between two equally sized rasters, overall and in a row band. */
function differingPixels(
  a: { width: number; pixels: Uint8Array },
  b: { pixels: Uint8Array },
  rows?: [number, number],
): number {
  let n = 0;
  const [r0, r1] = rows ?? [0, a.pixels.length / 4 / a.width];
  for (let p = r0 * a.width; p < r1 * a.width; p++) {
    const i = p * 4;
    if (
      a.pixels[i] !== b.pixels[i] ||
      a.pixels[i + 1] !== b.pixels[i + 1] ||
      a.pixels[i + 2] !== b.pixels[i + 2]
    ) {
      n++;
    }
  }
  return n;
}

/** Width and height from a PNG's IHDR chunk (PNG specification, ISO/IEC 15948, section 11.2.2). */
function pngSize(png: Uint8Array): [number, number] {
  const v = new DataView(png.buffer, png.byteOffset, png.byteLength);
  return [v.getUint32(16), v.getUint32(20)];
}

const svgs = new Map<string, string>();
async function svgOf(name: (typeof CHART_NAMES)[number]): Promise<string> {
  if (!svgs.has(name)) svgs.set(name, await renderSvg(specs[name]));
  return svgs.get(name)!;
}

describe('rendering charts in Node', () => {
  it('uses the DejaVu fonts installed by test/setup.sh, and falls back to system fonts', () => {
    expect(statSync(join(DEJAVU_DIR, 'DejaVuSans.ttf')).size).toBeGreaterThan(100_000);
    expect(fontOptions()).toMatchObject({
      loadSystemFonts: false,
      defaultFontFamily: 'DejaVu Sans',
    });
    expect(fontOptions('/no/such/dir')).toEqual({ loadSystemFonts: true });
  });

  for (const name of CHART_NAMES) {
    it(`${name}: SVG with marks and title, PNG non-empty with text drawn`, async () => {
      const svg = await svgOf(name);
      expect(svg.startsWith('<svg')).toBe(true);
      expect(svg).toMatch(/class="mark-(line|rect|symbol)/);
      const title = (specs[name] as { title: { text: string } }).title.text;
      expect(svg).toContain(`>${title}</text>`);

      const png = svgToPng(svg);
      // PNG signature (PNG specification, section 5.2): 89 50 4E 47 0D 0A 1A 0A.
      expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
      const svgWidth = Number(/width="(\d+)"/.exec(svg)![1]);
      const [w, h] = pngSize(png);
      expect(Math.abs(w - svgWidth * PNG_SCALE)).toBeLessThanOrEqual(1);
      expect(h).toBeGreaterThan(100);

      // Text is drawn when the picture differs from the same chart with its text removed: with
      // no usable font the two rasters would be identical. The band of the title (top 30 px of
      // the chart) must differ too, since nothing but the title is drawn there.
      const full = rasterize(svg);
      const bare = rasterize(withoutText(svg));
      expect(bare.width).toBe(full.width);
      expect(differingPixels(full, bare)).toBeGreaterThan(2000);
      expect(differingPixels(full, bare, [0, Math.round(30 * PNG_SCALE)])).toBeGreaterThan(300);
      // And not all of it: the marks themselves are still there without text.
      let inked = 0;
      for (let i = 0; i < bare.pixels.length; i += 4) if (bare.pixels[i] < 200) inked++;
      expect(inked).toBeGreaterThan(1000);
    });
  }

  it('is deterministic: the same spec gives the same SVG and PNG bytes', async () => {
    // Other charts drawn in between advance vega's internal clip-path counter.
    const a = await renderSvg(specs['water-table']);
    await renderSvg(specs.cumulative);
    const b = await renderSvg(specs['water-table']);
    expect(a).toMatch(/clip-path="url\(#clip1\)"/);
    expect(a).toBe(b);
    expect(Buffer.from(svgToPng(a)).equals(Buffer.from(svgToPng(b)))).toBe(true);
  });
});

describe('user strings in rendered charts', () => {
  it('are escaped by the SVG renderer (scenario and field names with markup)', async () => {
    const hostile = makeReportData({
      years: 2,
      names: ['conventional', '<img src=x onerror=alert(1)>', 'controlled'],
      compareScenarios,
    }) as ReportData;
    const svg = await renderSvg(
      buildChartSpecs({ ...hostile, fieldName: '<b>field</b>' }).tradeoff,
    );
    expect(svg).not.toMatch(/<img|<b>/);
    expect(svg).toContain('&lt;img src=x onerror=alert(1)&gt;');
    expect(svg).toContain('&lt;b&gt;field&lt;/b&gt;');
  });
});

describe('long records', () => {
  it('the annual chart of a 1000-year record renders (no list of years for Vega to compile)', async () => {
    // A generated climate of 1000 years is a real use (tileflux weather make --years 1000).
    // Vega-Lite turns an explicit sort list into one nested condition per value, which overflows
    // Vega's expression parser ("Maximum call stack size exceeded") at this length.
    const names = data.scenarios.map((s) => s.name);
    const annual = names.flatMap((scenario) =>
      Array.from({ length: 1000 }, (_, k) => ({
        ...data.annual[0]!,
        scenario,
        year: 2001 + k,
        drainflow_mm: 200 + (k % 37),
        no3n_load_kg_ha: 20 + (k % 11),
      })),
    );
    const svg = await renderSvg(annualChart({ ...data, annual }));
    expect(svg).toContain('Annual drain flow and nitrate-N load');
    expect(svg).toContain('2001 to 3000');
  });
});

describe('writeCharts', () => {
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-charts-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('writes <name>.vl.json, .svg and .png for every chart into charts/', async () => {
    const written = await writeCharts(dir, specs);
    expect(written.length).toBe(3 * CHART_NAMES.length);
    for (const name of CHART_NAMES) {
      const base = join(dir, 'charts', name);
      expect(JSON.parse(readFileSync(`${base}.vl.json`, 'utf8'))).toEqual(specs[name]);
      expect(readFileSync(`${base}.svg`, 'utf8')).toBe(await svgOf(name));
      expect(statSync(`${base}.png`).size).toBeGreaterThan(5000);
    }
  });

  it('with images: false writes the specs alone and draws nothing', async () => {
    const only = mkdtempSync(join(tmpdir(), 'tileflux-charts-'));
    try {
      // A drawer that fails proves nothing is drawn.
      const draw = () => Promise.reject(new Error('drawn'));
      const written = await writeCharts(only, specs, { images: false, draw });
      expect(written).toEqual(CHART_NAMES.map((n) => join(only, 'charts', `${n}.vl.json`)));
      expect(readdirSync(join(only, 'charts')).length).toBe(CHART_NAMES.length);
    } finally {
      rmSync(only, { recursive: true, force: true });
    }
  });

  it('a failing chart writes nothing, and nothing is still on its way when it throws', async () => {
    // The run removes its half-written folder as soon as writeCharts throws; a PNG still being
    // rasterised would then write into a deleted folder (ENOENT thrown into the process). Every
    // chart is drawn before any file is written, so a failure leaves no charts/ at all, then or
    // a moment later.
    const failing = mkdtempSync(join(tmpdir(), 'tileflux-charts-'));
    try {
      const broken = { ...specs.tradeoff, transform: [{ calculate: 'datum.x +', as: 'y' }] };
      await expect(writeCharts(failing, { tradeoff: specs.tradeoff, broken })).rejects.toThrow();
      await new Promise((r) => setTimeout(r, 300));
      expect(existsSync(join(failing, 'charts'))).toBe(false);
    } finally {
      rmSync(failing, { recursive: true, force: true });
    }
  });

  it('draws on chart threads (built modules in dist/) the same files, byte for byte', async () => {
    const dist = (f: string) => pathToFileURL(join(process.cwd(), 'dist', f)).href;
    const { startChartThreads } = (await import(
      dist('report/chartThreads.js')
    )) as typeof import('../../src/report/chartThreads.js');
    const threads = startChartThreads(2);
    const here = mkdtempSync(join(tmpdir(), 'tileflux-charts-'));
    const there = mkdtempSync(join(tmpdir(), 'tileflux-charts-'));
    try {
      const a = await writeCharts(here, specs);
      const b = await writeCharts(there, specs, { draw: threads.draw });
      expect(b.map((p) => p.slice(there.length))).toEqual(a.map((p) => p.slice(here.length)));
      for (const p of a) {
        const q = there + p.slice(here.length);
        expect(readFileSync(q).equals(readFileSync(p)), q).toBe(true);
      }
      // A chart that cannot be drawn rejects the drawing, on the threads as here.
      const broken = { ...specs.tradeoff, transform: [{ calculate: 'datum.x +', as: 'y' }] };
      await expect(threads.draw({ broken }, 1)).rejects.toThrow();
    } finally {
      await threads.close();
      rmSync(here, { recursive: true, force: true });
      rmSync(there, { recursive: true, force: true });
    }
  });

  it('refuses a chart name that is not a plain file stem', async () => {
    await expect(writeCharts(dir, { '../escape': specs.tradeoff })).rejects.toThrow(
      /safe file stem/,
    );
  });
});
