import { describe, expect, it } from 'vitest';
import { systemSchema } from '../../src/drainage/systemSchema.js';
import { buildSystemTree } from '../../src/drainage/systemTree.js';
import { TilefluxError } from '../../src/errors.js';

// Expected areas and flows are summed by hand (lateral count x length x spacing, plus the
// reach's own area, plus everything upstream: a main is sized section by section for the area
// above the lower end of each section, common practice), written out beside each check.

/** Four mains, listed out of design order: a at the outlet, b and c into a, d into b. */
function fourMains() {
  return systemSchema.parse({
    name: 'four mains',
    coefficient: '12 mm/d',
    laterals: { spacing: '20 m', grade: '0.3 %' },
    mains: [
      {
        name: 'a',
        reaches: [
          {
            length: '100 m',
            grade: '0.2 %',
            laterals: [
              { count: 4, length: '150 m', side: 'left' },
              {
                count: 2,
                length: '100 m',
                spacing: '30 m',
                grade: '0.5 %',
                material: 'smooth-wall',
              },
            ],
          },
          { length: '120 m', grade: '0.2 %', area: '0.5 ha', inletFlow: '3 L/s' },
          { length: '80 m', laterals: [{ count: 3, length: '200 m' }] },
        ],
      },
      {
        name: 'd',
        joins: { main: 'b', station: '110 m' },
        reaches: [{ length: '30 m', area: '0.3 ha', inletFlow: '0.5 L/s' }],
      },
      {
        name: 'c',
        joins: { main: 'a', station: '300 m' },
        reaches: [{ length: '40 m', area: '0.2 ha' }],
      },
      {
        name: 'b',
        material: 'clay',
        grade: '0.25 %',
        joins: { main: 'a', station: '100 m' },
        reaches: [
          { length: '50 m', laterals: [{ count: 5, length: '100 m' }] },
          { length: '60 m', material: 'concrete', area: '1 ha', inletFlow: '1 L/s' },
        ],
      },
    ],
  });
}

/** The message of the error `fn` throws (a TilefluxError). */
function messageOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(TilefluxError);
    return (e as Error).message;
  }
  throw new Error('expected an error');
}

describe('buildSystemTree on four mains (hand sums)', () => {
  it('orders receivers before tributaries, breadth-first from the outlet', () => {
    const tree = buildSystemTree(fourMains());
    // a first; then the mains joining a in file order (c, b); then d, which joins b.
    expect(tree.mains.map((m) => m.name)).toEqual(['a', 'c', 'b', 'd']);
    expect(tree.outletMain).toBe('a');
  });

  it('numbers reaches from the downstream end, with stations, keys and lengths', () => {
    const tree = buildSystemTree(fourMains());
    const a = tree.mains[0];
    expect(
      a.reaches.map((r) => [r.id, r.index, r.key, r.fromStationM, r.toStationM, r.lengthM]),
    ).toEqual([
      ['a-1', 0, 'mains[0].reaches[0]', 0, 100, 100],
      ['a-2', 1, 'mains[0].reaches[1]', 100, 220, 120],
      ['a-3', 2, 'mains[0].reaches[2]', 220, 300, 80],
    ]);
    expect(a.lengthM).toBe(300);
    expect(a.key).toBe('mains[0]');
    const b = tree.mains[2];
    expect(b.key).toBe('mains[3]');
    expect(b.joins).toEqual({ main: 'a', stationM: 100 });
    expect(b.lengthM).toBe(110);
    expect(tree.mains[0].joins).toBeUndefined();
  });

  it('carries the area and inlet flow above each reach', () => {
    const tree = buildSystemTree(fourMains());
    const reach = (id: string) => tree.mains.flatMap((m) => m.reaches).find((r) => r.id === id)!;
    // Local areas (ha): a-1 4 x 150 x 20 + 2 x 100 x 30 = 12000 + 6000 m2 = 1.8; a-2 0.5;
    // a-3 3 x 200 x 20 = 1.2; b-1 5 x 100 x 20 = 1.0; b-2 1; c-1 0.2; d-1 0.3.
    // Above each lower end (ha, L/s):
    const expected: Array<[string, number, number, number, number]> = [
      // id, local ha, local L/s, above ha, above L/s
      ['d-1', 0.3, 0.5, 0.3, 0.5],
      ['c-1', 0.2, 0, 0.2, 0],
      ['b-2', 1, 1, 1 + 0.3, 1 + 0.5], // d joins at the top of b-2 (110 m)
      ['b-1', 1, 0, 1 + 1.3, 1.5],
      ['a-3', 1.2, 0, 1.2 + 0.2, 0], // c joins at the top of a-3 (300 m)
      ['a-2', 0.5, 3, 0.5 + 1.4, 3],
      ['a-1', 1.8, 0, 1.8 + 1.9 + 2.3, 3 + 1.5], // b joins at the top of a-1 (100 m)
    ];
    for (const [id, localHa, localLs, aboveHa, aboveLs] of expected) {
      const r = reach(id);
      expect(Math.abs(r.localAreaM2 / 10000 - localHa)).toBeLessThan(1e-12);
      expect(Math.abs(r.localInletM3s * 1000 - localLs)).toBeLessThan(1e-12);
      expect(Math.abs(r.areaAboveM2 / 10000 - aboveHa)).toBeLessThan(1e-12);
      expect(Math.abs(r.inletAboveM3s * 1000 - aboveLs)).toBeLessThan(1e-12);
    }
  });

  it('builds the lateral groups: ids, keys, spacing and grade defaults, area of one lateral', () => {
    const tree = buildSystemTree(fourMains());
    const [g1, g2] = tree.mains[0].reaches[0].laterals;
    expect(g1).toEqual({
      id: 'a-1/L1',
      reachId: 'a-1',
      key: 'mains[0].reaches[0].laterals[0]',
      count: 4,
      lengthM: 150,
      spacingM: 20, // laterals.spacing
      grade: 0.003, // laterals.grade, 0.3 %
      material: 'corrugated', // the reach's material, the file's default
      side: 'left',
      areaEachM2: 150 * 20,
    });
    expect(g2).toEqual({
      id: 'a-1/L2',
      reachId: 'a-1',
      key: 'mains[0].reaches[0].laterals[1]',
      count: 2,
      lengthM: 100,
      spacingM: 30,
      grade: 0.005,
      material: 'smooth-wall',
      areaEachM2: 100 * 30,
    });
    expect('side' in g2).toBe(false);
  });

  it('takes materials from the reach, else the main, else the file; laterals from their reach', () => {
    const tree = buildSystemTree(fourMains());
    const reach = (id: string) => tree.mains.flatMap((m) => m.reaches).find((r) => r.id === id)!;
    expect(reach('a-1').material).toBe('corrugated');
    expect(reach('b-1').material).toBe('clay');
    expect(reach('b-2').material).toBe('concrete');
    expect(reach('b-1').laterals[0].material).toBe('clay');
    expect(reach('b-1').laterals[0].id).toBe('b-1/L1');
  });

  it('the file-wide lateral material comes before the reach material', () => {
    const f = fourMains();
    f.laterals.material = 'concrete';
    const tree = buildSystemTree(f);
    const reach = (id: string) => tree.mains.flatMap((m) => m.reaches).find((r) => r.id === id)!;
    expect(reach('b-1').laterals[0].material).toBe('concrete');
    expect(reach('a-1').laterals[1].material).toBe('smooth-wall'); // its own comes first
  });

  it('fixed grades from the reach or its main; none where both are absent', () => {
    const tree = buildSystemTree(fourMains());
    const reach = (id: string) => tree.mains.flatMap((m) => m.reaches).find((r) => r.id === id)!;
    expect(reach('a-1').fixedGrade).toBe(0.002);
    expect(reach('b-2').fixedGrade).toBe(0.0025);
    expect(reach('a-3').fixedGrade).toBeUndefined();
  });
});

describe('buildSystemTree refuses a bad tree with one clear message at its key', () => {
  const mainsOf = (mains: unknown[], laterals: object = { spacing: '20 m', grade: '0.3 %' }) =>
    systemSchema.parse({ name: 'bad', coefficient: '12 mm/d', laterals, mains });

  it('a name given twice', () => {
    const f = mainsOf([
      { name: 'a', reaches: [{ length: '100 m' }] },
      { name: 'a', joins: { main: 'a', station: '100 m' }, reaches: [{ length: '50 m' }] },
    ]);
    expect(messageOf(() => buildSystemTree(f))).toBe('mains[1].name: main "a" is named twice');
  });

  it('a lateral group without spacing or grade, here or file-wide', () => {
    const twoReaches = [{ length: '100 m' }, { length: '100 m', laterals: [{ length: '80 m' }] }];
    const noSpacing = mainsOf([{ name: 'a', reaches: twoReaches }], { grade: '0.3 %' });
    expect(messageOf(() => buildSystemTree(noSpacing))).toBe(
      'mains[0].reaches[1].laterals[0].spacing: give the lateral spacing here or as laterals.spacing',
    );
    const twoGroups = [{ length: '100 m', laterals: [{ length: '80 m' }, { length: '80 m' }] }];
    const noGrade = mainsOf([{ name: 'a', reaches: twoGroups }], { spacing: '20 m' });
    expect(messageOf(() => buildSystemTree(noGrade))).toBe(
      'mains[0].reaches[0].laterals[0].grade: give the laterals a grade here or as laterals.grade',
    );
  });

  it('no main at the outlet, or two', () => {
    const none = mainsOf([
      { name: 'a', joins: { main: 'b', station: '50 m' }, reaches: [{ length: '100 m' }] },
      { name: 'b', joins: { main: 'a', station: '100 m' }, reaches: [{ length: '50 m' }] },
    ]);
    expect(messageOf(() => buildSystemTree(none))).toBe(
      'mains: every main joins another; exactly one main (without joins) must reach the outlet',
    );
    const two = mainsOf([
      { name: 'a', reaches: [{ length: '100 m' }] },
      { name: 'b', reaches: [{ length: '50 m' }] },
    ]);
    expect(messageOf(() => buildSystemTree(two))).toBe(
      'mains: exactly one main reaches the outlet (has no joins); got a, b',
    );
  });

  it('a junction into an unknown main, into itself, or off a reach boundary', () => {
    const unknown = mainsOf([
      { name: 'a', reaches: [{ length: '100 m' }] },
      { name: 'b', joins: { main: 'z', station: '100 m' }, reaches: [{ length: '50 m' }] },
    ]);
    expect(messageOf(() => buildSystemTree(unknown))).toBe(
      'mains[1].joins.main: no main is named "z"; mains are a, b',
    );
    const itself = mainsOf([
      { name: 'a', reaches: [{ length: '100 m' }] },
      { name: 'b', joins: { main: 'b', station: '50 m' }, reaches: [{ length: '50 m' }] },
    ]);
    expect(messageOf(() => buildSystemTree(itself))).toBe(
      'mains[1].joins.main: main "b" cannot join itself',
    );
    const off = mainsOf([
      { name: 'a', reaches: [{ length: '100 m' }, { length: '120 m' }, { length: '80.0004 m' }] },
      { name: 'b', joins: { main: 'a', station: '150 m' }, reaches: [{ length: '50 m' }] },
    ]);
    expect(messageOf(() => buildSystemTree(off))).toBe(
      'mains[1].joins.station: a main joins another at the upper end of one of its reaches; ' +
        'stations of "a" are 100, 220, 300 m; got 150 m',
    );
  });

  it('mains joining each other in a loop, away from the outlet', () => {
    const loop = mainsOf([
      { name: 'a', reaches: [{ length: '100 m' }] },
      { name: 'b', joins: { main: 'c', station: '40 m' }, reaches: [{ length: '50 m' }] },
      { name: 'c', joins: { main: 'b', station: '50 m' }, reaches: [{ length: '40 m' }] },
    ]);
    expect(messageOf(() => buildSystemTree(loop))).toBe(
      'mains: mains b, c join in a loop and never reach the outlet',
    );
  });
});
