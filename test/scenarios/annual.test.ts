// The crop-condition measures of the annual table against hand-computed cases: a water table
// and a root-zone depletion held at known values on known days give a known air-filled porosity,
// surface-layer water content and count. Every expected figure is worked out by hand in the
// comments from the definitions in README "Measures"; nothing is taken from the code's output.
import { describe, expect, it } from 'vitest';
import { annualRows } from '../../src/scenarios/annual.js';
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

/** One year of days with every engine series held constant; `set` changes some days. */
function heldYear(
  set: (
    key: string,
    d: { wtd: number; depl: number; inf: number; pond: number; swe: number },
  ) => void,
) {
  const ds = dates('2001-01-01', 365);
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
  const [row] = annualRows('held', forcing, r, no3, w, soil, 0, 365);

  it('counts aeration-stress days and the aeration deficit', () => {
    expect(row.aeration_stress_days).toBe(20); // 1-20 May
    expect(row.aeration_deficit_days).toBeCloseTo(10 * (1 - 8 / 30) + 10 * 0.3, 10); // 10.333
  });

  it('counts wet days by the water-table depth alone', () => {
    expect(row.wet_days).toBe(10); // 1-10 May
  });

  it('counts fieldwork days against the window lengths', () => {
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
