import { describe, expect, it } from 'vitest';
import { cli, cliJson as json, expectUserError } from './harness.js';
import { gloverSeriesRatio, hooghoudtQ, vdmwDepth as vdmwD } from '../drainage/reference.js';

// Hooghoudt's equation, the vdMW series and the Glover-Dumm series, evaluated independently:
// ../drainage/reference.ts.

const layout = (barrier: string) => [
  'spacing',
  '--conductivity',
  '0.5',
  '--drain-depth',
  '1.2',
  '--restrictive-layer-depth',
  barrier,
  // The references below are for a 0.1 m radius (a drain in a gravel envelope), given here
  // rather than left to the default.
  '--radius',
  '0.1',
];
const STEADY = layout('3.2');

describe('tileflux spacing (steady state)', () => {
  it('--json: the spacing discharges the rate by Hooghoudt with the series d', () => {
    const out = json([...STEADY, '--water-table', '0.5', '--coefficient', '7']);
    expect(out.head_m).toBeCloseTo(0.7, 12);
    expect(out.rate_mm_d).toBe(7);
    const d = vdmwD(out.spacing_m, 2, 0.1);
    expect(out.equivalent_depth_m).toBeCloseTo(d, 9);
    expect(hooghoudtQ(0.5, 0.5, d, 0.7, out.spacing_m) * 1000).toBeCloseTo(7, 8);
    // Drainage intensity: the same equation with the water table at the surface (h = 1.2 m).
    expect(out.drainage_intensity_mm_d).toBeCloseTo(
      hooghoudtQ(0.5, 0.5, d, 1.2, out.spacing_m) * 1000,
      8,
    );
    expect(out.ponded_rate_mm_d).toBeGreaterThan(0);
  });

  it('takes unit strings and converts them once (1 in = 25.4 mm, 1 ft = 0.3048 m, exact)', () => {
    const a = json([
      'spacing',
      '--conductivity',
      '2 cm/h',
      '--drain-depth',
      '4 ft',
      '--restrictive-layer-depth',
      '10 ft',
      '--water-table',
      '12 in',
      '--coefficient',
      '0.375 in/d',
    ]);
    const b = json([
      'spacing',
      '--conductivity',
      String(0.02 * 24),
      '--drain-depth',
      String(4 * 0.3048),
      '--restrictive-layer-depth',
      String(10 * 0.3048),
      '--water-table',
      String(0.3048),
      '--coefficient',
      String(0.375 * 25.4),
    ]);
    expect(a.spacing_m).toBeCloseTo(b.spacing_m, 9);
  });

  it('--units us echoes every input in feet and inches per day, defaults too (1 ft = 0.3048 m)', () => {
    const r = cli([
      'spacing',
      '--conductivity',
      '3 ft/d',
      '--drain-depth',
      '4 ft',
      '--restrictive-layer-depth',
      '2.5 m',
      '--water-table',
      '1 ft',
      '--coefficient',
      '0.5 in/d',
      '--units',
      'us',
    ]);
    expect(r.status).toBe(0);
    const inputs = r.stdout.split('Result')[0];
    expect(inputs).toMatch(/conductivity above drains\s+3 ft\/d\n/);
    // 2.5 / 0.3048 = 8.202 ft; 8.202 - 4 = 4.20 ft of layer below the drains.
    expect(inputs).toContain('2.5 m = 8.202 ft (4.20 ft below the drains)');
    // The default radius 0.05 m = 0.164 ft.
    expect(inputs).toContain('0.164 ft (default)');
    expect(inputs).not.toMatch(/\d (m|mm)(\/d)?\b(?! =)/);
  });

  it('an input given in the unit shown is echoed once, not "1 m/d = 1.000 m/d"', () => {
    const r = cli([
      'spacing',
      '--conductivity',
      '1 m/d',
      '--drain-depth',
      '1.2 m',
      '--restrictive-layer-depth',
      '2.5 m',
      '--water-table',
      '0.3 m',
      '--coefficient',
      '12 mm/d',
    ]);
    expect(r.stdout).toMatch(/drain depth\s+1\.2 m\n/);
    expect(r.stdout).not.toMatch(/(\d+(\.\d+)?) (m|m\/d|mm\/d) = /);
  });

  it('human output echoes the inputs as given, the result, the method and the caution', () => {
    const r = cli([...STEADY, '--water-table', '20 in', '--coefficient', '0.3 in/d']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('20 in = 0.508 m');
    expect(r.stdout).toContain('0.3 in/d = 7.62 mm/d');
    expect(r.stdout).toMatch(/spacing\s+\d+\.\d m/);
    expect(r.stdout).toContain('Hooghoudt (1940)');
    expect(r.stdout).toContain('van der Molen & Wesseling (1991)');
    expect(r.stdout).toContain('Planning estimate');
  });

  it('--units us prints feet and inches per day', () => {
    const r = cli([...STEADY, '--water-table', '0.5', '--coefficient', '7', '--units', 'us']);
    const si = json([...STEADY, '--water-table', '0.5', '--coefficient', '7']);
    expect(r.stdout).toContain(`${(si.spacing_m / 0.3048).toFixed(1)} ft`);
    expect(r.stdout).toMatch(/\d in\/d with the water table at the surface/);
  });

  it('--equivalent-depth moody is used and named', () => {
    const r = cli([
      ...STEADY,
      '--water-table',
      '0.5',
      '--coefficient',
      '7',
      '--equivalent-depth',
      'moody',
    ]);
    expect(r.stdout).toContain('Moody (1966)');
  });
});

describe('tileflux spacing --transient (Glover-Dumm)', () => {
  const T = [...STEADY, '--transient', '--drainable-porosity', '5 %', '--from', '0', '--to', '0.3'];
  it('--json: the spacing lowers the midpoint head to the ratio asked in the time given', () => {
    const out = json([...T, '--days', '2']);
    expect(out.initial_head_m).toBeCloseTo(1.2, 12);
    expect(out.final_head_m).toBeCloseTo(0.9, 12);
    // Glover-Dumm series for a flat initial water table (Ritzema 1994 ch. 8), D = d + h0/2.
    const D = vdmwD(out.spacing_m, 2, 0.1) + 1.2 / 2;
    const y = (Math.PI ** 2 * 0.5 * D * 2) / (0.05 * out.spacing_m ** 2);
    expect(gloverSeriesRatio(y, 5000)).toBeCloseTo(0.75, 9);
    expect(out.average_flow_depth_m).toBeCloseTo(D, 9);
  });
  it('a longer time allows a wider spacing', () => {
    expect(json([...T, '--days', '4']).spacing_m).toBeGreaterThan(
      json([...T, '--days', '2']).spacing_m,
    );
  });
});

describe('tileflux spacing rejects bad input with one line and exit code 1', () => {
  const cases: Array<[string, string[], RegExp]> = [
    [
      'barrier above the drains',
      [...layout('1'), '--water-table', '0.5', '--coefficient', '7'],
      /--restrictive-layer-depth .* must be deeper than --drain-depth/,
    ],
    [
      'water table above the surface',
      [...STEADY, '--water-table', '-0.1', '--coefficient', '7'],
      /--water-table .* above the surface/,
    ],
    [
      'water table below the drains',
      [...STEADY, '--water-table', '1.3', '--coefficient', '7'],
      /--water-table .* shallower than --drain-depth/,
    ],
    [
      'radius as large as the layer',
      [...layout('1.25'), '--water-table', '0.5', '--coefficient', '7'],
      /--radius .* smaller than the layer/,
    ],
    ['missing rate', [...STEADY, '--water-table', '0.5'], /--coefficient is required/],
    [
      'zero rate',
      [...STEADY, '--water-table', '0.5', '--coefficient', '0'],
      /--coefficient must be greater than 0/,
    ],
    [
      'wrong unit',
      [...STEADY, '--water-table', '0.5', '--coefficient', '7 m'],
      /--coefficient expects a rate/,
    ],
    [
      'unknown method',
      [...STEADY, '--water-table', '0.5', '--coefficient', '7', '--equivalent-depth', 'x'],
      /--equivalent-depth expects vdmw or moody/,
    ],
    [
      'mixed modes',
      [...STEADY, '--water-table', '0.5', '--coefficient', '7', '--days', '2'],
      /--days applies only with --transient/,
    ],
    [
      'water table rising',
      [
        ...STEADY,
        '--transient',
        '--drainable-porosity',
        '0.05',
        '--from',
        '0.4',
        '--to',
        '0.3',
        '--days',
        '2',
      ],
      /--to .* deeper than --from/,
    ],
    [
      'porosity out of range',
      [
        ...STEADY,
        '--transient',
        '--drainable-porosity',
        '1.5',
        '--from',
        '0',
        '--to',
        '0.3',
        '--days',
        '2',
      ],
      /--drainable-porosity must be a fraction/,
    ],
  ];
  for (const [what, args, message] of cases) it(what, () => expectUserError(args, message));
});

describe('tileflux spacing --help', () => {
  it('teaches with an example of each mode and carries the caution', () => {
    const r = cli(['spacing', '--help']);
    expect(r.stdout).toContain('tileflux spacing --conductivity 0.5 --drain-depth 1.2');
    expect(r.stdout).toContain('tileflux spacing --transient');
    expect(r.stdout).toContain('Planning estimate');
  });
});

describe('former flag names', () => {
  it('still work, with a warning naming the new flag, and give the same spacing', () => {
    const now = cli([...STEADY, '--water-table', '0.5', '--coefficient', '7', '--json']);
    const old = cli([
      'spacing',
      '--k',
      '0.5',
      '--drain-depth',
      '1.2',
      '--barrier-depth',
      '3.2',
      '--radius',
      '0.1',
      '--water-table',
      '0.5',
      '--rate',
      '7',
      '--json',
    ]);
    expect(old.status).toBe(0);
    expect(old.stdout).toBe(now.stdout);
    expect(old.stderr).toContain('--k is now --conductivity');
    expect(old.stderr).toContain('--barrier-depth is now --restrictive-layer-depth');
    expect(old.stderr).toContain('--rate is now --coefficient');
  });
});
