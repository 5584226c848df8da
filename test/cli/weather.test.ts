import { describe, it, expect } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

// The built CLI (dist/cli/main.js), run as a user would; the global setup builds dist/ once per
// test run (test/support/buildOnce.ts).
const root = join(import.meta.dirname, '..', '..');
const main = join(root, 'dist', 'cli', 'main.js');
const vega = join(root, 'node_modules', 'vega-datasets', 'data', 'weather.csv');
const demo = join(root, 'data-demo', 'weather.csv');

function tileflux(...args: string[]) {
  const r = spawnSync(process.execPath, [main, ...args], { cwd: root, encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

const NY = [
  '--columns',
  'date=date,precip=precipitation,tmax=temp_max,tmin=temp_min',
  '--where',
  'location=New York',
];

/** Annual precipitation totals per year, by plain splitting (independent of the reader). */
function totalsByYear(
  text: string,
  keep: (cells: string[]) => boolean,
  dateCol: number,
  pCol: number,
) {
  const totals = new Map<string, number>();
  for (const line of text.trim().split('\n').slice(1)) {
    const c = line.split(',');
    if (!keep(c)) continue;
    const y = c[dateCol].slice(0, 4);
    totals.set(y, (totals.get(y) ?? 0) + Number(c[pCol]));
  }
  return [...totals.values()];
}

// Each run starts a Node process; on a busy machine that takes seconds, hence the long timeouts.
describe('tileflux weather check', { timeout: 120_000 }, () => {
  it('summarises the New York record of vega-datasets', () => {
    const r = tileflux('weather', 'check', vega, ...NY, '--json');
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    const j = JSON.parse(r.out);
    const totals = totalsByYear(readFileSync(vega, 'utf8'), (c) => c[0] === 'New York', 1, 2);
    expect(j.days).toBe(1461); // 2012-2015, calendar fact
    expect([j.first_date, j.last_date]).toEqual(['2012-01-01', '2015-12-31']);
    expect(j.filled_days).toBe(0);
    expect(j.complete_years).toBe(4);
    expect(Math.abs(j.precip_mean_mm_yr - totals.reduce((a, b) => a + b) / 4)).toBeLessThanOrEqual(
      0.005,
    );
    expect(Math.abs(j.precip_min_mm_yr - Math.min(...totals))).toBeLessThanOrEqual(0.005);
    expect(Math.abs(j.precip_max_mm_yr - Math.max(...totals))).toBeLessThanOrEqual(0.005);
    expect(j.ref_et_method).toBe('Hargreaves');
    expect(j.latitude_assumed).toBe(true);
    expect(j.snow_share_percent).toBeGreaterThan(0);
    expect(j.snow_share_percent).toBeLessThan(20);
  });

  it('prints a readable summary that says when the latitude was assumed', () => {
    const r = tileflux('weather', 'check', vega, ...NY);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/2012-01-01 to 2015-12-31, 1461 days, none filled/);
    expect(r.out).toMatch(/driest 902\.7 mm \(2013\), wettest 1289\.8 mm \(2014\)/); // plain sums of the raw file
    expect(r.out).toMatch(/Hargreaves \(FAO-56 Eq\. 52\) at latitude 42 deg, assumed/);
    const given = tileflux('weather', 'check', vega, ...NY, '--latitude', '40.8');
    expect(given.out).not.toMatch(/assumed/);
  });

  it('summarises the demo file', () => {
    const r = tileflux('weather', 'check', demo, '--latitude', '42', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    const totals = totalsByYear(readFileSync(demo, 'utf8'), () => true, 0, 1);
    expect(totals.length).toBe(30);
    expect(j.days).toBe(10958); // 1991-2020: 30 * 365 + 8 leap days
    expect(Math.abs(j.precip_mean_mm_yr - totals.reduce((a, b) => a + b) / 30)).toBeLessThanOrEqual(
      0.005,
    );
    // The invented site is meant to get 850 to 950 mm/yr with snowy winters.
    expect(j.precip_mean_mm_yr).toBeGreaterThan(850);
    expect(j.precip_mean_mm_yr).toBeLessThan(950);
    expect(j.snow_share_percent).toBeGreaterThan(5);
  });

  it.each([
    [
      'a missing file',
      ['weather', 'check', 'no-such.csv'],
      /cannot read weather file no-such\.csv: no such file/,
    ],
    [
      'a bad --columns',
      ['weather', 'check', vega, '--columns', 'rain'],
      /--columns expects VARIABLE=HEADER/,
    ],
    [
      'an unknown --where value',
      ['weather', 'check', vega, ...NY.slice(0, 2), '--where', 'location=Paris'],
      /no rows where location is "Paris"/,
    ],
    [
      'a bad latitude',
      ['weather', 'check', demo, '--latitude', '95'],
      /--latitude expects degrees from -90/,
    ],
    [
      'a bad unit flag',
      ['weather', 'check', demo, '--precip-unit', 'cm'],
      /--precip-unit expects mm or in/,
    ],
    ['make without --years', ['weather', 'make', '--seed', '1'], /--years is required/],
    [
      'make with a fractional seed',
      ['weather', 'make', '--years', '1', '--seed', '1.5'],
      /--seed expects a whole number/,
    ],
    [
      'make --json without --out',
      ['weather', 'make', '--years', '1', '--seed', '1', '--json'],
      /give --out FILE/,
    ],
  ])('rejects %s with one line on stderr and exit code 1', (_name, args, re) => {
    const r = tileflux(...args);
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    expect(r.err.trimEnd().split('\n')).toHaveLength(1);
    expect(r.err).toMatch(/^tileflux: error: /);
    expect(r.err).toMatch(re);
  });

  it('rejects each kind of bad file with its line and column', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tileflux-weather-'));
    const good =
      'date,precip_mm,tmax_c,tmin_c\n2024-05-01,1,20,10\n2024-05-02,0,22,11\n2024-05-03,3,18,9\n';
    const cases: Array<[string, string, RegExp]> = [
      [
        'gap',
        good.replace('2024-05-02', '2024-05-09').replace('2024-05-03', '2024-05-10'),
        /line 3, column date: dates jump/,
      ],
      [
        'dup',
        good.replace('2024-05-03', '2024-05-02'),
        /line 4, column date: date 2024-05-02 repeats line 3/,
      ],
      [
        'order',
        good.replace('2024-05-01', '2024-05-04'),
        /line 3, column date: date 2024-05-02 comes after/,
      ],
      ['number', good.replace('22,11', 'x,11'), /line 3, column tmax_c: "x" is not a number/],
      [
        'negative',
        good.replace('05-03,3', '05-03,-3'),
        /line 4, column precip_mm: precipitation -3 is negative/,
      ],
      ['tmin', good.replace('18,9', '18,19'), /line 4, column tmin_c: minimum temperature 19/],
      [
        'bounds',
        good.replace('20,10', '20,-999'),
        /line 2, column tmin_c: .*outside the physical range/,
      ],
      [
        'date',
        good.replace('2024-05-01', '05/01/2024'),
        /line 2, column date: "05\/01\/2024" is not a date/,
      ],
      ['columns', good.replace('tmax_c', 'tmax_k'), /line 1: no maximum temperature column/],
      ['empty', '', /line 1: the file is empty/],
      [
        'header',
        'date,precip_mm,tmax_c,tmin_c\r\n',
        /line 1: the file has a header but no data rows/,
      ],
    ];
    for (const [name, text, re] of cases) {
      const file = join(dir, `${name}.csv`);
      writeFileSync(file, text);
      const r = tileflux('weather', 'check', file);
      expect(r.code, name).toBe(1);
      expect(r.err.trimEnd().split('\n'), name).toHaveLength(1);
      expect(r.err, name).toContain(`${name}.csv line `);
      expect(r.err, name).toMatch(re);
    }
  });

  it('--fill fills a short gap and reports it', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tileflux-weather-'));
    const file = join(dir, 'gap.csv');
    writeFileSync(file, 'date,precip_mm,tmax_c,tmin_c\n2024-05-01,1,20,10\n2024-05-04,0,23,13\n');
    const j = JSON.parse(tileflux('weather', 'check', file, '--fill', '--json').out);
    expect([j.days, j.filled_days]).toEqual([4, 2]);
  });
});

describe('tileflux weather check --units us', { timeout: 120_000 }, () => {
  it('prints precipitation in inches and temperatures in degF (1 in = 25.4 mm; F = 9/5 C + 32)', () => {
    const j = JSON.parse(tileflux('weather', 'check', vega, ...NY, '--json').out);
    const r = tileflux('weather', 'check', vega, ...NY, '--units', 'us');
    expect(r.code).toBe(0);
    const inches = (j.precip_mean_mm_yr / 25.4).toFixed(2);
    expect(r.out).toContain(`precipitation  ${inches} in/yr`);
    expect(r.out).toContain(`driest ${(j.precip_min_mm_yr / 25.4).toFixed(2)} in`);
    // The degree-day snow threshold of 1 degC is 33.8 degF.
    expect(r.out).toContain('daily mean of 33.8 degF or below');
    const summary = r.out.split('\n').slice(3).join('\n');
    expect(summary).not.toMatch(/\bmm\b|degC/);
  });

  it('compares two records in inches and degF, the monthly figures converted', () => {
    const si = tileflux('weather', 'check', '--compare', demo, demo);
    const us = tileflux('weather', 'check', '--compare', demo, demo, '--units', 'us');
    expect(us.code, us.err).toBe(0);
    const jan = (t: string) =>
      t
        .split('\n')
        .find((l) => l.startsWith('Jan'))!
        .trim()
        .split(/\s+/);
    const [, pA, , , , tA] = jan(si.out);
    const [, pAus, , , , tAus] = jan(us.out);
    expect(Number(pAus)).toBeCloseTo(Number(pA) / 25.4, 1);
    expect(Number(tAus)).toBeCloseTo((Number(tA) * 9) / 5 + 32, 0);
    expect(us.out).not.toMatch(/\bmm\b|degC/);
  });
});

describe('tileflux weather make', { timeout: 120_000 }, () => {
  it('regenerates the demo file byte for byte (data-demo/README.md gives the command)', () => {
    const r = tileflux('weather', 'make', '--years', '30', '--seed', '7');
    expect(r.code).toBe(0);
    expect(r.out === readFileSync(demo, 'utf8')).toBe(true);
  });

  it('writes a file, refuses to overwrite it without --force, and summarises it as JSON', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tileflux-weather-'));
    const out = join(dir, 'w.csv');
    const first = tileflux(
      'weather',
      'make',
      '--years',
      '2',
      '--seed',
      '3',
      '--start-year',
      '2001',
      '--out',
      out,
    );
    expect(first.code).toBe(0);
    expect(first.out).toMatch(
      /Wrote .*w\.csv: synthetic weather of an invented site, 2001-01-01 to 2002-12-31/,
    );
    const again = tileflux('weather', 'make', '--years', '2', '--seed', '3', '--out', out);
    expect(again.code).toBe(1);
    expect(again.err).toMatch(/already exists; use --force/);
    const forced = tileflux(
      'weather',
      'make',
      '--years',
      '2',
      '--seed',
      '4',
      '--start-year',
      '2001',
      '--out',
      out,
      '--force',
      '--json',
    );
    expect(forced.code).toBe(0);
    const j = JSON.parse(forced.out);
    expect([j.days, j.seed, j.first_date]).toEqual([730, 4, '2001-01-01']);
    const check = JSON.parse(tileflux('weather', 'check', out, '--json').out);
    expect(check.precip_mean_mm_yr).toBe(j.precip_mean_mm_yr);
  });

  it('moves the seasons for a southern latitude', () => {
    const csv = tileflux(
      'weather',
      'make',
      '--years',
      '20',
      '--seed',
      '5',
      '--latitude',
      '-35',
    ).out;
    const mean = (month: string) => {
      const v = csv
        .split('\n')
        .filter((l) => l.slice(5, 7) === month)
        .map((l) => Number(l.split(',')[2]));
      return v.reduce((a, b) => a + b, 0) / v.length;
    };
    expect(mean('01')).toBeGreaterThan(mean('07') + 20);
  });
});

describe('tileflux weather: public formats, fitted generator, deltas, comparison', () => {
  const fixtures = join(root, 'test', 'io', 'fixtures');
  it('reads a Daymet table and a GHCN-Daily export, detected from the header', () => {
    const d = tileflux('weather', 'check', join(fixtures, 'daymet.csv'), '--json');
    expect(d.code).toBe(0);
    const dj = JSON.parse(d.out);
    expect(dj.format).toBe('daymet');
    expect(dj.days).toBe(6); // 28 Dec 2024 to 2 Jan 2025 with the filled 31 December
    const g = tileflux(
      'weather',
      'check',
      join(fixtures, 'ghcn-wide-metric.csv'),
      '--station',
      'XX000000002',
      '--export-units',
      'metric',
      '--json',
    );
    expect(g.code).toBe(0);
    expect(JSON.parse(g.out)).toMatchObject({ format: 'ghcn', days: 2 });
    const bad = tileflux('weather', 'check', join(fixtures, 'daymet.csv'), '--format', 'csv');
    expect(bad.code).toBe(1);
    expect(bad.err).toMatch(/--format expects one of auto, tileflux, ghcn, daymet/);
  });

  it('make --like with deltas names the climate, and check --compare shows both', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tileflux-like-'));
    const out = join(dir, 'future.csv');
    const m = tileflux(
      ...['weather', 'make', '--like', demo, '--years', '30', '--seed', '3'],
      ...['--precip-change', '+10%', '--temp-change', '+2C', '--out', out, '--json'],
    );
    expect(m.code).toBe(0);
    const j = JSON.parse(m.out);
    expect(j.climate).toMatch(
      /fitted to weather.csv .*precipitation intensity \+10%, temperature \+2 degC \(delta change\)/,
    );
    const c = tileflux('weather', 'check', '--compare', demo, out, '--json');
    expect(c.code).toBe(0);
    const cj = JSON.parse(c.out);
    expect(cj.a.tmax_month_c).toHaveLength(12);
    // +2 degC on every month of a fitted climate: July mean Tmax about 2 degC warmer (30 years
    // of sampling noise on each side, so within 0.6 degC).
    expect(Math.abs(cj.b.tmax_month_c[6] - cj.a.tmax_month_c[6] - 2)).toBeLessThan(0.6);
  });
});
