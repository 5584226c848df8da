/**
 * Hooghoudt's equivalent depth d: the depth of a layer of purely horizontal flow that carries
 * the same water with the same head loss as the real layer of thickness D below the drains,
 * where flow converges radially into the pipe.
 *
 * van der Molen & Wesseling (1991), as given by Ritzema (1994, Drainage Principles and
 * Applications, ILRI Publ. 16, ch. 8):
 *
 *   d = (pi L / 8) / (ln(L / (pi r0)) + F(x)),   x = 2 pi D / L
 *   F(x) = sum over n = 1, 3, 5, ... of 4 exp(-2 n x) / (n (1 - exp(-2 n x)))
 *   F(x) ~ pi^2 / (4 x) + ln(x / (2 pi))   for small x
 *
 * The series is summed here in closed form. Expanding 1/(1 - e) as a geometric series gives
 * F(x) = 2 sum_k ln coth(k x) = -2 ln theta4(q) with q = exp(-2 x), where
 * theta4(q) = 1 + 2 sum_n (-1)^n q^(n^2) (Gauss's product identity for the Jacobi theta function).
 * For x >= pi/2 that sum needs three terms for full double precision; for x < pi/2 Jacobi's
 * imaginary transformation gives F(x) = pi^2/(4x) + ln(x/(2 pi)) - 2 ln(1 + sum_n
 * exp(-pi^2 n (n+1) / (2x))), whose first two terms are exactly the published small-x form and
 * whose remaining sum needs two terms. Either way the result is the published series to rounding
 * error, at the cost of a few exponentials.
 *
 * Moody (1966, J. Irrig. Drain. Div. ASCE 92(IR2)) fitted Hooghoudt's tabulated values:
 *
 *   D/L <= 0.3:  d = D / (1 + (D/L) (8/pi ln(D/r0) - a)),  a = 3.55 - 1.6 D/L + 2 (D/L)^2
 *   D/L >  0.3:  d = pi L / (8 (ln(L/r0) - 1.15))
 *
 * Both forms can exceed D when the drains sit within a few radii of the barrier (the radial
 * term turns negative); the layer cannot carry more than its own thickness, so d is capped at D.
 */
import { TilefluxError } from '../errors.js';
import { requirePositive, requireRadiusBelowLayer } from './checks.js';

/** Which published form of the equivalent depth to use. */
export type EquivalentDepthMethod = 'vdmw' | 'moody';

/** Method names with their sources, for help text and reports. */
export const EQUIVALENT_DEPTH_METHODS: Readonly<Record<EquivalentDepthMethod, string>> = {
  vdmw: 'van der Molen & Wesseling (1991) series, summed in closed form',
  moody: "Moody (1966) approximation of Hooghoudt's tabulated values",
};

const PI = Math.PI;
const PI2 = PI * PI;
const HALF_PI = PI / 2;

/**
 * F(x) of van der Molen & Wesseling and its derivative dF/dx, summed exactly (see the module
 * comment for the theta-function form).
 */
function vdmwF(x: number): { f: number; df: number } {
  if (x >= HALF_PI) {
    // theta4(q) = 1 - 2q + 2q^4 - 2q^9, q = exp(-2x) <= exp(-pi); the q^16 term is < 1e-21.
    const q = Math.exp(-2 * x);
    const q4 = q * q * q * q;
    const q9 = q4 * q4 * q;
    const theta = 1 - 2 * q + 2 * q4 - 2 * q9;
    // d(theta)/dx with dq/dx = -2q: d(q^m)/dx = -2 m q^m.
    const dTheta = 4 * q - 16 * q4 + 36 * q9;
    return { f: -2 * Math.log(theta), df: (-2 * dTheta) / theta };
  }
  // Small-x side: e1 = exp(-pi^2/x) <= exp(-2 pi), e2 = exp(-3 pi^2/x); the next is < 1e-16.
  const e1 = Math.exp(-PI2 / x);
  const e2 = e1 * e1 * e1;
  const s = 1 + e1 + e2;
  const dS = (e1 * PI2 + e2 * 3 * PI2) / (x * x);
  return {
    f: PI2 / (4 * x) + Math.log(x / (2 * PI)) - 2 * Math.log(s),
    df: -PI2 / (4 * x * x) + 1 / x - (2 * dS) / s,
  };
}

/**
 * Equivalent depth and its derivative with respect to the spacing, without input checks.
 * The spacing solvers use the derivative for Newton steps; callers check inputs first.
 */
export function equivalentDepthAndSlope(
  spacingM: number,
  layerBelowDrainsM: number,
  drainRadiusM: number,
  method: EquivalentDepthMethod,
): { d: number; dDdL: number } {
  const L = spacingM;
  const D = layerBelowDrainsM;
  const r = drainRadiusM;
  let d: number;
  let dDdL: number;
  if (method === 'vdmw') {
    const x = (2 * PI * D) / L;
    const { f, df } = vdmwF(x);
    const g = Math.log(L / (PI * r)) + f;
    // dg/dL = 1/L + F'(x) dx/dL with dx/dL = -x/L.
    const dg = (1 - x * df) / L;
    d = (PI * L) / (8 * g);
    dDdL = (PI / (8 * g)) * (1 - (L * dg) / g);
  } else {
    const u = D / L;
    if (u <= 0.3) {
      const c = (8 / PI) * Math.log(D / r);
      const a = 3.55 - 1.6 * u + 2 * u * u;
      const den = 1 + u * (c - a);
      d = D / den;
      // d(den)/du = (c - a) - u da/du, da/du = -1.6 + 4u; du/dL = -u/L.
      const dDen = c - a + u * (1.6 - 4 * u);
      dDdL = (D * dDen * u) / (den * den * L);
    } else {
      const g = Math.log(L / r) - 1.15;
      d = (PI * L) / (8 * g);
      dDdL = (PI / 8) * (1 / g - 1 / (g * g));
    }
  }
  if (!(d > 0) || d >= D) return { d: D, dDdL: 0 };
  return { d, dDdL };
}

/**
 * Hooghoudt's equivalent depth d (m) for drains at spacing L above a restrictive layer.
 *
 * Source: van der Molen & Wesseling (1991), as in Ritzema (1994) ch. 8 (default); Moody (1966)
 * by option. Capped at the layer thickness D.
 *
 * @param spacingM           drain spacing L, m (greater than pi times the radius)
 * @param layerBelowDrainsM  D, barrier depth minus drain depth, m (greater than the radius)
 * @param drainRadiusM       effective drain radius r0, m
 * @param method             'vdmw' (default) or 'moody'
 * @example equivalentDepth(20, 2, 0.1) // 1.359 (m)
 */
export function equivalentDepth(
  spacingM: number,
  layerBelowDrainsM: number,
  drainRadiusM: number,
  method: EquivalentDepthMethod = 'vdmw',
): number {
  checkEquivalentDepthInputs(spacingM, layerBelowDrainsM, drainRadiusM, method);
  return equivalentDepthAndSlope(spacingM, layerBelowDrainsM, drainRadiusM, method).d;
}

/** Smallest spacing the equivalent-depth forms accept for a drain radius, m. */
export function minimumSpacingM(drainRadiusM: number): number {
  // ln(L / (pi r0)) must stay positive (vdMW); Moody's large-D form needs ln(L/r0) > 1.15,
  // i.e. L > 3.16 r0, which the same bound covers.
  return 4 * drainRadiusM;
}

/** Throws unless `method` names an equivalent-depth method. */
export function checkMethod(method: string): asserts method is EquivalentDepthMethod {
  if (method !== 'vdmw' && method !== 'moody') {
    throw new TilefluxError(`equivalent-depth method must be vdmw or moody; got "${method}"`);
  }
}

/** Checks the inputs of `equivalentDepth`; throws TilefluxError naming the parameter. */
export function checkEquivalentDepthInputs(
  spacingM: number,
  layerBelowDrainsM: number,
  drainRadiusM: number,
  method: string,
): void {
  checkMethod(method);
  requireRadiusBelowLayer(layerBelowDrainsM, drainRadiusM);
  requirePositive(spacingM, 'spacingM', 'm');
  if (spacingM <= minimumSpacingM(drainRadiusM)) {
    throw new TilefluxError(
      `spacingM (${spacingM} m) must be more than 4 drain radii (${minimumSpacingM(drainRadiusM)} m)`,
    );
  }
}
