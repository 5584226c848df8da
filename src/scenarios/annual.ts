/**
 * Annual tables and the crop-condition measures (README "Measures"; windows and thresholds are
 * set in the field file's `wetness` section):
 * - wet_days: growing-season days with the midpoint water table shallower than `threshold`;
 * - aeration_stress_days: growing-season days on which the air-filled porosity of the top
 *   `aerationLayer` is below `aerationThreshold` (about 10 % by volume is the usual agronomic
 *   limit for root respiration: Grable & Siemer 1968, Soil Sci. Soc. Am. Proc. 32: 180-186;
 *   Wesseling 1974, in Drainage for Agriculture, ASA Agronomy 17 (both from memory));
 * - aeration_deficit_days: our intensity of that stress: each such day adds its shortfall as a
 *   share of the threshold, (threshold - air) / threshold, so a day with no air in the layer
 *   counts 1 and a day just under the threshold almost 0; the unit is days of a layer with no air;
 * - spring_fieldwork_days / fall_fieldwork_days: days in the window on which the surface layer
 *   holds at most `trafficabilityLimit` x field capacity, with no standing water or snow
 *   (workability a little drier than field capacity: e.g. Earl 1997, Soil & Tillage Research 40:
 *   155-168 (from memory)); spring_window_days / fall_window_days are the window lengths;
 * - stress_days: growing-season days with the FAO-56 water-stress coefficient Ks below 1.
 */
import { dayIndexOf, isLeapYear, monthDayKey } from '../climate/calendar.js';
import { porosityTable } from '../engine/porosityProfile.js';
import type { EngineForcing, EngineResult } from '../engine/types.js';
import { annualNitrate } from '../nitrate/annual.js';
import type { NitrateResult } from '../nitrate/types.js';
import type { Field } from './fieldSchema.js';
import {
  airFilledPorosity,
  layerDepletionCapacityMm,
  surfaceWaterContent,
  topLayerDepletionMm,
  type SoilAirParams,
} from './soilAir.js';
import type { AnnualRow } from './types.js';

export type WetnessSettings = Field['wetness'];

/** Whether "MM-DD" `key` lies in the inclusive window (windows may wrap the new year). */
export function inWindow(key: string, w: { from: string; to: string }): boolean {
  return w.from <= w.to ? key >= w.from && key <= w.to : key >= w.from || key <= w.to;
}

/** A window as month-day keys (`monthDayKey`), for daily loops. */
interface WindowKeys {
  from: number;
  to: number;
}

function windowKeys(w: { from: string; to: string }): WindowKeys {
  return { from: monthDayKey(w.from), to: monthDayKey(w.to) };
}

/** Whether month-day key `md` lies in the inclusive window (same rule as `inWindow`). */
function inWindowKeys(md: number, w: WindowKeys): boolean {
  return w.from <= w.to ? md >= w.from && md <= w.to : md >= w.from || md <= w.to;
}

/**
 * Aggregate a scenario's daily results by calendar year over days [start, end). The calendar
 * fields come from `forcing.days` (computed from the dates when absent).
 * @example annualRows('conventional', forcing, engine, nitrate, wetness, spec.params, 365, 730)
 */
export function annualRows(
  scenario: string,
  forcing: EngineForcing,
  r: EngineResult,
  no3: NitrateResult,
  w: WetnessSettings,
  soil: SoilAirParams,
  start: number,
  end: number,
): AnnualRow[] {
  const rows: AnnualRow[] = [];
  const days = forcing.days ?? dayIndexOf(r.dates);
  const growing = windowKeys(w.growingSeason);
  const springWindow = windowKeys(w.springWindow);
  const fallWindow = windowKeys(w.fallWindow);
  const table = porosityTable(soil.porosity, soil.barrierDepthM);
  const part = (a: Float64Array) => a.subarray(start, end);
  const depletion = part(r.rootZoneDepletionMm);
  const infiltration = part(r.infiltrationMm);
  const aerationDepletion = topLayerDepletionMm(
    depletion,
    infiltration,
    layerDepletionCapacityMm(soil, w.aerationLayer),
  );
  const surfaceDepletion = topLayerDepletionMm(
    depletion,
    infiltration,
    layerDepletionCapacityMm(soil, w.surfaceLayer),
  );
  const workableAtOrBelow = w.trafficabilityLimit * soil.fieldCapacity;
  const { precipMm, snowmeltMm, refEtMm, sweMm } = forcing;
  const { etMm, runoffMm, drainflowMm, seepageMm, balanceErrorMm } = r;
  const { soilStorageMm, pondedMm, waterTableDepthM, ks } = r;
  // The nitrate columns come from the nitrate module's own yearly sums.
  const nitrate = annualNitrate(days.year, r.drainflowMm, no3, start, end);
  // One year at a time, its sums in local variables (a daily loop over the fields of a row
  // object costs several times more), made into a row at the year's end.
  for (let first = start; first < end;) {
    const year = days.year[first];
    let last = first;
    while (last < end && days.year[last] === year) last++;
    // Storage at the start of the year: soil + ponded water + snow at the end of the day before.
    const storagePrev =
      first > 0
        ? soilStorageMm[first - 1] + pondedMm[first - 1] + sweMm[first - 1]
        : soilStorageMm[0] +
          pondedMm[0] +
          sweMm[0] -
          precipMm[0] +
          etMm[0] +
          runoffMm[0] +
          drainflowMm[0] +
          seepageMm[0] +
          balanceErrorMm[0];
    let wtSum = 0;
    let wtMin = Infinity;
    let precip = 0;
    let snowmelt = 0;
    let refEt = 0;
    let et = 0;
    let runoff = 0;
    let drainflow = 0;
    let seepage = 0;
    let balance = 0;
    let wet = 0;
    let aerationStress = 0;
    let aerationDeficit = 0;
    let stress = 0;
    let springDays = 0;
    let springWork = 0;
    let fallDays = 0;
    let fallWork = 0;
    for (let i = first; i < last; i++) {
      const md = days.monthDay[i];
      const wtd = waterTableDepthM[i];
      precip += precipMm[i];
      snowmelt += snowmeltMm[i];
      refEt += refEtMm[i];
      et += etMm[i];
      runoff += runoffMm[i];
      drainflow += drainflowMm[i];
      seepage += seepageMm[i];
      balance += balanceErrorMm[i];
      wtSum += wtd;
      if (wtd < wtMin) wtMin = wtd;
      const j = i - start;
      if (inWindowKeys(md, growing)) {
        if (wtd < w.threshold) wet++;
        const air = airFilledPorosity(table, w.aerationLayer, wtd, aerationDepletion[j]);
        if (air < w.aerationThreshold) {
          aerationStress++;
          aerationDeficit += (w.aerationThreshold - air) / w.aerationThreshold;
        }
        if (ks[i] < 1 - 1e-9) stress++;
      }
      const spring = inWindowKeys(md, springWindow);
      const fall = inWindowKeys(md, fallWindow);
      if (spring || fall) {
        const theta = surfaceWaterContent(
          table,
          w.surfaceLayer,
          soil.fieldCapacity,
          wtd,
          surfaceDepletion[j],
        );
        const workable = theta <= workableAtOrBelow + 1e-12 && pondedMm[i] <= 0 && sweMm[i] <= 0;
        if (spring) {
          springDays++;
          if (workable) springWork++;
        }
        if (fall) {
          fallDays++;
          if (workable) fallWork++;
        }
      }
    }
    const n = nitrate[rows.length];
    const storage = soilStorageMm[last - 1] + pondedMm[last - 1] + sweMm[last - 1];
    rows.push({
      scenario,
      year,
      days: last - first,
      drainflow_mm: drainflow,
      runoff_mm: runoff,
      seepage_mm: seepage,
      et_mm: et,
      no3n_load_kg_ha: n.no3n_load_kg_ha,
      fwmc_mg_l: n.fwmc_mg_l,
      runoff_n_kg_ha: n.runoff_n_kg_ha,
      seepage_n_kg_ha: n.seepage_n_kg_ha,
      aeration_stress_days: aerationStress,
      aeration_deficit_days: aerationDeficit,
      stress_days: stress,
      wet_days: wet,
      spring_fieldwork_days: springWork,
      spring_window_days: springDays,
      fall_fieldwork_days: fallWork,
      fall_window_days: fallDays,
      wt_mean_depth_m: wtSum / (last - first),
      wt_shallowest_depth_m: wtMin,
      precip_mm: precip,
      snowmelt_mm: snowmelt,
      ref_et_mm: refEt,
      storage_change_mm: storage - storagePrev,
      balance_error_mm: balance,
      n_balance_error_kg_ha: n.n_balance_error_kg_ha,
    });
    first = last;
  }
  return rows;
}

/** Whether an annual row of `days` days covers less than its calendar year. */
export function isPartialYear(year: number, days: number): boolean {
  return days < (isLeapYear(year) ? 366 : 365);
}

/**
 * An annual row as annual.csv writes it: `partial_year` ("yes" or "no") after `days`, so the
 * sums of a year the reported period covers only in part are not read as annual rates.
 * @example withPartialYear(row).partial_year // "yes" for 1991 with 300 days
 */
export function withPartialYear({ scenario, year, days, ...rest }: AnnualRow) {
  return { scenario, year, days, partial_year: isPartialYear(year, days) ? 'yes' : 'no', ...rest };
}
