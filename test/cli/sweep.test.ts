import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
      const r = cli(['sweep', field, ...WEATHER, '--out', out, '--workers', k, '--seed', '4']);
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
