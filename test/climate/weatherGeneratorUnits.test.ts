import { describe, it, expect } from 'vitest';
import {
  checkGeneratorParams,
  DEFAULT_GENERATOR,
  forHemisphere,
  generateWeather,
  type GeneratorParams,
} from '../../src/climate/index.js';

// Deterministic checks of the weather generator: parameter and option refusals word for word
// with their accepted boundaries, the hemisphere shift, and generated records whose every day
// is fixed by the parameters (Markov chains with probabilities 0 or 1; Tmax and Tmin anomalies
// tied by a correlation of 1, so Tmax - Tmin carries no randomness).

const OMEGA = (2 * Math.PI) / 365.25;

/** Generator parameters for a test: the demo set with some fields replaced. */
function params(change: Partial<GeneratorParams>): GeneratorParams {
  return { ...DEFAULT_GENERATOR, ...change };
}

/** Day of year, 1 on 1 January (plain UTC arithmetic). */
function dayOfYear(date: string): number {
  const y = date.slice(0, 4);
  return (Date.parse(`${date}T00:00:00Z`) - Date.parse(`${y}-01-01T00:00:00Z`)) / 86400000 + 1;
}

describe('generateWeather, fixed days', () => {
  it('all days wet when p01 = p11 = 1, the first day included; all dry when both are 0', () => {
    // Stationary wet probability p01 / (1 + p01 - p11) (Richardson, 1981): 1 and 0.
    const wet = generateWeather({
      years: 1,
      seed: 3,
      params: params({ pWetGivenDry: Array(12).fill(1), pWetGivenWet: Array(12).fill(1) }),
    });
    expect(wet.precipMm.every((p) => p > 0)).toBe(true);
    const dry = generateWeather({
      years: 1,
      seed: 3,
      params: params({ pWetGivenDry: Array(12).fill(0), pWetGivenWet: Array(12).fill(0) }),
    });
    expect(dry.precipMm.every((p) => p === 0)).toBe(true);
  });

  it('Tmax - Tmin follows the harmonics, offsets and wet/dry shift exactly when the anomalies are tied', () => {
    // Correlation 1: the Tmin anomaly equals the Tmax anomaly; equal spreads then cancel in
    // Tmax - Tmin = (mean, amplitude and offset differences) + shift, the shift being
    // (pi - 1) d on wet days and pi d on dry days, pi = p01 / (1 + p01 - p11) (the module's
    // documented straddle of the harmonic). Lag-1 correlation 0 (innovation sqrt(1 - 0) = 1).
    const p01 = 0.3;
    const p11 = 0.6;
    const d = 1.5;
    const tmaxOffset = [1, 0, -1, 0.5, 0, 0, 2, 0, 0, -0.5, 0, 0.25];
    const tminOffset = [0, 0.5, 0, 0, -1, 0, 0, 1, 0, 0, 0.75, 0];
    const p = params({
      pWetGivenDry: Array(12).fill(p01),
      pWetGivenWet: Array(12).fill(p11),
      tmax: { meanC: 20, amplitudeC: 10, sdMeanC: 2, sdAmplitudeC: 0.5 },
      tmin: { meanC: 8, amplitudeC: 4, sdMeanC: 2, sdAmplitudeC: 0.5 },
      warmestDayOfYear: 195,
      tmaxDryMinusWetC: d,
      lag1Correlation: 0,
      tmaxTminCorrelation: 1,
      tmaxMonthlyOffsetC: tmaxOffset,
      tminMonthlyOffsetC: tminOffset,
    });
    const w = generateWeather({ years: 2, seed: 17, params: p });
    const pi = p01 / (1 + p01 - p11);
    let wetDays = 0;
    for (let i = 0; i < w.dates.length; i++) {
      const m = Number(w.dates[i].slice(5, 7)) - 1;
      const h = Math.cos(OMEGA * (dayOfYear(w.dates[i]) - 195));
      const wet = w.precipMm[i] > 0;
      if (wet) wetDays++;
      const shift = (wet ? pi - 1 : pi) * d;
      const expected = tmaxOffset[m] - tminOffset[m] + 12 + 6 * h + shift;
      expect(w.tmaxC[i] - w.tminC[i]).toBeCloseTo(expected, 9);
    }
    // Both kinds of day occur (else the shift would be checked on one side only).
    expect(wetDays).toBeGreaterThan(50);
    expect(wetDays).toBeLessThan(w.dates.length - 50);
  });

  it('starts on 1 January of the start year, year 1 written with four digits', () => {
    const w = generateWeather({ years: 1, seed: 0, startYear: 1 });
    expect(w.dates[0]).toBe('0001-01-01');
    expect(w.dates).toHaveLength(365);
    expect(generateWeather({ years: 1, seed: 0, startYear: 9999 }).dates.at(-1)).toBe('9999-12-31');
  });
});

describe('generateWeather, option refusals', () => {
  it('years from 1 to 2000, start year from 1 to 9999 - years + 1, seed 0 or more', () => {
    expect(() => generateWeather({ years: 0, seed: 1 })).toThrow(
      'years must be a whole number from 1 to 2000; got 0',
    );
    expect(() => generateWeather({ years: 2001, seed: 1 })).toThrow(
      'years must be a whole number from 1 to 2000; got 2001',
    );
    expect(() => generateWeather({ years: 1.5, seed: 1 })).toThrow(
      'years must be a whole number from 1 to 2000; got 1.5',
    );
    expect(generateWeather({ years: 1, seed: 1 }).dates).toHaveLength(365); // 1991
    expect(() => generateWeather({ years: 1, seed: 1, startYear: 0 })).toThrow(
      'start year must be a whole number from 1 to 9999; got 0',
    );
    expect(() => generateWeather({ years: 2, seed: 1, startYear: 9999 })).toThrow(
      'start year must be a whole number from 1 to 9998; got 9999',
    );
    expect(() => generateWeather({ years: 1, seed: 1, startYear: 1990.5 })).toThrow(
      'start year must be a whole number from 1 to 9999; got 1990.5',
    );
    expect(generateWeather({ years: 2, seed: 1, startYear: 9998 }).dates.at(-1)).toBe('9999-12-31');
    expect(() => generateWeather({ years: 1, seed: -1 })).toThrow(
      'seed must be a whole number of 0 or more; got -1',
    );
    expect(() => generateWeather({ years: 1, seed: 0.5 })).toThrow(
      'seed must be a whole number of 0 or more; got 0.5',
    );
    expect(generateWeather({ years: 1, seed: 0 }).dates).toHaveLength(365);
  });
});

describe('forHemisphere', () => {
  it('moves monthly values six months and the warmest day half of 365.25 days; latitude 0 stays', () => {
    const months = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12];
    const p = params({
      warmestDayOfYear: 100,
      tmaxMonthlyOffsetC: months,
      tminMonthlyOffsetC: months.map((m) => -m),
    });
    expect(forHemisphere(p, 0)).toBe(p);
    const q = forHemisphere(p, -30);
    // January takes July's value (hand shift by six).
    expect(q.tmaxMonthlyOffsetC).toEqual([7, 8, 9, 10, 11, 12, 1, 2, 3, 4, 5, 6]);
    expect(q.tminMonthlyOffsetC).toEqual([-7, -8, -9, -10, -11, -12, -1, -2, -3, -4, -5, -6]);
    expect(q.pWetGivenDry[0]).toBe(DEFAULT_GENERATOR.pWetGivenDry[6]);
    // Day 100 + 182.625 = 282.625; day 300 + 182.625 = 482.625, past 365.25 + 1: 117.375.
    expect(q.warmestDayOfYear).toBeCloseTo(282.625, 12);
    expect(forHemisphere(params({ warmestDayOfYear: 300 }), -1).warmestDayOfYear).toBeCloseTo(
      117.375,
      12,
    );
    // Without offsets none are made.
    expect(forHemisphere(DEFAULT_GENERATOR, -30).tmaxMonthlyOffsetC).toBeUndefined();
  });
});

describe('checkGeneratorParams', () => {
  it('monthly arrays: 12 values, probabilities 0 to 1 inclusive, gamma parameters above 0', () => {
    const twelve = (v: number, at = -1, other = 0.5) =>
      Array.from({ length: 12 }, (_, m) => (m === at ? v : other));
    expect(() => checkGeneratorParams(params({ pWetGivenDry: twelve(0.2).slice(1) }))).toThrow(
      'generator parameter pWetGivenDry needs 12 monthly values',
    );
    expect(() => checkGeneratorParams(params({ pWetGivenDry: twelve(-0.01, 2) }))).toThrow(
      'generator parameter pWetGivenDry[3] = -0.01; expected a probability from 0 to 1',
    );
    expect(() => checkGeneratorParams(params({ pWetGivenWet: twelve(1.01, 0) }))).toThrow(
      'generator parameter pWetGivenWet[1] = 1.01; expected a probability from 0 to 1',
    );
    expect(() => checkGeneratorParams(params({ gammaShape: twelve(0, 11) }))).toThrow(
      'generator parameter gammaShape[12] = 0; expected a positive number',
    );
    expect(() => checkGeneratorParams(params({ gammaScaleMm: twelve(NaN, 4) }))).toThrow(
      'generator parameter gammaScaleMm[5] = NaN; expected a positive number of mm',
    );
    // Accepted ends: probabilities exactly 0 and 1 (not together), a tiny positive shape.
    expect(() =>
      checkGeneratorParams(
        params({
          pWetGivenDry: twelve(0, 3),
          pWetGivenWet: twelve(1, 4),
          gammaShape: twelve(1e-9, 1),
        }),
      ),
    ).not.toThrow();
  });

  it('refuses a month with p01 = 0 and p11 = 1 (no long-run wet frequency: 0/0)', () => {
    // p01 / (1 + p01 - p11) = 0 / 0 (Richardson, 1981 stationary form).
    expect(() =>
      checkGeneratorParams(
        params({
          pWetGivenDry: Array.from({ length: 12 }, (_, m) => (m === 4 ? 0 : 0.2)),
          pWetGivenWet: Array.from({ length: 12 }, (_, m) => (m === 4 ? 1 : 0.5)),
        }),
      ),
    ).toThrow(
      'generator month 5: pWetGivenDry 0 with pWetGivenWet 1 has no long-run wet frequency',
    );
  });

  it('offsets, harmonics, correlations and the last two numbers', () => {
    expect(() => checkGeneratorParams(params({ tmaxMonthlyOffsetC: Array(11).fill(0) }))).toThrow(
      'generator parameter tmaxMonthlyOffsetC needs 12 finite monthly values, degC',
    );
    expect(() =>
      checkGeneratorParams(params({ tminMonthlyOffsetC: [...Array(11).fill(0), Infinity] })),
    ).toThrow('generator parameter tminMonthlyOffsetC needs 12 finite monthly values, degC');
    const h = DEFAULT_GENERATOR.tmax;
    expect(() => checkGeneratorParams(params({ tmin: { ...h, amplitudeC: NaN } }))).toThrow(
      'generator parameter tmin needs finite numbers',
    );
    expect(() =>
      checkGeneratorParams(params({ tmax: { ...h, sdMeanC: 1, sdAmplitudeC: -1 } })),
    ).toThrow(
      'generator parameter tmax: sdMeanC must exceed |sdAmplitudeC| so the spread stays positive',
    );
    expect(() =>
      checkGeneratorParams(params({ tmax: { ...h, sdMeanC: 1, sdAmplitudeC: -0.99 } })),
    ).not.toThrow();
    expect(() => checkGeneratorParams(params({ lag1Correlation: 1 }))).toThrow(
      'generator correlations must lie between -1 and 1',
    );
    expect(() => checkGeneratorParams(params({ tmaxTminCorrelation: -1.01 }))).toThrow(
      'generator correlations must lie between -1 and 1',
    );
    // A same-day correlation of exactly 1 is accepted (Tmin's anomaly is Tmax's); lag 0.99 too.
    expect(() =>
      checkGeneratorParams(params({ lag1Correlation: -0.99, tmaxTminCorrelation: 1 })),
    ).not.toThrow();
    expect(() => checkGeneratorParams(params({ warmestDayOfYear: NaN }))).toThrow(
      'generator parameters warmestDayOfYear and tmaxDryMinusWetC must be numbers',
    );
    expect(() => checkGeneratorParams(params({ tmaxDryMinusWetC: Infinity }))).toThrow(
      'generator parameters warmestDayOfYear and tmaxDryMinusWetC must be numbers',
    );
  });
});
