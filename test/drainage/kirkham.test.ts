import { describe, expect, it } from 'vitest';
import { kirkhamFlux, kirkhamGeometryFactor } from '../../src/drainage/kirkham.js';

// Independent evaluation by the method of images that underlies Kirkham (1957): drains at depth
// b (line sinks) spaced L, ponded surface z = 0 at constant head, impermeable layer at z = h.
// Images: sinks at z = b + 4hn and 2h - b + 4hn, sources at z = -b + 4hn and b - 2h + 4hn, in
// every column x = kL. Head difference surface - drain top = (Q / 2 pi K) * S, where S sums
// sign * (ln|surface - image| - ln|drain top - image|); with Q = q L and
// q = 4 pi K (t + b - r) / (g L), Kirkham's g equals 2 S. Summed by brute force here.
function imageSum(b: number, h: number, r: number, L: number, N: number): number {
  const K = Math.ceil((12 * h) / L) + 2;
  const surface = { x: L / 2, z: 0 };
  const top = { x: 0, z: b - r };
  let s = 0;
  for (let k = -K; k <= K; k++) {
    const x = k * L;
    for (let n = -N; n <= N; n++) {
      const o = 4 * h * n;
      for (const [z, sign] of [
        [b + o, 1],
        [2 * h - b + o, 1],
        [-b + o, -1],
        [b - 2 * h + o, -1],
      ] as const) {
        const ds = Math.hypot(surface.x - x, surface.z - z);
        const dt = Math.hypot(top.x - x, top.z - z);
        s += sign * (Math.log(ds) - Math.log(dt));
      }
    }
  }
  return 2 * s;
}

describe('kirkhamGeometryFactor', () => {
  it('matches a brute-force image sum', () => {
    for (const [b, D, r, L] of [
      [1.0, 2.0, 0.1, 20],
      [1.2, 0.8, 0.05, 10],
      [0.8, 5.0, 0.1, 40],
    ]) {
      const g = kirkhamGeometryFactor({
        drainDepthM: b,
        layerBelowDrainsM: D,
        drainRadiusM: r,
        spacingM: L,
      });
      // Each period of images carries a net dipole, so truncating the z-sums at +-N periods
      // leaves a remainder proportional to 1/N; Richardson extrapolation from N and 2N removes
      // it, leaving O(1/N^2), well below the 1e-6 checked.
      const extrapolated = 2 * imageSum(b, b + D, r, L, 4000) - imageSum(b, b + D, r, L, 2000);
      expect(Math.abs(g / extrapolated - 1)).toBeLessThan(1e-6);
    }
  });

  it('approaches the row of drains in a deep soil: g = 2 ln(sinh(pi (2b - r)/L) / sinh(pi r / L))', () => {
    // Row of line sinks under a constant-head surface in a half-space: each sink with its image
    // source, summed over the row in closed form (the image method of Kirkham 1949; closed form
    // written out here, from memory).
    const [b, r, L] = [1, 0.1, 15];
    const g = kirkhamGeometryFactor({
      drainDepthM: b,
      layerBelowDrainsM: 2000,
      drainRadiusM: r,
      spacingM: L,
    });
    const deep =
      2 * Math.log(Math.sinh((Math.PI * (2 * b - r)) / L) / Math.sinh((Math.PI * r) / L));
    // Relative effect of a barrier 2000 m down on a 15 m layout: well under 1e-4.
    expect(Math.abs(g / deep - 1)).toBeLessThan(1e-4);
  });

  it('rejects a radius that reaches the surface or the barrier', () => {
    expect(() =>
      kirkhamGeometryFactor({
        drainDepthM: 0.05,
        layerBelowDrainsM: 2,
        drainRadiusM: 0.1,
        spacingM: 20,
      }),
    ).toThrowError(/drainRadiusM/);
    expect(() =>
      kirkhamGeometryFactor({
        drainDepthM: 1,
        layerBelowDrainsM: 0.05,
        drainRadiusM: 0.1,
        spacingM: 20,
      }),
    ).toThrowError(/restrictive layer must lie below/);
  });
});

describe('kirkhamFlux', () => {
  it('is q = 4 pi K (t + b - r) / (g L) (Kirkham 1957)', () => {
    const g = 5.5;
    const got = kirkhamFlux({
      kMPerDay: 0.8,
      pondedDepthM: 0.02,
      drainDepthM: 1.1,
      drainRadiusM: 0.06,
      spacingM: 18,
      geometryFactor: g,
    });
    expect(got).toBeCloseTo((4 * Math.PI * 0.8 * (0.02 + 1.1 - 0.06)) / (g * 18), 15);
  });
});
