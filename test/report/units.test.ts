import { describe, expect, it } from 'vitest';
import { displayUnits } from '../../src/report/units.js';

// Exact definitions: 1 in = 25.4 mm, 1 ft = 0.3048 m, 1 acre = 4046.8564224 m2,
// 1 lb = 0.45359237 kg (NIST Handbook 44, Appendix C).
describe('display units', () => {
  it('SI shows the core units unchanged', () => {
    const si = displayUnits('si');
    for (const u of Object.values(si)) expect(u.factor).toBe(1);
    expect(si.water.label).toBe('mm');
    expect(si.load.label).toBe('kg N/ha');
  });

  it('US converts mm to in, m to ft, kg/ha to lb/ac, m/ha to ft/ac', () => {
    const us = displayUnits('us');
    expect(254 * us.water.factor).toBeCloseTo(10, 12);
    expect(0.3048 * us.length.factor).toBeCloseTo(1, 12);
    // 1 kg/ha = (1/0.45359237 lb) / (10000/4046.8564224 ac) = 0.8921791 lb/ac.
    expect(us.load.factor).toBeCloseTo(0.8921791, 7);
    // 500 m/ha of lateral = 1640.42 ft per 2.4710538 ac = 663.854 ft/ac.
    expect(500 * us.pipe.factor).toBeCloseTo(663.854, 2);
    expect(us.conc.factor).toBe(1);
  });
});
