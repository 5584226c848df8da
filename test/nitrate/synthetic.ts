/**
 * Synthetic daily inputs for the nitrate tests, built here so the tests do not depend on the
 * engine: a seeded rain series routed through a linear reservoir (drain flow proportional to the
 * water stored above the drains, the lumped form of a drained field's recession), a sinusoidal
 * annual temperature cycle and a corn-soybean calendar.
 */
import type { CropCalendar } from '../../src/engine/types.js';
import { DEFAULT_POOL_PARAMS } from '../../src/nitrate/defaults.js';
import type { NitrateInput, PoolParams } from '../../src/nitrate/types.js';

/** Small seeded PRNG (mulberry32) so every run sees the same numbers. */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviate (Box-Muller) from a uniform generator. */
export function normal(u: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u());
}

/** ISO dates from `first` for `n` days (UTC arithmetic). */
export function dates(first: string, n: number): string[] {
  const t0 = Date.parse(`${first}T00:00:00Z`);
  const out: string[] = [];
  for (let i = 0; i < n; i++) out.push(new Date(t0 + i * 86400000).toISOString().slice(0, 10));
  return out;
}

/** Corn in even years (05-01 to 10-15), soybean in odd years (05-15 to 10-05). */
export function cornSoybeanCalendar(ds: readonly string[]): CropCalendar {
  const n = ds.length;
  const crop = new Uint8Array(n);
  const seasonFraction = new Float64Array(n).fill(-1);
  const day = (iso: string) => Date.parse(`${iso}T00:00:00Z`) / 86400000;
  for (let i = 0; i < n; i++) {
    const y = Number(ds[i].slice(0, 4));
    const corn = y % 2 === 0;
    const plant = day(`${y}-${corn ? '05-01' : '05-15'}`);
    const harvest = day(`${y}-${corn ? '10-15' : '10-05'}`);
    const d = day(ds[i]);
    if (d >= plant && d <= harvest) {
      crop[i] = corn ? 1 : 2;
      seasonFraction[i] = (d - plant) / (harvest - plant);
    }
  }
  return {
    kc: new Float64Array(n),
    depletionFraction: new Float64Array(n),
    crop,
    seasonFraction,
    crops: ['corn', 'soybean'],
  };
}

/**
 * Plausible daily series for `years` years from 2000-01-01: rain on about 30 % of days
 * (exponential depths, mean 10 mm), runoff of 30 % of rain above 25 mm, a linear reservoir of
 * drainable water (drain flow 5 % of the store per day, seepage 0.2 % per day, runoff of storage
 * above 150 mm), saturated fraction
 * = store / 150 mm, and T = 10 - 12 cos(2 pi (doy - 15) / 365) degC.
 */
export function syntheticInput(years = 4, seed = 1): NitrateInput {
  const ds = dates('2000-01-01', Math.round(years * 365.25));
  const n = ds.length;
  const u = rng(seed);
  const drainflowMm = new Float64Array(n);
  const runoffMm = new Float64Array(n);
  const seepageMm = new Float64Array(n);
  const tmeanC = new Float64Array(n);
  const saturatedFraction = new Float64Array(n);
  const waterTableDepthM = new Float64Array(n);
  let store = 30;
  for (let i = 0; i < n; i++) {
    const doy = i % 365;
    tmeanC[i] = 10 - 12 * Math.cos((2 * Math.PI * (doy - 15)) / 365);
    const et = Math.max(0, 1 + 2 * Math.sin((2 * Math.PI * (doy - 105)) / 365) * 1.5);
    const rain = u() < 0.3 ? -10 * Math.log(1 - u()) : 0;
    // Heavy rain partly runs off; what the store cannot hold runs off too.
    runoffMm[i] = rain > 25 ? 0.3 * (rain - 25) : 0;
    store = Math.max(0, store + rain - runoffMm[i] - et);
    if (store > 150) {
      runoffMm[i] += store - 150;
      store = 150;
    }
    drainflowMm[i] = 0.05 * store;
    seepageMm[i] = 0.002 * store;
    store -= drainflowMm[i] + seepageMm[i];
    saturatedFraction[i] = store / 150;
    waterTableDepthM[i] = 1.2 * (1 - saturatedFraction[i]);
  }
  return {
    dates: ds,
    drainflowMm,
    runoffMm,
    seepageMm,
    tmeanC,
    saturatedFraction,
    waterTableDepthM,
    calendar: cornSoybeanCalendar(ds),
  };
}

/** Input of `n` days from 2001-01-01 with constant values (for closed-form checks). */
export function constantInput(
  n: number,
  v: Partial<{ drain: number; runoff: number; seepage: number; t: number; sat: number }> = {},
): NitrateInput {
  const ds = dates('2001-01-01', n);
  const fill = (x: number) => new Float64Array(n).fill(x);
  return {
    dates: ds,
    drainflowMm: fill(v.drain ?? 0),
    runoffMm: fill(v.runoff ?? 0),
    seepageMm: fill(v.seepage ?? 0),
    tmeanC: fill(v.t ?? 20),
    saturatedFraction: fill(v.sat ?? 0),
    waterTableDepthM: fill(1.2 * (1 - (v.sat ?? 0))),
    calendar: {
      kc: fill(0),
      depletionFraction: fill(0),
      crop: new Uint8Array(n),
      seasonFraction: fill(-1),
      crops: [],
    },
  };
}

/** Pool parameters with every process switched off, to switch on one at a time. */
export const QUIET: PoolParams = {
  ...DEFAULT_POOL_PARAMS,
  initialPoolKgHa: 0,
  fertilizer: [],
  mineralizationKgHaPerYear: 0,
  uptakeKgHa: { corn: 0, soybean: 0 },
  denitrificationMaxPerDay: 0,
};
