/**
 * The `rating` concentration model: a power-law concentration-discharge relation C = a Q^b, the
 * form commonly fitted to stream and drain-water chemistry (e.g. Godsey, Kirchner & Clow 2009,
 * Hydrological Processes 23: 1844-1864, on C-Q power laws (from memory)). Q is the daily drain
 * flow in mm/d and C the nitrate-N concentration in mg N/L, so `a` is the concentration at
 * 1 mm/d.
 *
 * A power law fitted to a range of flows says nothing reliable outside that range. Flows outside
 * `flowRangeMm` are therefore not extrapolated: the concentration is taken at the nearest edge of
 * the range and the day is counted in `outOfRangeDays`, which the report shows. Days without
 * drain flow are not counted; their (unused) concentration is the one at the lower edge.
 */

/**
 * Daily concentration from the rating, clamping flows to the fitted range.
 *
 * @param drainflowMm daily drain flow, mm
 * @param a           concentration at 1 mm/d, mg N/L
 * @param b           exponent (dimensionless)
 * @param flowRangeMm smallest and largest flow the rating covers, mm/d (both > 0)
 * @example ratingConcentration(new Float64Array([0, 4, 100]), 10, 0.5, [1, 25])
 * // { concMgL: Float64Array [10, 20, 50], outOfRangeDays: 1 }
 */
export function ratingConcentration(
  drainflowMm: Float64Array,
  a: number,
  b: number,
  flowRangeMm: readonly [number, number],
): { concMgL: Float64Array; outOfRangeDays: number } {
  const [lo, hi] = flowRangeMm;
  if (!(lo > 0 && hi >= lo)) {
    throw new RangeError(`flowRangeMm must satisfy 0 < min <= max; got [${lo}, ${hi}]`);
  }
  const n = drainflowMm.length;
  const concMgL = new Float64Array(n);
  let outOfRangeDays = 0;
  for (let i = 0; i < n; i++) {
    const q = drainflowMm[i];
    let qUsed = q;
    if (q <= 0) qUsed = lo;
    else if (q < lo || q > hi) {
      outOfRangeDays++;
      qUsed = q < lo ? lo : hi;
    }
    concMgL[i] = a * Math.pow(qUsed, b);
  }
  return { concMgL, outOfRangeDays };
}
