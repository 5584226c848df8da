import { describe, expect, it } from 'vitest';
import { generateWeather } from '../../src/climate/weatherGenerator.js';
import { parseField } from '../../src/io/field.js';
import { compareScenarios } from '../../src/scenarios/compare.js';
import { capitalRecoveryFactor, designCost } from '../../src/scenarios/economics.js';
import { nonDominated } from '../../src/scenarios/frontier.js';
import { runField } from '../../src/scenarios/run.js';
import { latinHypercube, scaledValue } from '../../src/scenarios/sampling.js';
import { planSweep, sweepField } from '../../src/scenarios/sweep.js';
import { costsSchema } from '../../src/scenarios/sweepSchema.js';
import { starterFieldFile } from '../../src/scenarios/starter.js';

const FIELD = `name: Sweep test field
soil:
  conductivity: 0.9 m/d
  conductivityBelowDrains: 0.6 m/d
  restrictiveLayerDepth: 2.2 m
  drainablePorosity: 0.05
drains: { depth: 1.1 m, spacing: 18 m, capacity: 0.5 in/d }
`;
const weather = generateWeather({ years: 5, seed: 3, startYear: 2001 });

describe('capital recovery factor', () => {
  it('matches the tabulated (A/P, i, n) factors of an engineering economics text', () => {
    // Compound interest tables, 4 decimals: Newnan, Eschenbach & Lavelle, Engineering Economic
    // Analysis, (A/P, i, n) column (from memory): 10 % 10 yr 0.1627, 8 % 20 yr 0.1019,
    // 6 % 30 yr 0.0726, 4 % 25 yr 0.0640; the worked loan of 10,000 at 10 % over 10 years is
    // repaid by 1,627 a year. Tolerance: half the last tabulated digit.
    for (const [i, n, table] of [
      [0.1, 10, 0.1627],
      [0.08, 20, 0.1019],
      [0.06, 30, 0.0726],
      [0.04, 25, 0.064],
    ]) {
      expect(Math.abs(capitalRecoveryFactor(i, n) - table)).toBeLessThanOrEqual(0.00005);
    }
    expect(Math.round(10_000 * capitalRecoveryFactor(0.1, 10))).toBe(1627);
    expect(capitalRecoveryFactor(0, 20)).toBe(1 / 20);
  });

  it('repays the present sum: 1 / CRF is the present worth of n unit payments', () => {
    // Independent evaluation: sum of the discount factors (1 + i)^-t, t = 1..n.
    for (const [i, n] of [
      [0.04, 25],
      [0.07, 15],
    ]) {
      let pw = 0;
      for (let t = 1; t <= n; t++) pw += Math.pow(1 + i, -t);
      expect(1 / capitalRecoveryFactor(i, n)).toBeCloseTo(pw, 10);
    }
  });

  it('annualises laterals, mains and a control structure per hectare', () => {
    const c = costsSchema.parse({});
    const free = designCost(20, false, c);
    // 10 000 / 20 m = 500 m/ha at 3.0 /m, mains 15 % more.
    expect(free.capitalPerHa).toBeCloseTo(500 * 3 * 1.15, 9);
    expect(designCost(20, true, c).capitalPerHa - free.capitalPerHa).toBeCloseTo(2000 / 8, 9);
    expect(free.annualPerHa).toBeCloseTo(free.capitalPerHa * capitalRecoveryFactor(0.04, 25), 9);
    const perFt = costsSchema.parse({ lateral: '0.9144 /ft', main: '10 % of lateral' });
    expect(perFt.lateral).toBeCloseTo(3, 12);
    expect(perFt.main.ofLateral).toBeCloseTo(0.1, 12);
  });
});

describe('trade-off frontier', () => {
  it('keeps non-dominated, tied and duplicate rows and drops dominated ones', () => {
    // Hand-built table (all aims minimised): [load, wetness, cost].
    const rows = [
      [10, 5, 100], // 0 frontier: lowest load
      [12, 2, 100], // 1 frontier: fewer wet days
      [12, 2, 100], // 2 duplicate of 1: neither dominates the other
      [11, 5, 100], // 3 dominated by 0 (more load, same rest)
      [10, 5, 100], // 4 duplicate of 0
      [20, 9, 50], // 5 frontier: cheapest
      [20, 9, 60], // 6 dominated by 5 (tied on two aims, dearer)
      [9, 9, 200], // 7 frontier: lowest load of all
      [NaN, 1, 1], // 8 undefined aim: never on the frontier
    ];
    expect(nonDominated(rows)).toEqual([true, true, true, false, true, true, false, true, false]);
  });
});

describe('Latin hypercube', () => {
  it('hits every stratum of every parameter once per sample set', () => {
    for (const n of [1, 7, 40]) {
      const pts = latinHypercube(n, 3, 11);
      for (let d = 0; d < 3; d++) {
        const strata = pts.map((p) => Math.floor(p[d] * n)).sort((a, b) => a - b);
        expect(strata).toEqual(Array.from({ length: n }, (_, k) => k));
      }
    }
  });
  it('is fixed by its seed', () => {
    expect(latinHypercube(10, 2, 5)).toEqual(latinHypercube(10, 2, 5));
    expect(latinHypercube(10, 2, 5)).not.toEqual(latinHypercube(10, 2, 6));
  });
  it('maps onto a log scale evenly in the logarithm', () => {
    expect(scaledValue(0.5, 0.4, 1.6, 'log')).toBeCloseTo(0.8, 12); // geometric mean
    expect(scaledValue(0.25, 0.03, 0.07, 'linear')).toBeCloseTo(0.04, 12);
  });
});

describe('sweep plan', () => {
  it('expands ranges, adds the field as given and samples the soil values', () => {
    const f = parseField(
      FIELD +
        `sweep:
  depth: [0.9 m, 0.75 m]
  spacing: { from: 10 m, to: 16 m, step: 3 m }
  outlet: { free: free, hold: { schedule: [ { from: '11-01', depth: 0.3 m }, { from: '04-01', depth: free } ] } }
  uncertain:
    soil.conductivity: { low: 40 cm/d, high: 1.6 m/d, scale: log }
  samples: 5
`,
    ).base;
    const plan = planSweep(f, { seed: 3 });
    expect(plan.designs.map((d) => d.name).slice(0, 3)).toEqual([
      '1.1 m x 18 m, free (field as given)',
      '0.75 m x 10 m, free',
      '0.75 m x 13 m, free',
    ]);
    expect(plan.designs).toHaveLength(1 + 2 * 3 * 2);
    expect(plan.params[0]).toMatchObject({ low: 0.4, high: 1.6, column: 'soil_conductivity_m_d' });
    expect(plan.samples).toHaveLength(5);
    for (const [k] of plan.samples) expect(k >= 0.4 && k <= 1.6).toBe(true);
  });

  it('refuses uncertain keys that are no soil value and drains below the restrictive layer', () => {
    expect(() =>
      parseField(
        FIELD +
          'sweep: { depth: [1 m], spacing: [20 m], uncertain: { soil.colour: { low: 1, high: 2 } } }\n',
      ),
    ).toThrow(/line 8, column \d+: .*"soil.colour" is not a soil value/);
    expect(() =>
      parseField(
        FIELD +
          'sweep: { depth: [1 m, 2 m], spacing: [20 m], uncertain: { soil.restrictiveLayerDepth: { low: 1.9 m, high: 2.5 m } } }\n',
      ),
    ).toThrow(/sweep.*deepest drains \(2 m\) must lie above the restrictive layer \(1.9 m/);
  });

  it('init shows a sweep and a costs section that validate when uncommented', () => {
    const text = starterFieldFile();
    const lines = text.split('\n');
    const start = lines.indexOf('# sweep:');
    expect(start).toBeGreaterThan(0);
    const block: string[] = [];
    for (let k = start; k < lines.length && /^# (sweep:|costs:| {2})/.test(lines[k]); k++)
      block.push(lines[k].slice(2));
    for (
      let k = lines.indexOf(lines.find((l) => l.startsWith('# costs:'))!);
      /^# (costs:| {2})/.test(lines[k]);
      k++
    )
      block.push(lines[k].slice(2));
    const f = parseField(FIELD + block.join('\n') + '\n').base;
    expect(f.sweep!.spacing).toHaveLength(11);
    expect(f.costs!.discountRate).toBe(0.04);
  });
});

describe('the sample count', () => {
  it('is refused outside 1 to 10000 with the setting named as the library calls it', () => {
    const f = parseField(FIELD + 'sweep: { depth: [1.1 m], spacing: [18 m] }\n').base;
    // The library names its own setting; the command line maps it to --samples.
    expect(() => planSweep(f, { samples: 0 })).toThrow(/^samples expects a whole number/);
    expect(() => planSweep(f, { samples: 10001 })).toThrow(/from 1 to 10000; got 10001/);
    expect(() => planSweep(f, { samples: 2.5 })).toThrow(/got 2\.5/);
  });
});

describe('a sweep', () => {
  it('of one design gives the same numbers as run of that design', () => {
    const f = parseField(FIELD + 'sweep: { depth: [1.1 m], spacing: [18 m] }\n');
    const r = sweepField(f.base, weather);
    expect(r.designs).toHaveLength(1);
    const run = runField({ base: f.base, scenarios: [{ name: 'own', field: f.base }] }, weather);
    const [c] = compareScenarios(run.scenarios[0].annual, {
      baseline: 'own',
      scenarios: [{ name: 'own', spacingM: 18 }],
    });
    const d = r.designs[0];
    for (const k of [
      'drainflow_mm',
      'no3n_load_kg_ha',
      'fwmc_mg_l',
      'runoff_mm',
      'et_mm',
      'wet_days',
      'aeration_stress_days',
      'spring_fieldwork_days',
      'fall_fieldwork_days',
      'stress_days',
      'wt_mean_depth_m',
    ] as const) {
      expect(d[k] as number).toBeCloseTo(c[k] as number, 9);
    }
    expect(d.lateral_length_m_ha).toBe(c.pipe_length_m_ha);
    expect(d.is_baseline).toBe(true);
  });

  it('never gives less drain flow with deeper drains at a fixed spacing, in any soil sample', () => {
    const f = parseField(
      FIELD +
        `sweep:
  depth: { from: 0.6 m, to: 1.5 m, step: 0.3 m }
  spacing: [12 m, 30 m]
  uncertain:
    soil.conductivity: { low: 0.2 m/d, high: 2 m/d, scale: log }
    soil.drainablePorosity: { low: 0.02, high: 0.08 }
  samples: 6
`,
    ).base;
    const r = sweepField(f, weather, { seed: 9 });
    let checked = 0;
    for (const spacing of [12, 30]) {
      for (let s = 1; s <= 6; s++) {
        const flows = r.samples
          .filter(
            (x) =>
              x.sample === s &&
              String(x.design).includes(`x ${spacing} m, free`) &&
              !String(x.design).includes('as given'),
          )
          .map((x) => [Number(String(x.design).split(' ')[0]), Number(x.drainflow_mm)])
          .sort((a, b) => a[0] - b[0]);
        expect(flows).toHaveLength(4);
        for (let k = 1; k < flows.length; k++) {
          expect(flows[k][1]).toBeGreaterThanOrEqual(flows[k - 1][1] - 1e-9);
          checked++;
        }
      }
    }
    expect(checked).toBe(36);
  });
});
