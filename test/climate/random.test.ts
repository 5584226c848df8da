import { describe, it, expect } from 'vitest';
import { gammaVariate, normalSampler, sfc32 } from '../../src/climate/random.js';

// Sampling-error tolerances: 5 standard errors, so a correct generator fails with probability
// below 1e-6 per check; a biased one (wrong mean or variance by a few %) fails.
const N = 200_000;

function moments(draw: () => number) {
  let s = 0;
  let s2 = 0;
  for (let i = 0; i < N; i++) {
    const x = draw();
    s += x;
    s2 += x * x;
  }
  const mean = s / N;
  return { mean, variance: s2 / N - mean * mean };
}

describe('seeded random numbers', () => {
  it('repeat for a seed and differ between seeds', () => {
    const a = sfc32(12345);
    const b = sfc32(12345);
    const c = sfc32(12346);
    const xa = Array.from({ length: 50 }, a);
    expect(Array.from({ length: 50 }, b)).toEqual(xa);
    expect(Array.from({ length: 50 }, c)).not.toEqual(xa);
    for (const x of xa) expect(x >= 0 && x < 1).toBe(true);
  });

  it('are uniform on [0, 1): mean 1/2, variance 1/12, no lag-1 correlation', () => {
    const u = sfc32(7);
    const xs = Float64Array.from({ length: N }, u);
    let s = 0;
    let s2 = 0;
    let lag = 0;
    for (let i = 0; i < N; i++) {
      s += xs[i];
      s2 += xs[i] * xs[i];
      if (i > 0) lag += (xs[i] - 0.5) * (xs[i - 1] - 0.5);
    }
    const sd = Math.sqrt(1 / 12);
    expect(Math.abs(s / N - 0.5)).toBeLessThan((5 * sd) / Math.sqrt(N));
    // Sampling variance of a variance estimate: (mu4 - sigma^4) / N = (1/80 - 1/144) / N,
    // that is 1/(180 N).
    expect(Math.abs(s2 / N - (s / N) ** 2 - 1 / 12)).toBeLessThan(
      (5 * Math.sqrt(1 / 180)) / Math.sqrt(N),
    );
    expect(Math.abs(lag / (N - 1) / (1 / 12))).toBeLessThan(5 / Math.sqrt(N));
  });

  it('normal variates have mean 0 and variance 1', () => {
    const { mean, variance } = moments(normalSampler(sfc32(3)));
    expect(Math.abs(mean)).toBeLessThan(5 / Math.sqrt(N));
    expect(Math.abs(variance - 1)).toBeLessThan(5 * Math.sqrt(2 / N)); // Var(s2) = 2 sigma^4 / N
  });

  it('gamma variates have mean k theta and variance k theta^2 (k above and below 1)', () => {
    for (const [k, theta] of [
      [0.7, 12],
      [2.5, 3],
    ]) {
      const u = sfc32(11);
      const z = normalSampler(sfc32(13));
      const { mean, variance } = moments(() => gammaVariate(u, z, k, theta));
      const sd = Math.sqrt(k) * theta;
      expect(Math.abs(mean - k * theta)).toBeLessThan((5 * sd) / Math.sqrt(N));
      // Variance of the sample variance of a gamma: (mu4 - sigma^4)/N with kurtosis 3 + 6/k.
      const varOfVar = (sd ** 4 * (2 + 6 / k)) / N;
      expect(Math.abs(variance - k * theta * theta)).toBeLessThan(5 * Math.sqrt(varOfVar));
    }
  });
});

/**
 * sfc32 written out again from its published definition, in plain modular arithmetic on 32-bit
 * words (no `| 0` tricks), so that it shares no code with src/climate/random.ts. PractRand's
 * sfc32 step (Doty-Humphrey, PractRand 0.9x, from memory):
 *   tmp = a + b + counter++;  a = b ^ (b >> 9);  b = c + (c << 3);  c = rotl(c, 21) + tmp;
 *   return tmp.
 * The seeding is the one documented on `sfc32`: a, b, c from the golden ratio, pi and e (c also
 * XORed with the seed's high word), the counter from the seed's low word and incremented before
 * its first use (so PractRand's counter starts at low word + 1), then 15 outputs discarded.
 */
function sfc32Reference(seed: number): () => number {
  const M = 2 ** 32;
  const word = (x: number) => ((x % M) + M) % M;
  let a = 0x9e3779b9;
  let b = 0x243f6a88;
  let c = word(0xb7e15162 ^ Math.floor(seed / M));
  let counter = word((seed % M) + 1);
  const step = () => {
    const tmp = word(a + b + counter);
    counter = word(counter + 1);
    a = word(b ^ Math.floor(b / 2 ** 9));
    b = word(c + c * 2 ** 3);
    c = word(word(c * 2 ** 21) + Math.floor(c / 2 ** 11) + tmp);
    return tmp / M;
  };
  for (let i = 0; i < 15; i++) step();
  return step;
}

describe('sfc32 against its published definition', () => {
  it('gives the same numbers as an independent transcription, for low and high seeds', () => {
    // Seeds above 2^32 reach the high-word part of the seeding; 2^53 - 1 is the largest allowed.
    for (const seed of [
      0,
      1,
      42,
      2 ** 31 + 7,
      2 ** 32 - 1,
      2 ** 32 + 5,
      3 * 2 ** 40 + 11,
      2 ** 53 - 1,
    ]) {
      const ours = sfc32(seed);
      const reference = sfc32Reference(seed);
      const a = Array.from({ length: 40 }, ours);
      const b = Array.from({ length: 40 }, reference);
      expect(a, `seed ${seed}`).toEqual(b);
    }
  });

  it('refuses seeds that are negative, fractional, unsafe or not numbers', () => {
    for (const seed of [-1, 0.5, 2 ** 53, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => sfc32(seed)).toThrow(`seed must be a non-negative integer; got ${seed}`);
    }
    expect(() => sfc32(0)).not.toThrow();
  });
});

/** A fixed list of numbers handed out in turn, to drive a sampler through chosen branches. */
function scripted(values: number[]): () => number {
  let i = 0;
  return () => {
    if (i >= values.length) throw new Error('scripted stream ran out');
    return values[i++];
  };
}

describe('gammaVariate follows Marsaglia and Tsang step by step', () => {
  // Marsaglia and Tsang (2000), the algorithm as printed: d = k - 1/3, c = 1/sqrt(9 d);
  // draw x ~ N(0,1) until 1 + c x > 0; v = (1 + c x)^3; accept d v if U < 1 - 0.0331 x^4 or
  // log U < x^2/2 + d (1 - v + log v). The sampler takes U = 1 - u() so that log U is finite.
  const accepted = (k: number, x: number, scale: number) => {
    const d = k - 1 / 3;
    return d * (1 + x / Math.sqrt(9 * d)) ** 3 * scale;
  };

  it('accepts at the first draw when the squeeze test passes', () => {
    const g = gammaVariate(scripted([0.5]), scripted([0.5]), 2.5, 3);
    expect(g).toBeCloseTo(accepted(2.5, 0.5, 3), 12);
  });

  it('draws x again while 1 + c x <= 0, before any uniform is used', () => {
    // k = 2.5: c = 0.2265, so x = -5 gives 1 + c x = -0.13: drawn again. The uniforms 0.5 then
    // 0 (U = 1, which both tests reject at x = 0.5) tell a sampler that skipped the redraw apart.
    const g = gammaVariate(scripted([0.5, 0, 0.5]), scripted([-5, 0.5, 1]), 2.5, 3);
    expect(g).toBeCloseTo(accepted(2.5, 0.5, 3), 12);
  });

  it('rejects a draw that fails both tests and takes the next', () => {
    // x = 2 with U = 1: 1 < 1 - 0.0331 * 16 fails, and log 1 = 0 < 2 + d (1 - v + log v) = -0.05
    // fails (hand calculation with d = 13/6, v = 3.067), so x = 0.5 with U = 0.5 is returned.
    const g = gammaVariate(scripted([0, 0.5]), scripted([2, 0.5]), 2.5, 3);
    expect(g).toBeCloseTo(accepted(2.5, 0.5, 3), 12);
  });

  it('draws shape 1 directly and boosts shapes below 1 by U^(1/k)', () => {
    // Shape exactly 1 is in the direct branch (k >= 1): one normal, one uniform.
    expect(gammaVariate(scripted([0.5]), scripted([0.5]), 1, 2)).toBeCloseTo(
      accepted(1, 0.5, 2),
      12,
    );
    // Shape 0.4: the first uniform 0.75 boosts, (1 - 0.75)^(1/0.4), then shape 1.4 is drawn.
    expect(gammaVariate(scripted([0.75, 0.5]), scripted([0.5]), 0.4, 2)).toBeCloseTo(
      accepted(1.4, 0.5, 2) * 0.25 ** (1 / 0.4),
      12,
    );
  });
});
