/**
 * Fit of the concentration-discharge rating C = a Q^b to observed pairs by ordinary least
 * squares in log space, ln C = ln a + b ln Q (the usual way power-law rating curves are fitted,
 * e.g. Godsey, Kirchner & Clow 2009, Hydrological Processes 23: 1844-1864 (from memory)), with
 * simple-statistics `linearRegression` and `rSquared`.
 *
 * The back-transformed curve a Q^b is the median, not the mean, concentration at a flow when the
 * scatter is lognormal; no bias correction (such as Duan's smearing estimate) is applied, so
 * loads from a fitted rating lean low when the scatter is wide. Pairs with a zero or negative
 * flow or concentration have no logarithm: they are left out and counted in `skipped`.
 */
import { linearRegression, rSquared } from 'simple-statistics';
import { TilefluxError } from '../errors.js';
import type { RatingFit } from './types.js';

/**
 * Fit C = a Q^b to pairs of daily drain flow (mm) and nitrate-N concentration (mg/L).
 *
 * @throws TilefluxError with fewer than 3 usable pairs or a single distinct flow
 * @example fitRating({ flowMm: [1, 4, 16], concMgL: [10, 20, 40] })
 * // { a: 10, b: 0.5, rSquared: 1, n: 3, skipped: 0, flowRangeMm: [1, 16] }
 */
export function fitRating(
  pairs: { flowMm: readonly number[]; concMgL: readonly number[] },
  where = 'rating observations',
): RatingFit {
  const { flowMm, concMgL } = pairs;
  if (flowMm.length !== concMgL.length) {
    throw new RangeError(`${flowMm.length} flows but ${concMgL.length} concentrations`);
  }
  const xy: [number, number][] = [];
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < flowMm.length; i++) {
    const q = flowMm[i];
    const c = concMgL[i];
    if (!(q > 0 && c > 0)) continue;
    xy.push([Math.log(q), Math.log(c)]);
    if (q < lo) lo = q;
    if (q > hi) hi = q;
  }
  const skipped = flowMm.length - xy.length;
  if (xy.length < 3) {
    throw new TilefluxError(
      `a rating C = a Q^b needs at least 3 pairs with a flow and a concentration above 0; ` +
        `got ${xy.length} (${skipped} left out for a zero or negative value)`,
      where,
    );
  }
  if (!(hi > lo)) {
    throw new TilefluxError(
      `all ${xy.length} usable pairs have the same flow (${lo} mm), so no exponent b can be fitted; ` +
        'give pairs over a range of flows',
      where,
    );
  }
  const line = linearRegression(xy);
  const r2 = rSquared(xy, (x) => line.b + line.m * x);
  return {
    a: Math.exp(line.b),
    b: line.m,
    rSquared: r2,
    n: xy.length,
    skipped,
    flowRangeMm: [lo, hi],
  };
}
