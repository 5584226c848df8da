import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import Ajv from 'ajv';
import { compile, type TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { compareScenarios } from '../../src/scenarios/compare.js';
import {
  buildChartSpecs,
  CHART_NAMES,
  niceCeil,
  placeLabels,
  waterTableChart,
} from '../../src/report/charts.js';
import { VEGA_LITE_SCHEMA } from '../../src/report/chartTheme.js';
import type { ReportData } from '../../src/report/types.js';
import { TilefluxError } from '../../src/errors.js';
import { makeReportData } from './fixture.mjs';

// The JSON schema shipped inside the installed vega-lite package (the outside reference for
// what a valid spec is). ajv 6 is in node_modules as a dependency of eslint.
const require = createRequire(import.meta.url);
const schemaPath = require.resolve('vega-lite/vega-lite-schema.json');
const ajv = new Ajv({ allErrors: true, jsonPointers: true, logger: false });
ajv.addFormat('color-hex', /^#(?:[0-9a-fA-F]{3,4}|[0-9a-fA-F]{6}|[0-9a-fA-F]{8})$/);
const validate = ajv.compile(JSON.parse(readFileSync(schemaPath, 'utf8')));

const data = makeReportData({ years: 3, compareScenarios }) as ReportData;
const specs = buildChartSpecs(data);

type Row = Record<string, number | string>;
/** The inline values of a spec (top level or of one of its layers). */
function valuesOf(spec: unknown, layer?: number): Row[] {
  const s = spec as { data?: { values: Row[] }; layer?: Array<{ data?: { values: Row[] } }> };
  return (layer === undefined ? s.data : s.layer![layer].data)!.values;
}

/** The water-table chart's two panels: precipitation bars above, the water table below. */
function waterTablePanels(spec: unknown) {
  const [rain, table] = (spec as { vconcat: [unknown, unknown] }).vconcat;
  return { rain, table };
}
/** Layers of the water-table panel, in drawing order. */
const WT = { bands: 0, bandLabels: 1, line: 2, outlet: 3, threshold: 4 } as const;

function compileWarnings(spec: TopLevelSpec): string[] {
  const warnings: string[] = [];
  const logger = {
    level: () => logger,
    error: (...a: unknown[]) => (warnings.push(`error: ${a.join(' ')}`), logger),
    warn: (...a: unknown[]) => (warnings.push(a.join(' ')), logger),
    info: () => logger,
    debug: () => logger,
  };
  compile(spec, { logger: logger as never });
  return warnings;
}

describe('chart specs', () => {
  it('builds every chart, in report order', () => {
    expect(Object.keys(specs)).toEqual([...CHART_NAMES]);
  });

  for (const name of CHART_NAMES) {
    it(`${name} validates against the Vega-Lite schema and compiles without warnings`, () => {
      const spec = specs[name];
      expect((spec as { $schema?: string }).$schema).toBe(VEGA_LITE_SCHEMA);
      const ok = validate(spec);
      expect(ok ? [] : validate.errors).toEqual([]);
      expect(compileWarnings(spec)).toEqual([]);
    });
  }

  it('the schema check can fail: a broken spec is rejected', () => {
    const broken = structuredClone(specs.tradeoff) as { layer: Array<{ mark: { type: string } }> };
    broken.layer[0].mark.type = 'blob';
    expect(validate(broken)).toBe(false);
  });

  it('keeps the inlined data small and the output deterministic', () => {
    const again = buildChartSpecs(makeReportData({ years: 3, compareScenarios }) as ReportData);
    expect(JSON.stringify(again)).toBe(JSON.stringify(specs));
    const big = buildChartSpecs(makeReportData({ years: 30, compareScenarios }) as ReportData);
    // Budget of our own: a 30-year, 3-scenario report carries under 50 kB of chart data per
    // chart on average (400 kB for the eight charts).
    expect(JSON.stringify(big).length).toBeLessThan(50_000 * CHART_NAMES.length);
  });
});

describe('chart content equals figures computed here from the fixture', () => {
  const names = data.scenarios.map((s) => s.name);
  const dates = data.daily.dates;
  const inYear = dates
    .map((d, i) => [d, i] as const)
    .filter(([d]) => d.startsWith(`${data.chartYear}-`));

  it('water table: the chosen year only, depth axis reversed, outlet steps and threshold', () => {
    const spec = waterTablePanels(specs['water-table']).table as {
      layer: Array<{ encoding: { y: { scale?: { reverse?: boolean }; datum?: number } } }>;
    };
    expect(spec.layer[WT.line].encoding.y.scale?.reverse).toBe(true);
    expect(spec.layer[WT.threshold].encoding.y.datum).toBe(data.wetThresholdM);
    const wt = valuesOf(spec, WT.line);
    expect(wt.length).toBe(inYear.length * names.length);
    const s0 = data.daily.series[0];
    for (const r of wt.filter((r) => r.scenario === names[0])) {
      const i = dates.indexOf(r.date as string);
      expect(r.depth).toBeCloseTo(s0.waterTableDepthM[i], 3);
    }
    // Expanding the outlet steps (step-after) gives back the daily outlet depth of every day.
    const steps = valuesOf(spec, WT.outlet);
    for (const [k, name] of names.entries()) {
      const mine = steps.filter((r) => r.scenario === name);
      for (const [d, i] of inYear) {
        const last = mine.filter((r) => (r.date as string) <= d).pop()!;
        expect(last.depth, `${name} ${d}`).toBeCloseTo(data.daily.series[k].outletDepthM[i], 6);
      }
    }
  });

  it('water table: precipitation bars of each wet day of the year, one day wide', () => {
    const rain = valuesOf(waterTablePanels(specs['water-table']).rain);
    const wetDays = inYear.filter(([, i]) => data.daily.precipMm[i] > 0);
    expect(rain.map((r) => r.date)).toEqual(wetDays.map(([d]) => d));
    for (const r of rain) {
      const i = dates.indexOf(r.date as string);
      expect(r.precip).toBeCloseTo(data.daily.precipMm[i], 3);
      expect(Date.parse(r.end as string) - Date.parse(r.date as string)).toBe(86_400_000);
    }
  });

  it("water table: the fieldwork windows of the field's measures shaded, end day included", () => {
    const table = waterTablePanels(specs['water-table']).table;
    // The fixture's windows: 20 Apr - 25 May and 25 Sep - 10 Nov.
    const y = data.chartYear;
    expect(valuesOf(table, WT.bands)).toEqual([
      { start: `${y}-04-20`, end: `${y}-05-26`, window: 'Spring fieldwork' },
      { start: `${y}-09-25`, end: `${y}-11-11`, window: 'Fall fieldwork' },
    ]);
    // A window across the new year is two bands inside the year.
    const wrapped = waterTableChart({
      ...data,
      measures: { ...data.measures, fallWindow: { from: '12-01', to: '01-15' } },
    });
    expect(valuesOf(waterTablePanels(wrapped).table, WT.bands).slice(1)).toEqual([
      { start: `${y}-01-01`, end: `${y}-01-16`, window: 'Fall fieldwork' },
      { start: `${y}-12-01`, end: `${y + 1}-01-01`, window: 'Fall fieldwork' },
    ]);
  });

  it('duration curve: each point is the share of growing-season days no deeper, counted here', () => {
    // The fixture's growing season is 1 Apr - 31 Oct, every year.
    const season = dates
      .map((d, i) => [d.slice(5, 10), i] as const)
      .filter(([md]) => md >= '04-01' && md <= '10-31')
      .map(([, i]) => i);
    const rows = valuesOf(specs.duration, 0);
    for (const [k, name] of names.entries()) {
      const wt = season.map((i) => data.daily.series[k].waterTableDepthM[i]);
      const mine = rows.filter((r) => r.scenario === name);
      expect(mine.length).toBeGreaterThan(50);
      expect(mine.at(-1)!.share).toBe(100);
      expect(mine.at(-1)!.depth).toBeCloseTo(Math.max(...wt), 4);
      for (const r of mine) {
        // Depths are rounded to 0.1 mm: count the days no deeper than the point's depth.
        const atMost = wt.filter((d) => d <= (r.depth as number) + 5e-5).length;
        const below = wt.filter((d) => d < (r.depth as number) - 5e-5).length;
        const share = r.share as number;
        expect(share, `${name} at ${r.depth}`).toBeGreaterThan((100 * below) / wt.length);
        expect(share, `${name} at ${r.depth}`).toBeLessThanOrEqual(
          (100 * atMost) / wt.length + 1e-3,
        );
      }
    }
  });

  it('hydrograph: the daily drain flow of the chosen year, every day of every scenario', () => {
    const rows = valuesOf(specs.hydrograph);
    expect(rows.length).toBe(inYear.length * names.length);
    for (const [k, name] of names.entries()) {
      const mine = rows.filter((r) => r.scenario === name);
      expect(mine.map((r) => r.date)).toEqual(inYear.map(([d]) => d));
      for (const [j, [, i]] of inYear.entries()) {
        expect(mine[j].flow).toBeCloseTo(data.daily.series[k].drainflowMm[i], 4);
      }
    }
  });

  it('cumulative: the last point is the period total, thinned to weekly or coarser', () => {
    const rows = valuesOf(specs.cumulative);
    for (const [k, name] of names.entries()) {
      const mine = rows.filter((r) => r.scenario === name);
      const s = data.daily.series[k];
      let flow = 0;
      let load = 0;
      for (let i = 0; i < dates.length; i++) {
        flow += s.drainflowMm[i];
        load += s.no3LoadKgHa[i];
      }
      const last = mine[mine.length - 1];
      expect(last.date).toBe(dates[dates.length - 1]);
      expect(last.flow).toBeCloseTo(flow, 1);
      expect(last.load).toBeCloseTo(load, 2);
      expect(mine.length).toBeLessThanOrEqual(Math.ceil(dates.length / 7) + 1);
    }
  });

  it('annual bars equal the annual table', () => {
    const rows = valuesOf(specs.annual);
    expect(rows.length).toBe(data.annual.length);
    for (const a of data.annual) {
      const r = rows.find((x) => x.scenario === a.scenario && x.year === a.year)!;
      expect(r.flow).toBeCloseTo(a.drainflow_mm, 2);
      expect(r.load).toBeCloseTo(a.no3n_load_kg_ha, 3);
    }
  });

  it('monthly bars and concentration equal means and flow weighting done here', () => {
    const monthly = valuesOf(specs.monthly);
    const conc = valuesOf(specs.concentration);
    const s = data.daily.series[1];
    for (const [m, label] of [
      ['03', 'Mar'],
      ['11', 'Nov'],
    ] as const) {
      let flow = 0;
      let load = 0;
      for (let i = 0; i < dates.length; i++) {
        if (dates[i].slice(5, 7) !== m) continue;
        flow += s.drainflowMm[i];
        load += s.no3LoadKgHa[i];
      }
      const bar = monthly.find((r) => r.scenario === names[1] && r.month === label)!;
      expect(bar.flow).toBeCloseTo(flow / data.period.years, 2);
      expect(bar.load).toBeCloseTo(load / data.period.years, 3);
      // Flow-weighted concentration: C = 100 x load (kg/ha) / flow (mm), mg/L.
      const c = conc.find((r) => r.scenario === names[1] && r.month === label)!;
      expect(c.conc).toBeCloseTo((100 * load) / flow, 3);
    }
  });

  it('trade-off: one labelled point per scenario at its mean wet days and load', () => {
    const rows = valuesOf(specs.tradeoff);
    expect(rows.map((r) => r.scenario)).toEqual(names);
    for (const c of data.comparison) {
      const r = rows.find((x) => x.scenario === c.scenario)!;
      expect(r.wet).toBeCloseTo(c.wet_days, 2);
      expect(r.load).toBeCloseTo(c.no3n_load_kg_ha, 3);
      expect(r.label).toBe(c.is_baseline ? `${c.scenario} (baseline)` : c.scenario);
    }
  });

  it('trade-off: labels of close points never overlap each other or a point', () => {
    // Three scenarios within 0.1 wet day and 0.3 kg N/ha of each other: on a 520 x 320 px plot
    // of 0-5 days and 0-50 kg their points are a few pixels apart.
    const pts = [
      { label: 'conventional (baseline)', wet: 1.0, load: 30 },
      { label: 'controlled', wet: 1.05, load: 30.2 },
      { label: 'shallow', wet: 1.1, load: 29.9 },
    ];
    const placed = placeLabels(pts, 5, 50);
    const px = (wet: number, load: number) => [(wet / 5) * 520, 320 - (load / 50) * 320];
    // Label boxes from the label centres, 0.62 em a character at 12 px, 14 px high.
    const boxes = placed.map((p) => {
      const [cx, cy] = px(p.labelWet, p.labelLoad);
      const w = 0.62 * 12 * p.label.length;
      return [cx - w / 2, cx + w / 2, cy - 7, cy + 7];
    });
    const hit = (a: number[], b: number[]) =>
      a[0] < b[1] && b[0] < a[1] && a[2] < b[3] && b[2] < a[3];
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++)
        expect(hit(boxes[i], boxes[j]), `${i} ${j}`).toBe(false);
      for (const p of pts) {
        const [x, y] = px(p.wet, p.load);
        expect(hit(boxes[i], [x - 6, x + 6, y - 6, y + 6]), `${i} on ${p.label}`).toBe(false);
      }
    }
    // A lone point keeps its label on the right.
    const [lone] = placeLabels([{ label: 'a', wet: 2, load: 20 }], 5, 50);
    expect(lone.labelWet).toBeGreaterThan(2);
    expect(lone.labelLoad).toBeCloseTo(20, 6);
  });

  it('axis ends are round numbers: 1, 2, 2.5 or 5 times a power of ten', () => {
    expect([4.2, 5, 6.5, 11, 23, 0.37].map(niceCeil)).toEqual([5, 5, 10, 20, 25, 0.5]);
  });

  it('converts to US units: inches of water and feet of depth (1 in = 25.4 mm, 1 ft = 0.3048 m, NIST HB 44)', () => {
    const us = buildChartSpecs({ ...data, units: 'us' });
    const si = valuesOf(specs.annual);
    const usRows = valuesOf(us.annual);
    expect(usRows[0].flow).toBeCloseTo((si[0].flow as number) / 25.4, 2);
    // 1 kg/ha = 0.892179 lb/ac (NIST HB 44 definitions of the pound and the acre).
    expect(usRows[0].load).toBeCloseTo((si[0].load as number) * 0.892179, 2);
    const wt = valuesOf(waterTablePanels(us['water-table']).table, WT.line);
    expect(wt[0].depth).toBeCloseTo(
      data.daily.series[0].waterTableDepthM[inYear[0][1]] / 0.3048,
      2,
    );
    expect(JSON.stringify(us.annual)).toContain('in/yr');
    const rain = valuesOf(waterTablePanels(us['water-table']).rain);
    const i = dates.indexOf(rain[0].date as string);
    expect(rain[0].precip).toBeCloseTo(data.daily.precipMm[i] / 25.4, 3);
    expect(valuesOf(us.hydrograph)[0].flow).toBeCloseTo(
      data.daily.series[0].drainflowMm[inYear[0][1]] / 25.4,
      4,
    );
    expect(valuesOf(us.duration, 0).at(-1)!.depth).toBeCloseTo(
      (valuesOf(specs.duration, 0)
        .filter((r) => r.scenario === names[0])
        .at(-1)!.depth as number) / 0.3048,
      3,
    );
  });

  it('rejects a chart year outside the weather period, naming the period', () => {
    expect(() => waterTableChart({ ...data, chartYear: 1999 })).toThrow(TilefluxError);
    expect(() => waterTableChart({ ...data, chartYear: 1999 })).toThrow(
      /^chartYear: chart year 1999 is outside the weather period \(2001-01-01 to 2003-12-31\)/,
    );
  });
});
