import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designSystem, type SystemSettings } from '../../src/drainage/systemDesign.js';
import { systemSchema } from '../../src/drainage/systemSchema.js';
import { buildSystemTree } from '../../src/drainage/systemTree.js';
import { materialMinimumGrade, roughnessFor } from '../../src/drainage/pipeMaterials.js';
import { minimumGrade } from '../../src/drainage/manning.js';
import { pipeSizeList, INCH_SIZES } from '../../src/drainage/pipeSizes.js';
import type { GroundProfile } from '../../src/drainage/gradeLaying.js';
import { TilefluxError } from '../../src/errors.js';
import { inchD, M3S_PER_CFS, manningQ } from './reference.js';

const FT = 0.3048;
const IN = 0.0254;

/** Settings in SI: 1/2 in/d, inch sizes, 1.4 ft/s, round up, 1.1 m depth, 0.6 m cover, 2.5 m deep. */
function settings(over: Partial<SystemSettings> = {}): SystemSettings {
  return {
    coefficientMmD: 12.7,
    sizes: INCH_SIZES,
    velocityMs: 1.4 * FT,
    round: 'up',
    depthM: 1.1,
    minimumCoverM: 0.6,
    maximumDepthM: 2.5,
    ...over,
  };
}

/** Manning in inch-pound units (Chow 1959): Q (ft3/s) = (1.486/n) A R^(2/3) S^(1/2), D in ft. */
const usQ = (dFt: number, s: number, n: number) =>
  (1.486 / n) * ((Math.PI * dFt * dFt) / 4) * Math.pow(dFt / 4, 2 / 3) * Math.sqrt(s);
/** Minimum grade for a full-flow velocity in inch-pound units: S = (V n / (1.486 R^(2/3)))^2. */
const usMinGrade = (dIn: number, vFtS: number, n: number) =>
  Math.pow((vFtS * n) / (1.486 * Math.pow(dIn / 12 / 4, 2 / 3)), 2);

describe('accumulation along a hand-built tree (two mains, laterals both sides)', () => {
  // Main "a" reaches the outlet; main "b" joins it at station 100 m (the top of a-1).
  // a-1: 5 laterals 200 m left and 5 laterals 150 m right, 20 m apart; a-2: 10 laterals 200 m,
  // both sides; b-1: 8 laterals 100 m, both sides; b-2: 1 ha of random lines and 2 L/s of
  // surface inlets. Areas by hand (lateral length x spacing x count):
  //   a-1 local 3.5 ha, a-2 4 ha, b-1 1.6 ha, b-2 1 ha.
  const file = systemSchema.parse({
    name: 'hand-built',
    coefficient: '0.5 in/d',
    laterals: { spacing: '20 m', grade: '0.3 %' },
    mains: [
      {
        name: 'a',
        grade: '0.2 %',
        reaches: [
          {
            length: '100 m',
            laterals: [
              { count: 5, length: '200 m', side: 'left' },
              { count: 5, length: '150 m', side: 'right' },
            ],
          },
          { length: '100 m', laterals: [{ count: 10, length: '200 m', side: 'both' }] },
        ],
      },
      {
        name: 'b',
        grade: '0.2 %',
        joins: { main: 'a', station: '100 m' },
        reaches: [
          { length: '80 m', laterals: [{ count: 8, length: '100 m', side: 'both' }] },
          { length: '80 m', area: '1 ha', inletFlow: '2 L/s' },
        ],
      },
    ],
  });
  const tree = buildSystemTree(file);
  const reach = (id: string) => tree.mains.flatMap((m) => m.reaches).find((r) => r.id === id)!;

  it('carries the area and inlet flow above each reach (hand sums)', () => {
    const expected: Array<[string, number, number]> = [
      ['b-2', 1, 0.002],
      ['b-1', 2.6, 0.002],
      ['a-2', 4, 0],
      ['a-1', 3.5 + 4 + 2.6, 0.002],
    ];
    for (const [id, ha, inlet] of expected) {
      expect(reach(id).areaAboveM2 / 10000).toBeCloseTo(ha, 12);
      expect(reach(id).inletAboveM3s).toBeCloseTo(inlet, 15);
    }
    expect(tree.mains.map((m) => m.name)).toEqual(['a', 'b']);
  });

  it('design flow = area x coefficient + inlets, by the trade rule q (ft3/s) = A (ac) x DC (in/d) / 23.8', () => {
    // 1 ft3/s for a day is 86 400 ft3 = 23.80 acre-inches (common practice).
    const d = designSystem(tree, settings());
    for (const r of d.reaches) {
      const acres = r.reach.areaAboveM2 / 4046.8564224;
      const cfs = (acres * 0.5) / 23.8 + r.reach.inletAboveM3s / M3S_PER_CFS;
      // 23.8 is 23.80 rounded: 2e-4 relative allowed.
      expect(Math.abs(r.designFlowM3s / M3S_PER_CFS / cfs - 1)).toBeLessThan(2e-4);
    }
  });

  it('each reach is the next size up, and the effective coefficient is capacity / area', () => {
    const d = designSystem(tree, settings());
    for (const r of d.reaches) {
      const nominal = r.selected.nominal;
      const i = INCH_SIZES.nominal.indexOf(nominal);
      const need = r.requiredDiameterM / IN;
      expect(nominal).toBeGreaterThanOrEqual(need);
      if (i > 0) expect(INCH_SIZES.nominal[i - 1]).toBeLessThan(need);
      const n = roughnessFor('corrugated', nominal * IN);
      expect(r.capacityM3s).toBeCloseTo(manningQ(nominal * IN, 0.002, n), 12);
      const eff = ((r.capacityM3s - r.reach.inletAboveM3s) / r.reach.areaAboveM2) * 86400 * 1000;
      expect(r.effectiveCoefficientMmD).toBeCloseTo(eff, 9);
    }
    // The lateral groups: one lateral's area and flow.
    const l = d.laterals.find((x) => x.id === 'a-1/L2')!;
    expect(l.areaEachM2).toBe(150 * 20);
    expect(l.designFlowM3s).toBeCloseTo((3000 * 0.0127) / 86400, 15);
  });

  it('rejects a junction off a reach boundary, an unknown main and a loop, naming the key', () => {
    const bad = (mutate: (f: typeof file) => void) => {
      const f = structuredClone(file);
      mutate(f);
      return () => buildSystemTree(f);
    };
    expect(
      bad((f) => {
        f.mains[1].joins!.station = 50;
      }),
    ).toThrowError(/mains\[1\]\.joins\.station: .*stations of "a" are 100, 200 m; got 50 m/);
    expect(bad((f) => (f.mains[1].joins!.main = 'c'))).toThrowError(/no main is named "c"/);
    expect(
      bad((f) => {
        f.mains[0].joins = { main: 'b', station: 80 };
      }),
    ).toThrowError(TilefluxError);
  });
});

describe("Manning capacity against a drainage guide's worked example", () => {
  // Worked example of the kind drainage guides print (from memory): a main for 40 acres at
  // 3/8 in/d on 0.2 % in corrugated tubing: q = 40 x 3/8 / 23.8 = 0.630 ft3/s, and with
  // n = 0.015, D = 16 (q n / S^0.5)^(3/8) = 8.9 in, so 10 in tubing.
  it('sizes the 40-acre main to 10 in and agrees with the inch design formula', () => {
    const areaM2 = 40 * 4046.8564224;
    const file = systemSchema.parse({
      name: 'worked example',
      coefficient: '0.375 in/d',
      mains: [
        { name: 'm', reaches: [{ length: '300 m', grade: '0.2 %', area: `${areaM2 / 10000} ha` }] },
      ],
    });
    const d = designSystem(buildSystemTree(file), settings({ coefficientMmD: 0.375 * 25.4 }));
    const r = d.reaches[0];
    const q = (40 * 0.375) / 23.8;
    expect(r.designFlowM3s / M3S_PER_CFS).toBeCloseTo(q, 3); // 0.630 ft3/s (23.8 rounded)
    expect(inchD(q, 0.002, 0.015)).toBeCloseTo(8.93, 2); // the guide's 8.9 in
    expect(r.selected.nominal).toBe(10);
    // At 10 in corrugated tubing is rougher (n = 0.017, pipeMaterials.ts, from memory): the
    // requirement there is 16 (q 0.017 / S^0.5)^(3/8) = 9.4 in, still within 10 in.
    expect(r.roughness).toBe(0.017);
    const need = (r.requiredDiameterM * 1000) / 25.4;
    // The 16 of the inch formula is 16.01 rounded: 2e-3 relative allowed.
    expect(Math.abs(need / inchD(r.designFlowM3s / M3S_PER_CFS, 0.002, 0.017) - 1)).toBeLessThan(
      2e-3,
    );
    // Full capacity by the inch-pound Manning form (1.486, Chow 1959); 1.486 vs 1.4859: 2e-4.
    expect(Math.abs(r.capacityM3s / (usQ(10 / 12, 0.002, 0.017) * M3S_PER_CFS) - 1)).toBeLessThan(
      2e-4,
    );
  });
});

describe('minimum grades against the trade table', () => {
  // Minimum grades (ft per 100 ft) that keep 1.4 ft/s flowing full, by inside diameter and
  // Manning n, as tabulated in US drainage handbooks for subsurface drains (from memory; the
  // table is Manning's equation at 1.4 ft/s, printed to two decimals).
  const TABLE: Array<[inches: number, n011: number, n013: number, n015: number]> = [
    [3, 0.43, 0.6, 0.81],
    [4, 0.3, 0.41, 0.55],
    [5, 0.22, 0.31, 0.41],
    [6, 0.17, 0.24, 0.32],
    [8, 0.12, 0.16, 0.22],
  ];
  it('minimumGrade reproduces the table to its printed rounding (0.005 ft/100 ft)', () => {
    for (const [d, ...grades] of TABLE) {
      [0.011, 0.013, 0.015].forEach((n, k) => {
        const pct = minimumGrade(d * IN, 1.4 * FT, n) * 100;
        expect(Math.abs(pct - grades[k])).toBeLessThanOrEqual(0.005 + 1e-9);
        // And the inch-pound form evaluated here (1.486 vs 1.4859: 1e-4 relative).
        expect(Math.abs(pct / (usMinGrade(d, 1.4, n) * 100) - 1)).toBeLessThan(2e-4);
      });
    }
  });
  it('corrugated tubing of 3-8 in takes the n = 0.015 column; concrete the n = 0.013 column', () => {
    for (const [d, , n013, n015] of TABLE) {
      expect(
        Math.abs(materialMinimumGrade('corrugated', d * IN, 1.4 * FT) * 100 - n015),
      ).toBeLessThanOrEqual(0.005 + 1e-9);
      expect(
        Math.abs(materialMinimumGrade('concrete', d * IN, 1.4 * FT) * 100 - n013),
      ).toBeLessThanOrEqual(0.005 + 1e-9);
    }
  });
  it('larger corrugated tubing is rougher (0.017 for 10-12 in, 0.020 above; from memory)', () => {
    expect(roughnessFor('corrugated', 8 * IN)).toBe(0.015);
    expect(roughnessFor('corrugated', 10 * IN)).toBe(0.017);
    expect(roughnessFor('corrugated', 12 * IN)).toBe(0.017);
    expect(roughnessFor('corrugated', 15 * IN)).toBe(0.02);
    expect(roughnessFor('clay', 15 * IN)).toBe(0.012);
  });
});

describe('a profile with a knoll', () => {
  // One 400 m reach from the outlet over a knoll 1 m high at station 200 m, back to the outlet's
  // ground level at 400 m. Following the ground would need a level pipe (0 %), flatter than
  // any minimum grade: the pipe is laid at the minimum grade of its size and the cut is deepest
  // at the knoll.
  const profile: GroundProfile = {
    stationsM: Float64Array.of(0, 100, 200, 300, 400),
    elevationsM: Float64Array.of(100, 100.5, 101, 100.5, 100),
  };
  const file = systemSchema.parse({
    name: 'knoll',
    coefficient: '0.5 in/d',
    mains: [{ name: 'trunk', reaches: [{ length: '400 m', area: '4 ha' }] }],
  });
  const s = settings({ velocityMs: 0.5 * FT, outletInvertM: 98.9 });
  const d = designSystem(buildSystemTree(file), s, new Map([['trunk', profile]]));
  const r = d.reaches[0];

  it('keeps the minimum grade of the selected size (inch-pound Manning at 0.5 ft/s)', () => {
    expect(r.gradeLimit).toBe('minimum grade');
    const n = roughnessFor('corrugated', r.selected.diameterM);
    const expected = usMinGrade(r.selected.nominal, 0.5, n);
    expect(Math.abs(r.grade / expected - 1)).toBeLessThan(2e-4);
    expect(r.grade).toBeGreaterThan(0);
  });

  it('reports the deepest cut at the knoll: ground 101 m less the invert there', () => {
    const m = d.mains[0];
    expect(m.maxCutStationM).toBe(200);
    expect(m.maxCutM!).toBeCloseTo(101 - (98.9 + r.grade * 200), 9);
    const cuts = d.profile.map((p) => p.cutM);
    expect(Math.max(...cuts)).toBe(m.maxCutM);
    // Upstream of the knoll the pipe, still rising, keeps its cover above the 0.6 m minimum.
    expect(d.profile.every((p) => p.flag === '')).toBe(true);
  });

  it('flags the stations past the knoll when the cover runs out, and the knoll when too deep', () => {
    const tight = designSystem(
      buildSystemTree(file),
      { ...s, maximumDepthM: 1.5, velocityMs: 1.4 * FT },
      new Map([['trunk', profile]]),
    );
    const flags = tight.profile.map((p) => p.flag);
    expect(flags).toContain('shallow');
    expect(tight.reaches[0].grade).toBeGreaterThanOrEqual(tight.reaches[0].minimumGrade);
    expect(tight.notes.join(' ')).toMatch(/less than the minimum cover/);
  });
});

describe('rounding a 4.4 in requirement', () => {
  // A reach whose flow needs exactly 4.4 in on 0.2 % in corrugated tubing (n = 0.015): the flow
  // is Manning's full capacity of a 4.4 in pipe (./reference.ts), the area that flow / 1/2 in/d.
  const q = manningQ(4.4 * IN, 0.002, 0.015);
  const areaHa = (q * 86400) / 0.0127 / 10000;
  const file = systemSchema.parse({
    name: 'rounding',
    coefficient: '0.5 in/d',
    mains: [{ name: 'm', reaches: [{ length: '200 m', grade: '0.2 %', area: `${areaHa} ha` }] }],
  });
  const tree = buildSystemTree(file);

  it('selects 5 in rounding up, with more than the chosen coefficient', () => {
    const r = designSystem(tree, settings()).reaches[0];
    expect(r.requiredDiameterM / IN).toBeCloseTo(4.4, 9);
    expect(r.selected.nominal).toBe(5);
    // Same grade and n: capacity goes with D^(8/3) (Manning), so 12.7 (5/4.4)^(8/3) mm/d.
    expect(r.effectiveCoefficientMmD).toBeCloseTo(12.7 * Math.pow(5 / 4.4, 8 / 3), 9);
  });

  it('selects 4 in rounding down and reports the smaller coefficient 12.7 (4/4.4)^(8/3)', () => {
    const d = designSystem(tree, settings({ round: 'down' }));
    const r = d.reaches[0];
    expect(r.selected.nominal).toBe(4);
    expect(r.effectiveCoefficientMmD).toBeCloseTo(12.7 * Math.pow(4 / 4.4, 8 / 3), 9);
    expect(r.effectiveCoefficientMmD).toBeLessThan(12.7);
    expect(r.sharePercent).toBeGreaterThan(100);
    expect(d.notes.join(' ')).toMatch(
      /Rounding down: m-1 deliver less than the chosen coefficient/,
    );
  });

  it('is an error when no size in the list is large enough', () => {
    expect(() => designSystem(tree, settings({ sizes: pipeSizeList('3,4 in') }))).toThrowError(
      /larger than the largest size in the sizes of reach m-1/,
    );
  });
});

describe('accumulation on random trees (property)', () => {
  // Any tree: the outlet reach carries the sum of every local area and inlet (conservation),
  // and each reach carries exactly its local area plus everything upstream of its lower end,
  // summed here by walking the tree recursively (a different algorithm from the library's).
  const treeArb = fc
    .array(
      fc.record({
        reaches: fc.array(
          fc.record({
            areaHa: fc.integer({ min: 0, max: 50 }),
            inletLs: fc.integer({ min: 0, max: 5 }),
          }),
          { minLength: 1, maxLength: 4 },
        ),
        parent: fc.nat(),
        at: fc.nat(),
      }),
      { minLength: 1, maxLength: 6 },
    )
    .map((mains) =>
      mains.map((m, i) => {
        const parent = i === 0 ? undefined : m.parent % i;
        const at = parent === undefined ? 0 : (m.at % mains[parent].reaches.length) + 1;
        return { ...m, parent, at };
      }),
    );
  it('conserves area and inlet flow and matches a recursive sum', () => {
    fc.assert(
      fc.property(treeArb, (mains) => {
        const file = systemSchema.parse({
          name: 'random',
          coefficient: '10 mm/d',
          mains: mains.map((m, i) => ({
            name: `m${i}`,
            grade: '0.5 %',
            ...(m.parent === undefined
              ? {}
              : { joins: { main: `m${m.parent}`, station: `${100 * m.at} m` } }),
            reaches: m.reaches.map((r) => ({
              length: '100 m',
              area: `${r.areaHa} ha`,
              inletFlow: `${r.inletLs} L/s`,
            })),
          })),
        });
        const tree = buildSystemTree(file);
        // Recursive sum of area (ha) above reach j (1-based) of main i.
        const above = (i: number, j: number): [number, number] => {
          let a = 0;
          let q = 0;
          for (let k = j - 1; k < mains[i].reaches.length; k++) {
            a += mains[i].reaches[k].areaHa;
            q += mains[i].reaches[k].inletLs;
            mains.forEach((t, ti) => {
              if (t.parent === i && t.at === k + 1) {
                const [ta, tq] = above(ti, 1);
                a += ta;
                q += tq;
              }
            });
          }
          return [a, q];
        };
        const totalA = mains.flatMap((m) => m.reaches).reduce((s, r) => s + r.areaHa, 0);
        const totalQ = mains.flatMap((m) => m.reaches).reduce((s, r) => s + r.inletLs, 0);
        const outlet = tree.mains[0].reaches[0];
        expect(outlet.areaAboveM2 / 10000).toBeCloseTo(totalA, 9);
        expect(outlet.inletAboveM3s * 1000).toBeCloseTo(totalQ, 9);
        for (const m of tree.mains) {
          const i = Number(m.name.slice(1));
          for (const r of m.reaches) {
            const [a, q] = above(i, r.index + 1);
            expect(r.areaAboveM2 / 10000).toBeCloseTo(a, 9);
            expect(r.inletAboveM3s * 1000).toBeCloseTo(q, 9);
          }
        }
      }),
      { numRuns: 200 },
    );
  });
});
