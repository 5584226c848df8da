import { describe, expect, it } from 'vitest';
import { DEFAULT_SNOW, snowModel } from '../../src/climate/snow.js';
import {
  daylightHours,
  extraterrestrialRadiation,
  sunsetHourAngle,
} from '../../src/climate/extraterrestrialRadiation.js';
import { hargreavesRefEt } from '../../src/climate/hargreaves.js';
import {
  netLongwaveRadiation,
  penmanMonteithRefEt,
  saturationVapourPressure,
} from '../../src/climate/penmanMonteith.js';
import { TilefluxError } from '../../src/errors.js';

// The edges of the climate methods: where FAO-56 (Allen et al., 1998) clamps or floors a term,
// and the parameter ranges the snow model accepts. Reference values are the published equations
// evaluated here, or facts stated beside them.

const f64 = (a: number[]) => Float64Array.from(a);
const one = f64([1]);

describe('degree-day snow model: accepted parameters', () => {
  const ok = (p: Partial<typeof DEFAULT_SNOW>, swe = 0) =>
    snowModel(one, one, one, { ...DEFAULT_SNOW, ...p }, swe);
  it('accepts the ends of each range', () => {
    for (const t of [-10, 10]) {
      expect(() => ok({ rainSnowThresholdC: t })).not.toThrow();
      expect(() => ok({ meltBaseC: t })).not.toThrow();
    }
    expect(() => ok({ degreeDayMmPerCDay: 0 })).not.toThrow();
    expect(() => ok({ degreeDayMmPerCDay: 20 })).not.toThrow();
    expect(() => ok({}, 0)).not.toThrow();
  });
  it('refuses values just outside, and non-numbers, naming the parameter', () => {
    const cases: Array<[Partial<typeof DEFAULT_SNOW>, RegExp]> = [
      [{ rainSnowThresholdC: 10.5 }, /rain\/snow threshold 10\.5 .*between -10 and 10 degC/],
      [{ rainSnowThresholdC: -10.5 }, /rain\/snow threshold -10\.5/],
      [{ rainSnowThresholdC: NaN }, /rain\/snow threshold NaN/],
      [{ meltBaseC: 10.5 }, /melt base 10\.5 .*between -10 and 10 degC/],
      [{ meltBaseC: -10.5 }, /melt base -10\.5/],
      [{ meltBaseC: Infinity }, /melt base Infinity/],
      [{ degreeDayMmPerCDay: 20.5 }, /degree-day factor 20\.5 .*0 to 20 mm\/\(degC d\)/],
      [{ degreeDayMmPerCDay: NaN }, /degree-day factor NaN/],
    ];
    for (const [p, message] of cases) {
      expect(() => ok(p)).toThrowError(TilefluxError);
      expect(() => ok(p)).toThrowError(message);
    }
    expect(() => ok({}, Infinity)).toThrowError(/initial water equivalent Infinity .*0 mm or more/);
    expect(() => ok({}, NaN)).toThrowError(/initial water equivalent/);
  });
  it('refuses temperature series of another length', () => {
    expect(() => snowModel(f64([1, 2]), one, f64([1, 2]))).toThrowError(/differ in length/);
    expect(() => snowModel(f64([1, 2]), f64([1, 2]), one)).toThrowError(RangeError);
  });
  it('treats the threshold as snow and the melt base as no melt (at, not only below)', () => {
    // Mean exactly 1 degC (the default threshold): snow. Mean exactly 0 degC (the base): no melt.
    const s = snowModel(f64([5, 0]), f64([2, 1]), f64([0, -1]), DEFAULT_SNOW, 3);
    expect([...s.snowfallMm]).toEqual([5, 0]);
    // Day 1: T = 1 > base 0: melt 2.5 of the 8 mm pack; day 2: T = 0: no melt.
    expect([...s.meltMm]).toEqual([2.5, 0]);
    expect([...s.sweMm]).toEqual([5.5, 5.5]);
  });
  it('melts the whole pack when the potential melt equals it', () => {
    // T = 2 degC, factor 2.5: potential 5 mm against a 5 mm pack.
    const s = snowModel(f64([0]), f64([4]), f64([0]), DEFAULT_SNOW, 5);
    expect(s.meltMm[0]).toBe(5);
    expect(s.sweMm[0]).toBe(0);
  });
});

describe('FAO-56 radiation at the edges', () => {
  it('polar night: no sunrise (omega_s = 0), no daylight, no Ra', () => {
    // tan(phi) tan(delta) > 1 north of the Arctic circle in December (Eq. 25 clamped to [-1, 1]).
    expect(sunsetHourAngle((80 * Math.PI) / 180, -0.4)).toBe(0);
    expect(daylightHours(80, 355)).toBe(0);
    expect(extraterrestrialRadiation(80, 355)).toBe(0);
  });
  it('midnight sun: omega_s = pi and 24 hours of daylight (Eq. 34: N = 24 omega_s / pi)', () => {
    expect(sunsetHourAngle((80 * Math.PI) / 180, 0.4)).toBe(Math.PI);
    expect(daylightHours(80, 172)).toBeCloseTo(24, 12);
  });
  it('the equator has 12 hours of daylight on every day (omega_s = pi/2 when phi = 0)', () => {
    for (const j of [1, 91, 172, 300]) expect(daylightHours(0, j)).toBeCloseTo(12, 12);
  });
});

describe('FAO-56 ET0 terms that are clamped', () => {
  it('Rs/Rso is limited to 1 (Eq. 39), and Rso = 0 counts as clear sky', () => {
    const clear = netLongwaveRadiation(25, 12, 1.5, 20, 20);
    expect(netLongwaveRadiation(25, 12, 1.5, 26, 20)).toBe(clear);
    expect(netLongwaveRadiation(25, 12, 1.5, 3, 0)).toBe(clear);
    // Eq. 39 evaluated independently at Rs/Rso = 1.
    const k4 = (t: number) => (t + 273.16) ** 4;
    const want = ((4.903e-9 * (k4(25) + k4(12))) / 2) * (0.34 - 0.14 * Math.sqrt(1.5)) * 1;
    expect(Math.abs(clear / want - 1)).toBeLessThan(1e-14);
  });
  it('air wetter than saturation adds no aerodynamic term (es - ea floored at 0)', () => {
    const day = { tmaxC: 20, tminC: 10, rsMJm2: 15, raMJm2: 30, elevationM: 0 };
    const es = (saturationVapourPressure(20) + saturationVapourPressure(10)) / 2;
    const above = penmanMonteithRefEt({ ...day, eaKPa: es + 0.5, u2Ms: 2 });
    // Eq. 6 with es - ea = 0: the wind only enters the denominator; Rnl from Eq. 39 with the
    // given ea (evaluated here for T = 15 degC, sea level: P = 101.3 kPa, Rso = 0.75 Ra).
    const t = 15;
    const delta = (4098 * saturationVapourPressure(t)) / (t + 237.3) ** 2;
    const gamma = 0.665e-3 * 101.3;
    const rso = 0.75 * 30;
    const rn = 0.77 * 15 - netLongwaveRadiation(20, 10, es + 0.5, 15, rso);
    const want = (0.408 * delta * rn) / (delta + gamma * (1 + 0.34 * 2));
    expect(Math.abs(above / want - 1)).toBeLessThan(1e-12);
  });
  it('ET0 is floored at zero when net radiation is negative and the air saturated', () => {
    const et0 = penmanMonteithRefEt({
      tmaxC: 2,
      tminC: -4,
      // Rs half of Rso = 3.75: Rns = 1.44 < Rnl = 1.9 MJ m-2 d-1 (Eq. 38-39), ea above es.
      eaKPa: 0.9,
      rsMJm2: 1.875,
      raMJm2: 5,
      u2Ms: 1,
      elevationM: 0,
    });
    expect(et0).toBe(0);
  });
  it('Hargreaves gives 0 when Tmin exceeds Tmax (no range)', () => {
    expect(hargreavesRefEt(10, 12, 30)).toBe(0);
  });
});
