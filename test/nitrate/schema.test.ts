import { describe, expect, it } from 'vitest';
import { DEFAULT_POOL_PARAMS } from '../../src/nitrate/defaults.js';
import {
  DEFAULT_NITRATE,
  nitrateSchema,
  ratingFromObservations,
} from '../../src/nitrate/schema.js';
import { zKgHa } from '../../src/nitrate/schemaValues.js';

const issues = (v: unknown) => {
  const r = nitrateSchema.safeParse(v);
  return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
};

describe('nitrate section schema', () => {
  it('defaults to the pool model with the corn-soybean defaults', () => {
    expect(nitrateSchema.parse(undefined)).toEqual(DEFAULT_NITRATE);
    expect(DEFAULT_NITRATE).toEqual({ model: 'pool', ...DEFAULT_POOL_PARAMS });
    // A default handed out must not be the shared object.
    const a = nitrateSchema.parse(undefined);
    if (a.model !== 'pool') throw new Error('expected pool');
    a.fertilizer.push({ date: '01-01', amountKgHa: 1 });
    expect(DEFAULT_POOL_PARAMS.fertilizer).toHaveLength(1);
  });

  it('reads each model into its core form, converting units', () => {
    expect(nitrateSchema.parse({ model: 'fixed', concentration: '12 ppm' })).toEqual({
      model: 'fixed',
      concentrationMgL: 12,
      runoffExtractionRatio: 0.1,
    });
    const months = Array.from({ length: 12 }, (_, i) => `${10 + i} mg/L`);
    expect(nitrateSchema.parse({ model: 'seasonal', monthly: months })).toMatchObject({
      monthlyMgL: [10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20, 21],
    });
    // 0.5 in/d = 12.7 mm/d (1 in = 25.4 mm exactly).
    expect(
      nitrateSchema.parse({ model: 'rating', a: 9, b: 0.2, flowRange: ['0.1 mm/d', '0.5 in/d'] }),
    ).toMatchObject({ a: 9, b: 0.2, fitFlowRangeMm: [0.1, expect.closeTo(12.7, 9)] });
    expect(nitrateSchema.parse({ model: 'rating', a: 9, b: 0.2 })).toMatchObject({
      fitFlowRangeMm: [0.1, 25],
    });
    const pool = nitrateSchema.parse({
      model: 'pool',
      initialPool: '30 kg N/ha',
      mobileWater: '10 in',
      uptake: { corn: 200 },
      fertilizer: [{ date: '2024-04-20', amount: '100 lb/ac', crops: ['corn'] }],
      denitrificationRate: '2 %',
    });
    expect(pool).toMatchObject({
      initialPoolKgHa: 30,
      mobileWaterMm: 254,
      uptakeKgHa: { corn: 200, soybean: 110, 'small grains': 90 },
      denitrificationMaxPerDay: 0.02,
    });
    // 1 lb/ac = 0.45359237 kg / 0.40468564224 ha (exact definitions, NIST Handbook 44 App. C).
    if (pool.model !== 'pool') throw new Error('expected pool');
    expect(pool.fertilizer[0].amountKgHa).toBeCloseTo((100 * 0.45359237) / 0.40468564224, 9);
  });

  it('says what is wrong and where', () => {
    expect(issues({ model: 'pol' })[0]).toMatch(
      /^model: .*'fixed' \| 'seasonal' \| 'rating' \| 'pool'/,
    );
    expect(issues({ model: 'pool', initalPool: 3 })[0]).toMatch(/initalPool/);
    expect(issues({ model: 'rating', a: 3 })).toEqual([
      'b: a rating needs both a and b, or observations to fit them to',
    ]);
    expect(issues({ model: 'rating', a: 3, b: 1, observations: 'o.csv' })[0]).toMatch(
      /^observations: give either a and b/,
    );
    expect(issues({ model: 'fixed', concentration: '12 m' })[0]).toMatch(
      /^concentration: expects a concentration/,
    );
    expect(issues({ model: 'seasonal', monthly: [1, 2] })[0]).toMatch(/^monthly: /);
    expect(issues({ model: 'pool', fertilizer: [{ date: '02-30', amount: 1 }] })[0]).toMatch(
      /^fertilizer.0.date: expects a month-day such as "04-25"/,
    );
    expect(issues({ model: 'pool', initialPool: '40 kg' })[0]).toMatch(
      /^initialPool: expects a mass of N per area/,
    );
  });

  it('kg/ha quantities take numbers, kg/ha and lb/ac', () => {
    const s = zKgHa('x');
    expect(s.parse(150)).toBe(150);
    expect(s.parse('150')).toBe(150);
    expect(s.parse('150 kg/ha')).toBe(150);
    expect(s.parse('150 kg N/ha')).toBe(150);
    expect(s.parse('134 lb/ac')).toBeCloseTo((134 * 0.45359237) / 0.40468564224, 9);
    expect(s.safeParse(-1).success).toBe(false);
  });

  it('fits a rating named by observations once the file is read', () => {
    const section = nitrateSchema.parse({ model: 'rating', observations: 'no3.csv' });
    expect(section).toEqual({
      model: 'rating',
      observations: 'no3.csv',
      runoffExtractionRatio: 0.1,
    });
    if (!('observations' in section)) throw new Error('expected observations');
    // Pairs on C = 10 Q^0.5: 10, 20, 40 mg/L at 1, 4, 16 mm.
    const text = 'date,flow_mm,no3n_mg_l\n2024-04-01,1,10\n2024-04-02,4,20\n2024-04-03,16,40\n';
    const { config, fit } = ratingFromObservations(section, text);
    expect(config).toMatchObject({ model: 'rating', fitFlowRangeMm: [1, 16] });
    if (config.model !== 'rating') throw new Error('expected rating');
    expect(config.a).toBeCloseTo(10, 10);
    expect(config.b).toBeCloseTo(0.5, 10);
    expect(fit.n).toBe(3);
    expect(() => ratingFromObservations(section, 'date,flow_mm,no3n_mg_l\n')).toThrow(
      /^no3.csv: a rating C = a Q\^b needs at least 3 pairs/,
    );
  });
});
