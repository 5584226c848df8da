import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatWeatherCsv } from '../../src/io/weather.js';
import { newYork, START, twinFieldText, twinObservations } from '../scenarios/twin.js';

// The CLI as a user runs it (dist/), on the twin of the New York record (test/scenarios/twin.ts):
// daily flow for known parameters and weekly well readings, with 10 % noise.
const CLI = join(process.cwd(), 'dist/cli/main.js');
let dir: string;

function tileflux(...args: string[]) {
  const r = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', cwd: dir });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  if (!existsSync(CLI)) execFileSync('npm', ['run', 'build'], { stdio: 'ignore' });
  dir = mkdtempSync(join(tmpdir(), 'tileflux-fit-'));
  const weather = newYork();
  writeFileSync(join(dir, 'weather.csv'), formatWeatherCsv(weather));
  const s = START;
  writeFileSync(
    join(dir, 'field.yaml'),
    twinFieldText(s.k, s.porosity, s.seepageConductance, s.capacity),
  );
  const obs = twinObservations(weather);
  const rows = ['date,drainflow_mm,water_table_depth_m,no3n_mg_l'];
  // Outlet flow as L/s from 10 ha as well: 1 mm/d over 10 ha = 100 m3/d = 1000/864 L/s.
  const rates = ['date,flow_l_s'];
  for (let i = 0; i < obs.dates.length; i++) {
    const q = obs.drainflowMm[i];
    const w = obs.waterTableDepthM[i];
    rows.push(`${obs.dates[i]},${q.toFixed(3)},${i % 7 === 0 ? w.toFixed(3) : ''},`);
    rates.push(`${obs.dates[i]},${((q * 1000) / 864).toFixed(5)}`);
  }
  writeFileSync(join(dir, 'obs.csv'), rows.join('\n') + '\n');
  writeFileSync(join(dir, 'rates.csv'), rates.join('\n') + '\n');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const quick = [
  'field.yaml',
  '--weather',
  'weather.csv',
  '--params',
  'soil.conductivity,soil.seepageConductance',
  '--calibrate',
  '2013-01-01..2014-12-31',
  '--validate',
  '2015-01-01..2015-12-31',
];

describe('tileflux fit', () => {
  it('writes fitted.yaml, fit.json, fit.csv, charts and report; fitted.yaml runs as it is', () => {
    const r = tileflux(
      'fit',
      ...quick,
      '--observed',
      'obs.csv',
      '--out',
      'a',
      '--workers',
      '2',
      '--images',
    );
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(
      /calibration 2013-01-01 to 2014-12-31:\n {2}drain flow \(730 days\): NSE/,
    );
    expect(r.stdout).toMatch(/validation 2015-01-01 to 2015-12-31:/);
    const doc = JSON.parse(readFileSync(join(dir, 'a/fit.json'), 'utf8'));
    expect(doc.parameters.map((p: { path: string }) => p.path)).toEqual([
      'soil.conductivity',
      'soil.seepageConductance',
    ]);
    expect(doc.calibration.drainflow.n_days).toBe(730);
    expect(doc.validation.drainflow.n_days).toBe(365);
    expect(doc.validation.water_table.n_days).toBe(52); // every 7th day of 2015
    expect(doc.calibration.drainflow.nse).toBeGreaterThan(0.9);
    expect(doc.rating_source).toMatch(/Moriasi et al. \(2015\)/);
    const fitted = readFileSync(join(dir, 'a/fitted.yaml'), 'utf8');
    const k = doc.parameters[0].best;
    expect(fitted).toMatch(/^# Fitted by tileflux .* fit against obs.csv on weather.csv/);
    expect(fitted).toContain(`conductivity: ${k} m/d # first guess`);
    expect(fitted).toMatch(/# Validation 2015-01-01 to 2015-12-31: drain flow NSE /);
    const csv = readFileSync(join(dir, 'a/fit.csv'), 'utf8').split('\n');
    expect(csv[0]).toBe(
      'date,period,observed_drainflow_mm,simulated_drainflow_mm,observed_water_table_depth_m,' +
        'simulated_water_table_depth_m,observed_no3n_mg_l',
    );
    expect(csv[1]).toMatch(/^2013-01-01,calibration,/);
    for (const c of ['hydrograph', 'scatter', 'duration', 'water-table', 'cumulative']) {
      for (const ext of ['vl.json', 'svg', 'png']) {
        expect(existsSync(join(dir, `a/charts/fit-${c}.${ext}`))).toBe(true);
      }
    }
    const html = readFileSync(join(dir, 'a/report.html'), 'utf8');
    expect(html).toContain('id="flow-statistics"');
    expect(html).toContain('licensed professional');
    expect(html).not.toMatch(/<script[^>]+src=/);
    const run = spawnSync(
      process.execPath,
      [
        CLI,
        'run',
        'a/fitted.yaml',
        '--weather',
        'weather.csv',
        '--out',
        'r',
        '--no-charts',
        '--no-report',
      ],
      { encoding: 'utf8', cwd: dir },
    );
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
  });

  it('workers or none, the same seed gives the same fit; --json prints fit.json', () => {
    const one = tileflux(
      'fit',
      ...quick,
      '--observed',
      'obs.csv',
      '--out',
      'b',
      '--workers',
      '0',
      '--json',
      '--no-charts',
      '--no-report',
    );
    expect(one.code).toBe(0);
    const a = JSON.parse(readFileSync(join(dir, 'a/fit.json'), 'utf8'));
    const b = JSON.parse(one.stdout);
    expect(b).toEqual({ ...a, workers: 0 });
  });

  it('flow rates with --area are read as the same flows in mm/d', () => {
    const r = tileflux('fit', ...quick, '--observed', 'rates.csv', '--area', '10 ha', '--out', 'c');
    expect(r.stderr).toBe('');
    const column = (f: string) =>
      readFileSync(join(dir, f), 'utf8')
        .trim()
        .split('\n')
        .slice(1)
        .map((l) => Number(l.split(',')[2]));
    const mm = column('a/fit.csv');
    const rates = column('c/fit.csv');
    expect(rates.length).toBe(mm.length);
    // 5 decimals of L/s from 10 ha resolve 0.0000086 mm/d; fit.csv rounds to 0.001 mm.
    rates.forEach((q, i) => expect(Math.abs(q - mm[i])).toBeLessThanOrEqual(0.001 + 1e-9));
  });

  it('user errors: one located line, exit 1, nothing written', () => {
    writeFileSync(join(dir, 'bad.csv'), 'date,drainflow_mm\n2013-01-01,1\n2013-01-02,-2\n');
    const bad = tileflux('fit', ...quick, '--observed', 'bad.csv', '--out', 'x');
    expect(bad.code).toBe(1);
    expect(bad.stderr).toBe(
      'tileflux: error: bad.csv line 3, column drainflow_mm: drain flow -2 mm/d is negative; it must be 0 or more\n',
    );
    writeFileSync(join(dir, 'late.csv'), 'date,drainflow_mm\n2015-12-31,1\n2016-01-01,1\n');
    const late = tileflux('fit', ...quick, '--observed', 'late.csv', '--out', 'x');
    expect(late.stderr).toMatch(
      /late.csv line 3, column date: date 2016-01-01 lies outside the weather record/,
    );
    const rate = tileflux('fit', ...quick, '--observed', 'rates.csv', '--out', 'x');
    expect(rate.stderr).toMatch(
      /column flow_l_s: flow_l_s is a flow rate \(L\/s\); give the drained area/,
    );
    const short = tileflux(
      'fit',
      'field.yaml',
      '--weather',
      'weather.csv',
      '--observed',
      'obs.csv',
      '--calibrate',
      '2013-01-01..2013-03-01',
      '--out',
      'x',
    );
    expect(short.stderr).toMatch(
      /the calibration period has observations on 60 days, spanning 60 days .* at least 90 days/,
    );
    expect(
      tileflux('fit', ...quick, '--observed', 'obs.csv', '--objective', 'mae', '--out', 'x').stderr,
    ).toBe('tileflux: error: --objective expects one of kge, nse, lognse, rmse; got mae\n');
    expect(existsSync(join(dir, 'x'))).toBe(false);
    const again = tileflux('fit', ...quick, '--observed', 'obs.csv', '--out', 'a');
    expect(again.stderr).toMatch(/output folder a already exists; use --force/);
  });

  it('--help lists the options with an example', () => {
    const h = tileflux('fit', '--help');
    expect(h.stdout).toMatch(/--observed <csv>/);
    expect(h.stdout).toMatch(/--params <list>/);
    expect(h.stdout).toMatch(
      /Examples:\n {2}tileflux fit field.yaml --weather weather.csv --observed outlet.csv/,
    );
  });
});
