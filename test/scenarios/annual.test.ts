// The crop-condition measures of the annual table against hand-computed cases: a water table
// and a root-zone depletion held at known values on known days give a known air-filled porosity,
// surface-layer water content and count. Every expected figure is worked out by hand in the
// comments from the definitions in README "Measures"; nothing is taken from the code's output.
import { describe, expect, it } from 'vitest';
import {
  annualRows,
  inWindow,
  isPartialYear,
  withPartialYear,
} from '../../src/scenarios/annual.js';
import { wetnessSchema } from '../../src/scenarios/fieldSchema.js';
import {
  airFilledPorosity,
  layerDepletionCapacityMm,
  surfaceWaterContent,
  topLayerDepletionMm,
} from '../../src/scenarios/soilAir.js';
import { porosityTable } from '../../src/engine/porosityProfile.js';
import type { EngineForcing, EngineResult } from '../../src/engine/types.js';
import type { NitrateResult } from '../../src/nitrate/types.js';
import { dates } from '../nitrate/synthetic.js';

// Soil: drainable porosity 0.08 in the top 0.2 m, 0.05 below, restrictive layer at 2 m; field
// capacity 0.30, wilting point 0.10, root zone 0.6 m.
const soil = {
  porosity: { depthsM: [0.2, 2], values: [0.08, 0.05] },
  barrierDepthM: 2,
  fieldCapacity: 0.3,
  wiltingPoint: 0.1,
  rootZoneDepthM: 0.6,
};
const table = porosityTable(soil.porosity, soil.barrierDepthM);

describe('air and water in the top layers', () => {
  it('air-filled porosity of the top 0.3 m from the water-table depth and the depletion', () => {
    // Water table at 1.0 m: drained pores 0.08 x 0.2 m + 0.05 x 0.1 m = 21 mm over 300 mm.
    expect(airFilledPorosity(table, 0.3, 1.0, 0)).toBeCloseTo(0.07, 12);
    // Water table at 0.1 m: 0.08 x 0.1 m = 8 mm over 300 mm.
    expect(airFilledPorosity(table, 0.3, 0.1, 0)).toBeCloseTo(8 / 300, 12);
    // Saturated to the surface: no air.
    expect(airFilledPorosity(table, 0.3, 0, 0)).toBe(0);
    // 30 mm taken by the crop from the layer adds 30 mm of air: (21 + 30) / 300 = 0.17.
    expect(airFilledPorosity(table, 0.3, 1.0, 30)).toBeCloseTo(0.17, 12);
  });

  it('surface-layer water content: field capacity, saturation below the water table, depletion', () => {
    // Drained top 0.1 m at field capacity.
    expect(surfaceWaterContent(table, 0.1, 0.3, 1.0, 0)).toBeCloseTo(0.3, 12);
    // Water table at 0.05 m: the lower half is saturated, 0.3 + 0.08 / 2 = 0.34.
    expect(surfaceWaterContent(table, 0.1, 0.3, 0.05, 0)).toBeCloseTo(0.34, 12);
    // 20 mm taken from the 0.1 m layer: 0.3 - 20 / 100 = 0.10.
    expect(surfaceWaterContent(table, 0.1, 0.3, 1.0, 20)).toBeCloseTo(0.1, 12);
  });

  it('the top layer dries first and is rewetted first', () => {
    // Capacity of the top 0.1 m: (0.30 - 0.10) x 100 mm = 20 mm; of the top 0.3 m: 60 mm; a
    // layer deeper than the root zone only counts the root zone: 0.6 m x 0.2 = 120 mm.
    expect(layerDepletionCapacityMm(soil, 0.1)).toBeCloseTo(20, 12);
    expect(layerDepletionCapacityMm(soil, 0.3)).toBeCloseTo(60, 12);
    expect(layerDepletionCapacityMm(soil, 1.0)).toBeCloseTo(120, 12);
    // Root zone: 5 mm depleted, then 12 mm of drying (17), 10 mm of rain that refills it (7,
    // net -10), 2 mm of drying (9). Top layer (capacity 8): 5; 5 + 12 capped at 8; the rain
    // rewets it fully (8 - 10 < 0 -> 0); 2 mm of drying -> 2.
    const layer = topLayerDepletionMm(
      Float64Array.of(5, 17, 7, 9),
      Float64Array.of(0, 0, 10, 0),
      8,
    );
    expect(Array.from(layer)).toEqual([5, 8, 0, 2]);
  });
});

/** Days (one year by default) with every engine series held constant; `set` changes some. */
function heldYear(
  set: (
    key: string,
    d: { wtd: number; depl: number; inf: number; pond: number; swe: number },
  ) => void,
  ds = dates('2001-01-01', 365),
) {
  const n = ds.length;
  const col = () => new Float64Array(n);
  const r = {
    dates: ds,
    etMm: col(),
    cropEtMm: col(),
    runoffMm: col(),
    infiltrationMm: col(),
    drainflowMm: col(),
    seepageMm: col(),
    lateralSeepageMm: col(),
    waterTableDepthM: col(),
    outletDepthM: col(),
    pondedMm: col(),
    rootZoneDepletionMm: col(),
    ks: col().fill(1),
    soilStorageMm: col(),
    saturatedFraction: col(),
    balanceErrorMm: col(),
    capacityLimited: new Uint8Array(ds.length),
    substepsPerDay: 8,
    equivalentDepthM: 1,
  } satisfies EngineResult;
  const forcing: EngineForcing = {
    dates: ds,
    precipMm: col(),
    rainMm: col(),
    snowfallMm: col(),
    snowmeltMm: col(),
    sweMm: col(),
    refEtMm: col(),
    tmeanC: col(),
  };
  for (let i = 0; i < n; i++) {
    const d = { wtd: 1.0, depl: 30, inf: 0, pond: 0, swe: 0 };
    set(ds[i].slice(5), d);
    r.waterTableDepthM[i] = d.wtd;
    r.rootZoneDepletionMm[i] = d.depl;
    r.infiltrationMm[i] = d.inf;
    r.pondedMm[i] = d.pond;
    forcing.sweMm[i] = d.swe;
  }
  const no3: NitrateResult = {
    concMgL: col(),
    loadKgHa: col(),
    runoffLoadKgHa: col(),
    seepageLoadKgHa: col(),
    outOfRangeDays: 0,
  };
  return { forcing, r, no3 };
}

describe('annual crop-condition counts with the water table held at known depths', () => {
  // Defaults: growing season 1 May - 30 Sep, wet below 0.3 m, aeration layer 0.3 m with a 10 %
  // threshold, spring window 15 Apr - 31 May (47 days), fall 20 Sep - 15 Nov (57 days), surface
  // layer 0.1 m, workable at or below 0.9 x 0.30 = 0.27.
  const w = wetnessSchema.parse(undefined);
  // The rest of the year: water table at 1.0 m and 30 mm depleted, so the top 0.3 m holds
  // (21 + 30) / 300 = 17 % air and the top 0.1 m has 20 mm (its capacity) taken: 0.10 <= 0.27.
  const { forcing, r, no3 } = heldYear((key, d) => {
    if (key >= '05-01' && key <= '05-10') {
      // 1-10 May: water table at 0.1 m, profile refilled (30 mm of rain on 1 May). Air in the
      // top 0.3 m: 8 / 300 = 2.67 %, shortfall (10 - 2.67) / 10 = 0.7333 a day; wet (0.1 < 0.3);
      // surface layer at field capacity 0.30 > 0.27: no fieldwork.
      d.wtd = 0.1;
      d.depl = 0;
      if (key === '05-01') d.inf = 30;
    } else if (key >= '05-11' && key <= '05-20') {
      // 11-20 May: water table at 1.0 m, still at field capacity: 21 / 300 = 7 % air, shortfall
      // 0.3 a day; not wet; surface layer 0.30: no fieldwork. From 21 May the crop has taken
      // 30 mm again (dried from the top): workable, 17 % air.
      d.depl = 0;
    } else if (key === '04-16')
      d.swe = 10; // snow on the ground: no fieldwork
    else if (key === '04-20')
      d.pond = 5; // standing water: no fieldwork
    else if (key >= '10-10' && key <= '10-14') {
      // 10-14 Oct: water table at 0.05 m after 30 mm of rain: 0.3 + 0.04 = 0.34: no fieldwork.
      d.wtd = 0.05;
      d.depl = 0;
      if (key === '10-10') d.inf = 30;
    }
  });
  // The table is made inside each test (see below) so mutation testing sees which tests use it.
  const heldRow = () => annualRows('held', forcing, r, no3, w, soil, 0, 365)[0];

  it('counts aeration-stress days and the aeration deficit', () => {
    const row = heldRow();
    expect(row.aeration_stress_days).toBe(20); // 1-20 May
    expect(row.aeration_deficit_days).toBeCloseTo(10 * (1 - 8 / 30) + 10 * 0.3, 10); // 10.333
  });

  it('counts wet days by the water-table depth alone', () => {
    const row = heldRow();
    expect(row.wet_days).toBe(10); // 1-10 May
  });

  it('counts fieldwork days against the window lengths', () => {
    const row = heldRow();
    // Spring: 47 days, less 1-20 May (20), 16 Apr (snow) and 20 Apr (standing water): 25.
    expect(row.spring_window_days).toBe(47);
    expect(row.spring_fieldwork_days).toBe(25);
    // Fall: 57 days, less 10-14 Oct (5): 52.
    expect(row.fall_window_days).toBe(57);
    expect(row.fall_fieldwork_days).toBe(52);
  });

  it('moves the counts with the thresholds as the definitions say', () => {
    // With a 5 % aeration threshold the 7 %-air days (11-20 May) no longer count.
    const low = annualRows(
      'held',
      forcing,
      r,
      no3,
      { ...w, aerationThreshold: 0.05 },
      soil,
      0,
      365,
    )[0];
    expect(low.aeration_stress_days).toBe(10);
    expect(low.aeration_deficit_days).toBeCloseTo((10 * (0.05 - 8 / 300)) / 0.05, 10);
    // A limit of 1.0 x field capacity makes a drained layer at field capacity workable: 11-20 May
    // (10 days) join the spring count; 1-10 May (0.30 with the table at the layer's base) too.
    const loose = annualRows(
      'held',
      forcing,
      r,
      no3,
      { ...w, trafficabilityLimit: 1 },
      soil,
      0,
      365,
    )[0];
    expect(loose.spring_fieldwork_days).toBe(45);
    expect(loose.fall_fieldwork_days).toBe(52); // 0.34 is wetter than field capacity
  });
});

describe('annual sums, storage change and water table by calendar year', () => {
  // 2000 (leap, 366 days) and 2001 (365 days) with invented constant daily fluxes: each year's
  // sum is days x the daily value, by hand. Storage follows the water balance from -200 mm,
  // storage(i) = -200 + sum over days 0..i of (P - ET - runoff - drain - seepage - residual), so
  // a year's storage change must equal the sum of that year's daily terms (water balance).
  const w = wetnessSchema.parse(undefined);
  const ds = [...dates('2000-01-01', 366), ...dates('2001-01-01', 365)];
  const at = (iso: string) => ds.indexOf(iso);
  const { forcing, r, no3 } = heldYear(() => {}, ds);
  const P = 2;
  const net = P - 1.5 - 0.1 - 0.3 - 0.05 - 1e-8; // mm/d into storage
  for (let i = 0; i < ds.length; i++) {
    forcing.precipMm[i] = P;
    forcing.refEtMm[i] = 3;
    forcing.snowmeltMm[i] = ds[i].slice(5, 7) === '01' ? 1 : 0;
    r.etMm[i] = 1.5;
    r.runoffMm[i] = 0.1;
    r.drainflowMm[i] = 0.3;
    r.seepageMm[i] = 0.05;
    r.balanceErrorMm[i] = 1e-8;
    r.soilStorageMm[i] = -200 + net * (i + 1);
    no3.loadKgHa[i] = 0.01;
    no3.runoffLoadKgHa[i] = 0.001;
    no3.seepageLoadKgHa[i] = 0.002;
  }
  // Part of the storage sits in a pond and in snow on some days: the total is what counts.
  for (const [iso, pond, swe] of [
    ['2000-12-31', 3, 0],
    ['2001-02-10', 0, 7],
    ['2001-12-31', 2, 5],
  ] as const) {
    const i = at(iso);
    r.pondedMm[i] = pond;
    forcing.sweMm[i] = swe;
    r.soilStorageMm[i] -= pond + swe;
  }
  r.waterTableDepthM[at('2001-12-20')] = 0.2;
  r.ks[at('2001-01-15')] = 0.5; // outside the growing season (1 May - 30 Sep)
  for (let d = 1; d <= 10; d++) r.ks[at(`2001-06-${String(d).padStart(2, '0')}`)] = 0.5;
  r.ks[at('2001-07-01')] = 1 - 1e-10; // rounding short of 1 is no stress
  const pool = { balanceErrorKgHa: new Float64Array(ds.length).fill(1e-10) };
  // Tabulated inside each test: a table made in the describe body runs before any test, and
  // mutation testing could then tell no test from another.
  const tabulated = () =>
    annualRows('s', forcing, r, { ...no3, pool } as NitrateResult, w, soil, 0, ds.length);

  it('sums each flux over the days of its calendar year', () => {
    const rows = tabulated();
    expect(rows.map((x) => [x.year, x.days])).toEqual([
      [2000, 366],
      [2001, 365],
    ]);
    for (const [x, n] of [
      [rows[0], 366],
      [rows[1], 365],
    ] as const) {
      expect(x.scenario).toBe('s');
      expect(x.precip_mm).toBeCloseTo(2 * n, 9);
      expect(x.ref_et_mm).toBeCloseTo(3 * n, 9);
      expect(x.snowmelt_mm).toBeCloseTo(31, 9);
      expect(x.et_mm).toBeCloseTo(1.5 * n, 9);
      expect(x.runoff_mm).toBeCloseTo(0.1 * n, 9);
      expect(x.drainflow_mm).toBeCloseTo(0.3 * n, 9);
      expect(x.seepage_mm).toBeCloseTo(0.05 * n, 9);
      expect(x.balance_error_mm).toBeCloseTo(1e-8 * n, 15);
      expect(x.no3n_load_kg_ha).toBeCloseTo(0.01 * n, 12);
      expect(x.runoff_n_kg_ha).toBeCloseTo(0.001 * n, 12);
      expect(x.seepage_n_kg_ha).toBeCloseTo(0.002 * n, 12);
      expect(x.n_balance_error_kg_ha).toBeCloseTo(1e-10 * n, 18);
      // Flow-weighted mean: 100 x load / flow = 100 x 0.01 / 0.3 (load = flow x C / 100).
      expect(x.fwmc_mg_l).toBeCloseTo(100 / 30, 12);
      // The storage change is the year's net inflow (water balance), pond and snow included.
      expect(x.storage_change_mm).toBeCloseTo(net * n, 9);
    }
  });

  it('mean and shallowest water table of each year; stress days only in the season', () => {
    const rows = tabulated();
    expect(rows[0].wt_mean_depth_m).toBeCloseTo(1, 12);
    expect(rows[0].wt_shallowest_depth_m).toBe(1);
    expect(rows[1].wt_mean_depth_m).toBeCloseTo((364 + 0.2) / 365, 12);
    expect(rows[1].wt_shallowest_depth_m).toBe(0.2);
    expect(rows[0].stress_days).toBe(0);
    expect(rows[1].stress_days).toBe(10);
  });

  it('a reported period that starts and ends inside years: storage from the day before', () => {
    const [a, b] = annualRows('s', forcing, r, no3, w, soil, 100, 500);
    expect([a.year, a.days, b.year, b.days]).toEqual([2000, 266, 2001, 134]);
    expect(a.storage_change_mm).toBeCloseTo(net * 266, 9);
    expect(b.storage_change_mm).toBeCloseTo(net * 134, 9);
    expect(a.precip_mm).toBeCloseTo(2 * 266, 9);
    expect(a.n_balance_error_kg_ha).toBe(0); // concentration models: no pool balance
  });

  it('a growing season that wraps the new year counts its days on both sides', () => {
    const winter = { ...w, growingSeason: { from: '12-01', to: '01-31' }, threshold: 0.3 };
    const wet = heldYear((key, d) => {
      if (key === '12-20' || key === '01-10' || key === '03-01') d.wtd = 0.2;
    });
    const [row] = annualRows('w', wet.forcing, wet.r, wet.no3, winter, soil, 0, 365);
    expect(row.wet_days).toBe(2); // 10 Jan and 20 Dec, not 1 Mar
  });

  it('window test and part years (Gregorian leap years)', () => {
    const rows = tabulated();
    const summer = { from: '05-01', to: '09-30' };
    const winter = { from: '11-01', to: '02-28' };
    expect(['04-30', '05-01', '09-30', '10-01'].map((k) => inWindow(k, summer))).toEqual([
      false,
      true,
      true,
      false,
    ]);
    expect(
      ['10-31', '11-01', '12-31', '01-01', '02-28', '03-01'].map((k) => inWindow(k, winter)),
    ).toEqual([false, true, true, true, true, false]);
    expect(isPartialYear(2000, 366)).toBe(false);
    expect(isPartialYear(2000, 365)).toBe(true);
    expect(isPartialYear(2001, 365)).toBe(false);
    expect(isPartialYear(1900, 365)).toBe(false);
    expect(isPartialYear(2001, 364)).toBe(true);
    const marked = withPartialYear(rows[0]);
    expect(Object.keys(marked).slice(0, 5)).toEqual([
      'scenario',
      'year',
      'days',
      'partial_year',
      'drainflow_mm',
    ]);
    expect(marked.partial_year).toBe('no');
    expect(withPartialYear({ ...rows[1], days: 300 }).partial_year).toBe('yes');
  });
});
