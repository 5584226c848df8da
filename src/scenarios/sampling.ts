/**
 * Latin hypercube sampling (McKay, Beckman & Conover 1979, Technometrics 21: 239-245): with n
 * samples, the range of every parameter is cut into n strata of equal probability and each
 * stratum is used by exactly one sample; the strata of different parameters are paired by
 * independent random permutations, and each value lies at a random point within its stratum.
 * Seeded (sfc32), so a seed gives the same samples on every machine.
 */
import { sfc32 } from '../climate/random.js';

/**
 * `samples` points in the unit hypercube of `dims` dimensions: result[s][d] in [0, 1), with
 * floor(result[s][d] * samples) a permutation of 0..samples-1 over s for every d.
 *
 * @example latinHypercube(4, 2, 7).map((p) => Math.floor(p[0] * 4)).sort() // [0, 1, 2, 3]
 */
export function latinHypercube(samples: number, dims: number, seed: number): number[][] {
  if (!(Number.isInteger(samples) && samples >= 1))
    throw new RangeError(`samples must be a whole number of at least 1; got ${samples}`);
  const u = sfc32(seed);
  const out = Array.from({ length: samples }, () => new Array<number>(dims).fill(0));
  for (let d = 0; d < dims; d++) {
    // Fisher-Yates shuffle of the strata (Knuth, TAOCP vol. 2, Algorithm P).
    const perm = Array.from({ length: samples }, (_, k) => k);
    for (let k = samples - 1; k > 0; k--) {
      const j = Math.floor(u() * (k + 1));
      [perm[k], perm[j]] = [perm[j], perm[k]];
    }
    for (let s = 0; s < samples; s++) out[s][d] = (perm[s] + u()) / samples;
  }
  return out;
}

/**
 * A unit value mapped onto [low, high], evenly (`linear`) or evenly in the logarithm (`log`).
 *
 * @example scaledValue(0.5, 0.4, 1.6, 'log') // 0.8 (geometric mean)
 */
export function scaledValue(u: number, low: number, high: number, scale: 'linear' | 'log'): number {
  if (scale === 'log') return Math.exp(Math.log(low) + u * (Math.log(high) - Math.log(low)));
  return low + u * (high - low);
}
