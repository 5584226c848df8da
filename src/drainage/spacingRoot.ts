/**
 * The spacing equations of Hooghoudt and of Glover-Dumm both take the form
 *
 *   L^2 = c1 d(L) + c0,
 *
 * where d(L) is the equivalent depth, which itself depends on the spacing. This module finds
 * that L once for both. Because 0 < d <= D, the root lies between sqrt(c0) and sqrt(c1 D + c0);
 * Newton steps with the analytic slope of d converge in a handful of iterations, and a bisection
 * fallback keeps every step inside the bracket (Moody's two forms do not join exactly at
 * D/L = 0.3, where the answer is then the jump itself).
 */
import { TilefluxError } from '../errors.js';
import {
  equivalentDepthAndSlope,
  minimumSpacingM,
  type EquivalentDepthMethod,
} from './equivalentDepth.js';

/** Result of the spacing iteration. */
export interface SpacingRoot {
  spacingM: number;
  equivalentDepthM: number;
  iterations: number;
}

const REL_TOL = 1e-13;

function tooClose(minL: number): TilefluxError {
  return new TilefluxError(
    `the spacing these inputs call for is under ${minL} m (4 drain radii), outside the ` +
      `range of the equivalent-depth method; check the conductivity, rate and radius`,
  );
}
const MAX_ITER = 100;

/**
 * Solve L^2 = c1 d(L) + c0 for the spacing L (m), with d from `equivalentDepthAndSlope`.
 * Inputs must already be checked (c1 > 0, c0 >= 0, layer > radius > 0).
 */
export function solveSpacing(
  c1: number,
  c0: number,
  layerBelowDrainsM: number,
  drainRadiusM: number,
  method: EquivalentDepthMethod,
): SpacingRoot {
  const D = layerBelowDrainsM;
  const r = drainRadiusM;
  const minL = minimumSpacingM(r);
  let hi = Math.sqrt(c1 * D + c0);
  if (!(hi > minL)) {
    throw tooClose(minL);
  }
  let lo = Math.max(Math.sqrt(c0), minL);
  const phi = (L: number) => {
    const { d, dDdL } = equivalentDepthAndSlope(L, D, r, method);
    return { f: L * L - c1 * d - c0, df: 2 * L - c1 * dDdL, d };
  };
  // phi(hi) >= 0 because d <= D. If phi(lo) > 0 the root lies below the method's range.
  let at = phi(lo);
  if (at.f > 0) {
    throw tooClose(minL);
  }
  let L = hi;
  at = phi(L);
  for (let i = 1; i <= MAX_ITER; i++) {
    if (at.f > 0) hi = L;
    else if (at.f < 0) lo = L;
    const newton = L - at.f / at.df;
    // Converged: the next Newton step is below rounding of L.
    if (at.f === 0 || Math.abs(newton - L) <= REL_TOL * L) {
      return { spacingM: L, equivalentDepthM: at.d, iterations: i };
    }
    L = newton > lo && newton < hi ? newton : 0.5 * (lo + hi);
    at = phi(L);
    if (hi - lo <= REL_TOL * L) return { spacingM: L, equivalentDepthM: at.d, iterations: i };
  }
  return { spacingM: L, equivalentDepthM: at.d, iterations: MAX_ITER };
}
