import { describe, expect, it } from 'vitest';
import { solveSpacing } from '../../src/drainage/spacingRoot.js';
import { TilefluxError } from '../../src/errors.js';
import { moodyDepth, vdmwDepth } from './reference.js';

// The root of L^2 = c1 d(L) + c0 is found here by plain bisection on the equivalent depth of
// ./reference.ts (van der Molen & Wesseling 1991 as printed in Ritzema 1994 ch. 8; Moody 1966,
// from memory), each written from its printed form, inside the bracket the module documents:
// sqrt(c0) (or 4 drain radii) to sqrt(c1 D + c0), since 0 < d <= D.
function bisect(c1: number, c0: number, D: number, r: number, depth: typeof vdmwDepth): number {
  let lo = Math.max(Math.sqrt(c0), 4 * r);
  let hi = Math.sqrt(c1 * D + c0);
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (mid * mid - c1 * depth(mid, D, r) - c0 > 0) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}

describe('solveSpacing against bisection on the published equivalent depths', () => {
  it('finds the root for Hooghoudt-like (c0 > 0) and Glover-like inputs, both methods', () => {
    // (c1, c0, D, r): c1 = 8 K2 / q-like and c0 = 4 K1 h^2 / q-like magnitudes of field designs.
    const cases: Array<[number, number, number, number]> = [
      [160, 40, 2, 0.1], // L about 20 m
      [800, 250, 5, 0.08],
      [60, 0, 1, 0.05],
      [3000, 1000, 10, 0.1], // thick layer: d well below D
      [25, 5, 0.5, 0.1],
    ];
    for (const [c1, c0, D, r] of cases) {
      for (const [method, depth] of [
        ['vdmw', vdmwDepth],
        ['moody', moodyDepth],
      ] as const) {
        const got = solveSpacing(c1, c0, D, r, method);
        const want = bisect(c1, c0, D, r, depth);
        const label = `${method} c1=${c1} c0=${c0} D=${D} r=${r}`;
        // Root to 1e-13 of L in the module; the reference series agrees to ~1e-15: 1e-11 allowed.
        expect(Math.abs(got.spacingM / want - 1), label).toBeLessThan(1e-11);
        expect(Math.abs(got.equivalentDepthM / depth(got.spacingM, D, r) - 1), label).toBeLessThan(
          1e-11,
        );
        // "Newton steps converge in a handful of iterations" (the module's comment).
        expect(got.iterations, label).toBeGreaterThanOrEqual(1);
        expect(got.iterations, label).toBeLessThanOrEqual(10);
      }
    }
  });

  it('refuses a spacing under 4 drain radii, whether the bracket or the root falls below it', () => {
    const message =
      'the spacing these inputs call for is under 0.4 m (4 drain radii), outside the range of ' +
      'the equivalent-depth method; check the conductivity, rate and radius';
    // The whole bracket below 0.4 m: sqrt(0.01 x 1 + 0) = 0.1 m.
    expect(() => solveSpacing(0.01, 0, 1, 0.1, 'vdmw')).toThrow(TilefluxError);
    expect(() => solveSpacing(0.01, 0, 1, 0.1, 'vdmw')).toThrow(message);
    // Bracket top sqrt(0.02 x 10) = 0.45 m is above 0.4 m, but already at 0.4 m the left side
    // 0.4^2 = 0.16 exceeds c1 d(0.4): the root lies below the method's range.
    expect(0.02 * vdmwDepth(0.4, 10, 0.1)).toBeLessThan(0.16);
    expect(() => solveSpacing(0.02, 0, 10, 0.1, 'vdmw')).toThrow(message);
  });
});
