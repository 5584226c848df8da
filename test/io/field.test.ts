import { describe, expect, it } from 'vitest';
import { parseField } from '../../src/io/field.js';
import { TilefluxError } from '../../src/errors.js';

const GOOD = `name: Test field
soil:
  conductivity: 1.0 m/d
  restrictiveLayerDepth: 2.5 m
drains:
  depth: 1.2 m
  spacing: 20 m
`;

/** Parse and return the error message (the test fails if parsing succeeds or throws a bug). */
function messageOf(text: string): string {
  try {
    parseField(text, 'f.yaml');
  } catch (e) {
    expect(e).toBeInstanceOf(TilefluxError);
    return (e as Error).message;
  }
  throw new Error('expected a TilefluxError');
}

describe('field files', () => {
  it('accepts a minimal file and fills defaults in SI units', () => {
    const f = parseField(GOOD, 'f.yaml');
    expect(f.base.drains.depth).toBe(1.2);
    expect(f.base.soil.surfaceStorage).toBe(10);
    expect(f.base.outlet).toBe('free');
    expect(f.base.crops.rotation).toEqual(['corn', 'soybean']);
    expect(f.base.nitrate.model).toBe('pool');
  });

  it('converts unit strings: 48 in, 2 in/h, 0.5 in/d', () => {
    const f = parseField(
      GOOD.replace('1.2 m', '48 in').replace('1.0 m/d', '2 in/h') + '  capacity: 0.5 in/d\n',
      'f.yaml',
    );
    expect(f.base.drains.depth).toBeCloseTo(1.2192, 10); // 48 x 0.0254 m (exact inch)
    expect(f.base.soil.conductivity).toBeCloseTo(2 * 0.0254 * 24, 10);
    expect(f.base.drains.capacity).toBeCloseTo(12.7, 10);
  });

  const cases: Array<[string, string, RegExp]> = [
    [
      'YAML syntax',
      GOOD.replace('spacing: 20 m', 'spacing: [20 m'),
      /^f\.yaml: line \d+, column \d+: YAML syntax error/,
    ],
    [
      'unknown key with suggestion',
      GOOD.replace('conductivity:', 'condutivity:'),
      /line 3, column 3: unknown key "soil\.condutivity"; did you mean "conductivity"\?/,
    ],
    [
      'wrong dimension',
      GOOD.replace('depth: 1.2 m', 'depth: 12 m/d'),
      /line 6, column \d+: drains\.depth expects a length such as .*; got 12 m\/d/,
    ],
    [
      'missing key',
      GOOD.replace('  spacing: 20 m\n', ''),
      /line 5, column \d+: drains\.spacing is required/,
    ],
    [
      'out of range',
      GOOD + 'initial: { waterTableDepth: -1 m }\n',
      /line 8, column \d+: initial\.waterTableDepth must be at least 0 m/,
    ],
    [
      'bad month-day',
      GOOD + 'outlet: { schedule: [ { from: "13-40", depth: 0.3 m } ] }\n',
      /line 8, column \d+: outlet/,
    ],
    [
      'unknown crop',
      GOOD + 'crops: { rotation: [maize] }\n',
      /line 8, column \d+: crops\.rotation\[0\] must be one of "corn", "soybean", "small grains"; got "maize"/,
    ],
    ['not a mapping', '- a\n- b\n', /expects a mapping/],
    [
      'too few sub-steps (the step-halving floor)',
      GOOD + 'simulation: { substepsPerDay: 1 }\n',
      /line 8, column \d+: simulation\.substepsPerDay .*at least 8/,
    ],
    [
      'unknown scenario key',
      GOOD + 'scenarios:\n  - name: a\n  - name: b\n    drain: { depth: 0.8 m }\n',
      /line 11, column 5: unknown key "drain" in scenario "b"; did you mean "drains"\?/,
    ],
    [
      'bad scenario override located in the scenario',
      GOOD + 'scenarios:\n  - name: a\n  - name: b\n    drains: { depth: deep }\n',
      /line 11, column \d+: in scenario "b": drains\.depth expects a length/,
    ],
    [
      'duplicate scenario names',
      GOOD + 'scenarios:\n  - name: a\n  - name: a\n',
      /line 10, column \d+: scenario name "a" is used twice/,
    ],
  ];
  for (const [what, text, want] of cases) {
    it(`locates: ${what}`, () => {
      expect(messageOf(text)).toMatch(want);
    });
  }

  it('merges scenario overrides into the base and keeps the rest', () => {
    const f = parseField(
      GOOD + 'scenarios:\n  - name: base\n  - name: shallow\n    drains: { depth: 0.75 m }\n',
      'f.yaml',
    );
    expect(f.scenarios.map((s) => s.name)).toEqual(['base', 'shallow']);
    expect(f.scenarios[1].field.drains.depth).toBe(0.75);
    expect(f.scenarios[1].field.drains.spacing).toBe(20);
  });
});

describe('scenario nitrate overrides', () => {
  it('a scenario may switch nitrate model; keys of the same model merge', () => {
    const text =
      GOOD +
      'nitrate: { model: fixed, concentration: 12 mg/L }\n' +
      'scenarios:\n  - name: a\n  - name: b\n    nitrate: { model: seasonal, monthly: [10,10,10,10,10,10,10,10,10,10,10,10] }\n' +
      '  - name: c\n    nitrate: { concentration: 8 mg/L }\n';
    const f = parseField(text, 'f.yaml');
    expect(f.scenarios[1].field.nitrate.model).toBe('seasonal');
    expect(f.scenarios[2].field.nitrate).toMatchObject({ model: 'fixed', concentrationMgL: 8 });
  });
});

describe('layout checks across keys', () => {
  it('drains below the restrictive layer are located at drains.depth', () => {
    expect(messageOf(GOOD.replace('2.5 m', '1.0 m'))).toMatch(
      /line 6, column \d+: drains\.depth must lie above the restrictive layer \(soil\.restrictiveLayerDepth, 1 m\)/,
    );
  });
});
