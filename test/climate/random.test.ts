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
