import { describe, it, expect } from 'vitest';
import { hargreavesRefEt } from '../../src/climate/hargreaves.js';

// FAO-56 (Allen et al., 1998) Eq. 52, written out here independently of the code:
// ET0 = 0.0023 (Tmean + 17.8) (Tmax - Tmin)^0.5 * 0.408 Ra, Ra in MJ m-2 d-1, ET0 in mm/d.
const eq52 = (tmax: number, tmin: number, ra: number) =>
  0.0023 * ((tmax + tmin) / 2 + 17.8) * Math.pow(tmax - tmin, 0.5) * (0.408 * ra);

describe('Hargreaves ET0, FAO-56 Eq. 52', () => {
  it('matches an independent evaluation of the published formula', () => {
    const cases: Array<[number, number, number]> = [
      [30, 18, 40],
      [21.5, 12.3, 41.09],
      [5, -3, 12],
      [35, 15, 38],
      [0, -10, 8],
    ];
    for (const [tmax, tmin, ra] of cases) {
      expect(hargreavesRefEt(tmax, tmin, ra)).toBeCloseTo(eq52(tmax, tmin, ra), 12);
    }
  });

  it('gives a hand-computed value: Tmax 30, Tmin 18, Ra 40 -> 5.43 mm/d', () => {
    // 0.0023 * 41.8 * sqrt(12) * 16.32 = 0.0023 * 41.8 * 3.4641 * 16.32 = 5.435 (hand calculation)
    expect(hargreavesRefEt(30, 18, 40)).toBeCloseTo(5.435, 3);
  });

  it('is zero for a zero temperature range and floored at zero below -17.8 degC', () => {
    expect(hargreavesRefEt(10, 10, 30)).toBe(0);
    expect(hargreavesRefEt(-20, -30, 5)).toBe(0);
  });
});
