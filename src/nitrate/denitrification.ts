/**
 * Saturation response of denitrification. Denitrification needs anoxic soil, so it is negligible
 * in a drained, aerated profile and rises steeply as the profile saturates. Simplified models
 * express this as a threshold-power reduction function f = ((s - st) / (1 - st))^w above a
 * threshold saturation st and 0 below it (Heinen 2006, "Simplified denitrification models:
 * overview and properties", Geoderma 133: 444-463 (from memory)). Here s is the saturated
 * fraction of the drained profile, (drain depth - water-table depth) / drain depth, from the
 * engine: 0 with the water table at or below the drains, 1 with it at the surface.
 */

/**
 * Saturation factor (0..1) of denitrification.
 *
 * @param saturatedFraction saturated fraction of the drained profile, 0..1 (clamped)
 * @param threshold         st, 0..1 (below it: no denitrification)
 * @param exponent          w > 0
 * @example saturationFactor(0.75, 0.5, 1) // 0.5
 * @example saturationFactor(0.3, 0.5, 1) // 0
 */
export function saturationFactor(
  saturatedFraction: number,
  threshold: number,
  exponent: number,
): number {
  const s = saturatedFraction > 1 ? 1 : saturatedFraction;
  if (!(s > threshold)) return 0;
  const r = (s - threshold) / (1 - threshold);
  // The default square without the library call: IEEE multiplication rounds r * r correctly, and
  // Math.pow(r, 2) returns the same double (a test checks it).
  return exponent === 2 ? r * r : Math.pow(r, exponent);
}
