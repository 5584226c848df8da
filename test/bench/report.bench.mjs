// Report stage on a 30-year, 3-scenario fixture: build the six chart specs, render them to SVG
// and PNG (writeCharts) and build and write the HTML report. The first run is cold (it loads
// vega, vega-lite and resvg and reads the fonts and the browser bundles); warm runs repeat it.
import { mkdtempSync, rmSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { makeReportData } from '../report/fixture.mjs';

async function once(lib, data) {
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-bench-report-'));
  try {
    const t0 = performance.now();
    const specs = lib.buildChartSpecs(data);
    const t1 = performance.now();
    await lib.writeCharts(dir, specs);
    const t2 = performance.now();
    lib.writeReport(dir, data, specs);
    const t3 = performance.now();
    return { specs: t1 - t0, charts: t2 - t1, html: t3 - t2, total: t3 - t0 };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export default async function () {
  const i0 = performance.now();
  const lib = await import('../../dist/report/index.js');
  const { compareScenarios } = await import('../../dist/scenarios/compare.js');
  const importMs = performance.now() - i0;
  const data = makeReportData({ years: 30, compareScenarios });
  const cold = await once(lib, data);
  const warm = [];
  for (let i = 0; i < 3; i++) warm.push(await once(lib, data));
  const mean = (k) => warm.reduce((t, r) => t + r[k], 0) / warm.length;
  return [
    { name: 'import report module (vega etc. load on first use)', value: importMs, unit: 'ms' },
    { name: 'report, cold: specs + SVG/PNG + HTML (30 yr x 3)', value: cold.total, unit: 'ms' },
    { name: 'chart specs, warm (6 charts)', value: mean('specs'), unit: 'ms' },
    { name: 'charts to SVG + PNG, warm (6 charts)', value: mean('charts'), unit: 'ms' },
    { name: 'HTML report build + write, warm', value: mean('html'), unit: 'ms' },
    { name: 'report total, warm', value: mean('total'), unit: 'ms' },
  ];
}
