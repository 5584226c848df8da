// The pool model's pieces on hand-made days, without statistics: the crop's uptake demand day by
// day against the logistic curve evaluated here, the reuse of an earlier result's columns, the
// supply limit without a half-saturation constant, flows below zero, the input checks of every
// run, and the value schemas of the nitrate section. Everything is built inside each test.
import { describe, expect, it } from 'vitest';
import { annualNitrate } from '../../src/nitrate/annual.js';
import { concentrationMgL } from '../../src/nitrate/load.js';
import { poolForcingOf, simulatePool } from '../../src/nitrate/pool.js';
import { eventDate, zKgHa } from '../../src/nitrate/schemaValues.js';
import { simulateNitrate } from '../../src/nitrate/simulate.js';
import type { PoolParams } from '../../src/nitrate/types.js';
import { constantInput, QUIET } from './synthetic.js';

/**
 * The share of a season's uptake taken by season fraction s: the logistic
 * 1 / (1 + exp(-k (s - m))) rescaled to run from 0 at planting to 1 at harvest (the README's
 * uptake curve), written out here.
 */
function uptakeShare(s: number, m: number, k: number): number {
  const f = (x: number) => 1 / (1 + Math.exp(-k * (x - m)));
  return (f(s) - f(0)) / (f(1) - f(0));
}

/** A run of `fractions.length` days, crop codes and season fractions given day by day. */
function seasonInput(codes: number[], fractions: number[]) {
  const input = constantInput(codes.length);
  input.calendar.crop = Uint8Array.from(codes);
  input.calendar.seasonFraction = Float64Array.from(fractions);
  input.calendar.crops = ['corn', 'soybean'];
  return input;
}

describe('pool model: uptake demand day by day', () => {
  const p: PoolParams = { ...QUIET, uptakeKgHa: { corn: 200, soybean: 120 } };
  const share = (s: number) => uptakeShare(s, p.uptakeMidpoint, p.uptakeSteepness);

  it("takes each day's step along the crop's curve, from planting on", () => {
    // Bare, bare, corn from planting (0) to harvest (1), bare.
    const f = [-1, -1, 0, 0.25, 0.5, 0.75, 1, -1];
    const d = poolForcingOf(seasonInput([0, 0, 1, 1, 1, 1, 1, 0], f), p).uptakeDemandKgHa;
    const expected = [
      0,
      0,
      0,
      ...[0.25, 0.5, 0.75, 1].map((s, j) => 200 * (share(s) - share(f[j + 2]))),
      0,
    ];
    for (let i = 0; i < f.length; i++) expect(d[i], `day ${i}`).toBeCloseTo(expected[i], 12);
    // The season's demand adds up to the crop's uptake (share 0 at planting, 1 at harvest).
    expect(d.reduce((a, b) => a + b, 0)).toBeCloseTo(200, 10);
  });

  it('counts a season first seen after planting from the curve at 0, the run start from that day', () => {
    // Bare, then corn first seen at 0.4 (the planting day fell in a gap of the calendar): the
    // day takes the curve from 0 to 0.4. A run that starts at 0.4 takes nothing that day.
    const gap = poolForcingOf(seasonInput([0, 1, 1], [-1, 0.4, 0.6]), p).uptakeDemandKgHa;
    expect(gap[1]).toBeCloseTo(200 * share(0.4), 12);
    expect(gap[2]).toBeCloseTo(200 * (share(0.6) - share(0.4)), 12);
    const start = poolForcingOf(seasonInput([1, 1], [0.4, 0.6]), p).uptakeDemandKgHa;
    expect(start[0]).toBe(0);
    expect(start[1]).toBeCloseTo(200 * (share(0.6) - share(0.4)), 12);
  });

  it('starts a new crop from its own curve, and never takes a negative demand', () => {
    // Corn to 0.5, then soybean at 0.3 the next day: soybean's curve from 0 to 0.3.
    const swap = poolForcingOf(seasonInput([1, 1, 2], [0.2, 0.5, 0.3]), p).uptakeDemandKgHa;
    expect(swap[2]).toBeCloseTo(120 * share(0.3), 12);
    // Corn at harvest (1), then corn again at 0.1 the next day: the curve steps back, which is
    // no uptake (not a negative one).
    const again = poolForcingOf(seasonInput([1, 1, 1], [0.9, 1, 0.1]), p).uptakeDemandKgHa;
    expect(again[2]).toBe(0);
  });

  it('names the crops that have a value when one is missing', () => {
    const input = seasonInput([1], [0.5]);
    input.calendar.crops = ['wheat'];
    expect(() => poolForcingOf(input, p)).toThrow(
      'no seasonal N uptake given for crop "wheat"; add it (kg N/ha per season), e.g. ' +
        'uptake: { wheat: 150 }; crops with a value: corn, soybean',
    );
  });
});

describe('pool model: reuse, supply limit and flows below zero', () => {
  it("writes into an earlier result's columns over as many days, and allocates otherwise", () => {
    const p: PoolParams = { ...QUIET, initialPoolKgHa: 50 };
    const first = simulatePool(constantInput(20, { drain: 2 }), p);
    const again = simulatePool(constantInput(20, { drain: 4 }), p, undefined, first);
    expect(again.concMgL).toBe(first.concMgL);
    expect(again.pool.poolKgHa).toBe(first.pool.poolKgHa);
    expect([...again.loadKgHa]).toEqual([
      ...simulatePool(constantInput(20, { drain: 4 }), p).loadKgHa,
    ]);
    // Over another number of days the earlier columns are not used.
    const longer = simulatePool(constantInput(30, { drain: 4 }), p, undefined, first);
    expect(longer.concMgL).not.toBe(first.concMgL);
    expect(longer.concMgL).toHaveLength(30);
    expect([...longer.pool.poolKgHa]).toEqual([
      ...simulatePool(constantInput(30, { drain: 4 }), p).pool.poolKgHa,
    ]);
  });

  it('without a half-saturation constant takes the whole demand, and nothing from an empty pool', () => {
    // K = 0: uptake = min(demand, pool); an empty pool gives 0, not 0/0.
    const p: PoolParams = { ...QUIET, uptakeKgHa: { corn: 200 }, uptakeHalfSaturationKgHa: 0 };
    const input = seasonInput([1, 1, 1], [0, 0.5, 1]);
    input.calendar.crops = ['corn'];
    const empty = simulatePool(input, p).pool.uptakeKgHa;
    expect([...empty]).toEqual([0, 0, 0]);
    const full = simulatePool(input, { ...p, initialPoolKgHa: 500 }).pool.uptakeKgHa;
    const share = (s: number) => uptakeShare(s, p.uptakeMidpoint, p.uptakeSteepness);
    expect(full[1]).toBeCloseTo(200 * share(0.5), 12);
  });

  it('treats a flow below zero (a rounding residue) as no flow', () => {
    const p: PoolParams = { ...QUIET, initialPoolKgHa: 40 };
    const residue = simulatePool(
      constantInput(5, { drain: -1e-9, runoff: -1e-9, seepage: -1e-9 }),
      p,
    );
    const none = simulatePool(constantInput(5), p);
    expect([...residue.pool.poolKgHa]).toEqual([...none.pool.poolKgHa]);
    expect([...residue.loadKgHa]).toEqual([0, 0, 0, 0, 0]);
    expect([...residue.runoffLoadKgHa]).toEqual([0, 0, 0, 0, 0]);
    expect([...residue.seepageLoadKgHa]).toEqual([0, 0, 0, 0, 0]);
  });
});

describe('nitrate input checks', () => {
  it('checks the flows and the water regime of every run, also in arrays it has seen before', () => {
    // A sweep hands the same engine columns to run after run with new values: a value that is
    // not finite must be found in the second run too.
    for (const name of [
      'drainflowMm',
      'runoffMm',
      'seepageMm',
      'saturatedFraction',
      'waterTableDepthM',
    ] as const) {
      const input = constantInput(4, { drain: 1, sat: 0.5 });
      const config = { model: 'fixed', concentrationMgL: 10 } as const;
      expect(() => simulateNitrate(input, config)).not.toThrow();
      input[name][2] = Number.NaN;
      expect(() => simulateNitrate(input, config), name).toThrow(
        `nitrate input ${name} is not finite on 2001-01-03: NaN`,
      );
    }
  });
});

describe('nitrate value schemas', () => {
  it('reads masses of N per area as numbers, kg/ha or lb/ac, at least 0', () => {
    const s = zKgHa('Fertilizer N');
    expect(s.parse(150)).toBe(150);
    expect(s.parse(0)).toBe(0);
    expect(s.parse('150 kg N/ha')).toBe(150);
    // 1 lb/ac = 0.45359237 kg / 0.40468564224 ha = 1.12085 kg/ha (exact definitions).
    expect(s.parse('100 lb/ac')).toBeCloseTo((100 * 0.45359237) / 0.40468564224, 9);
    const bad = s.safeParse(-1);
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].message).toBe(
      'expects a mass of N per area of at least 0 such as 150, 150 kg/ha or 134 lb/ac; got -1',
    );
    expect(s.safeParse('lots').success).toBe(false);
    expect(s.description).toBe('Fertilizer N [kg N/ha; e.g. 150, 150 kg/ha or 134 lb/ac]');
    expect(zKgHa('Mineralization', true).description).toBe(
      'Mineralization [kg N/ha per year; e.g. 150, 150 kg/ha or 134 lb/ac]',
    );
  });

  it('takes application dates as real month-days or real dates only', () => {
    for (const good of ['04-25', '02-29', '2024-04-25', '2024-02-29']) {
      expect(eventDate.safeParse(good).success, good).toBe(true);
    }
    for (const bad of [
      '04-31',
      '4-25',
      '04-5',
      'x04-25',
      '04-25x',
      'ab-cd',
      '2023-02-29',
      '2024-4-25',
      'x2024-04-25',
      '2024-04-25x',
      '',
    ]) {
      expect(eventDate.safeParse(bad).success, bad).toBe(false);
    }
  });
});

describe('concentration and yearly sums', () => {
  it('turns kg N/ha in mm of water into mg N/L', () => {
    // 1 kg/ha in 1 mm is 1 kg in 10 m3, 100 g/m3 = 100 mg/L (unit definitions): 30 kg/ha in
    // 300 mm is 10 mg/L, 5 kg/ha in 250 mm 2 mg/L.
    expect(concentrationMgL(30, 300)).toBeCloseTo(10, 12);
    expect(concentrationMgL(5, 250)).toBeCloseTo(2, 12);
  });

  it('sums by year from ISO dates and from integer years alike', () => {
    const input = constantInput(400, { drain: 1 });
    const r = simulatePool(input, { ...QUIET, initialPoolKgHa: 60 });
    const byDate = annualNitrate(input.dates, input.drainflowMm, r);
    const years = Int32Array.from(input.dates, (d) => Number(d.slice(0, 4)));
    expect(annualNitrate(years, input.drainflowMm, r)).toEqual(byDate);
    expect(byDate.map((y) => y.year)).toEqual([2001, 2002]);
    expect(byDate[0].drainflow_mm).toBeCloseTo(365, 9);
  });
});
