// The response functions of the pool model and the pieces around it against their published forms,
// evaluated here by hand: threshold-power saturation response (Heinen 2006), Q10 and the NEMIS
// two-range temperature response (Henault & Germon 2000), the rescaled logistic uptake curve, the
// mixed-store washout with runoff extraction, and the daily input checks.
import { describe, expect, it } from 'vitest';
import { annualNitrate } from '../../src/nitrate/annual.js';
import { saturationFactor } from '../../src/nitrate/denitrification.js';
import { dailyFertilizer } from '../../src/nitrate/fertilizer.js';
import { simulatePool } from '../../src/nitrate/pool.js';
import { ratingConcentration } from '../../src/nitrate/rating.js';
import { simulateNitrate } from '../../src/nitrate/simulate.js';
import { denitrificationTemperatureFactor, q10Factor } from '../../src/nitrate/temperature.js';
import { cumulativeUptakeFraction } from '../../src/nitrate/uptake.js';
import { constantInput, cornSoybeanCalendar, dates, QUIET } from './synthetic.js';

describe('response functions', () => {
  it('saturation: f = ((s - st) / (1 - st))^w above the threshold, 0 below (Heinen 2006)', () => {
    expect(saturationFactor(0.75, 0.5, 1)).toBeCloseTo(0.5, 15);
    expect(saturationFactor(0.8, 0.2, 2)).toBeCloseTo((0.6 / 0.8) ** 2, 15);
    expect(saturationFactor(0.6, 0, 2)).toBeCloseTo(0.36, 15);
    expect(saturationFactor(0.5, 0.5, 1)).toBe(0); // at the threshold
    expect(saturationFactor(0.3, 0.5, 1)).toBe(0);
    expect(saturationFactor(1.2, 0.5, 2)).toBe(1); // saturated fraction capped at 1
    expect(saturationFactor(1, 0.2, 3)).toBe(1);
  });

  it('Q10: rate(T) / rate(20 degC) = Q10^((T - 20) / 10), none in frozen soil', () => {
    expect(q10Factor(10, 2)).toBeCloseTo(0.5, 15);
    expect(q10Factor(30, 2)).toBeCloseTo(2, 15);
    expect(q10Factor(25, 3)).toBeCloseTo(Math.sqrt(3), 15);
    expect(q10Factor(20, 5)).toBe(1);
    expect(q10Factor(0, 2)).toBe(0);
    expect(q10Factor(-3, 2)).toBe(0);
    expect(q10Factor(0.1, 2)).toBeCloseTo(2 ** -1.99, 15);
  });

  it('NEMIS two ranges: Q10 2.1 from 11 degC up, 89 below, continuous at 11 degC', () => {
    // Henault & Germon (2000) (from memory): f(T) = 2.1^((T - 20)/10) for T >= 11,
    // 2.1^(-0.9) x 89^((T - 11)/10) below.
    const f = (t: number) => denitrificationTemperatureFactor(t, 2.1, 89);
    expect(f(20)).toBe(1);
    expect(f(25)).toBeCloseTo(2.1 ** 0.5, 15);
    expect(f(11)).toBeCloseTo(2.1 ** -0.9, 15);
    expect(f(10.999999)).toBeCloseTo(2.1 ** -0.9, 5);
    expect(f(5)).toBeCloseTo(2.1 ** -0.9 * 89 ** -0.6, 15); // 0.0347, the doc example
    expect(f(5)).toBeCloseTo(0.0347, 4);
    expect(f(1)).toBeCloseTo(2.1 ** -0.9 * 89 ** -1, 15);
    expect(f(0)).toBe(0);
    expect(f(-5)).toBe(0);
    // One Q10 for both ranges is the plain Q10 factor.
    expect(denitrificationTemperatureFactor(5, 2, 2)).toBeCloseTo(q10Factor(5, 2), 15);
  });

  it('uptake: the logistic 1 / (1 + exp(-k (s - s50))) rescaled to 0 at planting, 1 at harvest', () => {
    const L = (x: number) => 1 / (1 + Math.exp(-10 * (x - 0.4)));
    const F = (x: number) => (L(x) - L(0)) / (L(1) - L(0));
    for (const s of [0.1, 0.3, 0.4, 0.65, 0.9]) {
      expect(cumulativeUptakeFraction(s, 0.4, 10)).toBeCloseTo(F(s), 15);
    }
    expect(cumulativeUptakeFraction(0, 0.4, 10)).toBe(0);
    expect(cumulativeUptakeFraction(1, 0.4, 10)).toBeCloseTo(1, 15);
    expect(cumulativeUptakeFraction(-0.2, 0.4, 10)).toBe(0);
    expect(cumulativeUptakeFraction(1.3, 0.4, 10)).toBeCloseTo(1, 15);
    expect(cumulativeUptakeFraction(0.5, 0.5, 10)).toBeCloseTo(0.5, 15); // symmetric curve
  });
});

describe('pool model: daily terms', () => {
  it('runoff washes out r x runoff / W of the pool, with drains and seepage, exactly', () => {
    // Mixed store with outflows drain 4, seepage 1 and runoff 10 mm/d at extraction ratio
    // 0.2: k = (4 + 1 + 0.2 x 10) / 300 per day, M(t) = M0 exp(-k t); losses share as 4 : 1 : 2.
    const input = constantInput(10, { drain: 4, seepage: 1, runoff: 10 });
    const r = simulatePool(input, {
      ...QUIET,
      initialPoolKgHa: 50,
      mobileWaterMm: 300,
      runoffExtractionRatio: 0.2,
    });
    const k = 7 / 300;
    for (let t = 1; t <= 10; t++) {
      expect(r.pool.poolKgHa[t - 1]).toBeCloseTo(50 * Math.exp(-k * t), 12);
    }
    const lost = 50 * (1 - Math.exp(-k));
    expect(r.loadKgHa[0]).toBeCloseTo((lost * 4) / 7, 12);
    expect(r.seepageLoadKgHa[0]).toBeCloseTo((lost * 1) / 7, 12);
    expect(r.runoffLoadKgHa[0]).toBeCloseTo((lost * 2) / 7, 12);
    expect(r.pool.profileConcMgL[0]).toBeCloseTo(((50 * Math.exp(-k)) / 300) * 100, 12);
    expect(r.pool.denitrificationKgHa[0]).toBe(0);
  });

  it('on a day without drain flow the concentration is the profile concentration', () => {
    // 60 kg N/ha in 300 mm is 60 / 300 x 100 = 20 mg/L (1 kg/ha in 1 mm is 100 mg/L).
    const input = constantInput(3);
    const r = simulatePool(input, { ...QUIET, initialPoolKgHa: 60, mobileWaterMm: 300 });
    expect(Array.from(r.concMgL)).toEqual([20, 20, 20]);
    expect(Array.from(r.loadKgHa)).toEqual([0, 0, 0]);
    expect(r.outOfRangeDays).toBe(0);
  });

  it('a season that starts inside the run takes its whole uptake; the pool caps it', () => {
    // Corn from 1 May to 15 October 2000 (synthetic calendar), 180 kg N/ha, no supply limit.
    const ds = dates('2000-01-01', 366);
    const input = { ...constantInput(366), dates: ds, calendar: cornSoybeanCalendar(ds) };
    const ample = simulatePool(input, {
      ...QUIET,
      initialPoolKgHa: 1000,
      uptakeKgHa: { corn: 180, soybean: 110 },
      uptakeHalfSaturationKgHa: 0,
    });
    const plant = ds.indexOf('2000-05-01');
    // The first season day is s = 0: no uptake yet; the day after takes F(s1) - F(0).
    expect(ample.pool.uptakeKgHa[plant]).toBe(0);
    const s1 = input.calendar.seasonFraction[plant + 1];
    expect(ample.pool.uptakeKgHa[plant + 1]).toBeCloseTo(
      180 * cumulativeUptakeFraction(s1, 0.4, 10),
      12,
    );
    expect(ample.pool.uptakeKgHa.reduce((a, b) => a + b, 0)).toBeCloseTo(180, 9);
    // Only 20 kg/ha in the pool: uptake never takes more than there is, and stops at empty.
    const short = simulatePool(input, {
      ...QUIET,
      initialPoolKgHa: 20,
      uptakeKgHa: { corn: 180, soybean: 110 },
      uptakeHalfSaturationKgHa: 0,
    });
    expect(short.pool.uptakeKgHa.reduce((a, b) => a + b, 0)).toBeCloseTo(20, 12);
    expect(short.pool.poolKgHa[365]).toBe(0);
  });

  it('crop names match the uptake table whatever their case and spacing', () => {
    const ds = dates('2000-01-01', 366);
    const cal = { ...cornSoybeanCalendar(ds), crops: [' Corn', 'soybean'] };
    const r = simulatePool(
      { ...constantInput(366), dates: ds, calendar: cal },
      {
        ...QUIET,
        initialPoolKgHa: 1000,
        uptakeKgHa: { 'corn ': 180, soybean: 110 },
        uptakeHalfSaturationKgHa: 0,
      },
    );
    expect(r.pool.uptakeKgHa.reduce((a, b) => a + b, 0)).toBeCloseTo(180, 9);
    expect(() =>
      simulatePool(
        { ...constantInput(366), dates: ds, calendar: cal },
        { ...QUIET, uptakeKgHa: {} },
      ),
    ).toThrow(/crop " Corn".*crops with a value: none$/);
  });
});

describe('fertilizer events', () => {
  const cal = (ds: string[]) => ({ ...constantInput(ds.length).calendar });
  it('a 02-29 event applies in leap years only; a dated event once', () => {
    const ds = dates('2000-01-01', 5 * 365 + 1);
    const f = dailyFertilizer(
      ds,
      [
        { date: '02-29', amountKgHa: 10 },
        { date: '2003-03-01', amountKgHa: 5 },
        { date: '2003-03-01', amountKgHa: 2 },
      ],
      cal(ds),
    );
    const on = ds.flatMap((d, i) => (f[i] > 0 ? [`${d}:${f[i]}`] : []));
    expect(on).toEqual(['2000-02-29:10', '2003-03-01:7', '2004-02-29:10']);
    expect(dailyFertilizer(ds, [], cal(ds)).every((x) => x === 0)).toBe(true);
  });

  it('an event for a crop goes on only where that crop grows in the year', () => {
    const ds = dates('2000-01-01', 731);
    const c = cornSoybeanCalendar(ds); // corn 2000, soybean 2001
    const f = dailyFertilizer(ds, [{ date: '06-01', amountKgHa: 30, crops: ['soybean'] }], c);
    expect(f[ds.indexOf('2000-06-01')]).toBe(0);
    expect(f[ds.indexOf('2001-06-01')]).toBe(30);
    const none = dailyFertilizer(ds, [{ date: '06-01', amountKgHa: 30, crops: ['rice'] }], c);
    expect(none.every((x) => x === 0)).toBe(true);
  });
});

describe('rating and run checks', () => {
  it('the rating range: its edges are in range, zero flow uses the lower edge uncounted', () => {
    const r = ratingConcentration(Float64Array.of(0, 1, 25, 0.5, 30), 10, 0.5, [1, 25]);
    expect(Array.from(r.concMgL)).toEqual([10, 10, 50, 10, 50]);
    expect(r.outOfRangeDays).toBe(2);
    expect(() => ratingConcentration(Float64Array.of(1), 10, 0.5, [0, 25])).toThrow(
      'flowRangeMm must satisfy 0 < min <= max; got [0, 25]',
    );
    expect(() => ratingConcentration(Float64Array.of(1), 10, 0.5, [5, 2])).toThrow(/got \[5, 2\]/);
    expect(ratingConcentration(Float64Array.of(3), 10, 1, [3, 3]).concMgL[0]).toBe(30);
  });

  it('refuses series of the wrong length or with non-finite values, naming them', () => {
    const input = constantInput(3);
    const config = { model: 'fixed', concentrationMgL: 10 } as const;
    expect(() => simulateNitrate({ ...input, runoffMm: new Float64Array(2) }, config)).toThrow(
      'nitrate input runoffMm has 2 days, dates 3',
    );
    const bad = Float64Array.of(1, NaN, 1);
    expect(() => simulateNitrate({ ...input, tmeanC: bad }, config)).toThrow(
      'nitrate input tmeanC is not finite on 2001-01-02: NaN',
    );
    for (const key of [
      'drainflowMm',
      'seepageMm',
      'saturatedFraction',
      'waterTableDepthM',
    ] as const) {
      expect(() => simulateNitrate({ ...input, [key]: bad }, config)).toThrow(
        `nitrate input ${key}`,
      );
    }
    const crop = { ...input.calendar, seasonFraction: bad };
    expect(() => simulateNitrate({ ...input, calendar: crop }, config)).toThrow(
      'nitrate input calendar.seasonFraction',
    );
    const short = { ...input.calendar, crop: new Uint8Array(1) };
    expect(() => simulateNitrate({ ...input, calendar: short }, config)).toThrow(
      'nitrate input calendar.crop has 1 days',
    );
  });

  it('the default runoff extraction ratio of the concentration models is 0.1', () => {
    const input = constantInput(2, { drain: 1, runoff: 10, seepage: 2 });
    for (const config of [
      { model: 'fixed', concentrationMgL: 10 },
      { model: 'seasonal', monthlyMgL: new Array(12).fill(10) },
      { model: 'rating', a: 10, b: 0, fitFlowRangeMm: [0.1, 25] },
    ] as const) {
      const r = simulateNitrate(input, config as Parameters<typeof simulateNitrate>[1]);
      expect(r.runoffLoadKgHa[0]).toBeCloseTo((10 * 0.1 * 10) / 100, 15);
      expect(r.seepageLoadKgHa[0]).toBeCloseTo((2 * 10) / 100, 15);
      expect(r.loadKgHa[0]).toBeCloseTo(0.1, 15);
    }
  });

  it('annual sums: a year without drain flow has no concentration to weigh (0)', () => {
    const ds = dates('2001-01-01', 730);
    const flow = new Float64Array(730);
    for (let i = 0; i < 365; i++) flow[i] = 2;
    const input = { ...constantInput(730), dates: ds, drainflowMm: flow };
    const r = simulateNitrate(input, { model: 'fixed', concentrationMgL: 12 });
    const [a, b] = annualNitrate(ds, flow, r);
    expect([a.year, b.year]).toEqual([2001, 2002]);
    expect(a.drainflow_mm).toBeCloseTo(730, 9);
    expect(a.no3n_load_kg_ha).toBeCloseTo((730 * 12) / 100, 9);
    expect(a.fwmc_mg_l).toBeCloseTo(12, 12);
    expect(b.drainflow_mm).toBe(0);
    expect(b.fwmc_mg_l).toBe(0);
    // Runoff and seepage N by year, and the pool's residual summed: invented daily values.
    const r2 = {
      ...r,
      runoffLoadKgHa: new Float64Array(730).fill(0.001),
      seepageLoadKgHa: new Float64Array(730).fill(0.002),
      pool: { balanceErrorKgHa: new Float64Array(730).fill(1e-12) },
    } as unknown as typeof r;
    const [c] = annualNitrate(ds, flow, r2);
    expect(c.runoff_n_kg_ha).toBeCloseTo(0.365, 12);
    expect(c.seepage_n_kg_ha).toBeCloseTo(0.73, 12);
    expect(c.n_balance_error_kg_ha).toBeCloseTo(365e-12, 20);
  });
});
