/**
 * A small seeded pseudo-random number generator and the two distributions the weather
 * generator needs. Seeded and deterministic: the same seed gives the same numbers on every
 * machine, in Node and in a browser (only 32-bit integer arithmetic and Math.log/sqrt/cos).
 */

/** A source of uniform numbers in [0, 1). */
export type Uniform = () => number;

/**
 * sfc32 ("small fast counting", 32-bit) from Chris Doty-Humphrey's PractRand test suite, where
 * it passes the suite's statistical tests (from memory). State is four 32-bit words; the
 * counter word guarantees a period of at least 2^32. The seed is spread over the state with
 * fixed constants (fractional digits of the golden ratio, pi and e) and the first 15 outputs are
 * discarded so that nearby seeds give unrelated streams.
 *
 * @param seed a non-negative integer up to 2^53 - 1
 * @example const u = sfc32(42); u(); // a number in [0, 1), the same on every run
 */
export function sfc32(seed: number): Uniform {
  if (!Number.isSafeInteger(seed) || seed < 0) {
    throw new RangeError(`seed must be a non-negative integer; got ${seed}`);
  }
  let a = 0x9e3779b9;
  let b = 0x243f6a88;
  let c = 0xb7e15162 ^ Math.floor(seed / 4294967296);
  let d = seed >>> 0;
  const next = (): number => {
    a >>>= 0;
    b >>>= 0;
    c >>>= 0;
    d >>>= 0;
    let t = (a + b) | 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) | 0;
    c = (c << 21) | (c >>> 11);
    d = (d + 1) | 0;
    t = (t + d) | 0;
    c = (c + t) | 0;
    return (t >>> 0) / 4294967296;
  };
  for (let i = 0; i < 15; i++) next();
  return next;
}

/**
 * Standard normal variates by the Box-Muller transform (Box and Muller, 1958, "A note on the
 * generation of random normal deviates", Ann. Math. Statist. 29: 610-611), keeping the second
 * variate of each pair for the next call.
 *
 * @example const z = normalSampler(sfc32(1)); z(); // mean 0, variance 1
 */
export function normalSampler(u: Uniform): () => number {
  let spare = NaN;
  return () => {
    if (!Number.isNaN(spare)) {
      const s = spare;
      spare = NaN;
      return s;
    }
    const u1 = 1 - u(); // (0, 1]: log is finite
    const r = Math.sqrt(-2 * Math.log(u1));
    const theta = 2 * Math.PI * u();
    spare = r * Math.sin(theta);
    return r * Math.cos(theta);
  };
}

/**
 * A gamma variate with shape k and scale theta (mean k theta, variance k theta^2), by
 * Marsaglia and Tsang (2000, "A simple method for generating gamma variables", ACM Trans. Math.
 * Software 26(3): 363-372); for k < 1 it draws with k + 1 and multiplies by U^(1/k), as that
 * paper describes.
 *
 * @example gammaVariate(sfc32(1), normalSampler(sfc32(2)), 0.8, 10) // mean 8 over many draws
 */
export function gammaVariate(u: Uniform, z: () => number, shape: number, scale: number): number {
  if (shape < 1) {
    const boost = Math.pow(1 - u(), 1 / shape);
    return gammaVariate(u, z, shape + 1, scale) * boost;
  }
  const d = shape - 1 / 3;
  const c = 1 / Math.sqrt(9 * d);
  for (;;) {
    let x: number;
    let v: number;
    do {
      x = z();
      v = 1 + c * x;
    } while (v <= 0);
    v = v * v * v;
    const w = 1 - u();
    if (w < 1 - 0.0331 * x * x * x * x) return d * v * scale;
    if (Math.log(w) < 0.5 * x * x + d * (1 - v + Math.log(v))) return d * v * scale;
  }
}
