import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { cli, cliJson as json, expectUserError } from './harness.js';
import { readFieldFile } from '../../src/io/field.js';
import { parseProfile, parseSystem } from '../../src/io/system.js';

const tmp = mkdtempSync(join(tmpdir(), 'tileflux-system-'));
const DEMO = ['data-demo/system.yaml', '--profile', 'data-demo/profile.csv'];

afterAll(() => rmSync(tmp, { recursive: true, force: true }));

function csv(path: string): Array<Record<string, string>> {
  return parse(readFileSync(path, 'utf8'), { columns: true }) as Array<Record<string, string>>;
}

describe('tileflux system on the demo plan', () => {
  const out = join(tmp, 'plan');
  let summary: Record<string, unknown>;
  beforeAll(() => {
    summary = json(['system', ...DEMO, '--out', out, '--images']);
  }, 120_000);

  it('writes the tables, a profile chart per main (spec, SVG, PNG), the report and system.json', () => {
    // Dot files are the output folder's own marker (io/atomicOutput.ts writeDirAtomic).
    expect(
      readdirSync(out)
        .filter((f) => !f.startsWith('.'))
        .sort(),
    ).toEqual(
      ['charts', 'laterals.csv', 'profile.csv', 'reaches.csv', 'report.html', 'system.json'].sort(),
    );
    expect(readdirSync(join(out, 'charts')).sort()).toEqual(
      ['trunk', 'west']
        .flatMap((m) => ['png', 'svg', 'vl.json'].map((e) => `profile-${m}.${e}`))
        .sort(),
    );
    const png = readFileSync(join(out, 'charts', 'profile-trunk.png'));
    expect(png.subarray(1, 4).toString('ascii')).toBe('PNG');
    expect(summary.files).toEqual(expect.arrayContaining(['reaches.csv', 'report.html']));
  });

  it('without --images, charts/ holds the Vega-Lite specs alone', () => {
    const bare = join(tmp, 'plan-specs');
    json(['system', ...DEMO, '--out', bare]);
    expect(readdirSync(join(bare, 'charts')).sort()).toEqual([
      'profile-trunk.vl.json',
      'profile-west.vl.json',
    ]);
    // The spec is the one the run with images wrote.
    const spec = (dir: string) =>
      readFileSync(join(dir, 'charts', 'profile-trunk.vl.json'), 'utf8');
    expect(spec(bare)).toBe(spec(out));
  });

  it('reaches.csv: the outlet reach carries the whole drained area; accumulation holds along the tree', () => {
    const rows = csv(join(out, 'reaches.csv'));
    const area = (id: string) => Number(rows.find((r) => r.reach === id)!.drained_area_ha);
    // The demo plan by hand (data-demo/system.yaml): trunk laterals 3 x 20 x 190 m x 18 m
    // = 20.52 ha, 1.5 ha pothole, west 2 x 18 x 150 m x 18 m = 9.72 ha.
    expect(area('trunk-1')).toBeCloseTo(20.52 + 1.5 + 9.72, 3);
    expect(area('trunk-2')).toBeCloseTo(area('trunk-3') + area('west-1') + 6.84, 3);
    expect(area('west-1')).toBeCloseTo(9.72, 3);
    for (const r of rows) {
      // Selected size not smaller than required (rounding up); share used at most 100 %.
      expect(Number(r.selected_diameter_mm)).toBeGreaterThanOrEqual(
        Number(r.required_diameter_mm) - 1e-3,
      );
      expect(Number(r.capacity_used_percent)).toBeLessThanOrEqual(100 + 1e-9);
      if (r.grade_set_by !== 'fixed') expect(r.meets_min_grade).toBe('yes');
    }
  });

  it('profile.csv: cut = ground - invert at every station; the flags follow the settings', () => {
    const rows = csv(join(out, 'profile.csv'));
    const reaches = csv(join(out, 'reaches.csv'));
    for (const r of reaches) {
      const shallow = rows.filter((p) => p.reach === r.reach && p.flag === 'shallow').length;
      expect(r.trench_flag.includes('shallow')).toBe(shallow > 0);
    }
    expect(rows.length).toBeGreaterThan(10);
    for (const r of rows) {
      expect(Number(r.cut_m)).toBeCloseTo(
        Number(r.ground_elevation_m) - Number(r.invert_elevation_m),
        3,
      );
      const flagged = Number(r.cover_m) < 0.6 - 1e-4 || Number(r.cut_m) > 2.4 + 1e-4;
      expect(r.flag !== '').toBe(flagged);
    }
  });

  it('the report opens offline and carries the cautions', () => {
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).toContain("default-src 'none'");
    expect(html).not.toMatch(/<script[^>]+src=/);
    expect(html).toMatch(/licensed professional/);
    expect(html).toMatch(/Trenching is dangerous/);
    expect(html).toContain('data-chart="profile-trunk"');
    expect(html).toContain('id="reach-table"');
  });

  it('refuses to overwrite the folder without --force', () => {
    expectUserError(['system', ...DEMO, '--out', out], /already exists; use --force/);
  });

  it('--units us writes feet, inches, acres and ft3/s', () => {
    const us = join(tmp, 'plan-us');
    const r = cli(['system', ...DEMO, '--out', us, '--units', 'us', '--no-charts', '--no-report']);
    expect(r.status).toBe(0);
    const si = csv(join(out, 'reaches.csv'))[0];
    const row = csv(join(us, 'reaches.csv'))[0];
    expect(Number(row.length_ft)).toBeCloseTo(Number(si.length_m) / 0.3048, 3);
    expect(Number(row.drained_area_ac)).toBeCloseTo(Number(si.drained_area_ha) / 0.40468564224, 3);
    expect(Number(row.required_diameter_in)).toBeCloseTo(Number(si.required_diameter_mm) / 25.4, 3);
    expect(Number(row.effective_coefficient_in_d)).toBeCloseTo(
      Number(si.effective_coefficient_mm_d) / 25.4,
      3,
    );
    expect(row.design_flow_cfs).toBeDefined();
    expect(r.stdout).toMatch(/in\/d/);
  });

  it('--round down gives the smaller sizes and says what they cost', () => {
    const down = json([
      'system',
      ...DEMO,
      '--out',
      join(tmp, 'down'),
      '--round',
      'down',
      '--no-charts',
      '--no-report',
    ]);
    const up = summary.reaches as Array<Record<string, number>>;
    const reaches = down.reaches as Array<Record<string, number>>;
    reaches.forEach((r, i) => {
      expect(r.selected_diameter_mm).toBeLessThanOrEqual(up[i].selected_diameter_mm);
    });
    expect(reaches.some((r) => r.effective_coefficient_mm_d < 12.7)).toBe(true);
    expect((down.notes as string[]).join(' ')).toMatch(/Rounding down/);
  });
});

describe('tileflux system: user errors are one located line', () => {
  const write = (name: string, text: string) => {
    const p = join(tmp, name);
    writeFileSync(p, text);
    return p;
  };
  const base = `name: t\ncoefficient: 0.5 in/d\nmains:\n  - name: a\n    reaches:\n      - { length: 100 m, grade: 0.2 %, area: 2 ha }\n`;

  it('a misspelt key, with line and column and a suggestion', () => {
    const p = write('typo.yaml', base.replace('coefficient', 'coeficient'));
    expectUserError(
      ['system', p, '--out', join(tmp, 'x')],
      /line 2, column 1: unknown key "coeficient"; did you mean "coefficient"\?/,
    );
  });
  it('a tributary naming a main that does not exist, at its line', () => {
    const p = write(
      'join.yaml',
      base +
        `  - name: b\n    joins: { main: c, station: 100 m }\n    reaches: [{ length: 50 m, grade: 0.3 %, area: 1 ha }]\n`,
    );
    expectUserError(['system', p, '--out', join(tmp, 'x')], /line 8, .*no main is named "c"/);
  });
  it('a reach without a grade and no profile', () => {
    const p = write('nograde.yaml', base.replace('grade: 0.2 %, ', ''));
    expectUserError(['system', p, '--out', join(tmp, 'x')], /reach a-1 has no grade; .*--profile/);
  });
  it('a profile that does not cover the main', () => {
    const p = write('short.csv', 'main,station_m,elevation_m\na,0,10\na,50,10.2\n');
    const s = write('laid.yaml', base.replace('grade: 0.2 %, ', ''));
    expectUserError(
      ['system', s, '--profile', p, '--out', join(tmp, 'x')],
      /covers stations 0 to 50 m; the main needs station 100 m/,
    );
  });
  it('--out is required; --round takes up or down', () => {
    expectUserError(['system', 'data-demo/system.yaml'], /--out is required/);
    expectUserError(
      ['system', ...DEMO, '--out', join(tmp, 'y'), '--round', 'sideways'],
      /--round expects up or down/,
    );
    expect(existsSync(join(tmp, 'y'))).toBe(false);
  });
});

describe('profile CSV', () => {
  it('reads feet, sorts stations and rejects duplicates', () => {
    const p = parseProfile('main,station_ft,elevation_ft\na,100,11\na,0,10\n');
    expect([...p.get('a')!.stationsM]).toEqual([0, 30.48]);
    expect(p.get('a')!.elevationsM[1]).toBeCloseTo(11 * 0.3048, 12);
    expect(() => parseProfile('main,station_m,elevation_m\na,0,1\na,0,2\n', 'p.csv')).toThrowError(
      /p\.csv: line 3: station 0 m of main "a" is given twice \(also line 2\)/,
    );
    expect(() => parseProfile('main,station,elevation_m\n', 'p.csv')).toThrowError(
      /no station_m or station_ft column/,
    );
  });
});

describe('drains.system in a field file', () => {
  it('sets drains.capacity to the smallest coefficient from a lateral to the outlet', () => {
    const field = readFileSync('data-demo/field.yaml', 'utf8')
      .replace(
        /^ {2}(capacity|coefficient): .*$/m,
        `  system: ${join(process.cwd(), 'data-demo', 'system.yaml')}`,
      )
      .replace(/^scenarios:[\s\S]*$/m, '');
    const p = join(tmp, 'field.yaml');
    writeFileSync(p, field);
    const loaded = readFieldFile(p);
    const plan = parseSystem(readFileSync('data-demo/system.yaml', 'utf8'));
    expect(plan.file.profile).toBe('profile.csv');
    const summary = JSON.parse(readFileSync(join(tmp, 'plan', 'system.json'), 'utf8'));
    expect(loaded.base.drains.capacity).toBeCloseTo(summary.field_coefficient_mm_d, 9);
    // Never more than any lateral or reach on the way delivers.
    const reaches = summary.reaches as Array<{ effective_coefficient_mm_d: number | null }>;
    const least = Math.min(...reaches.map((r) => r.effective_coefficient_mm_d ?? Infinity));
    expect(loaded.base.drains.capacity!).toBeGreaterThanOrEqual(least - 1e-9);
  });
  it('is an error beside drains.capacity, or when the spacing differs from the laterals', () => {
    const text = readFileSync('data-demo/field.yaml', 'utf8');
    const sys = join(process.cwd(), 'data-demo', 'system.yaml');
    const both = join(tmp, 'both.yaml');
    writeFileSync(
      both,
      text.replace(/^ {2}(capacity|coefficient): .*$/m, `  capacity: 0.5 in/d\n  system: ${sys}`),
    );
    expect(() => readFieldFile(both)).toThrowError(
      /drains\.system: give drains\.system, drains\.capacity or drains\.pipe/,
    );
    const spaced = join(tmp, 'spaced.yaml');
    // The shallow scenario of the demo field sets 14 m, the plan's laterals are 18 m apart.
    writeFileSync(spaced, text.replace(/^ {2}(capacity|coefficient): .*$/m, `  system: ${sys}`));
    expect(() => readFieldFile(spaced)).toThrowError(
      /scenario shallow: drains\.system: the laterals of .* are 18 m apart and drains\.spacing is 14 m/,
    );
  });
});
