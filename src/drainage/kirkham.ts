/**
 * Kirkham's (1957) steady drainage rate for a ponded surface: water stands at depth t on the
 * surface, drains of radius r lie at depth b below it, spacing L, on an impermeable layer at
 * depth h below the surface (Kirkham 1957, "Theory of land drainage", in Drainage of
 * Agricultural Lands, ASA Agronomy Monograph 7). Printed versions use varying symbols; the form
 * below is written out in this module's variables from the method of images (see below) and is
 * checked in the tests against a brute-force image sum:
 *
 *   q = 4 pi K (t + b - r) / (g L)
 *   g = 2 ln[ tan(pi (2b - r) / (4h)) / tan(pi r / (4h)) ]
 *     + 2 sum_{m>=1} ln[ (cosh(pi m L / (2h)) + cos(pi r / (2h))) (cosh(pi m L / (2h)) - cos(pi (2b - r) / (2h)))
 *                      / ((cosh(pi m L / (2h)) - cos(pi r / (2h))) (cosh(pi m L / (2h)) + cos(pi (2b - r) / (2h)))) ]
 *
 * The form follows from the method of images: each drain is a line sink with an image source
 * above the ponded surface (constant head) and mirror images below the impermeable layer; the
 * head at the drain is taken at the top of the pipe (depth b - r) and the water in the pipe is at
 * atmospheric pressure. g depends only on the layout, so it is computed once and the flux is one
 * multiplication per call.
 */
import { TilefluxError } from '../errors.js';
import { requirePositive, requireRadiusBelowLayer } from './checks.js';

/** Layout of a Kirkham geometry factor. */
export interface KirkhamGeometryInput {
  drainDepthM: number;
  layerBelowDrainsM: number;
  drainRadiusM: number;
  spacingM: number;
}

/**
 * Kirkham's geometry factor g (dimensionless) for a drain layout, the series summed until the
 * terms fall below 1e-16 of the total (they decay like exp(-pi m L / (2 h))).
 *
 * Source: Kirkham (1957); see the module comment.
 * @example kirkhamGeometryFactor({ drainDepthM: 1, layerBelowDrainsM: 2, drainRadiusM: 0.1, spacingM: 20 }) // 6.06
 */
export function kirkhamGeometryFactor(p: KirkhamGeometryInput): number {
  const b = p.drainDepthM;
  const r = p.drainRadiusM;
  const L = p.spacingM;
  requirePositive(b, 'drainDepthM', 'm');
  requireRadiusBelowLayer(p.layerBelowDrainsM, r);
  if (!(r < b)) {
    throw new TilefluxError(`drainRadiusM (${r} m) must be less than drainDepthM (${b} m)`);
  }
  requirePositive(L, 'spacingM', 'm');
  if (!(L > 2 * r)) {
    throw new TilefluxError(`spacingM (${L} m) must exceed the drain diameter (${2 * r} m)`);
  }
  const h = b + p.layerBelowDrainsM;
  let g =
    2 * Math.log(Math.tan((Math.PI * (2 * b - r)) / (4 * h)) / Math.tan((Math.PI * r) / (4 * h)));
  const ca = Math.cos((Math.PI * r) / (2 * h));
  const cb = Math.cos((Math.PI * (2 * b - r)) / (2 * h));
  for (let m = 1; m < 100000; m++) {
    const c = Math.cosh((Math.PI * m * L) / (2 * h));
    if (!Number.isFinite(c)) break;
    // ln((c + a)/(c - a)) = log1p(2a / (c - a)) keeps the digits when c is large.
    const term = 2 * (Math.log1p((2 * ca) / (c - ca)) - Math.log1p((2 * cb) / (c - cb)));
    g += term;
    if (Math.abs(term) <= 1e-16 * Math.abs(g)) break;
  }
  return g;
}

/** Inputs of the Kirkham flux. */
export interface KirkhamFluxInput {
  kMPerDay: number;
  /** Depth of water ponded on the surface, m (0 for a surface just saturated). */
  pondedDepthM: number;
  drainDepthM: number;
  drainRadiusM: number;
  spacingM: number;
  /** From `kirkhamGeometryFactor` for the same layout. */
  geometryFactor: number;
}

/**
 * Kirkham (1957) drain discharge per unit surface area (m/d) with water ponded on the surface:
 * q = 4 pi K (t + b - r) / (g L). Cheap: no series, no checks beyond a negative pond depth.
 *
 * Source: Kirkham (1957); see the module comment.
 * @example kirkhamFlux({ kMPerDay: 0.5, pondedDepthM: 0.01, drainDepthM: 1, drainRadiusM: 0.1, spacingM: 20, geometryFactor: 6.06 }) // 0.0471 m/d
 */
export function kirkhamFlux(p: KirkhamFluxInput): number {
  const t = p.pondedDepthM > 0 ? p.pondedDepthM : 0;
  return (
    (4 * Math.PI * p.kMPerDay * (t + p.drainDepthM - p.drainRadiusM)) /
    (p.geometryFactor * p.spacingM)
  );
}
