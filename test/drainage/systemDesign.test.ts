import { describe, expect, it } from 'vitest';
import type { GroundProfile } from '../../src/drainage/gradeLaying.js';
import { INCH_SIZES } from '../../src/drainage/pipeSizes.js';
import { designSystem, type SystemSettings } from '../../src/drainage/systemDesign.js';
import { systemSchema } from '../../src/drainage/systemSchema.js';
import { buildSystemTree } from '../../src/drainage/systemTree.js';
import { TilefluxError } from '../../src/errors.js';

// Expected values are worked in the test from first principles, never read from the code:
// - Manning, SI, full circular pipe (Chow 1959): Q = (1/n) (pi D^2 / 4) (D/4)^(2/3) S^(1/2),
//   so D = (4^(5/3) n Q / (pi S^(1/2)))^(3/8), and the minimum grade for a full-flow velocity V
//   is S = (V n / (D/4)^(2/3))^2;
// - design flow = drained area x drainage coefficient + inlet flow (common practice);
// - the next commercial size up, or down with `round: down` (common practice);
// - n = 0.012 for clay tile (drainage texts give 0.011-0.013, from memory);
// - invert = invert at the lower end + grade x distance; cut = ground - invert; cover = cut - D.

const N_CLAY = 0.012;
/** 1.4 ft/s in m/s (exact foot), the full-flow velocity that keeps fine sediment moving (common practice). */
const V_SEDIMENT = 1.4 * 0.3048;
const MM_D = 86400 * 1000; // m/s to mm/d

const capacity = (dM: number, s: number) =>
  (1 / N_CLAY) * ((Math.PI * dM * dM) / 4) * Math.pow(dM / 4, 2 / 3) * Math.sqrt(s);
const needD = (q: number, s: number) =>
  Math.pow((Math.pow(4, 5 / 3) * N_CLAY * q) / (Math.PI * Math.sqrt(s)), 3 / 8);
const minGrade = (dM: number, v: number) => Math.pow((v * N_CLAY) / Math.pow(dM / 4, 2 / 3), 2);

/** The size a hand designer picks from the inch list, and what it delivers. */
function byHand(areaM2: number, inletM3s: number, grade: number, round: 'up' | 'down' = 'up') {
  const q = (areaM2 * 12.7) / MM_D + inletM3s;
  const need = needD(q, grade);
  const sizes = INCH_SIZES.nominal;
  const fits = sizes.filter((d) => d * 0.0254 <= need);
  const nominal =
    round === 'up' ? sizes.find((d) => d * 0.0254 >= need)! : (fits.at(-1) ?? sizes[0]);
  const dM = nominal * 0.0254;
  const cap = capacity(dM, grade);
  return { q, need, nominal, dM, cap, eff: ((cap - inletM3s) / areaM2) * MM_D };
}

function settings(over: Partial<SystemSettings> = {}): SystemSettings {
  return {
    coefficientMmD: 12.7, // 1/2 in/d
    sizes: INCH_SIZES,
    velocityMs: V_SEDIMENT,
    round: 'up',
    depthM: 1.1,
    minimumCoverM: 0.6,
    maximumDepthM: 2.5,
    ...over,
  };
}

const rel = (a: number, b: number, tol = 1e-9) =>
  expect(Math.abs(a / b - 1), `${a} vs ${b}`).toBeLessThan(tol);
const near = (a: number, b: number, tol = 1e-9) =>
  expect(Math.abs(a - b), `${a} vs ${b}`).toBeLessThan(tol);

/**
 * a (outlet): a-1 100 m at 0.2 %, 2 ha; a-2 100 m at 0.15 %, 2 ha and 3 L/s of inlets;
 * a-3 100 m at 0.4 %, 2 ha and 2 laterals 150 m at 1 %. b joins a at 100 m: b-1 50 m at 0.5 %,
 * 5 laterals 200 m at 0.1 %. c joins a at 200 m: c-1 50 m at 0.5 %, 1 ha, 3 laterals 100 m at 1 %.
 * Laterals 20 m apart, clay throughout.
 */
/** A main of one reach, 50 m at 0.5 %, joining main a at `station`. */
const tributary = (name: string, station: string, reach: object) => ({
  name,
  joins: { main: 'a', station },
  reaches: [{ length: '50 m', grade: '0.5 %', ...reach }],
});

/** A clay system with laterals 20 m apart at 12.7 mm/d (1/2 in/d). */
const clayTree = (mains: unknown[]) =>
  buildSystemTree(
    systemSchema.parse({
      name: 'plan',
      coefficient: '12.7 mm/d',
      material: 'clay',
      laterals: { spacing: '20 m' },
      mains,
    }),
  );

function threeMains() {
  return clayTree([
    {
      name: 'a',
      reaches: [
        { length: '100 m', grade: '0.2 %', area: '2 ha' },
        { length: '100 m', grade: '0.15 %', area: '2 ha', inletFlow: '3 L/s' },
        {
          length: '100 m',
          grade: '0.4 %',
          area: '2 ha',
          laterals: [{ count: 2, length: '150 m', grade: '1 %' }],
        },
      ],
    },
    tributary('b', '100 m', { laterals: [{ count: 5, length: '200 m', grade: '0.1 %' }] }),
    tributary('c', '200 m', {
      area: '1 ha',
      laterals: [{ count: 3, length: '100 m', grade: '1 %' }],
    }),
  ]);
}

describe('designSystem with fixed grades and no profile (hand design)', () => {
  it('sizes every reach and lateral as a hand designer would', () => {
    const d = designSystem(threeMains(), settings({ outletInvertM: 95 }));
    // Areas above each lower end (m2): a-3 2 ha + 2 x 150 x 20; c-1 1 ha + 3 x 100 x 20;
    // a-2 2 ha + a-3 + c-1; b-1 5 x 200 x 20; a-1 2 ha + a-2 + b-1.
    const a3 = 20000 + 6000;
    const c1 = 10000 + 6000;
    const b1 = 20000;
    const a2 = 20000 + a3 + c1;
    const a1 = 20000 + a2 + b1;
    const hand: Record<string, ReturnType<typeof byHand>> = {
      'a-1': byHand(a1, 0.003, 0.002),
      'a-2': byHand(a2, 0.003, 0.0015),
      'a-3': byHand(a3, 0, 0.004),
      'b-1': byHand(b1, 0, 0.005),
      'c-1': byHand(c1, 0, 0.005),
    };
    expect(d.reaches.map((r) => r.reach.id)).toEqual(['a-1', 'a-2', 'a-3', 'b-1', 'c-1']);
    for (const r of d.reaches) {
      const h = hand[r.reach.id];
      rel(r.designFlowM3s, h.q);
      rel(r.requiredDiameterM, h.need);
      expect(r.selected.nominal).toBe(h.nominal);
      rel(r.capacityM3s, h.cap);
      rel(r.sharePercent, (100 * h.q) / h.cap);
      rel(r.effectiveCoefficientMmD, h.eff);
      expect(r.roughness).toBe(N_CLAY);
      expect(r.gradeLimit).toBe('fixed');
      rel(r.minimumGrade, minGrade(h.dM, V_SEDIMENT));
    }
    // Laterals: one lateral's area, at its own grade.
    const lat: Record<string, ReturnType<typeof byHand>> = {
      'a-3/L1': byHand(150 * 20, 0, 0.01),
      'b-1/L1': byHand(200 * 20, 0, 0.001),
      'c-1/L1': byHand(100 * 20, 0, 0.01),
    };
    expect(d.laterals.map((l) => l.id)).toEqual(['a-3/L1', 'b-1/L1', 'c-1/L1']);
    for (const l of d.laterals) {
      const h = lat[l.id];
      rel(l.designFlowM3s, h.q);
      expect(l.selected.nominal).toBe(h.nominal);
      rel(l.effectiveCoefficientMmD, h.eff);
      expect(l.gradeLimit).toBe('fixed');
    }
  });

  it('lays inverts up from the outlet; a tributary starts at the invert of the junction', () => {
    const d = designSystem(threeMains(), settings({ outletInvertM: 95 }));
    const ends = Object.fromEntries(
      d.reaches.map((r) => [r.reach.id, [r.invertFromM, r.invertToM]]),
    );
    // a: 95 + 0.002 x 100 = 95.2; + 0.0015 x 100 = 95.35; + 0.004 x 100 = 95.75
    // b at 100 m: 95.2, + 0.005 x 50 = 95.45; c at 200 m: 95.35, + 0.005 x 50 = 95.6
    const expected: Record<string, [number, number]> = {
      'a-1': [95, 95.2],
      'a-2': [95.2, 95.35],
      'a-3': [95.35, 95.75],
      'b-1': [95.2, 95.45],
      'c-1': [95.35, 95.6],
    };
    for (const [id, [from, to]] of Object.entries(expected)) {
      near(ends[id][0], from);
      near(ends[id][1], to);
    }
    expect(d.invertsAbsolute).toBe(true);
    expect(d.profile).toEqual([]);
    expect(d.mains).toEqual([
      { name: 'a', lengthM: 300, shallowStations: 0, deepStations: 0 },
      { name: 'b', lengthM: 50, shallowStations: 0, deepStations: 0 },
      { name: 'c', lengthM: 50, shallowStations: 0, deepStations: 0 },
    ]);
  });

  it('without an outlet invert the inverts are relative to the outlet (0)', () => {
    const d = designSystem(threeMains(), settings());
    expect(d.invertsAbsolute).toBe(false);
    near(d.reaches[0].invertFromM, 0);
    near(d.reaches[3].invertFromM, 0.2); // b joins at 100 m: 0.002 x 100
  });

  it('a lateral is limited by the least coefficient on its way to the outlet', () => {
    const d = designSystem(threeMains(), settings());
    const a3 = 26000;
    const c1 = 16000;
    const eff = {
      a1: byHand(20000 + 20000 + a3 + c1 + 20000, 0.003, 0.002).eff,
      a2: byHand(20000 + a3 + c1, 0.003, 0.0015).eff,
      a3: byHand(a3, 0, 0.004).eff,
      b1: byHand(20000, 0, 0.005).eff,
      c1: byHand(c1, 0, 0.005).eff,
      la: byHand(3000, 0, 0.01).eff,
      lb: byHand(4000, 0, 0.001).eff,
      lc: byHand(2000, 0, 0.01).eff,
    };
    // The case is chosen so that the checks tell paths apart: a-2 delivers the least of all,
    // b-1 the least on b's way (b-1, a-1), which does not pass a-2.
    expect(eff.a2).toBeLessThan(eff.b1);
    expect(eff.b1).toBeLessThan(Math.min(eff.a1, eff.lb, eff.a3, eff.c1));
    const path = Object.fromEntries(d.laterals.map((l) => [l.id, l.pathCoefficientMmD]));
    rel(path['b-1/L1'], Math.min(eff.lb, eff.b1, eff.a1));
    rel(path['c-1/L1'], Math.min(eff.lc, eff.c1, eff.a1, eff.a2)); // c joins at the top of a-2
    rel(path['a-3/L1'], Math.min(eff.la, eff.a1, eff.a2, eff.a3));
    rel(d.lateralCoefficientMmD, Math.min(eff.la, eff.lb, eff.lc));
    rel(d.fieldCoefficientMmD, eff.a2);
  });

  it('notes the laterals laid flatter than the minimum grade of their size, and only those', () => {
    const d = designSystem(threeMains(), settings());
    // b-1/L1: 3 in at 0.1 %; 3 in clay at 1.4 ft/s needs S = (V n / (D/4)^(2/3))^2.
    const pct = (x: number) => `${(x * 100).toFixed(3)} %`;
    expect(byHand(4000, 0, 0.001).nominal).toBe(3);
    expect(d.notes).toEqual([
      `Laterals b-1/L1: grades flatter than the minimum for their size (0.100 % < ` +
        `${pct(minGrade(3 * 0.0254, V_SEDIMENT))}); sediment may settle where the soil holds fine sand or silt.`,
    ]);
  });
});

/**
 * One main rounded down: a-1 100 m at 2 % carrying everything; a-2 100 m at 0.1 %, 3 ha and
 * laterals 200 m apart 20 m: 5 and 3 at 0.1 %, 2 at 0.2 %.
 */
function roundDownMain() {
  return clayTree([
    {
      name: 'a',
      reaches: [
        { length: '100 m', grade: '2 %' },
        {
          length: '100 m',
          grade: '0.1 %',
          area: '3 ha',
          laterals: [
            { count: 5, length: '200 m', grade: '0.1 %' },
            { count: 3, length: '200 m', grade: '0.1 %' },
            { count: 2, length: '200 m', grade: '0.2 %' },
          ],
        },
      ],
    },
  ]);
}

describe('designSystem rounding down, with its notes', () => {
  it('takes the next size down, or the smallest when even that is larger than needed', () => {
    const d = designSystem(roundDownMain(), settings({ round: 'down' }));
    const area = 30000 + 10 * 200 * 20;
    const a1 = byHand(area, 0, 0.02, 'down');
    const a2 = byHand(area, 0, 0.001, 'down');
    expect(d.reaches.map((r) => r.selected.nominal)).toEqual([a1.nominal, a2.nominal]);
    rel(d.reaches[0].effectiveCoefficientMmD, a1.eff);
    rel(d.reaches[1].effectiveCoefficientMmD, a2.eff);
    expect(a2.eff).toBeLessThan(12.7);
    // A lateral needs about 2.6 in: nothing in the list is smaller, so the smallest, 3 in.
    const lat = byHand(4000, 0, 0.001, 'down');
    expect(lat.need / 0.0254).toBeLessThan(3);
    expect(d.laterals.map((l) => l.selected.nominal)).toEqual([3, 3, 3]);
  });

  it('writes the notes: fixed grade too flat, flat laterals, smaller downstream, rounding down', () => {
    const d = designSystem(roundDownMain(), settings({ round: 'down' }));
    const area = 30000 + 10 * 200 * 20;
    const a1 = byHand(area, 0, 0.02, 'down');
    const a2 = byHand(area, 0, 0.001, 'down');
    const pct = (x: number) => (x * 100).toFixed(3);
    // The case: a-2's minimum grade is above 0.1 %, a-1's below 2 %; a-1 is smaller than a-2.
    expect(minGrade(a2.dM, V_SEDIMENT)).toBeGreaterThan(0.001);
    expect(minGrade(a1.dM, V_SEDIMENT)).toBeLessThan(0.02);
    expect(a1.nominal).toBeLessThan(a2.nominal);
    const m3 = pct(minGrade(3 * 0.0254, V_SEDIMENT));
    expect(d.notes).toEqual([
      `Reach a-2: the fixed grade 0.100 % is flatter than the minimum ` +
        `${pct(minGrade(a2.dM, V_SEDIMENT))} % for clay at this size; ` +
        'sediment may settle where the soil holds fine sand or silt.',
      `Laterals a-2/L1, a-2/L2, a-2/L3: grades flatter than the minimum for their size ` +
        `(0.100 % < ${m3} %; 0.200 % < ${m3} %); sediment may settle where the soil holds fine sand or silt.`,
      `Reach a-1 (${a1.nominal} in) is smaller than a-2 above it (${a2.nominal} in), carried by ` +
        'its steeper grade; many guides never let a main get smaller downstream.',
      // The 3 in laterals deliver more than 12.7 mm/d: not listed.
      'Rounding down: a-1, a-2 deliver less than the chosen coefficient of 12.70 mm/d ' +
        '(see effective_coefficient_mm_d).',
    ]);
  });

  it('beyond the list: the largest size rounding down, an error naming the reach rounding up', () => {
    const tree = clayTree([
      { name: 'a', reaches: [{ length: '100 m', grade: '0.1 %', area: '400 ha' }] },
    ]);
    // 400 ha x 12.7 mm/d = 0.588 m3/s: at 0.1 % clay needs about 0.79 m, above 24 in (0.61 m).
    expect(byHand(4e6, 0, 0.001, 'down').need).toBeGreaterThan(24 * 0.0254);
    expect(designSystem(tree, settings({ round: 'down' })).reaches[0].selected.nominal).toBe(24);
    expect(() => designSystem(tree, settings())).toThrow(TilefluxError);
    expect(() => designSystem(tree, settings())).toThrow(
      'the sizes of reach a-1 (mains[0].reaches[0])',
    );
    // A lateral group too large for the list: 2 laterals 5000 m long, 500 m apart, at 0.01 %
    // (250 ha each, 0.37 m3/s: about 1 m at 0.01 %); its reach at 50 % grade needs about 0.3 m.
    expect(byHand(2.5e6, 0, 0.0001).need).toBeGreaterThan(24 * 0.0254);
    expect(byHand(5e6, 0, 0.5).need).toBeLessThan(24 * 0.0254);
    const wide = clayTree([
      {
        name: 'a',
        reaches: [
          {
            length: '100 m',
            grade: '50 %',
            laterals: [{ count: 2, length: '5000 m', spacing: '500 m', grade: '0.01 %' }],
          },
        ],
      },
    ]);
    expect(() => designSystem(wide, settings())).toThrow(
      'the sizes of lateral group a-1/L1 (mains[0].reaches[0].laterals[0])',
    );
  });
});

describe('designSystem at the edges of a size', () => {
  /** One reach of 100 m at 0.3 % with no drained area. */
  const bareReach = () => clayTree([{ name: 'a', reaches: [{ length: '100 m', grade: '0.3 %' }] }]);

  it('a flow of exactly a size capacity selects that size, rounding up or down', () => {
    for (const round of ['up', 'down'] as const) {
      const tree = bareReach();
      const q = capacity(6 * 0.0254, 0.003);
      tree.mains[0].reaches[0].inletAboveM3s = q;
      const d = designSystem(tree, settings({ round }));
      expect(d.reaches[0].selected.nominal).toBe(6);
      rel(d.reaches[0].sharePercent, 100, 1e-9);
      // No drained area: no coefficient, and nothing to note.
      expect(d.reaches[0].effectiveCoefficientMmD).toBeNaN();
      expect(d.notes).toEqual([]);
    }
  });

  it('no flow at all needs no pipe: the smallest size, no coefficient', () => {
    for (const round of ['up', 'down'] as const) {
      const d = designSystem(bareReach(), settings({ round }));
      expect(d.reaches[0].requiredDiameterM).toBe(0);
      expect(d.reaches[0].selected.nominal).toBe(3);
      expect(d.reaches[0].effectiveCoefficientMmD).toBeNaN();
      expect(d.lateralCoefficientMmD).toBeNaN();
    }
  });
});

const profileOf = (stations: number[], elevations: number[]): GroundProfile => ({
  stationsM: Float64Array.from(stations),
  elevationsM: Float64Array.from(elevations),
});
const SIX_ONLY = { ...INCH_SIZES, name: 'six', nominal: [6] };
const D6 = 6 * 0.0254;

function oneMain(reaches: unknown[]) {
  return clayTree([{ name: 'a', reaches }]);
}

describe('designSystem on a ground profile', () => {
  it('cut, cover and flags at every station of a main with fixed grades (hand profile)', () => {
    const tree = oneMain([
      { length: '100 m', grade: '0.5 %', area: '1 ha' },
      { length: '100 m', grade: '0.25 %' }, // above 6 in clay's 0.204 %
    ]);
    const ground = profileOf([0, 50, 100, 150, 200], [99.2, 100.5, 99, 101.5, 100]);
    const d = designSystem(
      tree,
      settings({ sizes: SIX_ONLY, outletInvertM: 98 }),
      new Map([['a', ground]]),
    );
    // invert: 98 + 0.005 x; from 100 m 98.5 + 0.0025 (x - 100). cut = ground - invert;
    // cover = cut - 0.1524; shallow below 0.6 m cover, deep past 2.5 m cut.
    const expected: Array<[number, string, number, number, string]> = [
      [0, 'a-1', 99.2, 98, ''],
      [50, 'a-1', 100.5, 98.25, ''],
      [100, 'a-1', 99, 98.5, 'shallow'], // cover 0.5 - 0.1524 = 0.3476
      [150, 'a-2', 101.5, 98.625, 'deep'], // cut 2.875
      [200, 'a-2', 100, 98.75, ''],
    ];
    expect(d.profile.map((p) => [p.stationM, p.reachId, p.flag])).toEqual(
      expected.map(([s, id, , , flag]) => [s, id, flag]),
    );
    d.profile.forEach((p, i) => {
      const [, , g, inv] = expected[i];
      expect(p.main).toBe('a');
      near(p.groundM, g);
      near(p.invertM, inv);
      near(p.cutM, g - inv);
      near(p.coverM, g - inv - D6);
    });
    const [r1, r2] = d.reaches;
    near(r1.maxCutM!, 100.5 - 98.25);
    expect(r1.maxCutStationM).toBe(50);
    near(r2.maxCutM!, 101.5 - 98.625);
    expect(r2.maxCutStationM).toBe(150);
    near(r1.minCoverM!, 99 - 98.5 - D6);
    near(r2.minCoverM!, 100 - 98.75 - D6);
    expect([r1.shallowStations, r1.deepStations, r2.shallowStations, r2.deepStations]).toEqual([
      1, 0, 0, 1,
    ]);
    expect(d.mains).toHaveLength(1);
    expect(d.mains[0]).toMatchObject({
      name: 'a',
      shallowStations: 1,
      deepStations: 1,
      maxCutStationM: 150,
    });
    near(d.mains[0].maxCutM!, 2.875);
    expect(d.invertsAbsolute).toBe(true);
    expect(d.notes).toEqual([
      'Main a: 1 station(s) with less than the minimum cover (0.6 m over the pipe); see profile.csv (flag shallow).',
      'Main a: 1 station(s) deeper than the maximum depth (2.5 m to the invert); see profile.csv (flag deep).',
    ]);
  });

  it('a reach laid at the minimum cover is not flagged where it touches the cover', () => {
    const tree = oneMain([{ length: '100 m', area: '1 ha' }]);
    const ground = profileOf([0, 50, 100], [100, 99.9, 101]);
    const d = designSystem(
      tree,
      settings({ sizes: SIX_ONLY, outletDepthM: 1.5, depthM: 1, velocityMs: 0.1 }),
      new Map([['a', ground]]),
    );
    // Outlet invert 100 - 1.5 = 98.5. aim (101 - 1 - 98.5) / 100 = 0.015; cover bound at 50 m
    // (99.9 - 98.5 - 0.6 - 0.1524) / 50 = 0.012952; the flushing grade at 0.1 m/s is 1.1e-4.
    const r = d.reaches[0];
    near(r.invertFromM, 98.5);
    expect(r.gradeLimit).toBe('minimum cover');
    near(r.grade, (99.9 - 98.5 - 0.6 - D6) / 50, 1e-12);
    near(d.profile[1].coverM, 0.6);
    expect(d.profile.map((p) => p.flag)).toEqual(['', '', '']);
    expect(d.notes).toEqual([]);
    expect(d.invertsAbsolute).toBe(true); // elevations from the profile, no outlet invert given
  });

  it('a reach held at the maximum depth is not flagged where it reaches it', () => {
    const tree = oneMain([{ length: '100 m', area: '1 ha' }]);
    const ground = profileOf([0, 50, 100], [100, 102.1, 101]);
    const d = designSystem(
      tree,
      settings({ sizes: SIX_ONLY, depthM: 1, velocityMs: 0.1 }),
      new Map([['a', ground]]),
    );
    // Outlet invert 100 - 1 (the design depth). aim 0.01; machine bound at 50 m
    // (102.1 - 99 - 2.5) / 50 = 0.012; cover bound at 100 m (2 - 0.7524) / 100 = 0.012476.
    const r = d.reaches[0];
    near(r.invertFromM, 99);
    expect(r.gradeLimit).toBe('maximum depth');
    near(r.grade, 0.012, 1e-12);
    near(d.profile[1].cutM, 2.5);
    expect(d.profile.map((p) => p.flag)).toEqual(['', '', '']);
  });

  it('refuses a profile that misses a main or names one the system does not have', () => {
    const tree = threeMains();
    const ground = profileOf([0, 300], [100, 101]);
    const some = new Map([
      ['a', ground],
      ['b', ground],
    ]);
    expect(() => designSystem(tree, settings(), some)).toThrow(
      'the profile has no stations for main "c"; give main,station,elevation rows for every main',
    );
    const extra = new Map([
      ['a', ground],
      ['b', ground],
      ['c', ground],
      ['z', ground],
    ]);
    expect(() => designSystem(tree, settings(), extra)).toThrow(
      'the profile names main "z", which the system does not have; mains are a, b, c',
    );
  });

  it('refuses an outlet depth or a reach without grade when there is no profile', () => {
    expect(() => designSystem(threeMains(), settings({ outletDepthM: 1 }))).toThrow(
      'outlet.depth is a depth below the ground and needs a profile (profile); give outlet.invert instead',
    );
    const tree = oneMain([{ length: '100 m', grade: '0.2 %' }, { length: '50 m' }]);
    expect(() => designSystem(tree, settings())).toThrow(
      'mains[0].reaches[1].grade: reach a-2 has no grade; give it a grade (or the main one), or give a ground profile with profile',
    );
  });
});
