import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mean } from 'simple-statistics';

const CLI = join(process.cwd(), 'dist/cli/main.js');
let dir: string;
let out: string;
let stdout: string;

/** A CSV file as records of strings (the files hold no quoted commas). */
function readCsv(path: string): Array<Record<string, string>> {
  const [head, ...rows] = readFileSync(path, 'utf8').trim().split('\n');
  const keys = head.split(',');
  return rows.map((r) => Object.fromEntries(r.split(',').map((v, i) => [keys[i], v])));
}

beforeAll(() => {
  if (!existsSync(CLI)) execFileSync('npm', ['run', 'build'], { stdio: 'ignore' });
  dir = mkdtempSync(join(tmpdir(), 'tileflux-demo-'));
  out = join(dir, 'demo');
  const r = spawnSync(process.execPath, [CLI, 'demo', '--out', out], { encoding: 'utf8' });
  expect(r.stderr).toBe('');
  expect(r.status).toBe(0);
  stdout = r.stdout;
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('tileflux demo', () => {
  it('writes the whole run folder and names the report', () => {
    const files = ['daily.csv', 'annual.csv', 'comparison.csv', 'summary.json', 'report.html'];
    for (const f of [...files, 'explorer.html']) {
      expect(existsSync(join(out, f))).toBe(true);
    }
    expect(stdout).toMatch(/Report: .*report\.html/);
    expect(stdout).toMatch(/^Charts: .*charts\/ \(Vega-Lite specs; --images adds SVG and PNG\)$/m);
    expect(stdout).toMatch(/Explorer \(change the designs in a browser\): .*explorer\.html/);
    expect(stdout).toMatch(/^conventional\s/m);
    expect(stdout).toMatch(/Planning estimate/);
  });

  it('writes the eight chart specs, and no images without --images', () => {
    const charts = readdirSync(join(out, 'charts')).sort();
    expect(charts).toEqual(
      [
        'annual',
        'concentration',
        'cumulative',
        'duration',
        'hydrograph',
        'monthly',
        'tradeoff',
        'water-table',
      ].map((c) => `${c}.vl.json`),
    );
    const spec = JSON.parse(readFileSync(join(out, 'charts', 'tradeoff.vl.json'), 'utf8'));
    expect(spec.$schema).toMatch(/vega-lite/);
  });

  it('with --images also draws each chart to SVG and PNG, the specs unchanged', () => {
    const drawn = join(dir, 'demo-images');
    const r = spawnSync(process.execPath, [CLI, 'demo', '--out', drawn, '--images'], {
      encoding: 'utf8',
    });
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/^Charts: .*demo-images\/charts\/ \(Vega-Lite specs, SVG and PNG\)$/m);
    for (const spec of readdirSync(join(out, 'charts'))) {
      const stem = spec.replace(/\.vl\.json$/, '');
      const read = (d: string, f: string) => readFileSync(join(d, 'charts', f));
      expect(read(drawn, spec).equals(read(out, spec)), spec).toBe(true);
      expect(read(drawn, `${stem}.svg`).toString('utf8')).toMatch(/^<svg/);
      expect(read(drawn, `${stem}.png`).subarray(1, 4).toString('ascii')).toBe('PNG');
    }
    expect(readdirSync(join(drawn, 'charts')).length).toBe(3 * 8);
  });

  it('comparison.csv equals the annual table averaged independently', () => {
    const annual = readCsv(join(out, 'annual.csv'));
    const comparison = readCsv(join(out, 'comparison.csv'));
    for (const row of comparison) {
      const years = annual.filter((a) => a.scenario === row.scenario);
      expect(Number(row.years)).toBe(years.length);
      for (const key of ['drainflow_mm', 'no3n_load_kg_ha', 'runoff_mm', 'et_mm', 'wet_days']) {
        // Files hold 3-4 decimals, so means agree to about 1e-3.
        expect(Number(row[key])).toBeCloseTo(mean(years.map((y) => Number(y[key]))), 2);
      }
      const flow = years.reduce((s, y) => s + Number(y.drainflow_mm), 0);
      const load = years.reduce((s, y) => s + Number(y.no3n_load_kg_ha), 0);
      // Flow-weighted concentration: load (kg/ha) = flow (mm) x C (mg/L) / 100.
      expect(Number(row.fwmc_mg_l)).toBeCloseTo((100 * load) / flow, 2);
    }
  });

  it('shallow and controlled cut flow and load by amounts inside published ranges', () => {
    const c = Object.fromEntries(readCsv(join(out, 'comparison.csv')).map((r) => [r.scenario, r]));
    const cut = (s: string, k: string) => -Number(c[s][`${k}_change_percent`]);
    // Controlled drainage: field studies reviewed by Skaggs, Fausey & Evans (2012, J. Soil Water
    // Conserv. 67(6):167A) report reductions of drain outflow and nitrate-N loss from 17 % to
    // over 80 % (from memory). The demo's medium-seepage cut (12.8 % flow, 15.7 % load) falls
    // below that; the cut grows with seepage, and the low-high seepage band (9-20 % flow,
    // 13-19 % load) reaches the range. Checked: the band overlaps the range.
    const band = (s: string, k: string) => [
      -Number(c[s][`${k}_change_percent_low`]),
      -Number(c[s][`${k}_change_percent_high`]),
    ];
    for (const k of ['drainflow', 'no3n_load']) {
      const [low, high] = band('controlled', k);
      expect(high).toBeGreaterThanOrEqual(17);
      expect(low).toBeLessThanOrEqual(85);
      expect(cut('controlled', k)).toBeGreaterThan(0);
    }
    // Under controlled drainage the load falls with the flow and the concentration changes little
    // (a 2022 synthesis of Midwest and Southeast field sites, from memory): within +-10 %.
    expect(Math.abs(Number(c.controlled.fwmc_change_percent))).toBeLessThan(10);
    // Shallow drains at the same drainage intensity: field trials of shallow against conventional
    // drains in the U.S. Midwest report smaller cuts than controlled drainage, from a few percent
    // to a few tens of percent (from memory; no synthesis in hand), so 2-40 % is the band taken.
    for (const k of ['drainflow', 'no3n_load']) {
      expect(cut('shallow', k)).toBeGreaterThan(2);
      expect(cut('shallow', k)).toBeLessThan(40);
    }
  });

  it('states the seepage band, the assumptions and the load split everywhere', () => {
    expect(stdout).toMatch(
      /controlled: drain flow -\d+\.\d % \(-\d+\.\d % to -\d+\.\d % across seepage assumptions, low to high\)/,
    );
    expect(stdout).toMatch(/Assumed: Seepage setting "medium": vertical leakage/);
    expect(stdout).toMatch(/days the cap limited flow: conventional \d+/);
    expect(stdout).toMatch(/Hargreaves tends to overestimate/);
    const c = readCsv(join(out, 'comparison.csv'));
    for (const k of ['drainflow_change_percent', 'no3n_load_change_percent', 'fwmc_change_percent'])
      for (const b of ['low', 'high']) expect(c[2][`${k}_${b}`]).toMatch(/^-?\d/);
    const summary = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(summary.assumptions.seepage.name).toBe('medium');
    expect(summary.seepage_band.changes.map((x: { scenario: string }) => x.scenario)).toEqual([
      'shallow',
      'controlled',
    ]);
    const band = summary.seepage_band.changes[1].drainflow_change_percent;
    expect(band.medium).toBeCloseTo(Number(c[2].drainflow_change_percent), 2);
    expect(Number.isInteger(summary.scenarios[0].capacity_limited_days)).toBe(true);
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).toContain('across seepage assumptions');
    expect(html).toContain('Seepage setting');
  });

  it('the report names the climate of the compared period, computed here from the weather file', () => {
    const summary = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    const { from, to } = summary.period;
    const rows = readFileSync('data-demo/weather.csv', 'utf8')
      .trim()
      .split('\n')
      .slice(1)
      .map((l) => l.split(','))
      .filter(([d]) => d >= from && d <= to);
    const years = rows.length / 365.2425;
    const precip = rows.reduce((t, r) => t + Number(r[1]), 0) / years;
    // Daily mean air temperature as the mean of maximum and minimum (FAO-56 eq. 9).
    const tmean = mean(rows.map((r) => (Number(r[2]) + Number(r[3])) / 2));
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    const row = html.match(/<td class="text" id="climate">([^<]*)</)?.[1] ?? '';
    expect(row).toMatch(
      /^precipitation (\d+) mm\/yr, reference ET (\d+) mm\/yr, mean air temperature (-?\d+\.\d) °C; tileflux&#39;s own CSV$/,
    );
    const [, p, , t] = row.match(
      /(\d+) mm\/yr, reference ET (\d+) mm\/yr, mean air temperature (-?\d+\.\d)/,
    )!;
    expect(Number(p)).toBe(Math.round(precip));
    expect(Number(t)).toBeCloseTo(tmean, 1);
  });

  it("the report gives the demo's control structure in boards: (1.1 - 0.5) / 0.15 = 4 boards", () => {
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).toContain('id="outlet-table"');
    expect(html).toContain('add 4 boards');
    // (1.1 - 0.15) / 0.15 = 6.33: 6 boards, which hold the outlet at 1.1 - 0.9 = 0.20 m.
    expect(html).toContain('6 boards (outlet at 0.20 m)');
  });

  it("the report says how the crop's conditions changed, counts beside window lengths", () => {
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    for (const name of ['controlled', 'shallow']) {
      expect(html).toMatch(
        new RegExp(
          `${name}: [+-]?\\d+\\.\\d aeration-stress days, [+-]?\\d+\\.\\d wet days, ` +
            `[+-]?\\d+\\.\\d spring fieldwork days of 47 and [+-]?\\d+\\.\\d fall fieldwork days of 57`,
        ),
      );
    }
    expect(html).toContain('id="glossary"');
  });
});
