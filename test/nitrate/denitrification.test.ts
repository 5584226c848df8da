import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { saturationFactor } from '../../src/nitrate/denitrification.js';

// Threshold-power reduction function of Heinen (2006, Geoderma 133: 444-463, from memory):
// f = ((s - st) / (1 - st))^w above the threshold st, 0 at or below it; evaluated here with
// Math.pow for every exponent.
const heinen = (s: number, st: number, w: number) =>
  s > st ? Math.pow((Math.min(s, 1) - st) / (1 - st), w) : 0;

describe('saturation factor of denitrification', () => {
  it('is the threshold-power function, the same double as Math.pow for the default square', () => {
    // The engine's default exponent 2 takes r * r instead of the library call; sweeps compare
    // byte for byte with runs, so the value must be the very same double, not merely close.
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1.2, noNaN: true }),
        fc.double({ min: 0, max: 0.9, noNaN: true }),
        (s, st) => {
          expect(Object.is(saturationFactor(s, st, 2), heinen(s, st, 2))).toBe(true);
        },
      ),
      { numRuns: 5000 },
    );
  });

  it('follows the power for other exponents and is 0 at or below the threshold', () => {
    expect(saturationFactor(0.75, 0.5, 1)).toBe(0.5); // (0.25 / 0.5)^1
    expect(saturationFactor(0.75, 0.5, 3)).toBe(0.125); // (0.5)^3
    expect(saturationFactor(0.5, 0.5, 2)).toBe(0);
    expect(saturationFactor(0.3, 0.5, 2)).toBe(0);
    expect(saturationFactor(1.4, 0, 2)).toBe(1); // clamped to a saturated profile
    expect(saturationFactor(0.6, 0.2, 1.5)).toBe(heinen(0.6, 0.2, 1.5));
  });
});
