import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gloverHeadRatio, gloverSpacing, gloverTimeOfRatio } from '../../src/drainage/glover.js';
import { equivalentDepth } from '../../src/drainage/equivalentDepth.js';
import { gloverSeriesRatio as seriesRatio, vdmwDepth as vdmwD } from './reference.js';

// The Glover-Dumm series is evaluated independently in ./reference.ts (gloverSeriesRatio).

// Explicit finite differences for the linearized Boussinesq equation mu h_t = K D h_xx with
// h = 0 at both drains and h = h0 between them at t = 0 (forward Euler in time, central
// differences in space, stable for r = kappa dt / dx^2 <= 1/2).
function finiteDifferenceRatio(kappa: number, L: number, tDays: number, cells = 200): number {
  const dx = L / cells;
  const steps = Math.ceil(tDays / ((0.4 * dx * dx) / kappa));
  const r = (kappa * (tDays / steps)) / (dx * dx);
  let h = new Float64Array(cells + 1).fill(1);
  let next = new Float64Array(cells + 1);
  h[0] = 0;
  h[cells] = 0;
  for (let s = 0; s < steps; s++) {
    for (let i = 1; i < cells; i++) next[i] = h[i] + r * (h[i - 1] - 2 * h[i] + h[i + 1]);
    next[0] = 0;
    next[cells] = 0;
    [h, next] = [next, h];
  }
  return h[cells / 2];
}

const layout = {
  kMPerDay: 0.6,
  equivalentDepthM: 1.3,
  drainablePorosity: 0.06,
  spacingM: 22,
  initialHeadM: 0.8,
};
// The module's convention: transmissive depth D = d + h0 / 2.
const kappa =
  (layout.kMPerDay * (layout.equivalentDepthM + layout.initialHeadM / 2)) /
  layout.drainablePorosity;

describe('gloverHeadRatio', () => {
  it('agrees with the series summed directly', () => {
    for (const t of [0.01, 0.1, 0.5, 1, 2, 5, 10]) {
      const y = (Math.PI * Math.PI * kappa * t) / layout.spacingM ** 2;
      expect(gloverHeadRatio(t, layout)).toBeCloseTo(seriesRatio(y), 12);
    }
  });

  it('agrees with an explicit finite-difference solution of the linearized Boussinesq equation', () => {
    // 200 cells: discretisation error of order (dx/L)^2 = 2.5e-5 of the ratio; 1e-4 allowed.
    for (const t of [0.3, 1, 3, 6]) {
      const fd = finiteDifferenceRatio(kappa, layout.spacingM, t);
      expect(Math.abs(gloverHeadRatio(t, layout) - fd)).toBeLessThan(1e-4);
    }
  });

  it('is 1 at t = 0 and follows the one-term design formula once the first term dominates', () => {
    expect(gloverHeadRatio(0, layout)).toBe(1);
    // First term alone: h_mid / h0 = (4/pi) exp(-y); the next term is exp(-9y)/3, < 1e-4 of it
    // for y >= 1.2.
    const t = 8;
    const y = (Math.PI * Math.PI * kappa * t) / layout.spacingM ** 2;
    expect(y).toBeGreaterThan(1.2);
    expect(Math.abs(gloverHeadRatio(t, layout) / ((4 / Math.PI) * Math.exp(-y)) - 1)).toBeLessThan(
      1e-4,
    );
  });
});

describe('gloverSpacing', () => {
  it('t -> spacing -> t round trip, or a refusal exactly when under 4 radii (property)', () => {
    // The vdMW equivalent depth holds for spacings of at least 4 drain radii (0.4 m here).
    // A drawdown that even 0.4 m spacing cannot reach in time has no valid answer, and the
    // module must refuse it; whether 0.4 m suffices is decided here by the series itself.
    const r0 = 0.1;
    const minL = 4 * r0;
    const ratioAt = (L: number, k: number, mu: number, D: number, h0: number, days: number) =>
      seriesRatio((Math.PI * Math.PI * k * (vdmwD(L, D, r0) + h0 / 2) * days) / (mu * L * L), 5000);
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 5, noNaN: true }),
        fc.double({ min: 0.01, max: 0.3, noNaN: true }),
        fc.double({ min: 0.6, max: 2, noNaN: true }),
        fc.double({ min: 0.3, max: 10, noNaN: true }),
        fc.double({ min: 0, max: 0.9, noNaN: true }),
        fc.double({ min: 0.05, max: 0.95, noNaN: true }),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        (k, mu, drainDepthM, D, fromFrac, toFrac, days) => {
          const fromDepthM = fromFrac * drainDepthM * 0.5;
          const toDepthM = fromDepthM + toFrac * (drainDepthM - fromDepthM) * 0.99;
          fc.pre(toDepthM > fromDepthM);
          const h0 = drainDepthM - fromDepthM;
          const want = (drainDepthM - toDepthM) / h0;
          // Midpoint ratio reached after `days` at the smallest valid spacing: above the target
          // means no valid spacing drains fast enough. Cases within 1e-9 of the edge may go
          // either way.
          const atMin = ratioAt(minL, k, mu, D, h0, days);
          fc.pre(Math.abs(atMin - want) > 1e-9);
          const input = {
            kMPerDay: k,
            drainablePorosity: mu,
            drainDepthM,
            layerBelowDrainsM: D,
            drainRadiusM: r0,
            fromDepthM,
            toDepthM,
            days,
          };
          if (atMin > want) {
            expect(() => gloverSpacing(input)).toThrowError(/under 0\.4 m \(4 drain radii\)/);
            return;
          }
          const s = gloverSpacing(input);
          // d belongs to the spacing returned (vdMW series summed term by term, ./reference.ts;
          // the closed form agrees to ~1e-15 relative, 1e-12 allowed).
          expect(Math.abs(s.equivalentDepthM / vdmwD(s.spacingM, D, r0) - 1)).toBeLessThan(1e-12);
          expect(s.equivalentDepthM).toBe(equivalentDepth(s.spacingM, D, r0));
          // ...and the series reaches the target ratio in `days` (root solved to 1e-13 of L,
          // ratio error then ~1e-13; 1e-9 allowed).
          expect(Math.abs(ratioAt(s.spacingM, k, mu, D, h0, days) - want)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 300 },
    );
  });

  const base = {
    kMPerDay: 0.5,
    drainablePorosity: 0.05,
    drainDepthM: 1.2,
    layerBelowDrainsM: 2,
    drainRadiusM: 0.1,
    fromDepthM: 0.3,
    toDepthM: 0.6,
    days: 2,
  };
  it('rejects a start above the surface, a rise, a target at drain level and a bad porosity', () => {
    expect(() => gloverSpacing({ ...base, fromDepthM: -0.1 })).toThrowError(/above the surface/);
    expect(() => gloverSpacing({ ...base, toDepthM: 0.2 })).toThrowError(/deeper than fromDepthM/);
    expect(() => gloverSpacing({ ...base, toDepthM: 1.2 })).toThrowError(
      /shallower than the drain depth/,
    );
    expect(() => gloverSpacing({ ...base, drainablePorosity: 1.2 })).toThrowError(
      /drainablePorosity/,
    );
    expect(() => gloverSpacing({ ...base, layerBelowDrainsM: -1 })).toThrowError(
      /restrictive layer/,
    );
  });
});

describe('gloverTimeOfRatio (the dimensionless time of a midpoint ratio)', () => {
  it('for small ratios is the one-term time y = ln(4 / (pi ratio)) (Dumm 1954)', () => {
    // Once the first term dominates, ratio = (4/pi) e^(-y); the next, e^(-9y) / 3, is below
    // 1e-27 of it here.
    for (const ratio of [1e-3, 1e-6, 1e-9]) {
      const y = Math.log(4 / (Math.PI * ratio));
      expect(Math.abs(gloverTimeOfRatio(ratio) / y - 1), `ratio ${ratio}`).toBeLessThan(1e-12);
    }
  });

  it('returns the time at which the series summed term by term reaches the ratio', () => {
    // Down to ratio 0.9999999 (y about 0.043, where the module switches to the erfc form).
    for (const ratio of [0.05, 0.2, 0.5, 0.8, 0.95, 0.999, 0.9999999]) {
      const y = gloverTimeOfRatio(ratio);
      // The ratio is solved to 1e-15 of itself; 1e-13 allowed.
      expect(Math.abs(seriesRatio(y) - ratio), `ratio ${ratio}`).toBeLessThan(1e-13);
    }
  });

  it('names a bad input of gloverHeadRatio with its unit', () => {
    const p = {
      kMPerDay: 0,
      equivalentDepthM: 1,
      drainablePorosity: 0.05,
      spacingM: 20,
      initialHeadM: 0.5,
    };
    expect(() => gloverHeadRatio(1, p)).toThrow(
      'kMPerDay must be a number greater than 0 m/d; got 0',
    );
  });
});
