import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

// The CLI as a user runs it: the built dist/ (built once per test run by test/support/buildOnce.ts).
const CLI = join(process.cwd(), 'dist/cli/main.js');
const FIELD = 'data-demo/field.yaml';
const WEATHER = 'data-demo/weather.csv';
let dir: string;

function tileflux(...args: string[]) {
  const r = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** `run` on the demo files for whole years, tables only (fast), into `out`. */
function quickRun(fromYear: number, toYear: number, out: string, ...extra: string[]) {
  return tileflux('run', ...quickArgs(fromYear, toYear, out), ...extra);
}
function quickArgs(fromYear: number, toYear: number, out: string): string[] {
  return [
    FIELD,
    '--weather',
    WEATHER,
    '--from',
    `${fromYear}-01-01`,
    '--to',
    `${toYear}-12-31`,
    '--out',
    out,
    '--no-charts',
    '--no-report',
  ];
}

beforeAll(() => {
  if (!existsSync(CLI)) execFileSync('npm', ['run', 'build'], { stdio: 'ignore' });
  dir = mkdtempSync(join(tmpdir(), 'tileflux-run-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('tileflux run', () => {
  it('writes daily.csv, annual.csv and summary.json; same inputs give byte-identical files', () => {
    const a = join(dir, 'a');
    const b = join(dir, 'b');
    const r1 = quickRun(2001, 2005, a);
    expect(r1.stderr).toBe('');
    expect(r1.code).toBe(0);
    expect(r1.stdout).toMatch(/conventional/);
    expect(quickRun(2001, 2005, b).code).toBe(0);
    for (const f of ['daily.csv', 'annual.csv', 'summary.json']) {
      expect(readFileSync(join(a, f)).equals(readFileSync(join(b, f)))).toBe(true);
    }
    const daily = readFileSync(join(a, 'daily.csv'), 'utf8').trim().split('\n');
    expect(daily[0]).toMatch(
      /^scenario,date,precip_mm,.*drainflow_mm,.*water_table_depth_m,outlet_depth_m,ponded_mm/,
    );
    expect(daily.length).toBe(1 + 3 * 1826); // 3 scenarios x 5 years (2004 a leap year)
    const annual = readFileSync(join(a, 'annual.csv'), 'utf8').trim().split('\n');
    expect(annual.length).toBe(1 + 3 * 5);
  });

  it('refuses to overwrite an existing folder without --force, and writes nothing half', () => {
    const out = join(dir, 'keep');
    const args = quickArgs(2001, 2001, out);
    expect(tileflux('run', ...args).code).toBe(0);
    const before = readFileSync(join(out, 'summary.json'));
    const r = tileflux('run', ...args);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/already exists; use --force/);
    expect(readFileSync(join(out, 'summary.json')).equals(before)).toBe(true);
    expect(tileflux('run', ...args, '--force').code).toBe(0);
  });

  it('--json prints the summary alone on stdout', () => {
    const r = quickRun(2001, 2002, join(dir, 'j'), '--json');
    expect(r.code).toBe(0);
    const s = JSON.parse(r.stdout);
    expect(s.scenarios.map((x: { name: string }) => x.name)).toEqual([
      'conventional',
      'shallow',
      'controlled',
    ]);
    expect(s.scenarios[0].annual_mean).toHaveProperty('drainflow_mm');
  });

  it('--units us writes inches and pounds per acre', () => {
    const out = join(dir, 'us');
    const r = quickRun(2001, 2001, out, '--units', 'us');
    expect(r.code).toBe(0);
    const si = join(dir, 'si');
    quickRun(2001, 2001, si);
    const parse = (p: string) => {
      const [h, row] = readFileSync(p, 'utf8').trim().split('\n');
      const hs = h.split(',');
      const vs = row.split(',');
      return Object.fromEntries(hs.map((k, i) => [k, vs[i]]));
    };
    const u = parse(join(out, 'annual.csv'));
    const m = parse(join(si, 'annual.csv'));
    // 1 in = 25.4 mm; 1 kg/ha = 0.892179 lb/ac (NIST Handbook 44, App. C).
    expect(Number(u.drainflow_in)).toBeCloseTo(Number(m.drainflow_mm) / 25.4, 3);
    expect(Number(u.no3n_load_lb_ac)).toBeCloseTo(Number(m.no3n_load_kg_ha) * 0.892179, 3);
  });

  const bad: Array<[string, string[], RegExp]> = [
    [
      'missing field file',
      ['nope.yaml', '--weather', WEATHER],
      /cannot read field file nope\.yaml: no such file or folder/,
    ],
    [
      'bad date',
      [FIELD, '--weather', WEATHER, '--from', '2001/01/01'],
      /--from expects a real calendar date YYYY-MM-DD such as 2015-01-01; got 2001\/01\/01/,
    ],
    [
      'date outside the record',
      [FIELD, '--weather', WEATHER, '--from', '1900-01-01'],
      /outside the weather record/,
    ],
    [
      'unknown scenario',
      [FIELD, '--weather', WEATHER, '--scenario', 'deep'],
      /--scenario deep is not defined; the field has conventional, shallow, controlled/,
    ],
    ['bad units', [FIELD, '--weather', WEATHER, '--units', 'imperial'], /--units expects si or us/],
  ];
  for (const [what, args, want] of bad) {
    it(`bad input: ${what} gives one clear line and exit code 1`, () => {
      const r = tileflux('run', ...args, '--out', join(dir, 'never'));
      expect(r.code).toBe(1);
      expect(r.stderr).toMatch(want);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(existsSync(join(dir, 'never'))).toBe(false);
    });
  }

  it('a malformed field file names the line', () => {
    const f = join(dir, 'bad.yaml');
    writeFileSync(f, readFileSync(FIELD, 'utf8').replace('spacing: 18 m', 'spacing: 18 m/d'));
    const r = tileflux('run', f, '--weather', WEATHER, '--out', join(dir, 'never'));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/bad\.yaml: line \d+, column \d+: drains\.spacing expects a length/);
  });
});

describe('tileflux init', () => {
  it('writes a starter that tileflux itself accepts, and refuses to overwrite it', () => {
    const f = join(dir, 'starter.yaml');
    expect(tileflux('init', f).code).toBe(0);
    const r = tileflux(
      'run',
      f,
      '--weather',
      WEATHER,
      '--from',
      '2001-01-01',
      '--to',
      '2001-12-31',
      '--out',
      join(dir, 'starter-run'),
      '--no-charts',
      '--no-report',
    );
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const again = tileflux('init', f);
    expect(again.code).toBe(1);
    expect(again.stderr).toMatch(/already exists; use --force/);
  });
});
