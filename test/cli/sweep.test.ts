import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFieldFile } from '../../src/io/field.js';
import { toCsv } from '../../src/io/tables.js';
import { readWeatherFile } from '../../src/io/weather.js';
import { sweepField } from '../../src/scenarios/sweep.js';
import { sweepSummary } from '../../src/cli/actions/sweep.js';
import { cli, expectUserError } from './harness.js';

// Real daily weather, 2012-2015 (vega-datasets weather.csv, New York rows), so the sweeps are small.
const WEATHER = [
  '--weather',
  'node_modules/vega-datasets/data/weather.csv',
  '--columns',
  'date=date,precip=precipitation,tmax=temp_max,tmin=temp_min',
  '--precip-unit',
  'mm',
  '--temp-unit',
  'c',
  '--where',
  'location=New York',
];
const FIELD = `name: Sweep CLI field
site: { latitude: 40.7 }
soil:
  conductivity: 1.0 m/d
  restrictiveLayerDepth: 2.5 m
  drainablePorosity: 0.05
drains: { depth: 1.2 m, spacing: 20 m, capacity: 12 mm/d }
sweep:
  depth: [0.9 m, 1.2 m]
  spacing: [15 m, 25 m]
  outlet:
    free: free
    winter hold: { schedule: [ { from: '10-25', depth: 0.3 m }, { from: '04-05', depth: free } ] }
  uncertain:
    soil.conductivity: { low: 0.4 m/d, high: 1.6 m/d, scale: log }
  samples: 3
`;
let dir: string;
let field: string;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'tileflux-sweep-'));
  field = join(dir, 'field.yaml');
  writeFileSync(field, FIELD);
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function files(root: string, sub = ''): string[] {
  return readdirSync(join(root, sub), { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? files(root, join(sub, e.name)) : [join(sub, e.name)],
  );
}

describe('tileflux sweep', () => {
  it('writes the same files, byte for byte, with 1 and 2 workers and the same seed', () => {
    const outs = ['1', '2'].map((k) => {
      const out = join(dir, `w${k}`);
      const run = ['--workers', k, '--seed', '4', '--images'];
      const r = cli(['sweep', field, ...WEATHER, '--out', out, ...run]);
      expect(r.status, r.stderr).toBe(0);
      return out;
    });
    const names = files(outs[0]).sort();
    expect(names).toEqual(
      expect.arrayContaining([
        'designs.csv',
        'samples.csv',
        'summary.json',
        'report.html',
        join('charts', 'frontier.vl.json'),
        join('charts', 'frontier.svg'),
        join('charts', 'frontier.png'),
        join('charts', 'load-map.svg'),
        join('charts', 'wetness-map.svg'),
        join('charts', 'cost-per-kg.svg'),
      ]),
    );
    expect(files(outs[1]).sort()).toEqual(names);
    for (const n of names) {
      expect(readFileSync(join(outs[1], n)).equals(readFileSync(join(outs[0], n))), n).toBe(true);
    }
    const designs = readFileSync(join(outs[0], 'designs.csv'), 'utf8').trim().split('\n');
    // 2 depths x 2 spacings x 2 managements, plus the field as given (1.2 m x 20 m, free).
    expect(designs).toHaveLength(1 + 9);
    const head = designs[0].split(',');
    for (const c of [
      'design',
      'no3n_load_kg_ha',
      'no3n_load_p10_kg_ha',
      'no3n_load_p90_kg_ha',
      'no3n_load_change_kg_ha',
      'annual_cost_usd_ha',
      'cost_per_kg_n_avoided_usd_kg',
      'on_frontier',
      'frontier_share',
    ])
      expect(head).toContain(c);
    expect(readFileSync(join(outs[0], 'samples.csv'), 'utf8').trim().split('\n')).toHaveLength(
      1 + 9 * 3,
    );
    const html = readFileSync(join(outs[0], 'report.html'), 'utf8');
    expect(html).toMatch(/licensed professional/);
    expect(html).toMatch(/Trenching is dangerous/);
    expect(html).toMatch(/illustrative defaults/);
    expect(html).toContain('id="frontier-table"');
  });

  it('prints the summary as JSON, refuses an existing folder and other seeds change the samples', () => {
    const out = join(dir, 'json');
    const r = cli([
      'sweep',
      field,
      ...WEATHER,
      '--out',
      out,
      '--no-charts',
      '--no-report',
      '--json',
    ]);
    expect(r.status, r.stderr).toBe(0);
    const s = JSON.parse(r.stdout);
    expect(s.designs).toBe(9);
    expect(s.samples).toBe(3);
    expect(s.costs.illustrative_defaults).toBe(true);
    expect(s.frontier.length).toBeGreaterThan(0);
    expectUserError(['sweep', field, ...WEATHER, '--out', out], /already exists; use --force/);
    const other = cli([
      'sweep',
      field,
      ...WEATHER,
      '--out',
      out,
      '--force',
      '--seed',
      '5',
      '--samples',
      '2',
      '--no-charts',
      '--no-report',
      '--json',
    ]);
    expect(JSON.parse(other.stdout).samples).toBe(2);
    expectUserError(
      ['sweep', field, ...WEATHER, '--samples', '0'],
      /--samples expects a whole number/,
    );
  });

  it('explains a field without a sweep section', () => {
    const plain = join(dir, 'plain.yaml');
    writeFileSync(plain, FIELD.slice(0, FIELD.indexOf('sweep:')));
    expectUserError(['sweep', plain, ...WEATHER, '--out', join(dir, 'none')], /no sweep: section/);
  });

  it('stops on Ctrl-C with nothing written', async () => {
    const big = join(dir, 'big.yaml');
    writeFileSync(big, FIELD.replace('samples: 3', 'samples: 4000'));
    const out = join(dir, 'stopped');
    const child = spawn(
      process.execPath,
      [join('dist', 'cli', 'main.js'), 'sweep', big, ...WEATHER, '--out', out, '--workers', '2'],
      { stdio: ['ignore', 'pipe', 'pipe'] },
    );
    let stderr = '';
    child.stderr.on('data', (b) => (stderr += String(b)));
    await new Promise((r) => setTimeout(r, 6000));
    child.kill('SIGINT');
    const code = await new Promise<number | null>((r) => child.on('close', r));
    expect(code, stderr).toBe(130);
    expect(stderr).toMatch(/stopped by SIGINT; nothing was written/);
    expect(existsSync(out)).toBe(false);
    expect(readdirSync(dir).filter((n) => n.startsWith('.stopped'))).toEqual([]);
  });
});

describe('tileflux sweep under several climates', () => {
  let today: string;
  let wetter: string;
  const made = (out: string, change: string[]) => {
    const r = cli([
      'weather',
      'make',
      '--like',
      ...WEATHER.slice(1),
      '--years',
      '4',
      '--seed',
      '3',
      ...change,
      '--out',
      out,
    ]);
    expect(r.status, r.stderr).toBe(0);
  };
  beforeAll(() => {
    // Both climates from the generator fitted to the New York record, same seed; the wetter one
    // with the existing delta change of +20 % precipitation intensity.
    today = join(dir, 'today.csv');
    wetter = join(dir, 'wetter.csv');
    made(today, []);
    made(wetter, ['--precip-change', '+20%']);
  });
  const read = (out: string, name: string) => readFileSync(join(out, name), 'utf8');

  it('under one climate writes what the one-climate sweep gives, with a climate column first', () => {
    const out = join(dir, 'one');
    const r = cli([
      'sweep',
      field,
      '--weather',
      today,
      '--out',
      out,
      '--seed',
      '4',
      '--no-charts',
      '--no-report',
    ]);
    expect(r.status, r.stderr).toBe(0);
    // The library's plain sweep of the same field and weather, written as the CLI writes it.
    const lib = sweepField(readFieldFile(field).base, readWeatherFile(today).series, { seed: 4 });
    const csvOf = (rows: typeof lib.designs) =>
      toCsv(
        rows.map((x) =>
          Object.fromEntries(
            Object.entries(x).map(([k, v]) => [k, typeof v === 'boolean' ? String(v) : v]),
          ),
        ),
        'si',
      );
    for (const [file, rows] of [
      ['designs.csv', lib.designs],
      ['samples.csv', lib.samples],
    ] as const) {
      const lines = read(out, file).split('\n');
      expect(lines[0].startsWith('climate,')).toBe(true);
      expect(lines.slice(1, -1).every((l) => l.startsWith('today,'))).toBe(true);
      expect(lines.map((l) => l.slice(l.indexOf(',') + 1)).join('\n')).toBe(csvOf(rows));
    }
    const { climates, frontier_by_climate, robust_across_climates, ...rest } = JSON.parse(
      read(out, 'summary.json'),
    );
    expect(rest).toEqual(JSON.parse(JSON.stringify(sweepSummary(lib, 'field.yaml', 'today.csv'))));
    expect(climates).toHaveLength(1);
    expect(climates[0].name).toBe('today');
    expect(climates[0].read_as).toBe('today.csv, format tileflux');
    expect(robust_across_climates).toEqual(rest.frontier.map((d: { design: string }) => d.design));
    expect(frontier_by_climate).toHaveLength(rest.frontier.length);
    expect(r.stdout).toMatch(
      /climate today: today\.csv, format tileflux; .*precipitation \d+ mm\/yr, reference ET \d+ mm\/yr/,
    );
    expect(r.stdout).not.toMatch(/robust across climates/);
  });

  it('under two climates equals two one-climate sweeps, byte for byte for 1 and 2 workers', () => {
    const both = (k: string, extra: string[] = []) => {
      const out = join(dir, `two-w${k}`);
      const r = cli([
        'sweep',
        field,
        '--weather',
        `today=${today}`,
        '--weather',
        `wetter=${wetter}`,
        '--out',
        out,
        '--seed',
        '4',
        '--workers',
        k,
        ...extra,
      ]);
      expect(r.status, r.stderr).toBe(0);
      return { out, stdout: r.stdout };
    };
    const one = both('1', ['--no-charts']);
    const two = both('2', ['--images']);
    for (const n of ['designs.csv', 'samples.csv', 'summary.json']) {
      expect(read(two.out, n), n).toBe(read(one.out, n));
    }
    const charts = files(two.out, 'charts').map((f) => f.replace(/^charts\//, ''));
    for (const c of [
      'frontier-today.svg',
      'load-map-wetter.svg',
      'cost-per-kg-wetter.png',
      'climates.svg',
    ])
      expect(charts).toContain(c);
    expect(charts).not.toContain('frontier.svg');
    // Each climate alone.
    const alone = (name: string, file: string) => {
      const out = join(dir, `alone-${name}`);
      const r = cli([
        'sweep',
        field,
        '--weather',
        `${name}=${file}`,
        '--out',
        out,
        '--seed',
        '4',
        '--no-charts',
        '--no-report',
      ]);
      expect(r.status, r.stderr).toBe(0);
      return out;
    };
    const [a, b] = [alone('today', today), alone('wetter', wetter)];
    for (const n of ['designs.csv', 'samples.csv']) {
      const [head, ...rows] = read(two.out, n).trimEnd().split('\n');
      const of = (out: string) => read(out, n).trimEnd().split('\n');
      expect([head, ...rows.filter((l) => l.startsWith('today,'))]).toEqual(of(a));
      expect([head, ...rows.filter((l) => l.startsWith('wetter,'))]).toEqual(of(b));
    }
    const s = JSON.parse(read(two.out, 'summary.json'));
    const sb = JSON.parse(read(b, 'summary.json'));
    expect(s.climates.map((c: { name: string }) => c.name)).toEqual(['today', 'wetter']);
    expect(s.climates[1].frontier).toEqual(sb.frontier);
    expect(s.climates[1].baseline).toEqual(sb.baseline);
    expect(s.frontier).toEqual(JSON.parse(read(a, 'summary.json')).frontier);
    expect(s.climates[1].precip_mean_mm_yr).toBeGreaterThan(s.climates[0].precip_mean_mm_yr);
    for (const d of s.frontier_by_climate)
      expect(d.robust_across_climates).toBe(d.rank.today !== null && d.rank.wetter !== null);
    expect(two.stdout).toMatch(/under 2 climates/);
    expect(two.stdout).toMatch(/climate wetter: wetter\.csv, format tileflux/);
    expect(two.stdout).toMatch(/Recommended candidates under wetter/);
    expect(two.stdout).toMatch(/^ +design +today +wetter$/m);
    const html = read(two.out, 'report.html');
    for (const id of [
      'climate-table',
      'climate-frontier-table',
      'frontier-table-today',
      'frontier-table-wetter',
    ])
      expect(html).toContain(`id="${id}"`);
    expect(html).toMatch(/not a forecast or a projection/);
  });

  it('refuses repeated names and malformed --weather values in one line', () => {
    expectUserError(
      ['sweep', field, '--weather', `a=${today}`, '--weather', `A=${wetter}`],
      /--weather: climate name "A" is given twice/,
    );
    expectUserError(
      ['sweep', field, '--weather', today, '--weather', today],
      /"today" is given twice/,
    );
    expectUserError(
      ['sweep', field, '--weather', `=${today}`],
      /--weather expects FILE or NAME=FILE/,
    );
    expectUserError(['sweep', field, '--weather', 'wet='], /--weather expects FILE or NAME=FILE/);
    expectUserError(
      ['sweep', field, '--weather', `to day=${today}`],
      /climate name "to day" is not accepted/,
    );
    expectUserError(['sweep', field, '--weather', `x=${join(dir, 'missing.csv')}`], /missing\.csv/);
  });
});
