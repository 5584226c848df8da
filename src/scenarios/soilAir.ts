/**
 * Air and water in the upper soil layers, from the engine's states: the water-table depth, the
 * layered drainable porosity and the root-zone depletion below field capacity. These feed the
 * aeration and fieldwork measures of the annual table (README "Measures").
 *
 * The engine's picture of the profile (see engine/simulate.ts): below the water table the soil is
 * saturated; above it each layer has drained by its drainable porosity, i.e. holds field capacity,
 * less what the crop has taken from the root zone. Where in the root zone that depletion sits is
 * not needed by the engine, but it is by a measure of the top few centimetres, so one assumption
 * is added here: the root zone dries from the top down and is rewetted from the top down (soil
 * evaporation and the densest roots are near the surface, and infiltration enters there; the
 * same ordering underlies FAO-56's surface evaporation layer, Allen et al. 1998 ch. 7).
 */
import { airAbove, type PorosityTable } from '../engine/porosityProfile.js';
import type { EngineParams } from '../engine/types.js';

/** The soil properties the measures need (a subset of the engine's parameters). */
export type SoilAirParams = Pick<
  EngineParams,
  'porosity' | 'barrierDepthM' | 'fieldCapacity' | 'wiltingPoint' | 'rootZoneDepthM'
>;

/**
 * Largest depletion (mm) the top `layerM` of the root zone can carry: field capacity down to the
 * wilting point over the part of the layer inside the root zone.
 * @example layerDepletionCapacityMm({ fieldCapacity: 0.3, wiltingPoint: 0.1, rootZoneDepthM: 0.6 }, 0.1) // 20
 */
export function layerDepletionCapacityMm(
  soil: Pick<SoilAirParams, 'fieldCapacity' | 'wiltingPoint' | 'rootZoneDepthM'>,
  layerM: number,
): number {
  return 1000 * Math.min(layerM, soil.rootZoneDepthM) * (soil.fieldCapacity - soil.wiltingPoint);
}

/**
 * Daily depletion (mm) of a top layer of the root zone, from the root zone's daily depletion and
 * the day's infiltration: infiltration rewets the top layer first, and the day's drying of the
 * root zone (its rise in depletion plus what infiltration refilled) is taken from the top layer
 * first, up to `capacityMm`. The layer never holds more depletion than the whole root zone.
 * Day `0` starts with the layer carrying as much of the root zone's depletion as it can.
 *
 * @example
 * // 10 mm of drying, then 4 mm of rain, then 3 mm more drying; the top layer holds up to 8 mm
 * topLayerDepletionMm(Float64Array.of(10, 6, 9), Float64Array.of(0, 4, 0), 8) // [8, 4, 7]
 */
export function topLayerDepletionMm(
  rootZoneDepletionMm: Float64Array,
  infiltrationMm: Float64Array,
  capacityMm: number,
): Float64Array {
  const n = rootZoneDepletionMm.length;
  const out = new Float64Array(n);
  if (n === 0) return out;
  let layer = Math.min(capacityMm, rootZoneDepletionMm[0]);
  out[0] = layer;
  for (let i = 1; i < n; i++) {
    const before = rootZoneDepletionMm[i - 1];
    const after = rootZoneDepletionMm[i];
    const inf = infiltrationMm[i];
    const drying = Math.max(0, after - before + Math.min(inf, before));
    layer = Math.max(0, layer - inf) + drying;
    if (layer > capacityMm) layer = capacityMm;
    if (layer > after) layer = after;
    out[i] = layer;
  }
  return out;
}

/**
 * Air-filled porosity (volume fraction) of the top `layerM` of the soil: the pores drained above
 * the water table inside the layer plus the layer's depletion below field capacity, over the
 * layer's volume.
 * @example airFilledPorosity(porosityTable({ depthsM: [2], values: [0.06] }, 2), 0.3, 0.5, 6) // 0.08
 */
export function airFilledPorosity(
  table: PorosityTable,
  layerM: number,
  waterTableDepthM: number,
  layerDepletionMm: number,
): number {
  const drained = airAbove(table, Math.min(Math.max(waterTableDepthM, 0), layerM));
  return (drained + layerDepletionMm) / (1000 * layerM);
}

/**
 * Volumetric water content of the top `layerM`: field capacity where drained, field capacity
 * plus the drainable porosity (saturation) below the water table, less the layer's depletion.
 * @example surfaceWaterContent(porosityTable({ depthsM: [2], values: [0.06] }, 2), 0.1, 0.3, 0.05, 0) // 0.33
 */
export function surfaceWaterContent(
  table: PorosityTable,
  layerM: number,
  fieldCapacity: number,
  waterTableDepthM: number,
  layerDepletionMm: number,
): number {
  const drainable = airAbove(table, layerM);
  const drained = airAbove(table, Math.min(Math.max(waterTableDepthM, 0), layerM));
  return fieldCapacity + (drainable - drained - layerDepletionMm) / (1000 * layerM);
}
