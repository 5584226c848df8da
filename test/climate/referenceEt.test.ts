import { describe, it, expect } from 'vitest';
import { ET_METHOD_SOURCE, HARGREAVES_BIAS, referenceEt } from '../../src/climate/referenceEt.js';
import { weatherSchema } from '../../src/scenarios/fieldSchema.js';
import { consecutiveDates, dayOfYear } from '../../src/climate/calendar.js';
import { extraterrestrialRadiation } from '../../src/climate/extraterrestrialRadiation.js';
import { hargreavesRefEt } from '../../src/climate/hargreaves.js';
import type { WeatherSeries } from '../../src/climate/weatherSeries.js';

function series(dates: string[], tmax: number, tmin: number): WeatherSeries {
  const n = dates.length;
  return {
    dates,
    precipMm: new Float64Array(n),
    tmaxC: new Float64Array(n).fill(tmax),
    tminC: new Float64Array(n).fill(tmin),
  };
}

describe('referenceEt: method choice', () => {
  it('takes a ref_et column as given', () => {
    const w = series(consecutiveDates('2024-06-01', 3), 25, 12);
    w.refEtMm = Float64Array.of(4.1, 5.2, 3.3);
    w.solarMJm2 = Float64Array.of(20, 20, 20);
    w.rhMeanPct = Float64Array.of(60, 60, 60);
    w.wind2mMs = Float64Array.of(2, 2, 2);
    const r = referenceEt(w, 42);
    expect(r.method).toBe('ref_et column');
    expect([...r.refEtMm]).toEqual([4.1, 5.2, 3.3]);
    expect(r.refEtMm).not.toBe(w.refEtMm); // a copy: callers may modify it
  });

  it('uses FAO Penman-Monteith with solar, humidity and wind: FAO-56 Example 18 as a record', () => {
    // FAO-56 Example 18 (50 deg 48 min N, 100 m, 6 July; from memory): Tmax 21.5,
    // Tmin 12.3 degC, Rs 22.07 MJ m-2 d-1, u2 2.078 m/s, ea 1.409 kPa -> ET0 = 3.9 mm/d.
    // The file form carries RHmean, so ea is given as RHmean = 100 ea / es with es = 1.997 kPa
    // (Example 18), and Ra comes from the latitude and date.
    const w = series(['2023-07-06'], 21.5, 12.3);
    w.solarMJm2 = Float64Array.of(22.07);
    w.rhMeanPct = Float64Array.of((100 * 1.409) / 1.997);
    w.wind2mMs = Float64Array.of(2.078);
    const r = referenceEt(w, 50 + 48 / 60, 100);
    expect(r.method).toBe('FAO Penman-Monteith');
    expect(Math.abs(r.refEtMm[0] - 3.9)).toBeLessThanOrEqual(0.05);
  });

  it('falls back to Hargreaves when any of solar, humidity or wind is missing', () => {
    const dates = consecutiveDates('2023-12-25', 400);
    const w = series(dates, 20, 8);
    w.solarMJm2 = new Float64Array(dates.length).fill(15);
    w.wind2mMs = new Float64Array(dates.length).fill(2);
    const r = referenceEt(w, -33.5);
    expect(r.method).toBe('Hargreaves');
    dates.forEach((d, i) => {
      const ra = extraterrestrialRadiation(-33.5, dayOfYear(d));
      expect(r.refEtMm[i]).toBeCloseTo(hargreavesRefEt(20, 8, ra), 12);
    });
    // Southern summer (January) evaporates more than southern winter (July).
    expect(r.refEtMm[dates.indexOf('2024-01-15')]).toBeGreaterThan(
      2 * r.refEtMm[dates.indexOf('2024-07-15')],
    );
  });
});

describe('referenceEt: what reports say about the method', () => {
  it('names the FAO-56 equation of each method', () => {
    // FAO-56 (Allen et al. 1998): Eq. 6 is the FAO Penman-Monteith equation for daily ET0 and
    // Eq. 52 the Hargreaves equation (from memory).
    expect(ET_METHOD_SOURCE).toEqual({
      'ref_et column': 'given in the weather file',
      'FAO Penman-Monteith': 'FAO-56 Eq. 6',
      Hargreaves: 'FAO-56 Eq. 52',
    });
  });

  it("warns that Hargreaves overestimates in humid climates and names the field file's factor", () => {
    expect(HARGREAVES_BIAS).toMatch(/overestimate ET0 in humid climates/);
    expect(HARGREAVES_BIAS).toMatch(/10-25 %/);
    // The key the caution names is one a field file accepts.
    expect(HARGREAVES_BIAS).toContain('weather.etFactor');
    expect(Object.keys(weatherSchema.unwrap().shape)).toContain('etFactor');
  });
});
