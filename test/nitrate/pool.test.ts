import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { TilefluxError } from '../../src/errors.js';
import { annualNitrate } from '../../src/nitrate/annual.js';
import { DEFAULT_POOL_PARAMS } from '../../src/nitrate/defaults.js';
import { simulatePool } from '../../src/nitrate/pool.js';
import { simulateNitrate } from '../../src/nitrate/simulate.js';
import type { NitrateInput } from '../../src/nitrate/types.js';
import { constantInput, QUIET, syntheticInput } from './synthetic.js';

function sum(a: Float64Array, from = 0, to = a.length): number {
  let s = 0;
  for (let i = from; i < to; i++) s += a[i];
  return s;
}

describe('pool model: N balance', () => {
  it('closes every calendar year within 1e-6 kg N/ha, from the reported terms', () => {
    // Balance of a control volume (README, Nitrate models): start + fertilizer +
    // mineralization = uptake + denitrification + drain + runoff + seepage N + end. Computed here
    // from the daily series, not from the model's own residual.
    for (const seed of [1, 2, 3]) {
      const input = syntheticInput(6, seed);
      const r = simulatePool(input, DEFAULT_POOL_PARAMS);
      const p = r.pool;
      let start = DEFAULT_POOL_PARAMS.initialPoolKgHa;
      let a = 0;
      const years: number[] = [];
      for (let i = 1; i <= input.dates.length; i++) {
        if (i < input.dates.length && input.dates[i].slice(0, 4) === input.dates[a].slice(0, 4))
          continue;
        const end = p.poolKgHa[i - 1];
        const residual =
          start +
          sum(p.fertilizerKgHa, a, i) +
          sum(p.mineralizationKgHa, a, i) -
          sum(p.uptakeKgHa, a, i) -
          sum(p.denitrificationKgHa, a, i) -
          sum(r.loadKgHa, a, i) -
          sum(r.runoffLoadKgHa, a, i) -
          sum(r.seepageLoadKgHa, a, i) -
          end;
        expect(Math.abs(residual)).toBeLessThan(1e-6);
        years.push(Number(input.dates[a].slice(0, 4)));
        start = end;
        a = i;
      }
      expect(years).toEqual([2000, 2001, 2002, 2003, 2004, 2005]);
      for (const y of annualNitrate(input.dates, input.drainflowMm, r)) {
        expect(Math.abs(y.n_balance_error_kg_ha)).toBeLessThan(1e-6);
      }
      // Every process really ran, so the balance is not closed trivially.
      for (const t of [p.fertilizerKgHa, p.mineralizationKgHa, p.uptakeKgHa, p.denitrificationKgHa])
        expect(sum(t)).toBeGreaterThan(1);
      expect(sum(r.loadKgHa)).toBeGreaterThan(1);
      expect(sum(r.runoffLoadKgHa)).toBeGreaterThan(0);
      expect(sum(r.seepageLoadKgHa)).toBeGreaterThan(0);
    }
  });

  it('load = drain flow x concentration / 100 each day', () => {
    const input = syntheticInput(3, 4);
    const r = simulateNitrate(input, { model: 'pool', ...DEFAULT_POOL_PARAMS });
    for (let i = 0; i < input.dates.length; i++) {
      expect(r.loadKgHa[i]).toBeCloseTo((input.drainflowMm[i] * r.concMgL[i]) / 100, 12);
    }
  });
});

describe('pool model: processes against closed forms', () => {
  it('washes out of a well-mixed store as exp(-Q t / W)', () => {
    // Completely mixed reservoir flushed at a constant rate (continuously stirred tank):
    // M(t) = M0 exp(-Q t / W). 60 kg/ha in 300 mm, 6 mm/d drain + 1 mm/d seepage for 20 days.
    const input = constantInput(20, { drain: 6, seepage: 1 });
    const r = simulatePool(input, { ...QUIET, initialPoolKgHa: 60, mobileWaterMm: 300 });
    for (let t = 1; t <= 20; t++) {
      expect(r.pool.poolKgHa[t - 1]).toBeCloseTo(60 * Math.exp((-7 * t) / 300), 10);
    }
    // Mean concentration of day 1's drain water: (1/day) x integral of C0 exp(-k t) dt
    // = C0 (1 - exp(-k)) / k with C0 = 60 / 300 x 100 = 20 mg/L and k = 7 / 300.
    const k = 7 / 300;
    expect(r.concMgL[0]).toBeCloseTo((20 * (1 - Math.exp(-k))) / k, 10);
    // Drain and seepage share the loss as 6 : 1.
    expect(r.loadKgHa[0] / r.seepageLoadKgHa[0]).toBeCloseTo(6, 10);
  });

  it('mineralizes M20 / 365.25 per day at 20 degC, half that at 10 degC with Q10 = 2', () => {
    // Q10 relation (van 't Hoff): rate(T) = rate(20) x Q10^((T - 20) / 10).
    const p = { ...QUIET, mineralizationKgHaPerYear: 146.1, mineralizationQ10: 2 };
    const at20 = simulatePool(constantInput(10, { t: 20 }), p);
    const at10 = simulatePool(constantInput(10, { t: 10 }), p);
    const frozen = simulatePool(constantInput(10, { t: -2 }), p);
    expect(at20.pool.mineralizationKgHa[0]).toBeCloseTo(146.1 / 365.25, 12);
    expect(at10.pool.mineralizationKgHa[0]).toBeCloseTo(146.1 / 365.25 / 2, 12);
    expect(frozen.pool.mineralizationKgHa[0]).toBe(0);
    expect(at20.pool.poolKgHa[9]).toBeCloseTo(10 * (146.1 / 365.25), 10);
  });

  it('denitrifies as first-order decay at kmax x s^w x the temperature factor', () => {
    // dP/dt = -k P, no flow: P(t) = P0 exp(-k t), k = 0.05 x 0.6^2 x f(T). NEMIS temperature
    // response (Henault & Germon 2000, Eur. J. Soil Sci. 51: 257-270; from memory), written out
    // here: f = 2.1^((T - 20)/10) from 11 degC up, 2.1^(-0.9) x 89^((T - 11)/10) below.
    for (const [t, f] of [
      [15, Math.pow(2.1, -0.5)],
      [5, Math.pow(2.1, -0.9) * Math.pow(89, -0.6)],
    ]) {
      const input = constantInput(30, { sat: 0.6, t });
      const r = simulatePool(input, {
        ...QUIET,
        initialPoolKgHa: 80,
        denitrificationMaxPerDay: 0.05,
      });
      const k = 0.05 * 0.36 * f;
      expect(r.pool.poolKgHa[29]).toBeCloseTo(80 * Math.exp(-k * 30), 10);
      expect(sum(r.pool.denitrificationKgHa)).toBeCloseTo(80 * (1 - Math.exp(-k * 30)), 10);
    }
  });

  it("takes each crop's seasonal uptake over its season when N is ample", () => {
    // The logistic curve is rescaled to run from 0 at planting to 1 at harvest, so a season
    // sums to the crop's uptake: corn 180 (2000), soybean 110 (2001), from DEFAULT_POOL_PARAMS.
    const input = syntheticInput(2, 9);
    input.drainflowMm.fill(0);
    input.runoffMm.fill(0);
    input.seepageMm.fill(0);
    const r = simulatePool(input, {
      ...QUIET,
      initialPoolKgHa: 1000,
      uptakeKgHa: DEFAULT_POOL_PARAMS.uptakeKgHa,
      uptakeHalfSaturationKgHa: 0,
    });
    const half = 366; // 2000 is a leap year
    expect(sum(r.pool.uptakeKgHa, 0, half)).toBeCloseTo(DEFAULT_POOL_PARAMS.uptakeKgHa.corn, 9);
    expect(sum(r.pool.uptakeKgHa, half)).toBeCloseTo(DEFAULT_POOL_PARAMS.uptakeKgHa.soybean, 9);
    // Uptake only in season.
    for (let i = 0; i < input.dates.length; i++)
      if (input.calendar.crop[i] === 0) expect(r.pool.uptakeKgHa[i]).toBe(0);
  });

  it('meets the demand in proportion P / (P + K) when nitrate runs short', () => {
    // Two days of a corn season (season fraction 0.4 then 0.5, no other process): the second
    // day's demand is 180 x (F(0.5) - F(0.4)) with F the logistic curve rescaled to 0..1,
    // evaluated here; Michaelis-Menten supply gives demand x 40 / (40 + 15) from a 40 kg/ha pool.
    const input = constantInput(2);
    input.calendar.crops = ['corn'];
    input.calendar.crop.fill(1);
    input.calendar.seasonFraction.set([0.4, 0.5]);
    const L = (x: number) => 1 / (1 + Math.exp(-10 * (x - 0.4)));
    const F = (x: number) => (L(x) - L(0)) / (L(1) - L(0));
    const demand = 180 * (F(0.5) - F(0.4));
    const r = simulatePool(input, {
      ...QUIET,
      initialPoolKgHa: 40,
      uptakeKgHa: { corn: 180 },
      uptakeMidpoint: 0.4,
      uptakeSteepness: 10,
      uptakeHalfSaturationKgHa: 15,
    });
    expect(r.pool.uptakeKgHa[0]).toBe(0); // the run starts mid-season
    expect(r.pool.uptakeKgHa[1]).toBeCloseTo((demand * 40) / 55, 12);
    expect(demand).toBeGreaterThan(10); // a real step of the curve
  });

  it('asks for the uptake of a crop it does not know', () => {
    const input = syntheticInput(1, 1);
    input.calendar.crops = ['corn', 'sorghum'];
    expect(() =>
      simulatePool(input, { ...DEFAULT_POOL_PARAMS, uptakeKgHa: { corn: 180 } }),
    ).toThrow(TilefluxError);
    expect(() =>
      simulatePool(input, { ...DEFAULT_POOL_PARAMS, uptakeKgHa: { corn: 180 } }),
    ).toThrow(/nitrate.uptake: no seasonal N uptake given for crop "sorghum"/);
  });
});

describe('pool model: fertilizer', () => {
  it('applies MM-DD events every year, or only in the years of the crops named', () => {
    const input = syntheticInput(4, 2); // corn in 2000 and 2002 (synthetic calendar)
    const r = simulatePool(input, {
      ...DEFAULT_POOL_PARAMS,
      fertilizer: [
        { date: '04-25', amountKgHa: 150, crops: ['Corn'] },
        { date: '11-01', amountKgHa: 20 },
        { date: '2001-06-01', amountKgHa: 7 },
      ],
    });
    const on = input.dates.flatMap((d, i) =>
      r.pool.fertilizerKgHa[i] > 0 ? [`${d}:${r.pool.fertilizerKgHa[i]}`] : [],
    );
    expect(on).toEqual([
      '2000-04-25:150',
      '2000-11-01:20',
      '2001-06-01:7',
      '2001-11-01:20',
      '2002-04-25:150',
      '2002-11-01:20',
      '2003-11-01:20',
    ]);
  });

  it('raises the concentration of the next drain flows', () => {
    // Same weather with and without a 100 kg/ha event on 2002-03-15: every later flow day
    // carries more nitrate until the extra is gone, and the first flow day after it carries
    // the closed-form mixed-store value.
    const input = syntheticInput(4, 6);
    const base = { ...DEFAULT_POOL_PARAMS, fertilizer: [] };
    const without = simulatePool(input, base);
    const withEvent = simulatePool(input, {
      ...base,
      fertilizer: [{ date: '2002-03-15', amountKgHa: 100 }],
    });
    const iEvent = input.dates.indexOf('2002-03-15');
    const flowDays: number[] = [];
    for (let i = iEvent; i < input.dates.length && flowDays.length < 10; i++)
      if (input.drainflowMm[i] > 0.1) flowDays.push(i);
    expect(flowDays.length).toBe(10);
    for (const i of flowDays) expect(withEvent.concMgL[i]).toBeGreaterThan(without.concMgL[i] + 1);
    for (let i = 0; i < iEvent; i++) expect(withEvent.concMgL[i]).toBe(without.concMgL[i]);
  });
});

describe('pool model: properties', () => {
  const days = 400;
  const base = syntheticInput(2, 8);
  const slice = (a: Float64Array) => a.slice(0, days);
  const inputWith = (sat: number[], drain?: number[]): NitrateInput => ({
    ...base,
    dates: base.dates.slice(0, days),
    drainflowMm: drain ? Float64Array.from(drain) : slice(base.drainflowMm),
    runoffMm: slice(base.runoffMm),
    seepageMm: slice(base.seepageMm),
    tmeanC: slice(base.tmeanC),
    saturatedFraction: Float64Array.from(sat),
    waterTableDepthM: slice(base.waterTableDepthM),
    calendar: {
      ...base.calendar,
      crop: base.calendar.crop.slice(0, days),
      seasonFraction: slice(base.calendar.seasonFraction),
      kc: slice(base.calendar.kc),
      depletionFraction: slice(base.calendar.depletionFraction),
    },
  });
  const fraction = fc.double({ min: 0, max: 1, noNaN: true });

  it('more saturation gives more denitrification', () => {
    // Raising the saturated fraction on any days raises the day's first-order rate; N removed
    // earlier can lower later denitrification by at most the same amount, so the total can
    // only grow (threshold-power reduction function, Heinen 2006 (from memory)).
    fc.assert(
      fc.property(
        fc.array(fraction, { minLength: days, maxLength: days }),
        fc.array(fraction, { minLength: days, maxLength: days }),
        fc.double({ min: 0.5, max: 4, noNaN: true }),
        (s, extra, w) => {
          const s2 = s.map((v, i) => Math.min(1, v + extra[i] * (1 - v)));
          const p = {
            ...DEFAULT_POOL_PARAMS,
            saturationExponent: w,
            denitrificationMaxPerDay: 0.1,
          };
          const lo = sum(simulatePool(inputWith(s), p).pool.denitrificationKgHa);
          const hi = sum(simulatePool(inputWith(s2), p).pool.denitrificationKgHa);
          expect(hi).toBeGreaterThanOrEqual(lo - 1e-9);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('a wetter profile also lowers the drain concentration (same flows)', () => {
    const dry = simulatePool(inputWith(new Array(days).fill(0.05)), DEFAULT_POOL_PARAMS);
    const wet = simulatePool(inputWith(new Array(days).fill(0.7)), DEFAULT_POOL_PARAMS);
    expect(sum(wet.pool.denitrificationKgHa)).toBeGreaterThan(sum(dry.pool.denitrificationKgHa));
    expect(sum(wet.loadKgHa)).toBeLessThan(sum(dry.loadKgHa));
  });

  it('never lets the pool go negative, whatever the flows and demands', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 2000, noNaN: true }), {
          minLength: days,
          maxLength: days,
        }),
        fc.array(fraction, { minLength: days, maxLength: days }),
        fc.double({ min: 0, max: 2000, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (drain, sat, uptake, kmax) => {
          const r = simulatePool(inputWith(sat, drain), {
            ...DEFAULT_POOL_PARAMS,
            mobileWaterMm: 50,
            uptakeKgHa: { corn: uptake, soybean: uptake },
            denitrificationMaxPerDay: kmax,
          });
          // One expect per case (a plain loop finds the days): 48,000 expect calls took 4 s.
          const bad: number[] = [];
          for (let i = 0; i < days; i++) {
            const ok =
              r.pool.poolKgHa[i] >= 0 &&
              r.loadKgHa[i] >= 0 &&
              Math.abs(r.pool.balanceErrorKgHa[i]) < 1e-9;
            if (!ok) bad.push(i);
          }
          expect(bad).toEqual([]);
        },
      ),
      { numRuns: 40 },
    );
  });
});
