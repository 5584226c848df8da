/**
 * Glover-Dumm falling water table: the linearized Boussinesq equation
 *
 *   mu dh/dt = K D d2h/dx2,   h(0, t) = h(L, t) = 0,   h(x, 0) = h0  (initially flat)
 *
 * has the series solution (Dumm 1954; Luthin 1966, Drainage Engineering; Ritzema 1994 ch. 8)
 *
 *   h(x, t) / h0 = (4 / pi) sum_{n = 1, 3, 5, ...} (1/n) sin(n pi x / L) exp(-n^2 a t),
 *   a = pi^2 K D / (mu L^2),
 *
 * so at the midpoint h_mid / h0 = (4/pi) sum_{n odd} (-1)^((n-1)/2) exp(-n^2 a t) / n. The usual
 * design formula keeps only the first term (L = pi sqrt(K D t / (mu ln(1.27 h0 / ht))) for the
 * flat initial water table); here the series is summed to convergence. For very early times
 * (a t < 0.05), where the series would need many terms, the equivalent image (erfc) form
 * h_mid / h0 = 1 - 2 sum_k (-1)^k erfc((2k + 1) pi / (4 sqrt(a t))) is used instead (Carslaw &
 * Jaeger 1959, Conduction of Heat in Solids, section 3.3).
 *
 * Convention: the transmissive depth is D = d + h0 / 2, Hooghoudt's equivalent depth plus half
 * the initial midpoint head, the average flow depth as the water table falls (the convention of
 * the Glover-Dumm design method as usually presented, e.g. Ritzema 1994 ch. 8; from memory).
 */
import { TilefluxError } from '../errors.js';
import { requireNonNegative, requirePositive, requireRadiusBelowLayer } from './checks.js';
import { checkMethod, type EquivalentDepthMethod } from './equivalentDepth.js';
import { solveSpacing } from './spacingRoot.js';

const SQRT_PI = Math.sqrt(Math.PI);

/** erfc(x) for x >= 3 by its continued fraction (Abramowitz & Stegun 7.1.14), 60 levels. */
function erfcLarge(x: number): number {
  let t = x;
  for (let k = 60; k >= 1; k--) t = x + k / 2 / t;
  return Math.exp(-x * x) / (SQRT_PI * t);
}

/**
 * Midpoint head ratio h_mid / h0 of the flat-initial Glover-Dumm solution as a function of the
 * dimensionless time y = a t = pi^2 K D t / (mu L^2).
 */
export function gloverRatioOfTime(y: number): number {
  if (!(y > 0)) return 1;
  if (y < 0.05) {
    // Image form: the arguments are >= 3.5, so erfcLarge is accurate; two terms reach 1e-40.
    const z = Math.PI / (4 * Math.sqrt(y));
    return 1 - 2 * (erfcLarge(z) - erfcLarge(3 * z));
  }
  let sum = 0;
  for (let n = 1, sign = 1; ; n += 2, sign = -sign) {
    const term = Math.exp(-n * n * y) / n;
    sum += sign * term;
    if (term < 1e-17 * Math.abs(sum) || term === 0) break;
  }
  return (4 / Math.PI) * sum;
}

/** Inputs of the Glover-Dumm head ratio. */
export interface GloverInput {
  kMPerDay: number;
  equivalentDepthM: number;
  drainablePorosity: number;
  spacingM: number;
  /** Initial midpoint head above drain level h0, m. */
  initialHeadM: number;
}

/**
 * Glover-Dumm midpoint head ratio h_mid(t) / h0 after `tDays` for an initially flat water table,
 * with transmissive depth D = d + h0/2.
 *
 * Source: Glover-Dumm series solution of the linearized Boussinesq equation (Dumm 1954;
 * Ritzema 1994 ch. 8); see the module comment.
 * @example gloverHeadRatio(2, { kMPerDay: 0.5, equivalentDepthM: 1.2, drainablePorosity: 0.05, spacingM: 20, initialHeadM: 0.5 }) // 0.622
 */
export function gloverHeadRatio(tDays: number, p: GloverInput): number {
  requireNonNegative(tDays, 'tDays', 'd');
  requirePositive(p.kMPerDay, 'kMPerDay', 'm/d');
  requireNonNegative(p.equivalentDepthM, 'equivalentDepthM', 'm');
  requirePorosity(p.drainablePorosity);
  requirePositive(p.spacingM, 'spacingM', 'm');
  requirePositive(p.initialHeadM, 'initialHeadM', 'm');
  const D = p.equivalentDepthM + p.initialHeadM / 2;
  const y = (Math.PI * Math.PI * p.kMPerDay * D * tDays) / (p.drainablePorosity * p.spacingM ** 2);
  return gloverRatioOfTime(y);
}

/** Dimensionless time y at which the midpoint ratio falls to `ratio` (0 < ratio < 1). */
export function gloverTimeOfRatio(ratio: number): number {
  // ratio(y) falls monotonically from 1; bracket in ln y and close it by the Illinois method.
  const f = (s: number) => gloverRatioOfTime(Math.exp(s)) - ratio;
  let a = Math.log(1e-6);
  let b = Math.log(Math.log(4 / (Math.PI * ratio)) + 10);
  let fa = f(a);
  let fb = f(b);
  let side = 0;
  for (let i = 0; i < 200; i++) {
    const s = (a * fb - b * fa) / (fb - fa);
    const fs = f(s);
    if (fs === 0 || Math.abs(b - a) < 1e-14) return Math.exp(s);
    if (fs * fb > 0) {
      b = s;
      fb = fs;
      if (side === 1) fa /= 2;
      side = 1;
    } else {
      a = s;
      fa = fs;
      if (side === -1) fb /= 2;
      side = -1;
    }
    if (Math.abs(fs) < 1e-15 * ratio) return Math.exp(s);
  }
  return Math.exp((a + b) / 2);
}

/** Inputs of the Glover-Dumm spacing. */
export interface GloverSpacingInput {
  kMPerDay: number;
  drainablePorosity: number;
  drainDepthM: number;
  /** Barrier depth minus drain depth, m. */
  layerBelowDrainsM: number;
  drainRadiusM: number;
  /** Midpoint water-table depth below the surface at the start, m. */
  fromDepthM: number;
  /** Midpoint water-table depth below the surface to reach, m. */
  toDepthM: number;
  /** Time allowed for the drawdown, d. */
  days: number;
  method?: EquivalentDepthMethod;
}

/**
 * Drain spacing (m) that lowers the midpoint water table from `fromDepthM` to `toDepthM` below
 * the surface in `days`, for an initially flat water table (Glover-Dumm, series summed in full).
 * The spacing and the equivalent depth are solved together, since d depends on L.
 *
 * Source: Glover-Dumm (Dumm 1954; Ritzema 1994 ch. 8); d from van der Molen & Wesseling (1991)
 * or Moody (1966).
 * @example gloverSpacing({ kMPerDay: 0.5, drainablePorosity: 0.05, drainDepthM: 1.2, layerBelowDrainsM: 2, drainRadiusM: 0.1, fromDepthM: 0.3, toDepthM: 0.6, days: 2 }) // { spacingM: 24.0, equivalentDepthM: 1.44, ... }
 */
export function gloverSpacing(p: GloverSpacingInput): {
  spacingM: number;
  equivalentDepthM: number;
  averageFlowDepthM: number;
  headRatio: number;
  iterations: number;
} {
  const method = p.method ?? 'vdmw';
  checkMethod(method);
  requirePositive(p.kMPerDay, 'kMPerDay', 'm/d');
  requirePorosity(p.drainablePorosity);
  requirePositive(p.days, 'days', 'd');
  requirePositive(p.drainDepthM, 'drainDepthM', 'm');
  requireRadiusBelowLayer(p.layerBelowDrainsM, p.drainRadiusM);
  if (!(Number.isFinite(p.fromDepthM) && p.fromDepthM >= 0)) {
    throw new TilefluxError(
      `fromDepthM (${p.fromDepthM} m) puts the water table above the surface; give a depth of ` +
        `at least 0 m below the surface`,
    );
  }
  if (!(p.toDepthM > p.fromDepthM)) {
    throw new TilefluxError(
      `toDepthM (${p.toDepthM} m) must be deeper than fromDepthM (${p.fromDepthM} m): the water ` +
        `table falls`,
    );
  }
  if (!(p.toDepthM < p.drainDepthM)) {
    throw new TilefluxError(
      `toDepthM (${p.toDepthM} m) must be shallower than the drain depth (${p.drainDepthM} m): ` +
        `drains cannot lower the water table to their own level in finite time`,
    );
  }
  const h0 = p.drainDepthM - p.fromDepthM;
  const ratio = (p.drainDepthM - p.toDepthM) / h0;
  const y = gloverTimeOfRatio(ratio);
  const c1 = (Math.PI * Math.PI * p.kMPerDay * p.days) / (p.drainablePorosity * y);
  const root = solveSpacing(c1, (c1 * h0) / 2, p.layerBelowDrainsM, p.drainRadiusM, method);
  return {
    spacingM: root.spacingM,
    equivalentDepthM: root.equivalentDepthM,
    averageFlowDepthM: root.equivalentDepthM + h0 / 2,
    headRatio: ratio,
    iterations: root.iterations,
  };
}

function requirePorosity(mu: number): void {
  if (!(Number.isFinite(mu) && mu > 0 && mu < 1)) {
    throw new TilefluxError(`drainablePorosity must be a fraction between 0 and 1; got ${mu}`);
  }
}
