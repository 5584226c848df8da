import { describe, expect, it } from 'vitest';
import { cli, cliJson as json, expectUserError } from './harness.js';
import { inchD, M3S_PER_CFS as CFS, manningQ } from '../drainage/reference.js';

// Manning's SI form and the inch design formula, evaluated independently: ../drainage/reference.ts.

const LATERAL = ['size', '--length', '400', '--spacing', '20', '--slope', '0.2 %'];

describe('tileflux size', () => {
  it('--json: a 400 m x 20 m lateral at 1/2 in/d on 0.2 % (drainage coefficient, common practice)', () => {
    const out = json([...LATERAL, '--coefficient', '0.5 in/d']);
    const q = (400 * 20 * 0.0127) / 86400; // area x rate, m3/s
    expect(out.flow_m3_s).toBeCloseTo(q, 12);
    expect(out.flow_cfs).toBeCloseTo(q / CFS, 12);
    expect(out.roughness).toBe(0.015);
    // Required diameter by the inch design formula, to the rounding of its 16 (0.1 %).
    expect(Math.abs(out.required_diameter_in / inchD(q / CFS, 0.002, 0.015) - 1)).toBeLessThan(
      2e-3,
    );
    // Field laterals are 3 to 6 in tubing in common practice.
    expect(out.selected_diameter_in).toBeGreaterThanOrEqual(3);
    expect(out.selected_diameter_in).toBeLessThanOrEqual(6);
    // Next size up (common practice): the one below is too small, the one chosen is not.
    const sizes = [3, 4, 5, 6, 8, 10, 12, 15, 18, 24];
    const i = sizes.indexOf(out.selected_diameter_in);
    expect(sizes[i] * 25.4).toBeGreaterThanOrEqual(out.required_diameter_mm);
    if (i > 0) expect(sizes[i - 1] * 25.4).toBeLessThan(out.required_diameter_mm);
    expect(out.selected_capacity_m3_s).toBeCloseTo(manningQ(sizes[i] * 0.0254, 0.002, 0.015), 12);
    expect(out.full_flow_velocity_m_s).toBeCloseTo(
      out.selected_capacity_m3_s / ((Math.PI * (sizes[i] * 0.0254) ** 2) / 4),
      12,
    );
    // Minimum grade: the grade at which the selected pipe reaches 1.4 ft/s flowing full.
    const v = 1.4 * 0.3048;
    const D = sizes[i] * 0.0254;
    const grade = Math.pow((v * 0.015) / Math.pow(D / 4, 2 / 3), 2);
    expect(out.min_grade_percent).toBeCloseTo(grade * 100, 10);
  });

  it('metric list gives selected_diameter_mm; smooth pipe uses n = 0.012', () => {
    const out = json([
      'size',
      '--area',
      '16',
      '--coefficient',
      '12',
      '--slope',
      '0.1 %',
      '--material',
      'smooth',
      '--sizes',
      'mm',
    ]);
    expect(out.roughness).toBe(0.012);
    expect(out.selected_diameter_mm).toBeGreaterThanOrEqual(out.required_diameter_mm);
    expect(out.selected_diameter_in).toBeUndefined();
  });

  it('a custom list and an explicit roughness', () => {
    const out = json([
      'size',
      '--area',
      '40 ac',
      '--coefficient',
      '0.5 in/d',
      '--slope',
      '0.1 %',
      '--sizes',
      '6,8,10,12,14 in',
      '--roughness',
      '0.02',
    ]);
    // js-quantities defines the acre to 9 significant digits (4046.85642 m2).
    expect(out.area_ha).toBeCloseTo(40 * 0.40468564224, 6);
    expect(out.roughness).toBe(0.02);
    expect([6, 8, 10, 12, 14]).toContain(out.selected_diameter_in);
  });

  it('--coefficient uses the middle of the tabulated range: mineral field none = 7/16 in/d (common practice, from memory)', () => {
    const out = json([...LATERAL, '--coefficient', 'mineral field none']);
    const byRate = json([...LATERAL, '--coefficient', `${7 / 16} in/d`]);
    expect(out.rate_mm_d).toBeCloseTo((7 / 16) * 25.4, 12);
    expect(out.flow_m3_s).toBeCloseTo(byRate.flow_m3_s, 15);
    expect(out.selected_diameter_in).toBe(byRate.selected_diameter_in);
    expect(out.coefficient).toMatchObject({
      soil: 'mineral',
      crop: 'field',
      inlets: 'none',
      low_mm_d: expect.closeTo(9.525, 9),
      high_mm_d: expect.closeTo(12.7, 9),
    });
    const r = cli([...LATERAL, '--coefficient', 'organic truck open']);
    expect(r.stdout).toMatch(
      /2\.7500 in\/d = 69\.85 mm\/d \(organic soil, truck crops, inlets open/,
    );
  });

  it('human output: inputs as given, result, method and caution; --units us', () => {
    const r = cli([...LATERAL, '--coefficient', '0.375 in/d']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('400 m x 20 m = 0.800 ha');
    expect(r.stdout).toContain('0.375 in/d = 9.53 mm/d');
    expect(r.stdout).toMatch(/selected size\s+\d+ in/);
    expect(r.stdout).toContain("Manning's equation");
    expect(r.stdout).toContain('Planning estimate');
    const us = cli([...LATERAL, '--coefficient', '0.375 in/d', '--units', 'us']);
    expect(us.stdout).toMatch(/design flow\s+0\.0\d+ cfs/);
    expect(us.stdout).toMatch(/ft\/s/);
  });
});

describe('tileflux size rejects bad input with one line and exit code 1', () => {
  const cases: Array<[string, string[], RegExp]> = [
    [
      'zero slope',
      [...LATERAL.slice(0, 5), '--slope', '0 %', '--coefficient', '10'],
      /--slope must be greater than 0/,
    ],
    [
      'negative slope',
      [...LATERAL.slice(0, 5), '--slope', '-0.1 %', '--coefficient', '10'],
      /--slope must be greater than 0/,
    ],
    [
      'flow beyond the largest size',
      ['size', '--area', '2000', '--coefficient', '25', '--slope', '0.1 %'],
      /larger than the largest size in --sizes \(24 in\)/,
    ],
    [
      'area and lateral both',
      ['size', '--area', '10', '--length', '400', '--coefficient', '10', '--slope', '0.1 %'],
      /either --area, or --length with --spacing/,
    ],
    [
      'lateral without spacing',
      ['size', '--length', '400', '--coefficient', '10', '--slope', '0.1 %'],
      /--length needs --spacing/,
    ],
    ['no area', ['size', '--coefficient', '10', '--slope', '0.1 %'], /give the drained area/],
    [
      'no rate',
      ['size', '--area', '1', '--slope', '0.1 %'],
      /give the drainage coefficient: --coefficient/,
    ],
    [
      'rate and coefficient',
      ['size', '--area', '1', '--slope', '0.1 %', '--rate', '10', '--coefficient', 'organic'],
      /--rate is the former name of --coefficient; give only --coefficient/,
    ],
    [
      'unknown coefficient word',
      ['size', '--area', '1', '--slope', '0.1 %', '--coefficient', 'sandy'],
      /--coefficient: does not know "sandy"/,
    ],
    [
      'roughness and material',
      [
        'size',
        '--area',
        '1',
        '--coefficient',
        '10',
        '--slope',
        '0.1 %',
        '--roughness',
        '0.013',
        '--material',
        'smooth',
      ],
      /--roughness or --material, not both/,
    ],
    [
      'unknown material',
      ['size', '--area', '1', '--coefficient', '10', '--slope', '0.1 %', '--material', 'steel'],
      /--material expects corrugated or smooth/,
    ],
    [
      'sizes out of order',
      ['size', '--area', '1', '--coefficient', '10', '--slope', '0.1 %', '--sizes', '8,6'],
      /--sizes accepts .* increasing order/,
    ],
    [
      'velocity not a speed',
      ['size', '--area', '1', '--coefficient', '10', '--slope', '0.1 %', '--velocity', '2 kg'],
      /--velocity expects a velocity/,
    ],
  ];
  for (const [what, args, message] of cases) it(what, () => expectUserError(args, message));
});

describe('tileflux size --help', () => {
  it('teaches with examples and carries the caution', () => {
    const r = cli(['size', '--help']);
    expect(r.stdout).toContain('tileflux size --length 400 --spacing 20');
    expect(r.stdout).toContain('Planning estimate');
  });
});
