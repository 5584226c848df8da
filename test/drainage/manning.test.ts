import { describe, expect, it } from 'vitest';
import {
  fullFlowVelocity,
  manningDiameter,
  manningDiameterInches,
  manningFullCapacity,
  minimumGrade,
} from '../../src/drainage/manning.js';
import {
  INCH_SIZES,
  METRIC_SIZES,
  pipeSizeList,
  ROUGHNESS,
  selectPipeSize,
} from '../../src/drainage/pipeSizes.js';
import { TilefluxError } from '../../src/errors.js';
import { inchD, M3S_PER_CFS, manningQ as siQ } from './reference.js';

// Manning's SI form and the inch design formula are evaluated independently in ./reference.ts.
// Manning's equation in US units (Chow 1959): Q(cfs) = (1.486/n) A R^(2/3) S^(1/2), A ft2, R ft.
const usQ = (Dft: number, S: number, n: number) =>
  (1.486 / n) * ((Math.PI * Dft * Dft) / 4) * Math.pow(Dft / 4, 2 / 3) * Math.sqrt(S);

describe('Manning full-pipe capacity', () => {
  const cases: Array<[D: number, S: number, n: number]> = [
    [0.0762, 0.001, 0.015],
    [0.1016, 0.002, 0.015],
    [0.2032, 0.0005, 0.012],
    [0.6096, 0.003, 0.02],
  ];
  it('equals the SI form evaluated directly', () => {
    for (const [D, S, n] of cases)
      expect(manningFullCapacity(D, S, n) / siQ(D, S, n) - 1).toBeCloseTo(0, 12);
  });
  it('equals the US-unit form (coefficient 1.486, rounded from 1/0.3048^(1/3) = 1.4859)', () => {
    // 1.486 vs 1.48592: 5e-5 relative; 2e-4 allowed.
    for (const [D, S, n] of cases) {
      const cfs = usQ(D / 0.3048, S, n);
      expect(Math.abs(manningFullCapacity(D, S, n) / (cfs * M3S_PER_CFS) - 1)).toBeLessThan(2e-4);
    }
  });
  it('diameter for a flow inverts the capacity; velocity is Q / A; minimum grade inverts velocity', () => {
    for (const [D, S, n] of cases) {
      const Q = siQ(D, S, n);
      expect(manningDiameter(Q, S, n)).toBeCloseTo(D, 12);
      expect(fullFlowVelocity(D, S, n)).toBeCloseTo(Q / ((Math.PI * D * D) / 4), 12);
      expect(minimumGrade(D, fullFlowVelocity(D, S, n), n)).toBeCloseTo(S, 12);
    }
  });
  it('the inch design formula D = 16 (q n / S^0.5)^(3/8) agrees with the SI form', () => {
    // The 16 is 16.01 rounded (12 (4^(5/3) / (1.486 pi))^(3/8)): 0.1 % apart; 2e-3 allowed.
    for (const [qCfs, S, n] of [
      [0.05, 0.002, 0.015],
      [0.5, 0.001, 0.015],
      [3, 0.0008, 0.013],
    ]) {
      const fromSi = (manningDiameter(qCfs * M3S_PER_CFS, S, n) * 1000) / 25.4;
      expect(Math.abs(fromSi / inchD(qCfs, S, n) - 1)).toBeLessThan(2e-3);
      expect(manningDiameterInches(qCfs, S, n)).toBeCloseTo(inchD(qCfs, S, n), 12);
    }
  });
  it('rejects a zero or negative grade', () => {
    expect(() => manningFullCapacity(0.1, 0, 0.015)).toThrowError(/slope/);
    expect(() => manningDiameter(0.01, -0.001, 0.015)).toThrowError(TilefluxError);
  });
});

describe('commercial sizes', () => {
  it('rounds up to the next size (common practice)', () => {
    expect(selectPipeSize(0.0762).nominal).toBe(3); // exactly 3 in
    expect(selectPipeSize(0.0763).nominal).toBe(4);
    expect(selectPipeSize(0.13).nominal).toBe(6); // 5.1 in
    expect(selectPipeSize(0.39).nominal).toBe(18); // 15.4 in
    expect(selectPipeSize(0.101, METRIC_SIZES)).toEqual({
      nominal: 125,
      unit: 'mm',
      diameterM: 0.125,
    });
  });
  it('is an error beyond the largest size, naming the setting', () => {
    expect(() => selectPipeSize(0.62, INCH_SIZES, '--sizes')).toThrowError(
      /largest size in --sizes \(24 in\)/,
    );
  });
  it('reads custom lists', () => {
    expect(pipeSizeList('4,6,8 in').nominal).toEqual([4, 6, 8]);
    expect(pipeSizeList('4,6,8 in').unit).toBe('in');
    expect(pipeSizeList('100, 150, 200').unit).toBe('mm');
    expect(pipeSizeList('0.1 m, 0.2 m').nominal).toEqual([100, 200]);
    expect(() => pipeSizeList('8,6 in')).toThrowError(/increasing order/);
    expect(() => pipeSizeList('4,,6')).toThrowError(/sizes accepts/);
    expect(() => pipeSizeList('4 kg')).toThrowError(/sizes accepts/);
  });
});

describe('drainage-coefficient check: a field lateral', () => {
  // A lateral 400 m long draining a 20 m strip (0.8 ha) at 3/8 and 1/2 inch per day, mineral
  // soil without surface inlets (drainage coefficients of common practice), on a 0.2 % grade,
  // corrugated tubing (n = 0.015). Field laterals are 3 to 6 in tubing in common practice.
  for (const inPerDay of [3 / 8, 1 / 2]) {
    it(`${inPerDay} in/d gets a 3-6 in lateral`, () => {
      const qM3s = (400 * 20 * inPerDay * 0.0254) / 86400;
      const need = manningDiameter(qM3s, 0.002, ROUGHNESS.corrugated.n);
      // Cross-check with the inch design formula evaluated independently.
      const needIn = inchD(qM3s / M3S_PER_CFS, 0.002, 0.015);
      expect(Math.abs((need * 1000) / 25.4 / needIn - 1)).toBeLessThan(2e-3);
      const size = selectPipeSize(need).nominal;
      expect(size).toBeGreaterThanOrEqual(3);
      expect(size).toBeLessThanOrEqual(6);
    });
  }
});
