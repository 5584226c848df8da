// The bad-input catalogue: each input a user could get wrong, with the first (and only) error
// line tileflux must answer with. Rule for all of them: one line saying what is wrong, where
// (file, line, column, key or option) and what is accepted; exit code 1; no stack trace;
// nothing written.
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { cli, expectUserError } from './harness.js';

const dir = mkdtempSync(join(tmpdir(), 'tileflux-bad-input-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const weather = join(import.meta.dirname, '..', '..', 'data-demo', 'weather.csv');

/** A valid field file, with `soil` lines and extra top-level YAML added. */
function field(name: string, extra = '', soil = ''): string {
  const path = join(dir, `${name}.yaml`);
  writeFileSync(
    path,
    'name: Catalogue field\n' +
      'soil:\n  conductivity: 0.9 m/d\n  restrictiveLayerDepth: 2.2 m\n' +
      soil +
      'drains:\n  depth: 1.1 m\n  spacing: 18 m\n' +
      extra,
  );
  return path;
}

/** `run` of a field file into a folder of the catalogue's own. */
const run = (file: string, ...more: string[]) => [
  'run',
  file,
  '--weather',
  weather,
  '--out',
  join(dir, 'out'),
  '--no-charts',
  '--no-report',
  ...more,
];

interface Case {
  what: string;
  args: () => string[];
  first: RegExp;
}

const cases: Case[] = [
  // Soil: a zero drainable porosity makes a millimetre of recharge raise the water table without
  // bound (the engine once looped for minutes on it); it is refused at the key.
  {
    what: 'drainable porosity 0 (one value)',
    args: () => run(field('por0', '', '  drainablePorosity: 0\n')),
    first: /por0\.yaml: line 5, column \d+: soil\.drainablePorosity must be greater than 0/,
  },
  {
    what: 'drainable porosity 0 in a layer',
    args: () =>
      run(
        field(
          'porlayer',
          '',
          '  drainablePorosity:\n    - { depth: 1 m, value: 0.05 }\n    - { depth: 2.2 m, value: 0 }\n',
        ),
      ),
    first: /line 7, column \d+: soil\.drainablePorosity\[1\]\.value must be greater than 0/,
  },
  {
    what: 'negative drainable porosity',
    args: () => run(field('porneg', '', '  drainablePorosity: -0.02\n')),
    first: /soil\.drainablePorosity must be greater than 0 \(fraction\); got -0\.02/,
  },
  // Plant-available water is field capacity minus wilting point (FAO-56 eq. 82): it must be
  // positive.
  {
    what: 'field capacity below the wilting point',
    args: () => run(field('fc', '', '  fieldCapacity: 0.1\n  wiltingPoint: 0.2\n')),
    first:
      /line 5, column \d+: soil\.fieldCapacity must be above soil\.wiltingPoint \(0\.2\); got 0\.1/,
  },
  {
    what: 'field capacity equal to the wilting point',
    args: () => run(field('fceq', '', '  fieldCapacity: 0.2\n  wiltingPoint: 0.2\n')),
    first: /soil\.fieldCapacity must be above soil\.wiltingPoint/,
  },
  // The engine's own limit, for inputs each legal alone: drains that would need millions of
  // sub-steps a day.
  {
    what: 'drains too fast for a daily balance',
    args: () => {
      const path = join(dir, 'fast.yaml');
      writeFileSync(
        path,
        'name: Fast field\nsoil:\n  conductivity: 100 m/d\n  restrictiveLayerDepth: 2.2 m\n' +
          '  drainablePorosity: 0.001\ndrains:\n  depth: 1.1 m\n  spacing: 1 m\n',
      );
      return run(path);
    },
    first: /drains react too fast.*sub-steps a day.*at most 20000.*conductivity.*spacing.*porosity/,
  },
  // Dates: 30 February and month 13 do not exist (Gregorian calendar).
  {
    what: '--from with month 13',
    args: () => run(field('ok1'), '--from', '1992-13-45'),
    first: /^tileflux: error: --from expects a real calendar date YYYY-MM-DD .*; got 1992-13-45/,
  },
  {
    what: '--to on 30 February',
    args: () => run(field('ok2'), '--to', '2015-02-30'),
    first: /--to expects a real calendar date .*; got 2015-02-30/,
  },
  {
    what: 'outlet schedule from 30 February',
    args: () => run(field('o0230', 'outlet: { schedule: [{ from: "02-30", depth: 0.3 m }] }\n')),
    first:
      /line 8, column \d+: outlet\.schedule\[0\]\.from expects a real month-day such as "10-25"/,
  },
  {
    what: 'dated outlet step on 2015-02-30',
    args: () => run(field('d0230', 'outlet: { dates: [{ from: "2015-02-30", depth: 0.3 m }] }\n')),
    first: /outlet\.dates\[0\]\.from expects a real calendar date such as "2024-10-25"/,
  },
  {
    what: 'crop planting on 31 April',
    args: () => run(field('plant', 'crops: { corn: { planting: "04-31" } }\n')),
    first: /crops\.corn\.planting expects a real month-day/,
  },
  {
    what: 'two outlet steps from the same day',
    args: () =>
      run(
        field(
          'dup',
          'outlet:\n  schedule:\n    - { from: "10-01", depth: 0.3 m }\n    - { from: "10-01", depth: 0.5 m }\n',
        ),
      ),
    first: /line 11, column \d+: outlet\.schedule\[1\]\.from repeats "10-01" of step 1/,
  },
  {
    what: 'negative outlet depth',
    args: () => run(field('oneg', 'outlet: { schedule: [{ from: "10-01", depth: -3 m }] }\n')),
    first:
      /outlet\.schedule\[0\]\.depth must be at least 0 m; got -3 m; accepted: .*from 0 to 5 m, or "free"/,
  },
  {
    what: 'huge outlet depth',
    args: () => run(field('ohuge', 'outlet: { schedule: [{ from: "10-01", depth: 99 m }] }\n')),
    first: /outlet\.schedule\[0\]\.depth must be at most 5 m; got 99 m; accepted:/,
  },
  {
    what: 'outlet in no accepted form',
    args: () => run(field('oform', 'outlet: { schedul: [] }\n')),
    first:
      /line 8, column 1: outlet has an unexpected value \{"schedul":\[\]\}; accepted: .*"free".*\{schedule: \[\{from: "MM-DD", depth\}\]\}.*\{dates: /,
  },
  // YAML's .nan and .inf are numbers JSON cannot show (it prints null).
  {
    what: '.nan in YAML',
    args: () => run(field('nan', 'initial: { waterTableDepth: .nan }\n')),
    first: /initial\.waterTableDepth is not a number \(\.nan\); accepted: .*\[m;/,
  },
  {
    what: '.inf in YAML',
    args: () => run(field('inf', 'initial: { waterTableDepth: .inf }\n')),
    first: /initial\.waterTableDepth is infinite \(\.inf\)/,
  },
  // Scenarios are named by name (or a 1-based number), never by a 0-based index.
  {
    what: 'bad value in the second scenario',
    args: () =>
      run(field('sc', 'scenarios:\n  - name: a\n  - name: wide\n    drains: { spacing: -4 m }\n')),
    first: /line 11, column \d+: in scenario "wide": drains\.spacing must be at least 1 m/,
  },
  {
    what: 'unknown key in a scenario',
    args: () => run(field('sck', 'scenarios:\n  - name: a\n  - name: b\n    soils: {}\n')),
    first: /unknown key "soils" in scenario "b"; did you mean "soil"\?/,
  },
  // Echoed values are cut to about 80 characters.
  {
    what: 'a 300-character value',
    args: () => run(field('long', `initial: { waterTableDepth: "${'x'.repeat(300)} m" }\n`)),
    first: /got "x{77}\.\.\. \(302 characters\)", which is not a number with a known unit/,
  },
  // A bare slope is ambiguous: "0.2" is 0.2 m/m to some and 0.2 % to others, 100 times apart.
  {
    what: 'size --slope without a unit',
    args: () => ['size', '--area', '12 ha', '--coefficient', '10 mm/d', '--slope', '0.2'],
    first: /^tileflux: error: --slope needs a unit: "0\.2 %", "0\.2 m\/m" or "0\.2 ft\/100ft"/,
  },
  // Output folders the system refuses.
  {
    what: '--out under /proc',
    args: () => [...run(field('p1')).slice(0, 5), '/proc/x'],
    first: /cannot write output folder \/proc\/x/,
  },
  {
    what: '--out under a file',
    args: () => {
      writeFileSync(join(dir, 'afile'), 'x');
      return [...run(field('p2')).slice(0, 5), join(dir, 'afile', 'out')];
    },
    first: /cannot write output folder .*afile\/out: .*afile is a file, not a folder/,
  },
  {
    what: '--out under /dev/null',
    args: () => [...run(field('p3')).slice(0, 5), '/dev/null/x'],
    first: /cannot write output folder \/dev\/null\/x: \/dev\/null is a file, not a folder/,
  },
  {
    what: '--out with a 300-character name',
    args: () => [...run(field('p4')).slice(0, 5), join(dir, 'y'.repeat(300))],
    first: /cannot write output folder .*\(\d+ characters\): a name in the path is too long/,
  },
  {
    what: '--images beside --no-charts (run)',
    args: () => run(field('img'), '--images'),
    first: /--images draws the charts that --no-charts skips; give one of them, not both/,
  },
  {
    what: '--images beside --no-charts (sweep, refused before any design runs)',
    args: () => [
      'sweep',
      field('img2'),
      '--weather',
      weather,
      '--out',
      join(dir, 'out'),
      '--no-charts',
      '--images',
    ],
    first: /--images draws the charts that --no-charts skips/,
  },
  {
    what: 'YAML alias bomb',
    args: () => {
      const levels = ['a: &a ["x","x","x","x","x","x","x","x","x","x"]'];
      for (let k = 1; k < 9; k++) {
        const p = String.fromCharCode(97 + k - 1);
        levels.push(
          `${String.fromCharCode(97 + k)}: &${String.fromCharCode(97 + k)} [*${p},*${p},*${p},*${p},*${p},*${p},*${p},*${p},*${p},*${p}]`,
        );
      }
      return run(field('bomb', levels.join('\n') + '\n'));
    },
    first: /bomb\.yaml: YAML aliases \(\*name\) expand to too many values/,
  },
];

describe('bad-input catalogue', () => {
  for (const c of cases) {
    it(c.what, () => {
      const args = c.args();
      expectUserError(args, c.first);
      const r = cli(args);
      expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
      expect(r.stderr).not.toMatch(/internal error/i);
      expect(existsSync(join(dir, 'out'))).toBe(false); // nothing written
    });
  }
});

describe('legal but doubtful input warns on stderr', () => {
  it('units written against the number, and a steep grade', () => {
    const r = cli(['size', '--area', '12ha', '--coefficient', '10mm/d', '--slope', '8%', '--json']);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.area_ha).toBe(12);
    expect(out.rate_mm_d).toBe(10);
    expect(out.slope_m_m).toBeCloseTo(0.08, 12);
    expect(r.stderr).toMatch(/warning: --slope 8% is .*steeper than the 5 %/);
    // Manning full pipe, V = (1/n) (D/4)^(2/3) S^(1/2) (Chow 1959), independently for the
    // selected size: n 0.015, S 0.08 gives over 1.07 m/s (3.5 ft/s) for any pipe above 2 in.
    const d = (out.selected_diameter_in * 25.4) / 1000;
    const v = (1 / 0.015) * (d / 4) ** (2 / 3) * Math.sqrt(0.08);
    expect(out.full_flow_velocity_m_s).toBeCloseTo(v, 6);
    expect(r.stderr).toMatch(/warning: full-flow velocity .* exceeds 3\.5 ft\/s/);
  });

  it('a gentle grade warns of nothing', () => {
    const r = cli(['size', '--area', '12 ha', '--coefficient', '10 mm/d', '--slope', '0.2 %']);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
  });

  it('an outlet held below the drains', () => {
    const out = join(dir, 'deep-run');
    const r = cli([
      ...run(field('odeep', 'outlet: { schedule: [{ from: "10-01", depth: 1.5 m }] }\n')).slice(
        0,
        5,
      ),
      out,
      '--no-charts',
      '--no-report',
      '--daily',
      'none',
    ]);
    expect(r.status).toBe(0);
    expect(r.stderr).toMatch(
      /warning: outlet\.schedule step 1 \(from 10-01\) holds the outlet at 1\.5 m, below the drains at 1\.1 m: the outlet is free then/,
    );
  });

  it('a warm-up longer than the record allows: summary.json gives the one that ran', () => {
    // The demo record starts 1991-01-01: before 1992-01-01 lies one year (365 days), not five.
    const out = join(dir, 'warm-run');
    const r = cli([
      ...run(field('warm')).slice(0, 5),
      out,
      '--no-charts',
      '--no-report',
      '--daily',
      'none',
      '--from',
      '1992-01-01',
      '--to',
      '1993-12-31',
      '--warmup-years',
      '5',
    ]);
    expect(r.status).toBe(0);
    expect(r.stderr).toMatch(
      /warning: the weather record starts 1991-01-01, so the warm-up before 1992-01-01 is 1 years, not the 5 asked for/,
    );
    const summary = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(summary.period.warmup_years).toBe(1);
    expect(summary.period.warmup_years_requested).toBe(5);
    expect(summary.period.simulated_from).toBe('1991-01-01');
  });

  it('a record shorter than two years: warned, and its part year marked partial', () => {
    // The first 300 days of the demo record: 1991-01-01 to 1991-10-27.
    const lines = readFileSync(weather, 'utf8').split('\n');
    const short = join(dir, 'short.csv');
    writeFileSync(short, lines.slice(0, 301).join('\n') + '\n');
    const out = join(dir, 'short-run');
    const r = cli([
      'run',
      field('short'),
      '--weather',
      short,
      '--out',
      out,
      '--no-charts',
      '--no-report',
      '--daily',
      'none',
    ]);
    expect(r.status).toBe(0);
    expect(r.stderr).toMatch(
      /warning: the weather record holds 300 days, less than two years: results start from a guessed initial state/,
    );
    const [head, first] = readFileSync(join(out, 'annual.csv'), 'utf8').split('\n');
    const cols = head.split(',');
    expect(cols.slice(0, 4)).toEqual(['scenario', 'year', 'days', 'partial_year']);
    expect(first.split(',').slice(1, 4)).toEqual(['1991', '300', 'yes']);
    const summary = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(summary.period.partial_years).toEqual([1991]);
  });

  it('whole years are not partial', () => {
    const out = join(dir, 'whole-run');
    const r = cli([
      ...run(field('whole')).slice(0, 5),
      out,
      '--no-charts',
      '--no-report',
      '--daily',
      'none',
      '--from',
      '1992-01-01',
      '--to',
      '1992-12-31',
    ]);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    const rows = readFileSync(join(out, 'annual.csv'), 'utf8').trim().split('\n').slice(1);
    // 1992 is a leap year: 366 days (Gregorian rule).
    for (const row of rows) expect(row.split(',').slice(1, 4)).toEqual(['1992', '366', 'no']);
  });
});
