import { describe, expect, it } from 'vitest';
import {
  SEEPAGE_SETTINGS,
  lateralSeepageMmPerDay,
  seepageParamsOf,
  verticalSeepageMmPerDay,
} from '../../src/engine/seepage.js';
import { simulate } from '../../src/engine/simulate.js';
import { constantForcing, flatCalendar, free, params } from './fixtures.js';

describe('seepage paths', () => {
  it("vertical leakage is Darcy flow across a leaky layer: q = K'/b' x head difference", () => {
    // K' = 1e-8 m/s through b' = 5 m (the medium setting), regional head 3 m down, water table
    // at 1.0 m: q = 1e-8 x 86400 / 5 x 2.0 m = 3.456e-4 m/d.
    const s = seepageParamsOf(SEEPAGE_SETTINGS.medium, 0.9);
    expect(verticalSeepageMmPerDay(1.0, 2.2, s)).toBeCloseTo(((1e-8 * 86400) / 5) * 2.0 * 1000, 12);
    expect(verticalSeepageMmPerDay(2.2, 2.2, s)).toBe(0); // no saturated soil above the layer
    expect(verticalSeepageMmPerDay(3.5, 4, s)).toBe(0); // water table below the regional head
  });

  it('lateral seepage keeps the Dupuit midpoint head of a strip draining to its edges', () => {
    // Independent check: integrate the Dupuit-Forchheimer equation d/dx(K h dh/dx) = q (uniform
    // outflow q over a strip, edge head He at x = 0, no flow across the middle x = X) by RK4
    // from the edge with the flux the function gives, and recover the field's head H there.
    const K = 0.9;
    const X = 200;
    const barrier = 2.2;
    const wt = 0.8;
    const edge = 1.5;
    const s = seepageParamsOf({ lateral: { distance: X, level: edge } }, K);
    const q = lateralSeepageMmPerDay(wt, barrier, s) / 1000; // m/d
    // h dh/dx = (q / K) (X - x): integrate y = h^2 / 2, dy/dx = (q / K) (X - x), exactly by RK4.
    const n = 1000;
    const dx = X / n;
    let y = (barrier - edge) ** 2 / 2;
    const f = (x: number) => (q / K) * (X - x);
    for (let i = 0; i < n; i++) {
      const x = i * dx;
      y += (dx / 6) * (f(x) + 4 * f(x + dx / 2) + f(x + dx));
    }
    expect(Math.sqrt(2 * y)).toBeCloseTo(barrier - wt, 10);
    expect(lateralSeepageMmPerDay(1.6, barrier, s)).toBe(0); // edge water higher than the field's
  });

  it('the engine removes the seepage of the day and closes its balance', () => {
    // No rain, no ET, drains far apart (almost no drain flow): the first day's seepage is the
    // sum of both paths at the starting water table, to the change of the table over one day.
    const n = 60;
    const seepage = seepageParamsOf(SEEPAGE_SETTINGS.high, 1);
    const p = params({ spacingM: 400, seepage, initialWaterTableDepthM: 0.5 });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    const expected =
      verticalSeepageMmPerDay(0.5, p.barrierDepthM, seepage) +
      lateralSeepageMmPerDay(0.5, p.barrierDepthM, seepage);
    expect(Math.abs(r.seepageMm[0] / expected - 1)).toBeLessThan(0.02);
    expect(r.lateralSeepageMm[0]).toBeGreaterThan(0);
    expect(r.lateralSeepageMm[0]).toBeLessThan(r.seepageMm[0]);
    let err = 0;
    for (let i = 0; i < n; i++) err += Math.abs(r.balanceErrorMm[i]);
    expect(err).toBeLessThan(1e-6);
    // The water table falls under seepage alone.
    expect(r.waterTableDepthM[n - 1]).toBeGreaterThan(0.5);
  });

  it('more seepage from low to medium to high (the band settings are ordered)', () => {
    const at = (b: 'low' | 'medium' | 'high') =>
      verticalSeepageMmPerDay(1, 2.2, seepageParamsOf(SEEPAGE_SETTINGS[b], 0.9)) +
      lateralSeepageMmPerDay(1, 2.2, seepageParamsOf(SEEPAGE_SETTINGS[b], 0.9));
    expect(at('low')).toBeLessThan(at('medium'));
    expect(at('medium')).toBeLessThan(at('high'));
  });
});
