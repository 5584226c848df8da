import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { DEFAULT_SNOW, snowModel } from '../../src/climate/snow.js';

const f64 = (a: number[]) => Float64Array.from(a);

describe('degree-day snow model', () => {
  it('accumulates below the threshold and melts factor * (T - base) per day', () => {
    // Hand calculation with the default parameters (threshold 1, base 0, 2.5 mm/degC/d):
    // day 1 T = -3: 10 mm snow, SWE 10; day 2 T = 2: rain 4, melt 2.5 * 2 = 5, SWE 5;
    // day 3 T = 4: melt min(5, 10) = 5, SWE 0.
    const s = snowModel(f64([10, 4, 0]), f64([0, 5, 8]), f64([-6, -1, 0]));
    expect([...s.snowfallMm]).toEqual([10, 0, 0]);
    expect([...s.rainMm]).toEqual([0, 4, 0]);
    expect([...s.meltMm]).toEqual([0, 5, 5]);
    expect([...s.sweMm]).toEqual([10, 5, 0]);
  });

  const day = fc.record({
    p: fc.double({ min: 0, max: 80, noNaN: true }),
    tmean: fc.double({ min: -25, max: 25, noNaN: true }),
    range: fc.double({ min: 0, max: 20, noNaN: true }),
  });

  it('conserves mass: snowfall = melt + change in SWE, rain + snowfall = precipitation', () => {
    fc.assert(
      fc.property(
        fc.array(day, { minLength: 1, maxLength: 200 }),
        fc.double({ min: 0, max: 300, noNaN: true }),
        (days, swe0) => {
          const p = f64(days.map((d) => d.p));
          const tmax = f64(days.map((d) => d.tmean + d.range / 2));
          const tmin = f64(days.map((d) => d.tmean - d.range / 2));
          const s = snowModel(p, tmax, tmin, DEFAULT_SNOW, swe0);
          let snow = 0;
          let melt = 0;
          for (let i = 0; i < days.length; i++) {
            expect(s.rainMm[i] + s.snowfallMm[i]).toBe(p[i]);
            expect(s.sweMm[i]).toBeGreaterThanOrEqual(0);
            snow += s.snowfallMm[i];
            melt += s.meltMm[i];
          }
          const dSwe = s.sweMm[days.length - 1] - swe0;
          expect(Math.abs(snow - melt - dSwe)).toBeLessThanOrEqual(1e-9 * (1 + snow + swe0));
        },
      ),
    );
  });

  it('never melts at or below the base temperature and never melts more than the pack', () => {
    fc.assert(
      fc.property(fc.array(day, { minLength: 1, maxLength: 200 }), (days) => {
        const p = f64(days.map((d) => d.p));
        const tmax = f64(days.map((d) => d.tmean + d.range / 2));
        const tmin = f64(days.map((d) => d.tmean - d.range / 2));
        const s = snowModel(p, tmax, tmin);
        let before = 0;
        for (let i = 0; i < days.length; i++) {
          const t = (tmax[i] + tmin[i]) / 2;
          if (t <= DEFAULT_SNOW.meltBaseC) expect(s.meltMm[i]).toBe(0);
          expect(s.meltMm[i]).toBeLessThanOrEqual(before + s.snowfallMm[i] + 1e-12);
          expect(s.meltMm[i]).toBeLessThanOrEqual(
            DEFAULT_SNOW.degreeDayMmPerCDay * Math.max(0, t - DEFAULT_SNOW.meltBaseC) + 1e-12,
          );
          before = s.sweMm[i];
        }
      }),
    );
  });

  it('rejects impossible parameters with a message', () => {
    const one = f64([1]);
    expect(() => snowModel(one, one, one, { ...DEFAULT_SNOW, degreeDayMmPerCDay: -1 })).toThrow(
      /degree-day factor -1/,
    );
    expect(() => snowModel(one, one, one, DEFAULT_SNOW, -5)).toThrow(/initial water equivalent/);
  });
});
