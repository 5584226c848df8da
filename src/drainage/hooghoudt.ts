/**
 * Hooghoudt's steady-state drain equation (Hooghoudt 1940; Ritzema 1994, Drainage Principles
 * and Applications, ILRI Publ. 16, ch. 8):
 *
 *   q = (8 K2 d h + 4 K1 h^2) / L^2
 *
 * q drain discharge per unit surface area (m/d), h head of the water table midway between the
 * drains above drain level (m), K1 and K2 saturated hydraulic conductivity above and below drain
 * level (m/d), d Hooghoudt's equivalent depth (m), L drain spacing (m). The first term is the
 * flow below drain level, the second the flow above it.
 */
import { TilefluxError } from '../errors.js';
import { requirePositive, requireRadiusBelowLayer } from './checks.js';
import { checkMethod, type EquivalentDepthMethod } from './equivalentDepth.js';
import { solveSpacing } from './spacingRoot.js';

/** Inputs of the Hooghoudt flux. */
export interface HooghoudtFluxInput {
  kAboveMPerDay: number;
  kBelowMPerDay: number;
  equivalentDepthM: number;
  headM: number;
  spacingM: number;
}

/**
 * Hooghoudt drain discharge q (m/d) for a midpoint head h above drain level (or above the
 * effective outlet level of a controlled drain). A head at or below zero gives no flow.
 * No input checks: this runs every engine sub-step, and the layout is checked once by the
 * caller (`equivalentDepth` checks the geometry).
 *
 * Source: Hooghoudt (1940); Ritzema (1994) ch. 8.
 * @example hooghoudtFlux({ kAboveMPerDay: 0.5, kBelowMPerDay: 0.5, equivalentDepthM: 1.2, headM: 0.6, spacingM: 20 }) // 0.009 m/d
 */
export function hooghoudtFlux(p: HooghoudtFluxInput): number {
  const h = p.headM;
  if (h <= 0) return 0;
  return (
    (8 * p.kBelowMPerDay * p.equivalentDepthM * h + 4 * p.kAboveMPerDay * h * h) /
    (p.spacingM * p.spacingM)
  );
}

/** Inputs of the Hooghoudt spacing. */
export interface HooghoudtSpacingInput {
  kAboveMPerDay: number;
  kBelowMPerDay: number;
  /** Barrier depth minus drain depth, m. */
  layerBelowDrainsM: number;
  drainRadiusM: number;
  /** Midpoint head above drain level, m. */
  headM: number;
  /** Design drainage rate (drainage coefficient), m/d. */
  rateMPerDay: number;
  method?: EquivalentDepthMethod;
  /** Drain depth below the surface, m; when given, a head above the surface is rejected. */
  drainDepthM?: number;
}

/**
 * Drain spacing L (m) at which Hooghoudt's equation discharges `rateMPerDay` with the midpoint
 * head `headM`. Since d depends on L, L^2 = (8 K2 d(L) h + 4 K1 h^2) / q is solved by safeguarded
 * Newton iteration (typically 3-6 steps) to a relative 1e-13.
 *
 * Source: Hooghoudt (1940); Ritzema (1994) ch. 8, whose trial-and-error procedure is replaced
 * here by Newton's method; d from van der Molen & Wesseling (1991) or Moody (1966).
 * @example hooghoudtSpacing({ kAboveMPerDay: 0.5, kBelowMPerDay: 0.5, layerBelowDrainsM: 2, drainRadiusM: 0.1, headM: 0.7, rateMPerDay: 0.007 }) // { spacingM: 27.08, equivalentDepthM: 1.48, iterations: 5 }
 */
export function hooghoudtSpacing(p: HooghoudtSpacingInput): {
  spacingM: number;
  equivalentDepthM: number;
  iterations: number;
} {
  const method = p.method ?? 'vdmw';
  requirePositive(p.kAboveMPerDay, 'kAboveMPerDay', 'm/d');
  requirePositive(p.kBelowMPerDay, 'kBelowMPerDay', 'm/d');
  requirePositive(p.rateMPerDay, 'rateMPerDay', 'm/d');
  requirePositive(p.headM, 'headM (midpoint head above drain level)', 'm');
  if (p.drainDepthM !== undefined && !(p.headM <= p.drainDepthM)) {
    throw new TilefluxError(
      `headM (${p.headM} m) puts the water table above the surface: it can be at most the ` +
        `drain depth (${p.drainDepthM} m)`,
    );
  }
  checkMethod(method);
  requireRadiusBelowLayer(p.layerBelowDrainsM, p.drainRadiusM);
  const q = p.rateMPerDay;
  const c1 = (8 * p.kBelowMPerDay * p.headM) / q;
  const c0 = (4 * p.kAboveMPerDay * p.headM * p.headM) / q;
  return solveSpacing(c1, c0, p.layerBelowDrainsM, p.drainRadiusM, method);
}

/** Inputs of the drainage intensity. */
export interface DrainageIntensityInput {
  kAboveMPerDay: number;
  kBelowMPerDay: number;
  equivalentDepthM: number;
  /** Drain depth below the surface, m: the midpoint head when the water table reaches it. */
  drainDepthM: number;
  spacingM: number;
}

/**
 * Drainage intensity (m/d): the Hooghoudt discharge of a layout when the water table midway
 * between the drains stands at the surface, i.e. with head h = drain depth. It is the largest
 * rate the drains remove before the surface saturates.
 *
 * Source: Hooghoudt (1940) equation as in Ritzema (1994) ch. 8, with h equal to drain depth.
 * @example drainageIntensity({ kAboveMPerDay: 0.5, kBelowMPerDay: 0.5, equivalentDepthM: 1.2, drainDepthM: 1.2, spacingM: 20 }) // 0.0216 m/d
 */
export function drainageIntensity(p: DrainageIntensityInput): number {
  return hooghoudtFlux({
    kAboveMPerDay: p.kAboveMPerDay,
    kBelowMPerDay: p.kBelowMPerDay,
    equivalentDepthM: p.equivalentDepthM,
    headM: p.drainDepthM,
    spacingM: p.spacingM,
  });
}
