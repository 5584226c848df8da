import { describe, expect, it } from 'vitest';
import { climateOf } from '../../src/report/reportData.js';
import type { EngineForcing } from '../../src/engine/types.js';

/** A forcing of `n` days with constant precipitation, reference ET and temperature. */
function constantForcing(n: number, p: number, et: number, t: number): EngineForcing {
  const filled = (v: number) => new Float64Array(n).fill(v);
  return {
    dates: Array.from({ length: n }, (_, i) =>
      new Date(Date.UTC(2001, 0, 1 + i)).toISOString().slice(0, 10),
    ),
    precipMm: filled(p),
    rainMm: filled(p),
    snowfallMm: filled(0),
    snowmeltMm: filled(0),
    sweMm: filled(0),
    refEtMm: filled(et),
    tmeanC: filled(t),
  };
}

describe('climate of the compared period', () => {
  it('gives totals per mean Gregorian year (365.2425 days), not per calendar year started', () => {
    // 730 days of 2 mm: 1460 mm over 730 / 365.2425 = 1.99867 years = 730.485 mm/yr.
    const c = climateOf(constantForcing(730, 2, 1.5, 8.5));
    expect(c.precipMmPerYr).toBeCloseTo(730.485, 3);
    expect(c.refEtMmPerYr).toBeCloseTo(547.864, 3);
    expect(c.tmeanC).toBeCloseTo(8.5, 12);
  });

  it('does not call a season a year: 90 days of 3 mm is 1095.7 mm/yr, not 270 mm/yr', () => {
    expect(climateOf(constantForcing(90, 3, 0, 0)).precipMmPerYr).toBeCloseTo(
      (270 * 365.2425) / 90,
      9,
    );
  });

  it('is not a number for an empty period', () => {
    expect(Number.isNaN(climateOf(constantForcing(0, 1, 1, 1)).precipMmPerYr)).toBe(true);
  });
});
