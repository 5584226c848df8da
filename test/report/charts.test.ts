import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import Ajv from 'ajv';
import { compile, type TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { compareScenarios } from '../../src/scenarios/compare.js';
import {
  buildChartSpecs,
  CHART_NAMES,
  VEGA_LITE_SCHEMA,
  waterTableChart,
} from '../../src/report/charts.js';
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
/** The inline values of a spec (top level or of its first layer). */
function valuesOf(spec: unknown, layer?: number): Row[] {
  const s = spec as { data?: { values: Row[] }; layer?: Array<{ data?: { values: Row[] } }> };
  return (layer === undefined ? s.data : s.layer![layer].data)!.values;
}

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
    // Budget of our own: a 30-year, 3-scenario report carries under 300 kB of chart data.
    expect(JSON.stringify(big).length).toBeLessThan(300_000);
  });
});

describe('chart content equals figures computed here from the fixture', () => {
  const names = data.scenarios.map((s) => s.name);
  const dates = data.daily.dates;
  const inYear = dates
    .map((d, i) => [d, i] as const)
    .filter(([d]) => d.startsWith(`${data.chartYear}-`));

  it('water table: the chosen year only, depth axis reversed, outlet steps and threshold', () => {
    const spec = specs['water-table'] as unknown as {
      layer: Array<{ encoding: { y: { scale?: { reverse?: boolean }; datum?: number } } }>;
    };
    expect(spec.layer[0].encoding.y.scale?.reverse).toBe(true);
    expect(spec.layer[2].encoding.y.datum).toBe(data.wetThresholdM);
    const wt = valuesOf(spec, 0);
    expect(wt.length).toBe(inYear.length * names.length);
    const s0 = data.daily.series[0];
    for (const r of wt.filter((r) => r.scenario === names[0])) {
      const i = dates.indexOf(r.date as string);
      expect(r.depth).toBeCloseTo(s0.waterTableDepthM[i], 3);
    }
    // Expanding the outlet steps (step-after) gives back the daily outlet depth of every day.
    const steps = valuesOf(spec, 1);
    for (const [k, name] of names.entries()) {
      const mine = steps.filter((r) => r.scenario === name);
      for (const [d, i] of inYear) {
        const last = mine.filter((r) => (r.date as string) <= d).pop()!;
        expect(last.depth, `${name} ${d}`).toBeCloseTo(data.daily.series[k].outletDepthM[i], 6);
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
      expect(r.load).toBeCloseTo(a.no3_load_kg_ha, 3);
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
      expect(r.load).toBeCloseTo(c.no3_load_kg_ha, 3);
      expect(r.label).toBe(c.is_baseline ? `${c.scenario} (baseline)` : c.scenario);
    }
  });

  it('converts to US units: inches of water and feet of depth (1 in = 25.4 mm, 1 ft = 0.3048 m, NIST HB 44)', () => {
    const us = buildChartSpecs({ ...data, units: 'us' });
    const si = valuesOf(specs.annual);
    const usRows = valuesOf(us.annual);
    expect(usRows[0].flow).toBeCloseTo((si[0].flow as number) / 25.4, 2);
    // 1 kg/ha = 0.892179 lb/ac (NIST HB 44 definitions of the pound and the acre).
    expect(usRows[0].load).toBeCloseTo((si[0].load as number) * 0.892179, 2);
    const wt = valuesOf(us['water-table'], 0);
    expect(wt[0].depth).toBeCloseTo(
      data.daily.series[0].waterTableDepthM[inYear[0][1]] / 0.3048,
      2,
    );
    expect(JSON.stringify(us.annual)).toContain('in/yr');
  });

  it('rejects a chart year outside the weather period, naming the period', () => {
    expect(() => waterTableChart({ ...data, chartYear: 1999 })).toThrow(TilefluxError);
    expect(() => waterTableChart({ ...data, chartYear: 1999 })).toThrow(/2001-01-01 to 2003-12-31/);
  });
});
