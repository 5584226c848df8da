/**
 * Drained pore volume above the water table for a layered drainable porosity (specific yield).
 *
 * The drainable porosity of a layer is the water released per unit volume when the water table
 * falls through it (specific yield; Ritzema 1994, ILRI Publ. 16). Integrating it from the
 * surface to the water table gives the air volume that rain must
 * fill before the water table reaches the surface; inverting the integral gives the water-table
 * depth from stored water. Layers are piecewise constant, so both directions are exact.
 */
import type { PorosityProfile } from './types.js';

/** Precomputed cumulative air volume at each layer boundary, for fast lookups. */
export interface PorosityTable {
  /** Layer tops and bottoms, m: tops[i] .. bottoms[i]; the last layer ends at the barrier. */
  tops: Float64Array;
  bottoms: Float64Array;
  values: Float64Array;
  /** Air volume (mm) above each layer top. */
  airAtTop: Float64Array;
  /** Air volume (mm) with the water table at the barrier: the largest the profile holds. */
  maxAirMm: number;
  barrierDepthM: number;
  /** Smallest drainable porosity in the profile. */
  minValue: number;
}

/**
 * Build the lookup table for a porosity profile down to the restrictive layer.
 * @example porosityTable({ depthsM: [2.5], values: [0.05] }, 2.5).maxAirMm // 125
 */
export function porosityTable(profile: PorosityProfile, barrierDepthM: number): PorosityTable {
  const tops: number[] = [];
  const bottoms: number[] = [];
  const values: number[] = [];
  let top = 0;
  for (let i = 0; i < profile.values.length && top < barrierDepthM; i++) {
    const isLast = i === profile.values.length - 1;
    const bottom = isLast ? barrierDepthM : Math.min(profile.depthsM[i], barrierDepthM);
    if (bottom <= top) continue;
    tops.push(top);
    bottoms.push(bottom);
    values.push(profile.values[i]);
    top = bottom;
  }
  const airAtTop = new Float64Array(tops.length);
  let air = 0;
  for (let i = 0; i < tops.length; i++) {
    airAtTop[i] = air;
    air += values[i] * (bottoms[i] - tops[i]) * 1000;
  }
  return {
    tops: Float64Array.from(tops),
    bottoms: Float64Array.from(bottoms),
    values: Float64Array.from(values),
    airAtTop,
    maxAirMm: air,
    barrierDepthM,
    minValue: Math.min(...values),
  };
}

/**
 * Air volume (mm) above a water table at `depthM`.
 * @example airAbove(porosityTable({ depthsM: [2], values: [0.05] }, 2), 1) // 50
 */
export function airAbove(t: PorosityTable, depthM: number): number {
  if (depthM <= 0) return 0;
  if (depthM >= t.barrierDepthM) return t.maxAirMm;
  let i = 0;
  while (i < t.tops.length - 1 && depthM > t.bottoms[i]) i++;
  return t.airAtTop[i] + t.values[i] * (depthM - t.tops[i]) * 1000;
}

/**
 * Water-table depth (m) at which the air volume above it equals `airMm`.
 * @example depthForAir(porosityTable({ depthsM: [2], values: [0.05] }, 2), 50) // 1
 */
export function depthForAir(t: PorosityTable, airMm: number): number {
  if (airMm <= 0) return 0;
  if (airMm >= t.maxAirMm) return t.barrierDepthM;
  let i = 0;
  while (i < t.tops.length - 1 && airMm > t.airAtTop[i + 1]) i++;
  return t.tops[i] + (airMm - t.airAtTop[i]) / (t.values[i] * 1000);
}

/**
 * Drainable porosity of the layer containing `depthM`.
 * @example porosityAt(porosityTable({ depthsM: [1, 2], values: [0.08, 0.04] }, 2), 1.5) // 0.04
 */
export function porosityAt(t: PorosityTable, depthM: number): number {
  let i = 0;
  while (i < t.tops.length - 1 && depthM >= t.bottoms[i]) i++;
  return t.values[i];
}
