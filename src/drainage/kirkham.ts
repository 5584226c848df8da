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
 *
 * Raised outlet (a control structure holding water at depth c below the surface). Heads are
 * elevations above the soil surface. The image solution fixes the geometry of the flow, and with
 * it g; the flux is linear in the head difference between the two equipotential boundaries,
 * q L = Q = 4 pi K (H_surface - H_drain) / g, with H_surface = t (the pond level). Only H_drain
 * depends on the outlet:
 * - free outlet, or the outlet level inside the pipe (c >= b - r): the pipe runs part full, its
 *   top is at atmospheric pressure, H_drain = -(b - r), as in Kirkham's form;
 * - outlet above the pipe top (c < b - r): the pipe runs full and connects, without head loss
 *   (the usual assumption for a short structure), to the water standing at depth c in the
 *   structure. The pressure head at the pipe top is then (b - r) - c and the hydraulic head
 *   H_drain = -(b - r) + ((b - r) - c) = -c.
 * Hence H_surface - H_drain = t + min(c, b - r): the drain keeps its place in the image
 * geometry (g for the real depth b) and the radius is not subtracted from the outlet level,
 * which is already the water level (putting c in place of b in t + b - r would lower the head
 * by r: by a sixth for c = 0.3 m and r = 0.05 m).
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
  /**
   * Level at which a control structure holds the outlet, m below the surface; omitted (or at or
   * below the pipe top) for a free outlet.
   */
  outletDepthM?: number;
}

/**
 * Head difference (m) that drives Kirkham's ponded flow: pond depth plus the depth of the drain's
 * hydraulic head, t + min(c, b - r) (see the module comment for the raised outlet).
 *
 * @example kirkhamHeadM({ pondedDepthM: 0, drainDepthM: 1.1, drainRadiusM: 0.05, outletDepthM: 0.3 }) // 0.3
 */
export function kirkhamHeadM(p: {
  pondedDepthM: number;
  drainDepthM: number;
  drainRadiusM: number;
  outletDepthM?: number;
}): number {
  const t = p.pondedDepthM > 0 ? p.pondedDepthM : 0;
  const top = p.drainDepthM - p.drainRadiusM;
  const c = p.outletDepthM;
  return t + (c !== undefined && c < top ? Math.max(0, c) : top);
}

/**
 * Kirkham (1957) drain discharge per unit surface area (m/d) with water ponded on the surface:
 * q = 4 pi K (t + b - r) / (g L) with a free outlet, q = 4 pi K (t + c) / (g L) with the outlet
 * held at depth c above the pipe top (`kirkhamHeadM`). Cheap: no series, no checks beyond a
 * negative pond depth.
 *
 * Source: Kirkham (1957); raised outlet derived in the module comment.
 * @example kirkhamFlux({ kMPerDay: 0.5, pondedDepthM: 0.01, drainDepthM: 1, drainRadiusM: 0.1, spacingM: 20, geometryFactor: 6.06 }) // 0.0471 m/d
 */
export function kirkhamFlux(p: KirkhamFluxInput): number {
  return (4 * Math.PI * p.kMPerDay * kirkhamHeadM(p)) / (p.geometryFactor * p.spacingM);
}
