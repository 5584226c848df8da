import { describe, it, expect } from 'vitest';
import {
  atmosphericPressure,
  clearSkyRadiation,
  meanSaturationVapourPressure,
  netLongwaveRadiation,
  penmanMonteithRefEt,
  psychrometricConstant,
  saturationVapourPressure,
  vapourPressureFromRhMean,
  vapourPressureSlope,
} from '../../src/climate/penmanMonteith.js';
import {
  daylightHours,
  extraterrestrialRadiation,
} from '../../src/climate/extraterrestrialRadiation.js';

// Reference values: FAO Irrigation and Drainage Paper 56 (Allen et al., 1998), worked examples
// 2, 3, 17 and 18 (from memory). Tolerance: half a unit of the last digit FAO-56 prints.

describe('FAO-56 meteorological helpers', () => {
  it('Example 2: at 1800 m, P = 81.8 kPa and gamma = 0.054 kPa/degC', () => {
    const p = atmosphericPressure(1800);
    expect(Math.abs(p - 81.8)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(psychrometricConstant(p) - 0.054)).toBeLessThanOrEqual(0.0005);
  });

  it('Example 3: e(24.5) = 3.075 kPa, e(15) = 1.705 kPa, es = 2.39 kPa', () => {
    expect(Math.abs(saturationVapourPressure(24.5) - 3.075)).toBeLessThanOrEqual(0.0005);
    expect(Math.abs(saturationVapourPressure(15) - 1.705)).toBeLessThanOrEqual(0.0005);
    expect(Math.abs(meanSaturationVapourPressure(24.5, 15) - 2.39)).toBeLessThanOrEqual(0.005);
  });

  it('RHmean gives ea = RHmean/100 * es (FAO-56 Eq. 19), evaluated independently', () => {
    const e = (t: number) => 0.6108 * Math.exp((17.27 * t) / (t + 237.3)); // Eq. 11
    expect(vapourPressureFromRhMean(68, 25, 18)).toBeCloseTo(0.68 * ((e(25) + e(18)) / 2), 12);
  });
});

describe('FAO Penman-Monteith ET0 (FAO-56 Eq. 6)', () => {
  it('Example 18: 50 deg 48 min N, 6 July, daily data gives ET0 = 3.9 mm/d', () => {
    // Example 18 inputs: z = 100 m, Tmax 21.5, Tmin 12.3 degC, RHmax 84 %, RHmin 63 %,
    // u10 = 10 km/h -> u2 = 2.078 m/s, n = 9.25 h, Ra = 41.09, N = 16.1 h (from memory).
    const ea = (saturationVapourPressure(12.3) * 0.84 + saturationVapourPressure(21.5) * 0.63) / 2;
    expect(Math.abs(ea - 1.409)).toBeLessThanOrEqual(0.0005); // Example 18: ea = 1.409 kPa (Eq. 17)
    expect(Math.abs(vapourPressureSlope(16.9) - 0.122)).toBeLessThanOrEqual(0.0005); // Delta
    const p = atmosphericPressure(100);
    expect(Math.abs(p - 100.1)).toBeLessThanOrEqual(0.05); // Example 18: P = 100.1 kPa
    expect(Math.abs(psychrometricConstant(p) - 0.0666)).toBeLessThanOrEqual(0.00005); // gamma
    const rs = (0.25 + (0.5 * 9.25) / daylightHours(50 + 48 / 60, 187)) * 41.09; // Eq. 35
    expect(Math.abs(rs - 22.07)).toBeLessThanOrEqual(0.005); // Example 18: Rs = 22.07
    const rso = clearSkyRadiation(41.09, 100);
    expect(Math.abs(rso - 30.9)).toBeLessThanOrEqual(0.005); // Example 18: Rso = 30.90
    const rnl = netLongwaveRadiation(21.5, 12.3, 1.409, 22.07, 30.9);
    expect(Math.abs(rnl - 3.71)).toBeLessThanOrEqual(0.005); // Example 18: Rnl = 3.71
    expect(Math.abs(0.77 * 22.07 - rnl - 13.28)).toBeLessThanOrEqual(0.01); // Rn = 13.28
    const et0 = penmanMonteithRefEt({
      tmaxC: 21.5,
      tminC: 12.3,
      eaKPa: 1.409,
      rsMJm2: 22.07,
      raMJm2: 41.09,
      u2Ms: 2.078,
      elevationM: 100,
    });
    expect(Math.abs(et0 - 3.9)).toBeLessThanOrEqual(0.05); // Example 18: ET0 = 3.9 mm/day
  });

  it('Example 17: 13 deg 44 min N, April, monthly data with G = 0.14 gives ET0 = 5.72 mm/d', () => {
    // Example 17 inputs: 13 deg 44 min N, z = 2 m, Tmax 34.8, Tmin 25.6 degC, ea 2.85 kPa,
    // u2 2 m/s, n 8.5 h/d, G = 0.14 MJ m-2 d-1; Rs = 22.65, Rso = 28.54, ET0 = 5.72 (from memory).
    const lat = 13 + 44 / 60;
    const ra = extraterrestrialRadiation(lat, 105);
    const rs = (0.25 + (0.5 * 8.5) / daylightHours(lat, 105)) * ra;
    expect(Math.abs(rs - 22.65)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(clearSkyRadiation(ra, 2) - 28.54)).toBeLessThanOrEqual(0.005);
    const et0 = penmanMonteithRefEt({
      tmaxC: 34.8,
      tminC: 25.6,
      eaKPa: 2.85,
      rsMJm2: rs,
      raMJm2: ra,
      u2Ms: 2,
      elevationM: 2,
      soilHeatFluxMJm2: 0.14,
    });
    expect(Math.abs(et0 - 5.72)).toBeLessThanOrEqual(0.005);
  });

  it('rises with wind and dryness and never turns negative', () => {
    const base = {
      tmaxC: 25,
      tminC: 12,
      eaKPa: 1.2,
      rsMJm2: 20,
      raMJm2: 35,
      u2Ms: 2,
      elevationM: 200,
    };
    const et = penmanMonteithRefEt(base);
    expect(penmanMonteithRefEt({ ...base, u2Ms: 4 })).toBeGreaterThan(et);
    expect(penmanMonteithRefEt({ ...base, eaKPa: 0.8 })).toBeGreaterThan(et);
    // A saturated, overcast winter day loses more longwave than it gains shortwave (Rn < 0):
    // Eq. 6 then gives a negative number, which is floored at zero.
    const ea = meanSaturationVapourPressure(2, -2);
    const rnl = netLongwaveRadiation(2, -2, ea, 3, clearSkyRadiation(6, 0));
    expect(0.77 * 3 - rnl).toBeLessThan(0);
    const wet = { tmaxC: 2, tminC: -2, eaKPa: ea, rsMJm2: 3, raMJm2: 6, u2Ms: 1, elevationM: 0 };
    expect(penmanMonteithRefEt(wet)).toBe(0);
  });
});
