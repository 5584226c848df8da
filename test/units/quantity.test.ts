import { describe, expect, it } from 'vitest';
import { parseQuantity } from '../../src/units/quantity.js';
import { TilefluxError } from '../../src/errors.js';

// Conversion factors are the exact definitions of the international inch (25.4 mm), foot
// (0.3048 m) and acre (4046.8564224 m2) (NIST Handbook 44, Appendix C).
describe('parseQuantity', () => {
  const cases: Array<[string, Parameters<typeof parseQuantity>[1], number]> = [
    ['1.2 m', 'length', 1.2],
    ['48 in', 'length', 1.2192],
    ['60 ft', 'length', 18.288],
    ['0.5 in/d', 'rate', 12.7],
    ['12 mm/d', 'rate', 12],
    ['2 m/d', 'conductivity', 2],
    ['0.3 in/h', 'conductivity', 0.3 * 0.0254 * 24],
    ['0.2 %', 'slope', 0.002],
    ['16 ha', 'area', 16],
    ['40 ac', 'area', 40 * 0.40468564224],
    ['10 mg/L', 'concentration', 10],
    ['1 cfs', 'flow', 0.028316846592],
    ['10 mm', 'depthMm', 10],
    ['4 in', 'diameter', 101.6],
    ['42.1', 'latitude', 42.1],
    ['5 %', 'fraction', 0.05],
  ];
  for (const [text, kind, want] of cases) {
    it(`${text} as ${kind}`, () => {
      expect(parseQuantity(text, kind, '--x')).toBeCloseTo(want, 6);
    });
  }

  it('takes a bare number in the documented unit', () => {
    expect(parseQuantity('1.5', 'length', '--drain-depth')).toBe(1.5);
    expect(parseQuantity(12, 'rate', 'drains.capacity')).toBe(12);
  });

  it('names the option, what it got and what it expects for a wrong dimension', () => {
    expect(() => parseQuantity('12 m', 'rate', '--rate')).toThrowError(
      '--rate expects a rate such as 12 mm/d or 0.5 in/d; got 12 m',
    );
    expect(() => parseQuantity('12 m', 'rate', '--rate')).toThrow(TilefluxError);
  });

  it('rejects unknown units and empty strings', () => {
    expect(() => parseQuantity('3 furlongs/fortnightx', 'rate', '--rate')).toThrow(
      /--rate expects/,
    );
    expect(() => parseQuantity('', 'length', 'soil.depth')).toThrow(/soil.depth expects/);
  });
});

describe('units written against their number', () => {
  // Exact definitions (common practice): 1 ha = 10,000 m2, 1 in = 25.4 mm, 1 ft = 0.3048 m.
  it.each([
    ['12ha', 'area', 12],
    ['40ac', 'area', 40 * 0.40468564224],
    ['10mm/d', 'rate', 10],
    ['0.5in/d', 'rate', 12.7],
    ['1.2m', 'length', 1.2],
    ['4ft', 'length', 4 * 0.3048],
    ['0.2%', 'slope', 0.002],
  ] as const)('%s', (text, kind, want) => {
    // Within 1e-5: the survey acre differs from the international acre by 2 ppm (from memory).
    const spaced = parseQuantity(text.replace(/^([\d.]+)/, '$1 '), kind, 'x');
    expect(Math.abs(parseQuantity(text, kind, 'x') / want - 1)).toBeLessThan(1e-5);
    expect(parseQuantity(text, kind, 'x')).toBe(spaced);
  });
  it('still refuses a word that is no unit', () => {
    expect(() => parseQuantity('12hands', 'area', '--area')).toThrow(
      /not a number with a known unit/,
    );
  });
});

describe('an exponent is not a unit', () => {
  it('1e1 m and 1.2E2 mm keep their exponents', () => {
    expect(parseQuantity('1e1 m', 'length', 'x')).toBe(10);
    expect(parseQuantity('1e1m', 'length', 'x')).toBe(10);
    expect(parseQuantity('1.2E2 mm', 'diameter', 'x')).toBe(120);
  });
});
