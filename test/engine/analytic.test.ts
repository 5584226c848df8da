// The engine against closed-form solutions of its own published flux equations, each derived and
// evaluated here independently of src/: recession of a linear reservoir, the Bernoulli solution of
// Hooghoudt's quadratic recession, Hooghoudt's steady state above a raised outlet, FAO-56 water
// stress, capillary supply, infiltration limited by the saturated conductivity, deep seepage.
import { describe, expect, it } from 'vitest';
import { simulate } from '../../src/engine/simulate.js';
import { TilefluxError } from '../../src/errors.js';
import { constantForcing, flatCalendar, free, params } from './fixtures.js';
import { kirkhamGeometryFactor } from '../../src/drainage/kirkham.js';
import { hooghoudtQ, moodyDepth, vdmwDepth } from '../drainage/reference.js';

const MU = 0.05; // drainable porosity of the fixture: 50 mm of water per m of water table
const sum = (a: Float64Array) => a.reduce((s, x) => s + x, 0);
/** The fixture with no conductivity: no drain flow, so one process can be followed alone. */
const undrained = (over: Parameters<typeof params>[0]) =>
  params({ kAboveMPerDay: 0, kBelowMPerDay: 0, ...over });

describe('recession without recharge: closed forms of Hooghoudt drainage', () => {
  it('linear reservoir (flow below the drains only): h = h0 exp(-8 K2 d t / (mu L^2))', () => {
    // With no conductivity above the drains Hooghoudt's flux is q = 8 K2 d h / L^2 (Hooghoudt
    // 1940), so mu dh/dt = -q is a linear reservoir with the exponential recession of the
    // classic depletion curve. d: van der Molen & Wesseling's equivalent depth (reference.ts).
    const n = 60;
    const p = params({ kAboveMPerDay: 0, kBelowMPerDay: 0.8, initialWaterTableDepthM: 0.2 });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    const d = vdmwDepth(p.spacingM, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    const rate = (8 * p.kBelowMPerDay * d) / (MU * p.spacingM ** 2); // 1/d
    const h0 = p.drainDepthM - p.initialWaterTableDepthM;
    let hPrev = h0;
    for (let i = 0; i < n; i++) {
      const h = h0 * Math.exp(-rate * (i + 1));
      // The step is solved exactly: achieved < 1e-14 m on heads from 1 m to 0.1 m (the head
      // passes through stored water in mm, so rounding is absolute); 1e-12 m allowed.
      expect(Math.abs(p.drainDepthM - r.waterTableDepthM[i] - h)).toBeLessThan(1e-12);
      // Outflow is the drained water: mu x fall of the table (mass balance).
      expect(Math.abs(r.drainflowMm[i] - MU * 1000 * (hPrev - h))).toBeLessThan(1e-9);
      hPrev = h;
    }
    expect(r.equivalentDepthM).toBeCloseTo(d, 12);
  });

  it('both Hooghoudt terms: h(t) = A h0 e^(-At/mu) / (A + B h0 (1 - e^(-At/mu)))', () => {
    // mu dh/dt = -(A h + B h^2), A = 8 K2 d / L^2, B = 4 K1 / L^2, is a Bernoulli equation:
    // 1/h = (1/h0 + B/A) e^(At/mu) - B/A. K1 and K2 differ so that swapping them shows.
    const n = 40;
    const p = params({ kAboveMPerDay: 1.5, kBelowMPerDay: 0.4, initialWaterTableDepthM: 0 });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    const L2 = p.spacingM ** 2;
    const d = vdmwDepth(p.spacingM, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    const A = (8 * p.kBelowMPerDay * d) / L2;
    const B = (4 * p.kAboveMPerDay) / L2;
    const h0 = p.drainDepthM;
    for (let i = 0; i < n; i++) {
      const e = Math.exp((-A * (i + 1)) / MU);
      const h = (A * h0 * e) / (A + B * h0 * (1 - e));
      // Achieved ~1e-14 relative; 1e-11 allowed. A 5 % change of K1 or K2 moves it by > 1e-3.
      expect(Math.abs((p.drainDepthM - r.waterTableDepthM[i]) / h - 1)).toBeLessThan(1e-11);
    }
  });

  it("Moody's equivalent depth is used when asked for", () => {
    const n = 20;
    const p = params({
      kAboveMPerDay: 0,
      equivalentDepthMethod: 'moody',
      initialWaterTableDepthM: 0.2,
    });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    const d = moodyDepth(p.spacingM, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    expect(r.equivalentDepthM).toBeCloseTo(d, 12);
    const h = (p.drainDepthM - 0.2) * Math.exp((-8 * p.kBelowMPerDay * d * n) / (MU * 400));
    expect(Math.abs((p.drainDepthM - r.waterTableDepthM[n - 1]) / h - 1)).toBeLessThan(1e-12);
  });
});

describe('steady recharge: Hooghoudt above the outlet level', () => {
  // Hooghoudt (1940): R = (8 K2 d h + 4 K1 h^2) / L^2 with h the head above the outlet level
  // and d the equivalent depth of the layer between that level and the barrier.
  const steadyHead = (R: number, L: number, K1: number, K2: number, d: number) => {
    const a = (4 * K1) / (L * L);
    const b = (8 * K2 * d) / (L * L);
    return (-b + Math.sqrt(b * b + 4 * a * R)) / (2 * a);
  };

  it('unequal conductivities above and below the drains (K1 = 0.3, K2 = 1.2 m/d)', () => {
    const n = 400;
    const p = params({ kAboveMPerDay: 0.3, kBelowMPerDay: 1.2, spacingM: 25 });
    const r = simulate(constantForcing(n, 4, 0), flatCalendar(n, 0), free(n), p);
    const d = vdmwDepth(25, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    const h = steadyHead(0.004, 25, 0.3, 1.2, d);
    // Settled to rounding after 400 days (achieved ~1e-14 relative); 1e-9 allowed.
    expect(Math.abs((p.drainDepthM - r.waterTableDepthM[n - 1]) / h - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.drainflowMm[n - 1] / 4 - 1)).toBeLessThan(1e-9);
  });

  it('an outlet held at 0.6 m: the head stands above 0.6 m on a 1.9 m layer', () => {
    const n = 400;
    const p = params({ kAboveMPerDay: 0.5, kBelowMPerDay: 0.5 });
    const outlet = new Float64Array(n).fill(0.6);
    const r = simulate(constantForcing(n, 2, 0), flatCalendar(n, 0), outlet, p);
    const d = vdmwDepth(p.spacingM, p.barrierDepthM - 0.6, p.drainRadiusM);
    const h = steadyHead(0.002, p.spacingM, 0.5, 0.5, d);
    expect(Math.abs((0.6 - r.waterTableDepthM[n - 1]) / h - 1)).toBeLessThan(1e-9);
    expect(r.outletDepthM[n - 1]).toBe(0.6);
    // The equivalent depth reported is the free outlet's (drains at 1.2 m).
    expect(r.equivalentDepthM).toBeCloseTo(
      vdmwDepth(p.spacingM, p.barrierDepthM - p.drainDepthM, p.drainRadiusM),
      12,
    );
  });

  it('from a table at the held level, the first day follows the Riccati closed form', () => {
    // Constant recharge R on a table starting at the outlet level (h = 0): mu dh/dt = R - A h -
    // B h^2 with A = 8 K2 d / L^2, B = 4 K1 / L^2 has the closed form
    // h(t) = h1 (1 - E) / (1 - (h1 / h2) E), E = exp(-B (h1 - h2) t / mu), h1 > 0 > h2 the roots
    // of B h^2 + A h - R (the Riccati equation of Hooghoudt's flux). Day 0's drain flow is the
    // recharge less the water stored: R - mu h(1). The drains may not take the table below the
    // held level, and from h = 0 on they must not be held back either.
    const p = params({ kAboveMPerDay: 0.5, kBelowMPerDay: 0.5, initialWaterTableDepthM: 0.6 });
    const r = simulate(
      constantForcing(1, 2, 0),
      flatCalendar(1, 0),
      new Float64Array(1).fill(0.6),
      p,
    );
    const d = vdmwDepth(p.spacingM, p.barrierDepthM - 0.6, p.drainRadiusM);
    const A = (8 * 0.5 * d) / p.spacingM ** 2;
    const B = (4 * 0.5) / p.spacingM ** 2;
    const R = 0.002;
    const root = Math.sqrt(A * A + 4 * B * R);
    const h1 = (-A + root) / (2 * B);
    const h2 = (-A - root) / (2 * B);
    const E = Math.exp((-B * (h1 - h2)) / MU);
    const h = (h1 * (1 - E)) / (1 - (h1 / h2) * E);
    const drainMm = (R - MU * h) * 1000;
    // Achieved ~1e-13 relative (the step is solved exactly); 1e-9 allowed. Holding the first
    // sub-step back would lose about 1.5 % of the day's flow.
    expect(drainMm).toBeGreaterThan(0.2);
    expect(Math.abs(r.drainflowMm[0] / drainMm - 1)).toBeLessThan(1e-9);
    expect(Math.abs((0.6 - r.waterTableDepthM[0]) / h - 1)).toBeLessThan(1e-9);
  });
});

describe('ponded and saturated with a free outlet', () => {
  // Saturated to the surface under a pond, the drains run at the larger of Hooghoudt's rate at
  // the full head (h = drain depth) and Kirkham's (1957) ponded rate
  // q = 4 pi K (t + b - r) / (g L), t the pond depth (10 mm of depression storage plus at most
  // one sub-step of rain), b the drain depth, r the radius.
  const K = 0.5;
  const run = (L: number, rainMm: number) => {
    const p = params({
      spacingM: L,
      kAboveMPerDay: K,
      kBelowMPerDay: K,
      initialWaterTableDepthM: 0,
    });
    return { p, r: simulate(constantForcing(6, rainMm, 0), flatCalendar(6, 0), free(6), p) };
  };

  it("close drains (L = 5 m): Hooghoudt's rate at full head, every day", () => {
    const { p, r } = run(5, 300);
    const d = vdmwDepth(5, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    const q = hooghoudtQ(K, K, d, p.drainDepthM, 5) * 1000;
    for (let i = 0; i < 6; i++) {
      // Achieved ~1e-15 relative; 1e-9 allowed.
      expect(Math.abs(r.drainflowMm[i] / q - 1)).toBeLessThan(1e-9);
      expect(r.waterTableDepthM[i]).toBe(0);
      expect(r.pondedMm[i]).toBe(p.surfaceStorageMm);
      // Saturated and ponded from start to end of the day: what infiltrates is what drains.
      expect(Math.abs(r.infiltrationMm[i] / r.drainflowMm[i] - 1)).toBeLessThan(1e-9);
    }
  });

  it("wider drains (L = 20 m): Kirkham's ponded rate, above Hooghoudt's", () => {
    const { p, r } = run(20, 100);
    const g = kirkhamGeometryFactor({
      drainDepthM: p.drainDepthM,
      layerBelowDrainsM: p.barrierDepthM - p.drainDepthM,
      drainRadiusM: p.drainRadiusM,
      spacingM: 20,
    });
    const q = (t: number) =>
      ((4 * Math.PI * K * (t + p.drainDepthM - p.drainRadiusM)) / (g * 20)) * 1000;
    const lo = q(p.surfaceStorageMm / 1000);
    const hi = q((p.surfaceStorageMm + 100 / r.substepsPerDay) / 1000);
    const d = vdmwDepth(20, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    expect(lo).toBeGreaterThan(hooghoudtQ(K, K, d, p.drainDepthM, 20) * 1000);
    for (let i = 1; i < 6; i++) {
      expect(r.drainflowMm[i]).toBeGreaterThanOrEqual(lo - 1e-9);
      expect(r.drainflowMm[i]).toBeLessThanOrEqual(hi + 1e-9);
    }
    // Runoff carries the rest: rain = drain flow + runoff once the profile is full.
    expect(r.runoffMm[3] + r.drainflowMm[3]).toBeCloseTo(100, 9);
  });
});

describe('outlet level of the day', () => {
  it('free (NaN) and levels at or below the drains mean the drains; above the surface means 0', () => {
    const n = 4;
    const outlet = Float64Array.from([NaN, 0.3, 1.5, -0.2]);
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), outlet, params());
    expect(Array.from(r.outletDepthM)).toEqual([1.2, 0.3, 1.2, 0]);
  });

  it('rain on a water table below the outlet level fills the profile without drain flow', () => {
    // Water table at 1.5 m, below the drains: 10 mm of rain fills 10 / 50 = 0.2 m of pores.
    const n = 1;
    const p = params({ initialWaterTableDepthM: 1.5 });
    for (const outlet of [free(n), new Float64Array(n).fill(0.5)]) {
      const r = simulate(constantForcing(n, 10, 0), flatCalendar(n, 0), outlet, p);
      expect(r.drainflowMm[0]).toBe(0);
      expect(r.waterTableDepthM[0]).toBeCloseTo(1.3, 12);
      expect(r.infiltrationMm[0]).toBeCloseTo(10, 12);
    }
  });
});

describe('crop ET: capillary supply and FAO-56 water stress', () => {
  it('the water table supplies exp(-(depth below the roots) / decay) of the demand', () => {
    // No drainage (K = 0), ET = Kc ET0 = 5 mm/d, roots 0.6 m, decay length 0.3 m, one sub-step
    // on a dry day. A water table within the root zone supplies all of it (it falls by
    // 5 / 50 = 0.1 m a day); below the roots the share exp(-x / 0.3) (the rest from the roots).
    const n = 6;
    const p = undrained({ initialWaterTableDepthM: 0.4 });
    const r = simulate(constantForcing(n, 0, 5), flatCalendar(n, 1), free(n), p);
    let wt = 0.4;
    let depletion = 0;
    for (let i = 0; i < n; i++) {
      const below = wt - p.rootZoneDepthM;
      const share = below <= 0 ? 1 : Math.exp(-below / p.capillaryDecayM);
      wt += (5 * share) / (MU * 1000);
      depletion += 5 * (1 - share);
      expect(r.waterTableDepthM[i]).toBeCloseTo(wt, 12);
      expect(r.rootZoneDepletionMm[i]).toBeCloseTo(depletion, 12);
      expect(r.etMm[i]).toBeCloseTo(5, 12);
      expect(r.cropEtMm[i]).toBe(5);
      expect(r.ks[i]).toBe(1);
      expect(r.soilStorageMm[i]).toBeCloseTo(-(MU * 1000 * wt + depletion), 10);
    }
    expect(r.waterTableDepthM[2]).toBeCloseTo(0.7, 12); // 0.4 + 3 x 0.1: all from the table
  });

  it('root-zone depletion follows FAO-56 Eq. 84: ET at Kc ET0 to RAW, then exponential', () => {
    // Water table at the barrier (no capillary supply), TAW = (0.30 - 0.14) x 600 mm = 96 mm,
    // p = 0.5: RAW = 48 mm. ET 4 mm/d until Dr = RAW on day 12; then
    // dDr/dt = 4 Ks = 4 (TAW - Dr) / ((1 - p) TAW), so TAW - Dr = 48 exp(-(t - 12) / 12).
    const n = 40;
    const p = params({ initialWaterTableDepthM: 2.5, substepsPerDay: 800 });
    const r = simulate(constantForcing(n, 0, 4), flatCalendar(n, 1), free(n), p);
    for (let i = 0; i < 11; i++) {
      expect(r.rootZoneDepletionMm[i]).toBeCloseTo(4 * (i + 1), 9);
      expect(r.ks[i]).toBe(1);
    }
    for (const t of [20, 30, 40]) {
      const dr = 96 - 48 * Math.exp(-(t - 12) / 12);
      // Explicit steps of 1/100 d on dry days: the Euler error (t - 12) / (2 x 12 x 1200) on
      // TAW - Dr, achieved 2.8e-4, 6.3e-4 and 9.7e-4 relative at t = 20, 30, 40; 1.2e-3 allowed.
      expect(Math.abs((96 - r.rootZoneDepletionMm[t - 1]) / (96 - dr) - 1)).toBeLessThan(1.2e-3);
      // Mean Ks of the day ~ Ks at mid-day (TAW - Dr) / ((1 - p) TAW): achieved 4.5e-4 relative.
      const ksMid = Math.exp(-(t - 0.5 - 12) / 12);
      expect(Math.abs(r.ks[t - 1] / ksMid - 1)).toBeLessThan(1e-3);
      // ET of the day = Kc ET0 Ks: achieved 9.5e-4 mm.
      expect(Math.abs(r.etMm[t - 1] - 4 * ksMid)).toBeLessThan(2e-3);
    }
    expect(r.waterTableDepthM[n - 1]).toBe(2.5);
  });

  it("the calendar's root depth sets TAW: 0.3 m roots reach RAW = 24 mm on day 6", () => {
    const n = 10;
    const cal = { ...flatCalendar(n, 1), rootDepthM: new Float64Array(n).fill(0.3) };
    const p = params({ initialWaterTableDepthM: 2.5 });
    const r = simulate(constantForcing(n, 0, 4), cal, free(n), p);
    for (let i = 0; i < 6; i++) expect(r.ks[i]).toBe(1);
    expect(r.rootZoneDepletionMm[5]).toBeCloseTo(24, 9);
    expect(r.ks[6]).toBeLessThan(1);
    // Euler step of one day from RAW: Dr = 24 + 4 x (48 - 24) / 24 = 28.
    expect(r.rootZoneDepletionMm[6]).toBeCloseTo(28, 9);
  });

  it('no available water (field capacity = wilting point): no ET from the roots, Ks = 0', () => {
    const n = 5;
    const p = params({ initialWaterTableDepthM: 2.5, fieldCapacity: 0.2, wiltingPoint: 0.2 });
    const r = simulate(constantForcing(n, 0, 4), flatCalendar(n, 1), free(n), p);
    expect(Array.from(r.ks)).toEqual([0, 0, 0, 0, 0]);
    expect(sum(r.etMm)).toBe(0);
  });

  it('no ET under snow cover, and the snow store closes the balance', () => {
    // 10 days of 5 mm snowfall (SWE to 50 mm), then 5 days of 10 mm melt; ET0 3 mm/d.
    const n = 20;
    const f = constantForcing(n, 0, 3);
    let swe = 0;
    for (let i = 0; i < n; i++) {
      if (i < 10) {
        f.snowfallMm[i] = 5;
        f.precipMm[i] = 5;
        swe += 5;
      } else if (i < 15) {
        f.snowmeltMm[i] = 10;
        swe -= 10;
      }
      f.sweMm[i] = swe;
    }
    const p = params({ initialWaterTableDepthM: 2.5 });
    const r = simulate(f, flatCalendar(n, 1), free(n), p);
    for (let i = 0; i < 14; i++) {
      expect(r.cropEtMm[i]).toBe(0);
      expect(r.etMm[i]).toBe(0);
    }
    expect(r.cropEtMm[14]).toBe(3); // melted out on day 14
    expect(r.etMm[14]).toBeCloseTo(3, 12);
    // 50 mm of melt into a profile 2.5 m deep: 1 m of water table rise, no drain flow.
    expect(r.waterTableDepthM[13]).toBeCloseTo(2.5 - 40 / 50, 12);
    expect(sum(r.drainflowMm)).toBe(0);
  });
});

describe('surface water and seepage', () => {
  it('infiltration is limited by the saturated conductivity; the excess ponds, then runs off', () => {
    // K = 0.01 m/d admits 10 mm/d (the long-time infiltration rate of a ponded soil tends to
    // its saturated conductivity, Green & Ampt 1911). 50 mm/d of rain on a dry profile (water
    // table at the barrier, 125 mm of pores): 10 mm ponds (the depression storage), the rest
    // runs off: 30 mm on day 1, 40 mm a day after; the table rises 10 / 50 = 0.2 m a day.
    const n = 5;
    const p = params({ kAboveMPerDay: 0.01, kBelowMPerDay: 0.01, initialWaterTableDepthM: 2.5 });
    const r = simulate(constantForcing(n, 50, 0), flatCalendar(n, 0), free(n), p);
    for (let i = 0; i < n; i++) {
      expect(r.infiltrationMm[i]).toBeCloseTo(10, 9);
      expect(r.runoffMm[i]).toBeCloseTo(i === 0 ? 30 : 40, 9);
      expect(r.pondedMm[i]).toBeCloseTo(10, 9);
      expect(r.waterTableDepthM[i]).toBeCloseTo(2.5 - 0.2 * (i + 1), 9);
      expect(r.drainflowMm[i]).toBe(0);
    }
  });

  it('a constant deep seepage lowers the table by rate / porosity per day', () => {
    const n = 10;
    const p = undrained({ seepageMmPerDay: 1, initialWaterTableDepthM: 1.5 });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    for (let i = 0; i < n; i++) {
      expect(r.seepageMm[i]).toBeCloseTo(1, 12);
      expect(r.waterTableDepthM[i]).toBeCloseTo(1.5 + (i + 1) / 50, 12);
    }
    expect(sum(r.lateralSeepageMm)).toBe(0);
  });

  it('vertical leakage to a deeper regional head lowers the table exponentially toward it', () => {
    // Leakage only (no drains, no other seepage): Darcy flow through the semi-pervious layer,
    // q = c (head difference) with leakance c = K'/b' (Hantush & Jacob 1955, from memory). With
    // c = 0.002 /d, the regional head held at Dr = 4 m below the surface and mu = 0.05, the
    // table depth follows mu dw/dt = c (Dr - w): w = Dr - (Dr - w0) exp(-c t / mu).
    const n = 10;
    const seepage = {
      leakancePerDay: 0.002,
      regionalHeadDepthM: 4,
      lateralKMPerDay: 0,
      edgeDistanceM: Infinity,
      edgeLevelDepthM: 0,
    };
    const p = undrained({ initialWaterTableDepthM: 0.8, seepage, substepsPerDay: 800 });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    const w = 4 - 3.2 * Math.exp((-0.002 * n) / MU);
    // Explicit steps of 1/100 d on dry days: the Euler error t (c/mu)^2 dt / 2 = 8e-5 relative
    // on Dr - w, achieved 8.0e-5; 1e-4 allowed (10 % on c moves Dr - w by 4 %).
    expect(Math.abs((4 - r.waterTableDepthM[n - 1]) / (4 - w) - 1)).toBeLessThan(1e-4);
    expect(sum(r.lateralSeepageMm)).toBe(0);
  });

  it('a forcing whose snow store does not add up is refused as an engine defect', () => {
    // The yearly balance check guards the engine: a snow store that gains 50 mm without any
    // snowfall leaves a residual of 50 mm, far above the tolerance.
    const n = 3;
    const f = constantForcing(n, 0, 0);
    f.sweMm[1] = 50;
    f.sweMm[2] = 50;
    expect(() => simulate(f, flatCalendar(n, 0), free(n), undrained({}))).toThrow(
      /water balance not closed in 2001: residual -50/,
    );
  });

  it('seepage proportional to the head above the barrier decays exponentially', () => {
    // c = 2 mm/d per m of head H above the barrier: 50 dH/dt = -2 H, H = H0 exp(-0.04 t).
    const n = 50;
    const p = undrained({
      seepageConductanceMmPerDayPerM: 2,
      initialWaterTableDepthM: 1.5,
      substepsPerDay: 800,
    });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    const H = 2.5 - r.waterTableDepthM[n - 1];
    // Explicit steps of 1/100 d on dry days: the Euler error n c'^2 dt / 2 = 50 x 0.04^2 x 0.01
    // / 2 = 4.0e-4 relative, achieved 4.0e-4; 5e-4 allowed (5 % on c moves H by 10 %).
    expect(Math.abs(H / Math.exp(-0.04 * n) - 1)).toBeLessThan(5e-4);
    expect(sum(r.seepageMm)).toBeCloseTo(50 * (1 - H), 9);
  });

  it('the top metre is saturated in proportion to the water table above 1 m', () => {
    const n = 60;
    const p = params({ kAboveMPerDay: 0, kBelowMPerDay: 0.1, initialWaterTableDepthM: 0 });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    let seen = 0;
    for (let i = 0; i < n; i++) {
      const wt = r.waterTableDepthM[i];
      expect(r.saturatedFraction[i]).toBeCloseTo(Math.min(1, Math.max(0, 1 - wt)), 12);
      if (wt > 0.2 && wt < 0.9) seen++;
    }
    expect(seen).toBeGreaterThan(5);
    expect(r.waterTableDepthM[n - 1]).toBeGreaterThan(1);
    expect(r.saturatedFraction[n - 1]).toBe(0);
    // Saturated to the surface under heavy rain: the whole top metre.
    const wetP = params({ initialWaterTableDepthM: 0 });
    const wet = simulate(constantForcing(3, 200, 0), flatCalendar(3, 0), free(3), wetP);
    expect(wet.waterTableDepthM[2]).toBe(0);
    expect(wet.saturatedFraction[2]).toBe(1);
  });

  it('the initial water table is held between the surface and the barrier', () => {
    const p = (d: number) => undrained({ initialWaterTableDepthM: d });
    const run = (d: number) =>
      simulate(constantForcing(1, 0, 0), flatCalendar(1, 0), free(1), p(d));
    expect(run(-0.5).waterTableDepthM[0]).toBe(0);
    expect(run(4).waterTableDepthM[0]).toBe(2.5);
  });
});

describe('sub-steps and the refusal of layouts a daily engine cannot follow', () => {
  it('takes more sub-steps than asked when the drains react fast', () => {
    // Linearised rate at full head: (A + 2 B h) / mu, at most 0.5 of the head per step.
    const p = params({ kAboveMPerDay: 3, kBelowMPerDay: 3, spacingM: 8 });
    const r = simulate(constantForcing(2, 0, 0), flatCalendar(2, 0), free(2), p);
    const d = vdmwDepth(8, 1.3, 0.05);
    const rate = ((8 * 3 * d) / 64 + (2 * 4 * 3 * 1.2) / 64) / MU;
    expect(r.substepsPerDay).toBe(Math.max(8, Math.ceil(rate / 0.5)));
    expect(r.substepsPerDay).toBeGreaterThan(8);
    expect(
      simulate(constantForcing(2, 0, 0), flatCalendar(2, 0), free(2), params()).substepsPerDay,
    ).toBe(8);
  });

  it('refuses with the numbers when over 20000 sub-steps a day would be needed', () => {
    const fast = params({
      kAboveMPerDay: 500,
      kBelowMPerDay: 400,
      spacingM: 4,
      porosity: { depthsM: [2.5], values: [0.01] },
    });
    const run = () => simulate(constantForcing(2, 0, 0), flatCalendar(2, 0), free(2), fast);
    expect(run).toThrow(TilefluxError);
    expect(run).toThrow(
      /^the drains react too fast for a daily water balance: \d+ sub-steps a day would be needed \(at most 20000\), from conductivity 500 m\/d above and 400 m\/d below the drains, spacing 4 m and drainable porosity 0\.01; widen the spacing or check the conductivity and porosity$/,
    );
    const none = params({ porosity: { depthsM: [2.5], values: [0] } });
    expect(() => simulate(constantForcing(2, 0, 0), flatCalendar(2, 0), free(2), none)).toThrow(
      /: unboundedly many sub-steps a day/,
    );
  });
});

describe('edge cases the mutation run found unchecked', () => {
  it('ponded water evaporates first, at the crop rate, before the water table gives any', () => {
    // No conductivity: 30 mm of rain on day 0 cannot enter, 10 mm stays (depression storage).
    // Then Kc ET0 = 4 mm/d comes from the pond alone: 10 -> 6 -> 2, the table untouched.
    const n = 3;
    const f = constantForcing(n, 0, 4);
    f.rainMm[0] = f.precipMm[0] = 30;
    f.refEtMm[0] = 0;
    const r = simulate(f, flatCalendar(n, 1), free(n), undrained({ initialWaterTableDepthM: 1.5 }));
    expect(Array.from(r.pondedMm)).toEqual([10, 6, 2]);
    expect(r.runoffMm[0]).toBe(20);
    expect(r.etMm[1]).toBe(4);
    expect(r.waterTableDepthM[1]).toBeCloseTo(1.5, 12);
    expect(r.rootZoneDepletionMm[1]).toBe(0);
  });

  it('the root zone never gives more than it holds above the wilting point (Dr <= TAW)', () => {
    // TAW = (0.20 - 0.15) x 600 mm = 30 mm, p = 0.8 (RAW 24 mm), 7 mm/d, one step a dry day:
    // Dr 7, 14, 21, 28; then Ks = (30 - 28) / (0.2 x 30) = 1/3 asks 2.33 mm of the 2 left.
    const n = 8;
    const cal = { ...flatCalendar(n, 1), depletionFraction: new Float64Array(n).fill(0.8) };
    const p = params({ initialWaterTableDepthM: 2.5, fieldCapacity: 0.2, wiltingPoint: 0.15 });
    const r = simulate(constantForcing(n, 0, 7), cal, free(n), p);
    expect(Array.from(r.rootZoneDepletionMm.slice(0, 4))).toEqual([7, 14, 21, 28]);
    expect(r.rootZoneDepletionMm[4]).toBeCloseTo(30, 12);
    expect(r.etMm[4]).toBeCloseTo(2, 12);
    for (let i = 5; i < n; i++) expect(r.etMm[i]).toBe(0);
  });

  it('melt on the first day is part of the snow store the balance starts from', () => {
    // 20 mm of snow melting 10 mm a day from day 0: the engine must not see 10 mm from nowhere
    // (it throws on an open balance); the melt fills 10 / 50 = 0.2 m of pores a day.
    const n = 2;
    const f = constantForcing(n, 0, 0);
    f.snowmeltMm.fill(10);
    f.sweMm.set([10, 0]);
    // Water table at the barrier, below the drains: no drain flow.
    const r = simulate(f, flatCalendar(n, 0), free(n), params({ initialWaterTableDepthM: 2.5 }));
    expect(r.waterTableDepthM[0]).toBeCloseTo(2.3, 12);
    expect(r.waterTableDepthM[1]).toBeCloseTo(2.1, 12);
  });

  it('the linear recession is exact at any step length (ten steps a dry day)', () => {
    const n = 10;
    const p = params({
      kAboveMPerDay: 0,
      kBelowMPerDay: 0.8,
      initialWaterTableDepthM: 0.2,
      substepsPerDay: 80,
    });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    const d = vdmwDepth(p.spacingM, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    const h = Math.exp((-8 * 0.8 * d * n) / (MU * p.spacingM ** 2));
    expect(Math.abs(p.drainDepthM - r.waterTableDepthM[n - 1] - h)).toBeLessThan(1e-12);
  });

  it('exactly 20000 sub-steps a day is accepted', () => {
    // K1 = 10000 m/d, no K2, L = 8 m, drains at 1 m, porosity 0.125: the linearised rate
    // 2 x 4 K1 h / L^2 / mu = 10000 per day, so ceil(10000 / 0.5) = 20000 steps (all exact in
    // binary floating point).
    const p = params({
      drainDepthM: 1,
      spacingM: 8,
      kAboveMPerDay: 10000,
      kBelowMPerDay: 0,
      porosity: { depthsM: [2.5], values: [0.125] },
      initialWaterTableDepthM: 2.5,
    });
    const r = simulate(constantForcing(1, 0, 0), flatCalendar(1, 0), free(1), p);
    expect(r.substepsPerDay).toBe(20000);
    expect(r.equivalentDepthM).toBe(0); // no conductivity below the drains: no depth to report
  });

  it('a pond on a table below the surface drains at the head of the table, not at full head', () => {
    // K = 0.01 m/d admits 10 mm/d, so 50 mm/d of rain ponds while the table (0.6 m deep, 0.6 m
    // above the drains) is still below the surface. The drains then run at Hooghoudt's rate for
    // the head of the table (0.6 m rising to about 0.8 m over the day), not at the full head of
    // a saturated profile (1.2 m), which is about twice as much.
    const K = 0.01;
    const p = params({ kAboveMPerDay: K, kBelowMPerDay: K, initialWaterTableDepthM: 0.6 });
    const r = simulate(constantForcing(1, 50, 0), flatCalendar(1, 0), free(1), p);
    const d = vdmwDepth(p.spacingM, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    const q = (h: number) => hooghoudtQ(K, K, d, h, p.spacingM) * 1000; // mm/d
    const hEnd = p.drainDepthM - r.waterTableDepthM[0];
    expect(r.pondedMm[0]).toBeGreaterThan(0);
    expect(r.infiltrationMm[0]).toBeCloseTo(10, 12);
    expect(hEnd).toBeGreaterThan(0.79);
    expect(hEnd).toBeLessThan(0.8);
    // The head rises through the day, so the day's flow lies between the rates at its ends.
    expect(r.drainflowMm[0]).toBeGreaterThan(q(0.6));
    expect(r.drainflowMm[0]).toBeLessThan(q(hEnd));
    expect(q(p.drainDepthM)).toBeGreaterThan(1.5 * q(hEnd));
  });

  it('a day with a pond and no rain still takes the wet-day sub-steps', () => {
    // K = 0.016 m/d admits 2 mm per eighth of a day. Day 0: 50 mm of rain leaves the 10 mm of
    // depression storage ponded. Day 1: no rain, Kc ET0 = 4 mm/d, each sub-step infiltrates
    // first, then evaporates from the pond: 10 -> 8 -> 7.5 -> 5.5 -> 5 -> 3 -> 2.5 -> 0.5 -> 0,
    // so 8 mm enter the soil and 2 mm evaporate. Taken as one dry-day step, all 10 mm would
    // enter before any evaporation.
    const f = constantForcing(2, 0, 4);
    f.rainMm[0] = f.precipMm[0] = 50;
    f.refEtMm[0] = 0;
    const p = params({ kAboveMPerDay: 0.016, kBelowMPerDay: 0.016, initialWaterTableDepthM: 2.5 });
    const r = simulate(f, flatCalendar(2, 1), free(2), p);
    expect(r.substepsPerDay).toBe(8);
    expect(r.pondedMm[0]).toBeCloseTo(10, 12);
    expect(r.infiltrationMm[0]).toBeCloseTo(16, 12);
    expect(r.infiltrationMm[1]).toBeCloseTo(8, 12);
    expect(r.pondedMm[1]).toBe(0);
  });

  it('deep seepage stops when the saturated zone above the barrier is empty', () => {
    // 100 mm/d of constant seepage against 0.2 m x 0.05 = 10 mm of water above the barrier
    // (table at 2.3 m, barrier at 2.5 m): 10 mm leave on day 0, the table reaches the barrier
    // and nothing more leaves.
    const n = 2;
    const p = undrained({ seepageMmPerDay: 100, initialWaterTableDepthM: 2.3 });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    expect(r.seepageMm[0]).toBeCloseTo(10, 12);
    expect(r.waterTableDepthM[0]).toBe(2.5);
    expect(r.seepageMm[1]).toBe(0);
  });

  it('no lateral seepage, and no NaN, while the table lies below the field edge level', () => {
    // A lateral path to an edge at 1 m depth and no other seepage: with the table at 2 m the
    // edge is higher than the table (H = 0.5 m < He = 1.5 m above the barrier), so no water
    // leaves sideways and every seepage rate of the step is 0.
    const n = 3;
    const seepage = {
      leakancePerDay: 0,
      regionalHeadDepthM: 0,
      lateralKMPerDay: 1,
      edgeDistanceM: 100,
      edgeLevelDepthM: 1,
    };
    const p = undrained({ initialWaterTableDepthM: 2, seepage });
    const r = simulate(constantForcing(n, 0, 0), flatCalendar(n, 0), free(n), p);
    expect(Array.from(r.lateralSeepageMm)).toEqual([0, 0, 0]);
    expect(Array.from(r.seepageMm)).toEqual([0, 0, 0]);
  });

  it('drains faster than the soil admits: ponded infiltration stays at K, the head at Hooghoudt', () => {
    // Close drains in a soil that conducts 2 m/d below the drains but only 0.05 m/d above them
    // could carry some 500 mm/d at full head, ten times what the topsoil admits. Under a
    // permanent pond the infiltration rate is the saturated conductivity, 50 mm/d (long-time
    // limit of Green & Ampt 1911, unit gradient), so the table falls below the surface and
    // settles where Hooghoudt's steady flux equals that recharge: R = 0.05 m/d in
    // R = (8 K2 d h + 4 K1 h^2) / L^2 (Hooghoudt 1940), solved for h here.
    const n = 30;
    const K1 = 0.05;
    const K2 = 2;
    const L = 5;
    const p = params({
      kAboveMPerDay: K1,
      kBelowMPerDay: K2,
      spacingM: L,
      initialWaterTableDepthM: 0,
    });
    const r = simulate(constantForcing(n, 200, 0), flatCalendar(n, 0), free(n), p);
    const d = vdmwDepth(L, p.barrierDepthM - p.drainDepthM, p.drainRadiusM);
    const a = (4 * K1) / (L * L);
    const b = (8 * K2 * d) / (L * L);
    const h = (-b + Math.sqrt(b * b + 4 * a * K1)) / (2 * a);
    for (let i = 0; i < n; i++) {
      // Every sub-step takes its full share K dt (sums of equal parts: ~1e-13 mm); 1e-9 allowed.
      expect(Math.abs(r.infiltrationMm[i] - 50)).toBeLessThan(1e-9);
      expect(r.pondedMm[i]).toBe(p.surfaceStorageMm);
    }
    // Settled within 30 days (time constant mu / (dq/dh) well under a day): achieved ~1e-13.
    expect(Math.abs((p.drainDepthM - r.waterTableDepthM[n - 1]) / h - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.drainflowMm[n - 1] - 50)).toBeLessThan(1e-9);
  });
});
