/**
 * Crop N uptake along the season. Cumulative N uptake of field crops follows an S-shaped
 * (logistic) curve over the season: slow after planting, fastest around flowering, levelling
 * off towards maturity (e.g. Bender, Haegele, Ruffo & Below 2013, Agronomy Journal 105: 161-170,
 * for maize (from memory)). The curve is the logistic 1 / (1 + exp(-k (s - s50))) of the season
 * fraction s, rescaled so that it is exactly 0 at planting (s = 0) and 1 at harvest (s = 1).
 */

/**
 * Fraction of the season's uptake taken by season fraction `s` (0..1).
 *
 * @param s         season fraction, 0 at planting, 1 at harvest (clamped to 0..1)
 * @param midpoint  season fraction at which half is taken (s50)
 * @param steepness logistic steepness k
 * @example cumulativeUptakeFraction(0.5, 0.5, 10) // 0.5
 * @example cumulativeUptakeFraction(1, 0.45, 10) // 1
 */
export function cumulativeUptakeFraction(s: number, midpoint: number, steepness: number): number {
  const x = s < 0 ? 0 : s > 1 ? 1 : s;
  const logistic = (v: number) => 1 / (1 + Math.exp(-steepness * (v - midpoint)));
  const at0 = logistic(0);
  return (logistic(x) - at0) / (logistic(1) - at0);
}
