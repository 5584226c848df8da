import { describe, expect, it } from 'vitest';
import {
  airAbove,
  depthForAir,
  porosityAt,
  porosityTable,
} from '../../src/engine/porosityProfile.js';

// Drained pore volume of a layered profile is the integral of the drainable porosity from the
// surface to the water table (specific yield; Ritzema 1994, ILRI Publ. 16): for piecewise
// constant layers it is a sum of porosity x thickness, evaluated by hand below (mm = 1000 x m).
// Layers: 0-0.5 m at 0.08 (40 mm), 0.5-1.0 m at 0.05 (25 mm), 1.0 m to the barrier at 2.0 m at
// 0.03 (30 mm; the last layer always reaches the barrier), 95 mm in all.
const layered = porosityTable({ depthsM: [0.5, 1.0, 3.0], values: [0.08, 0.05, 0.03] }, 2.0);

describe('layered drainable porosity: air volume and its inverse (hand sums)', () => {
  it('air above the water table is the sum of porosity x drained thickness', () => {
    expect(layered.maxAirMm).toBeCloseTo(95, 12);
    expect(layered.minValue).toBe(0.03);
    const cases: [number, number][] = [
      [-1, 0],
      [0, 0],
      [0.25, 0.08 * 250],
      [0.5, 40],
      [0.75, 40 + 0.05 * 250],
      [1.0, 65],
      [1.5, 65 + 0.03 * 500],
      [2.0, 95],
      [3.0, 95],
    ];
    for (const [depth, air] of cases) expect(airAbove(layered, depth)).toBeCloseTo(air, 12);
  });

  it('the water-table depth for a stored air volume inverts the sum', () => {
    const cases: [number, number][] = [
      [-5, 0],
      [0, 0],
      [20, 0.25],
      [40, 0.5],
      [52.5, 0.75],
      [65, 1.0],
      [80, 1.5],
      [95, 2.0],
      [200, 2.0],
    ];
    for (const [air, depth] of cases) expect(depthForAir(layered, air)).toBeCloseTo(depth, 12);
    for (let d = 0.01; d < 2; d += 0.07) {
      expect(depthForAir(layered, airAbove(layered, d))).toBeCloseTo(d, 12);
    }
  });

  it('the porosity at a depth is that of the layer below a boundary', () => {
    const cases: [number, number][] = [
      [0, 0.08],
      [0.25, 0.08],
      [0.5, 0.05],
      [0.99, 0.05],
      [1.0, 0.03],
      [1.99, 0.03],
      [5, 0.03],
    ];
    for (const [depth, mu] of cases) expect(porosityAt(layered, depth)).toBe(mu);
  });

  it('layers below the barrier and layers of no thickness are dropped', () => {
    // 0-1 m at 0.06, 1-2 m at 0.04 (cut at the barrier), a layer wholly below the barrier at
    // 0.01 that must not count (not in the volume, not the smallest porosity).
    const cut = porosityTable({ depthsM: [1, 3, 4], values: [0.06, 0.04, 0.01] }, 2);
    expect(cut.maxAirMm).toBeCloseTo(60 + 40, 12);
    expect(cut.minValue).toBe(0.04);
    expect(Array.from(cut.bottoms)).toEqual([1, 2]);
    // A layer whose bottom lies above the previous one has no thickness: 0-0.5 m at 0.1, then
    // 0.5 m to the barrier at 1.5 m at 0.05; the 0.02 layer (0.5 to 0.4 m) is skipped.
    const skipped = porosityTable({ depthsM: [0.5, 0.4, 1.5], values: [0.1, 0.02, 0.05] }, 1.5);
    expect(Array.from(skipped.values)).toEqual([0.1, 0.05]);
    expect(skipped.maxAirMm).toBeCloseTo(50 + 50, 12);
    expect(airAbove(skipped, 1)).toBeCloseTo(50 + 25, 12);
    // One layer: 0.05 over 2.5 m = 125 mm (the doc example).
    expect(porosityTable({ depthsM: [2.5], values: [0.05] }, 2.5).maxAirMm).toBeCloseTo(125, 12);
  });

  it('the last layer reaches the barrier; a layer of no thickness is not the smallest', () => {
    // Layers given to 1.0 and 1.5 m over a barrier at 2.0 m: the last one (0.04) goes on to it.
    const short = porosityTable({ depthsM: [1.0, 1.5], values: [0.06, 0.04] }, 2.0);
    expect(short.maxAirMm).toBeCloseTo(60 + 40, 12);
    expect(Array.from(short.bottoms)).toEqual([1, 2]);
    // 0.5 to 0.5 m has no thickness: its 0.001 must not set the smallest porosity.
    const flat = porosityTable({ depthsM: [0.5, 0.5, 2], values: [0.1, 0.001, 0.05] }, 2);
    expect(flat.minValue).toBe(0.05);
    expect(flat.values.length).toBe(2);
  });
});
