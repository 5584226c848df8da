import { describe, expect, it } from 'vitest';
import { annualNitrate, flowWeightedMeanMgL } from '../../src/nitrate/annual.js';
import { concentrationMgL, loadKgHa } from '../../src/nitrate/load.js';
import { seasonalConcentration } from '../../src/nitrate/seasonal.js';
import { simulateNitrate } from '../../src/nitrate/simulate.js';
import { dates, syntheticInput } from './synthetic.js';

describe('load and concentration units', () => {
  it('1 mm over 1 ha at 12 mg/L carries 0.12 kg', () => {
    // Unit arithmetic: 1 mm x 10 000 m2 = 10 m3 = 10 000 L; 10 000 L x 12 mg/L = 120 000 mg.
    const kg = (1e-3 * 10_000 * 1000 * 12) / 1e6;
    expect(loadKgHa(1, 12)).toBeCloseTo(kg, 15);
    // The inverse: 0.12 kg in 1 mm over 1 ha is 12 mg/L.
    expect(concentrationMgL(0.12, 1)).toBeCloseTo(12, 12);
  });
});

describe('fixed model', () => {
  const input = syntheticInput(4, 7);
  const c = 13.7;
  const r = simulateNitrate(input, {
    model: 'fixed',
    concentrationMgL: c,
    runoffExtractionRatio: 0.2,
  });

  it('load = flow x concentration / 100 every day, exactly', () => {
    // README, Nitrate models: load (kg N/ha) = flow (mm) x concentration (mg/L) / 100.
    let flowDays = 0;
    for (let i = 0; i < input.dates.length; i++) {
      expect(r.loadKgHa[i]).toBe((input.drainflowMm[i] * c) / 100);
      expect(r.concMgL[i]).toBe(c);
      if (input.drainflowMm[i] > 0) flowDays++;
    }
    expect(flowDays).toBeGreaterThan(100); // the synthetic record really has flow
  });

  it('flow-weighted mean concentration of every year equals the concentration', () => {
    // fwmc = 100 x sum(load) / sum(flow) = c when every day carries c.
    const years = annualNitrate(input.dates, input.drainflowMm, r);
    expect(years.map((y) => y.year)).toEqual([2000, 2001, 2002, 2003]);
    for (const y of years) {
      expect(y.drainflow_mm).toBeGreaterThan(0);
      expect(y.fwmc_mg_l).toBeCloseTo(c, 10);
      expect(y.n_balance_error_kg_ha).toBe(0);
    }
  });

  it('seepage carries the drain concentration, runoff the extraction ratio of it', () => {
    for (let i = 0; i < input.dates.length; i++) {
      expect(r.seepageLoadKgHa[i]).toBeCloseTo((input.seepageMm[i] * c) / 100, 14);
      expect(r.runoffLoadKgHa[i]).toBeCloseTo((input.runoffMm[i] * 0.2 * c) / 100, 14);
    }
    expect(r.pool).toBeUndefined();
    expect(r.outOfRangeDays).toBe(0);
  });
});

describe('seasonal model', () => {
  const monthly = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12].map((m) => 10 + m / 10);

  it('maps each date to its calendar month, across month, year and leap-day edges', () => {
    const ds = ['2023-12-31', '2024-01-01', '2024-01-31', '2024-02-01', '2024-02-29', '2024-03-01'];
    // Month of each date read off the calendar by hand: 12, 1, 1, 2, 2, 3.
    expect(Array.from(seasonalConcentration(ds, monthly))).toEqual([
      monthly[11],
      monthly[0],
      monthly[0],
      monthly[1],
      monthly[1],
      monthly[2],
    ]);
  });

  it('gives every month its value over a whole year, and loads from it', () => {
    const ds = dates('2021-01-01', 365);
    const input = syntheticInput(1, 3);
    input.dates = ds;
    const r = simulateNitrate(input, { model: 'seasonal', monthlyMgL: monthly });
    for (let i = 0; i < ds.length; i++) {
      const m = new Date(`${ds[i]}T00:00:00Z`).getUTCMonth(); // independent month lookup
      expect(r.concMgL[i]).toBe(monthly[m]);
      expect(r.loadKgHa[i]).toBe((input.drainflowMm[i] * monthly[m]) / 100);
    }
  });

  it('rejects a list that is not twelve months long', () => {
    expect(() => seasonalConcentration(['2024-01-01'], [1, 2, 3])).toThrow(/12 values/);
  });
});

describe('annual helper', () => {
  it('flow-weighted mean is 100 x load / flow, and 0 without flow', () => {
    expect(flowWeightedMeanMgL(30, 250)).toBeCloseTo(12, 12);
    expect(flowWeightedMeanMgL(0, 0)).toBe(0);
  });
});
