import { describe, it, expect } from 'vitest';
import {
  changeClimate,
  fitGenerator,
  type GeneratorParams,
  type WeatherSeries,
} from '../../src/climate/index.js';

// fitGenerator and changeClimate on small hand-made records, each built inside its test.
// Expected values are hand counts, plain loops written here, or published formulas evaluated
// here (named beside each check), never the library's own output.

const OMEGA = (2 * Math.PI) / 365.25;

/** Consecutive ISO days from `first`, `n` of them (UTC calendar arithmetic). */
function days(first: string, n: number): string[] {
  const t0 = Date.parse(`${first}T00:00:00Z`);
  return Array.from({ length: n }, (_, i) =>
    new Date(t0 + i * 86400000).toISOString().slice(0, 10),
  );
}

/** Day of year, 1 on 1 January (plain UTC arithmetic). */
function dayOfYear(date: string): number {
  return (
    (Date.parse(`${date}T00:00:00Z`) - Date.parse(`${date.slice(0, 4)}-01-01T00:00:00Z`)) /
      86400000 +
    1
  );
}

/** A record of `n` days from `first`; temperatures default to a plain annual wave. */
function record(
  first: string,
  n: number,
  precip: (i: number, date: string) => number,
  tmax: (i: number, date: string) => number = (_i, d) =>
    20 + 8 * Math.cos(OMEGA * (dayOfYear(d) - 200)),
  tmin: (i: number, date: string) => number = (_i, d) =>
    5 + 6 * Math.cos(OMEGA * (dayOfYear(d) - 200)),
): WeatherSeries {
  const dates = days(first, n);
  return {
    dates,
    precipMm: Float64Array.from(dates, (d, i) => precip(i, d)),
    tmaxC: Float64Array.from(dates, (d, i) => tmax(i, d)),
    tminC: Float64Array.from(dates, (d, i) => tmin(i, d)),
  };
}

/** Wet on positions where (37 i) mod 11 < 5; amounts 0.1 mm (exactly the threshold) upward. */
function irregularRain(i: number): number {
  if ((37 * i) % 11 >= 5) return i % 13 === 0 ? 0.09 : 0;
  return 0.1 + ((i * 7) % 9) * 1.7;
}

describe('fitGenerator, precipitation', () => {
  it('p01 and p11 per month equal the hand-counted transitions, counted in the second day’s month', () => {
    const w = record('2001-01-01', 730, irregularRain);
    const fit = fitGenerator(w);
    // Plain loop: a day is wet from 0.1 mm (common practice); the first day has no transition.
    const fromDry = new Array(12).fill(0);
    const dryWet = new Array(12).fill(0);
    const fromWet = new Array(12).fill(0);
    const wetWet = new Array(12).fill(0);
    for (let i = 1; i < w.dates.length; i++) {
      const m = Number(w.dates[i].slice(5, 7)) - 1;
      const before = w.precipMm[i - 1] >= 0.1;
      const now = w.precipMm[i] >= 0.1;
      if (before) {
        fromWet[m]++;
        if (now) wetWet[m]++;
      } else {
        fromDry[m]++;
        if (now) dryWet[m]++;
      }
    }
    for (let m = 0; m < 12; m++) {
      expect(fit.pWetGivenDry[m]).toBe(dryWet[m] / fromDry[m]);
      expect(fit.pWetGivenWet[m]).toBe(wetWet[m] / fromWet[m]);
    }
  });

  it('gamma shape and scale by Thom’s (1958) approximation of the maximum-likelihood shape', () => {
    const w = record('2001-01-01', 730, irregularRain);
    const fit = fitGenerator(w);
    for (let m = 0; m < 12; m++) {
      const x: number[] = [];
      w.dates.forEach((d, i) => {
        if (Number(d.slice(5, 7)) - 1 === m && w.precipMm[i] >= 0.1) x.push(w.precipMm[i]);
      });
      // Thom (1958): A = ln(mean) - mean(ln x), shape = (1 + sqrt(1 + 4A/3)) / (4A), scale =
      // mean / shape (from memory).
      const mean = x.reduce((s, v) => s + v, 0) / x.length;
      const A = Math.log(mean) - x.reduce((s, v) => s + Math.log(v), 0) / x.length;
      const shape = (1 + Math.sqrt(1 + (4 * A) / 3)) / (4 * A);
      expect(fit.gammaShape[m]).toBeCloseTo(shape, 10);
      expect(fit.gammaScaleMm[m]).toBeCloseTo(mean / shape, 10);
    }
  });

  it('a month of equal wet-day amounts (A = 0) gets the large fallback shape 50, keeping the mean', () => {
    // Every wet day 4 mm: ln(mean) - mean(ln x) = 0, where Thom's formula divides by zero; the
    // module documents a shape of 50 then, scale = mean / shape = 4 / 50.
    const w = record('2001-01-01', 365, (i) => ((37 * i) % 11 < 5 ? 4 : 0));
    const fit = fitGenerator(w);
    for (let m = 0; m < 12; m++) {
      expect(fit.gammaShape[m]).toBe(50);
      expect(fit.gammaScaleMm[m]).toBeCloseTo(4 / 50, 12);
    }
  });
});

describe('fitGenerator, temperature', () => {
  it('recovers the mean, amplitude and warmest day of an exact annual wave', () => {
    // Tmax = 20 + 8 cos(omega (d - 200)), Tmin = 5 + 6 cos(...): least squares must give the
    // wave back to rounding, with monthly offsets of 0 (the wave is the whole record).
    const fit = fitGenerator(record('2001-01-01', 730, irregularRain));
    expect(fit.warmestDayOfYear).toBeCloseTo(200, 8);
    expect(fit.tmax.meanC).toBeCloseTo(20, 9);
    expect(fit.tmax.amplitudeC).toBeCloseTo(8, 9);
    expect(fit.tmin.meanC).toBeCloseTo(5, 9);
    expect(fit.tmin.amplitudeC).toBeCloseTo(6, 9);
    for (let m = 0; m < 12; m++) {
      expect(fit.tmaxMonthlyOffsetC?.[m]).toBeCloseTo(0, 9);
      expect(fit.tminMonthlyOffsetC?.[m]).toBeCloseTo(0, 9);
    }
    // No anomaly at all: no dry/wet difference.
    expect(fit.tmaxDryMinusWetC).toBeCloseTo(0, 9);
  });

  it('a warmest day late in the year (day 300) comes back as 300, not as a negative day', () => {
    const wave = (mean: number, amp: number) => (_i: number, d: string) =>
      mean + amp * Math.cos(OMEGA * (dayOfYear(d) - 300));
    const fit = fitGenerator(record('2001-01-01', 730, irregularRain, wave(12, 9), wave(2, 7)));
    expect(fit.warmestDayOfYear).toBeCloseTo(300, 8);
    expect(fit.tmax.amplitudeC).toBeCloseTo(9, 9);
    expect(fit.tmin.amplitudeC).toBeCloseTo(7, 9);
  });

  it('the warmest day is that of the daily mean (Tmax + Tmin) / 2 when Tmax and Tmin peak apart', () => {
    // Tmax peaks on day 190 (amplitude 10), Tmin on day 230 (amplitude 4). The mean
    // (Tmax + Tmin)/2 = B cos(omega d) + C sin(omega d) with, by cos(x - y) = cos x cos y +
    // sin x sin y (trigonometric identity), B = (10 cos(190 w) + 4 cos(230 w)) / 2 and
    // C = (10 sin(190 w) + 4 sin(230 w)) / 2; its peak is at atan2(C, B) / w.
    const fit = fitGenerator(
      record(
        '2001-01-01',
        730,
        irregularRain,
        (_i, d) => 18 + 10 * Math.cos(OMEGA * (dayOfYear(d) - 190)),
        (_i, d) => 3 + 4 * Math.cos(OMEGA * (dayOfYear(d) - 230)),
      ),
    );
    const B = (10 * Math.cos(190 * OMEGA) + 4 * Math.cos(230 * OMEGA)) / 2;
    const C = (10 * Math.sin(190 * OMEGA) + 4 * Math.sin(230 * OMEGA)) / 2;
    // The day of year runs from 1: a negative angle is a day of the next turn of 365.25 days.
    const angleDay = Math.atan2(C, B) / OMEGA;
    const peak = angleDay < 1 ? angleDay + 365.25 : angleDay;
    expect(fit.warmestDayOfYear).toBeCloseTo(peak, 8);
    // Each amplitude is its wave projected on the common peak: A cos(w (own peak - common peak)).
    expect(fit.tmax.amplitudeC).toBeCloseTo(10 * Math.cos(OMEGA * (190 - peak)), 9);
    expect(fit.tmin.amplitudeC).toBeCloseTo(4 * Math.cos(OMEGA * (230 - peak)), 9);
    expect(fit.tmax.meanC).toBeCloseTo(18, 9);
  });
});

describe('fitGenerator, refusals', () => {
  it('refuses a record shorter than a year, and accepts exactly 365 days', () => {
    expect(() => fitGenerator(record('2001-01-01', 364, irregularRain))).toThrow(
      'a generator needs at least one year of daily weather to fit; the record has 364 days',
    );
    expect(() => fitGenerator(record('2001-01-01', 365, irregularRain))).not.toThrow();
  });

  it('refuses a month with 2 wet days, naming it; accepts 3 wet days (hand-made March)', () => {
    // Wet every other day, but March of 2001 (days 59..89) holds only the wet days given.
    const rain = (marchWet: number[]) => (i: number, d: string) =>
      d.startsWith('2001-03')
        ? marchWet.includes(Number(d.slice(8, 10)))
          ? 5
          : 0
        : i % 2
          ? 3 + (i % 5)
          : 0;
    expect(() => fitGenerator(record('2001-01-01', 365, rain([3, 4])))).toThrow(
      'the record has too few wet or dry days in Mar to fit the generator (2 wet days of 0.1 mm or more); give a longer record',
    );
    // 3 wet days, two of them in a row (one wet-to-wet transition), 28 dry days.
    const fit = fitGenerator(record('2001-01-01', 365, rain([3, 4, 20])));
    // Hand count for March: from wet days 3, 4, 20 (3 transitions, one to wet: 3 -> 4); from
    // dry: 28 (28 Feb is dry? day 58 is even, so dry: 1 Mar counts from dry), 2 of them to wet.
    expect(fit.pWetGivenWet[2]).toBe(1 / 3);
    expect(fit.pWetGivenDry[2]).toBe(2 / 28);
  });

  it('refuses a month with fewer than 3 days after a dry day', () => {
    // April of 2001 wet but for two days: 2 dry days (and so at most 2 days after a dry day).
    const fewDry = (i: number, d: string) =>
      d.startsWith('2001-04') ? (d.endsWith('-10') || d.endsWith('-20') ? 0 : 2) : i % 2 ? 3 : 0;
    expect(() => fitGenerator(record('2001-01-01', 365, fewDry))).toThrow(
      'the record has too few wet or dry days in Apr to fit the generator (28 wet days of 0.1 mm or more); give a longer record',
    );
    // Three dry days in April (the 10th, 20th, 25th; 31 March is wet, day 89 odd): exactly 3
    // days after a dry day (hand count), accepted; P(wet | dry) = 3/3, since each is followed by
    // a wet day.
    const threeDry = (i: number, d: string) =>
      d.startsWith('2001-04')
        ? ['10', '20', '25'].includes(d.slice(8, 10))
          ? 0
          : 2
        : i % 2
          ? 3
          : 0;
    expect(fitGenerator(record('2001-01-01', 365, threeDry)).pWetGivenDry[3]).toBe(1);
  });
});

describe('changeClimate', () => {
  // A fitted set without Tmin offsets (they are optional).
  const base = (): GeneratorParams => {
    const { tminMonthlyOffsetC: _dropped, ...p } = fitGenerator(
      record('2001-01-01', 365, irregularRain),
    );
    return p;
  };

  it('scales each month’s gamma scale by 1 + change/100 and adds the temperature change', () => {
    const p = base();
    const pct = [10, -20, 0, 5, 50, -50, 1, 2, 3, 4, -99, 100];
    const dt = [2, 0, -1, 0.5, 3, 3, 3, 3, 3, 3, -4, 1];
    const q = changeClimate(p, { precipChangePct: pct, tempChangeC: dt });
    for (let m = 0; m < 12; m++) {
      // Delta change by definition (the module's documented form).
      expect(q.gammaScaleMm[m]).toBeCloseTo(p.gammaScaleMm[m] * (1 + pct[m] / 100), 12);
      expect(q.gammaShape[m]).toBe(p.gammaShape[m]);
      expect(q.pWetGivenDry[m]).toBe(p.pWetGivenDry[m]);
      expect(q.tmaxMonthlyOffsetC?.[m]).toBeCloseTo((p.tmaxMonthlyOffsetC?.[m] ?? NaN) + dt[m], 12);
      // Without offsets the change alone is the offset.
      expect(q.tminMonthlyOffsetC?.[m]).toBe(dt[m]);
    }
  });

  it('refuses arrays of the wrong length, non-finite values, and a precipitation change of -100 %', () => {
    const p = base();
    const twelve = Array(12).fill(0);
    expect(() =>
      changeClimate(p, { precipChangePct: Array(11).fill(0), tempChangeC: twelve }),
    ).toThrow(
      'precipChangePct needs 12 monthly values above -100; got 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0',
    );
    expect(() =>
      changeClimate(p, { precipChangePct: [...Array(11).fill(0), -100], tempChangeC: twelve }),
    ).toThrow(
      'precipChangePct needs 12 monthly values above -100; got 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, -100',
    );
    expect(() =>
      changeClimate(p, { precipChangePct: twelve, tempChangeC: [NaN, ...Array(11).fill(1)] }),
    ).toThrow('tempChangeC needs 12 monthly values; got NaN, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1');
    expect(() =>
      changeClimate(p, { precipChangePct: twelve, tempChangeC: [...Array(11).fill(1), Infinity] }),
    ).toThrow('tempChangeC needs 12 monthly values; got 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, Infinity');
    // Just above the bound is accepted: -99.9 % leaves a tenth of the amounts.
    expect(
      changeClimate(p, { precipChangePct: Array(12).fill(-99.9), tempChangeC: twelve })
        .gammaScaleMm[0],
    ).toBeCloseTo(p.gammaScaleMm[0] * 0.001, 12);
  });
});
