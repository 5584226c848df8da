import { describe, expect, it } from 'vitest';
import { proseUnits } from '../../src/units/prose.js';

// Exact definitions: 1 ft = 0.3048 m, 1 in = 25.4 mm (NIST Handbook 44, Appendix C).
describe('quantities in sentences', () => {
  it('US: feet for lengths, inches per day for rates, feet per day for conductivity', () => {
    const us = proseUnits('us');
    expect(us.length(0.3048)).toBe('1.00 ft');
    expect(us.length(1.2)).toBe('3.94 ft'); // 1.2 / 0.3048 = 3.937
    expect(us.length(200, 0)).toBe('656 ft'); // 656.17
    expect(us.rate(12.7)).toBe('0.50 in/d');
    expect(us.conductivity(0.9)).toBe('2.95 ft/d'); // 0.9 / 0.3048 = 2.953
  });

  it("SI: the field file's own numbers unless decimals are asked for; no negative zero", () => {
    const si = proseUnits('si');
    expect(si.length(1.1)).toBe('1.1 m');
    expect(si.length(0.15, 2)).toBe('0.15 m');
    expect(si.rate(11.11)).toBe('11.1 mm/d');
    expect(si.rate(-0.01)).toBe('0.0 mm/d');
    expect(si.conductivity(0.9)).toBe('0.9 m/d');
  });
});
