import { describe, expect, it } from 'vitest';
import { kirkhamFlux, kirkhamGeometryFactor, kirkhamHeadM } from '../../src/drainage/kirkham.js';

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
      // Close drains of a large radius over a thin layer: the series terms carry about 22 % of g.
      [1.0, 0.5, 0.2, 2],
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

// Head of the image potential at a point, per unit sink strength Q / (2 pi K): the sum over the
// images of imageSum (sinks +1, sources -1) of ln(distance), truncated at +-N periods.
function imagePotential(
  px: number,
  pz: number,
  b: number,
  h: number,
  L: number,
  N: number,
): number {
  const K = Math.ceil((12 * h) / L) + 2;
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
        s += sign * Math.log(Math.hypot(px - x, pz - z));
      }
    }
  }
  return s;
}

describe('kirkhamFlux with a raised outlet (submerged drain)', () => {
  // Independent evaluation by the method of images: drains (line sinks, strength Q per metre)
  // under a ponded surface at head t, the drain boundary at the head of the water in the pipe.
  // With the outlet held at depth c above the pipe top the pipe runs full and its head is the
  // outlet level, -c (hydrostatics: pressure head (b - r) - c at the pipe top, elevation
  // -(b - r)). Q follows from head(surface) - head(drain top) = (Q / 2 pi K) x potential
  // difference, with the truncation removed by Richardson extrapolation as above.
  const [K, b, D, r, L] = [0.9, 1.1, 1.1, 0.05, 18];
  const h = b + D;
  const g = kirkhamGeometryFactor({
    drainDepthM: b,
    layerBelowDrainsM: D,
    drainRadiusM: r,
    spacingM: L,
  });
  const potential = (x: number, z: number) =>
    2 * imagePotential(x, z, b, h, L, 4000) - imagePotential(x, z, b, h, L, 2000);
  const surface = potential(L / 2, 0);
  const top = potential(0, b - r);

  for (const [t, c] of [
    [0, 0.3],
    [0, 0.15],
    [0.05, 0.3],
    [0.02, 0.6],
  ]) {
    it(`pond ${t} m, outlet ${c} m: q = 2 pi K (t + c) / (L x potential difference)`, () => {
      const q = (2 * Math.PI * K * (t + c)) / (L * (surface - top));
      const got = kirkhamFlux({
        kMPerDay: K,
        pondedDepthM: t,
        drainDepthM: b,
        drainRadiusM: r,
        spacingM: L,
        geometryFactor: g,
        outletDepthM: c,
      });
      // Richardson-extrapolated image sums agree with the series to better than 1e-6.
      expect(Math.abs(got / q - 1)).toBeLessThan(1e-6);
      // The surface is an equipotential of the image solution (exactly, by the mirror images),
      // and the drain circumference nearly so: a line sink stands for the pipe, so the head at
      // the pipe bottom and side differs from the top by a share of the driving head of the
      // order of r / b (achieved 1.8 % here for r = 0.05 m, b = 1.1 m).
      const perHead = (t + c) / (surface - top);
      expect(Math.abs(potential(L / 4, 0) - surface) * perHead).toBeLessThan(1e-9);
      for (const [x, z] of [
        [0, b + r],
        [r, b],
      ]) {
        expect(Math.abs(potential(x, z) - top) * perHead).toBeLessThan(0.02 * (t + c));
      }
    });
  }

  it('a free outlet, or an outlet level inside the pipe, keeps the head at the pipe top', () => {
    const base = { pondedDepthM: 0.02, drainDepthM: b, drainRadiusM: r };
    expect(kirkhamHeadM(base)).toBeCloseTo(0.02 + b - r, 15);
    expect(kirkhamHeadM({ ...base, outletDepthM: b })).toBeCloseTo(0.02 + b - r, 15);
    expect(kirkhamHeadM({ ...base, outletDepthM: b - r / 2 })).toBeCloseTo(0.02 + b - r, 15);
    expect(kirkhamHeadM({ ...base, outletDepthM: 0.3 })).toBeCloseTo(0.32, 15);
  });
});
