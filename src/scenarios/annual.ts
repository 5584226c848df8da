/**
 * Annual tables and the wetness measures (our own definitions, with configurable windows and
 * thresholds):
 * - wet_days: growing-season days with the midpoint water table shallower than the threshold;
 * - excess_wetness_cm_days: growing-season sum of (threshold - depth) in cm over those days;
 * - planting_ready_days / harvest_ready_days: days in the window with the water table at least
 *   `readyDepth` deep, no ponded water and less rain than `readyRain` that day;
 * - stress_days: growing-season days with the FAO-56 water-stress coefficient Ks below 1.
 */
import { dayIndexOf, monthDayKey } from '../climate/calendar.js';
import type { EngineForcing, EngineResult } from '../engine/types.js';
import { flowWeightedMeanMgL } from '../nitrate/annual.js';
import type { NitrateResult } from '../nitrate/types.js';
import type { Field } from './fieldSchema.js';
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
 * @example annualRows('conventional', forcing, engine, nitrate, wetness, 365, 730)
 */
export function annualRows(
  scenario: string,
  forcing: EngineForcing,
  r: EngineResult,
  no3: NitrateResult,
  w: WetnessSettings,
  start: number,
  end: number,
): AnnualRow[] {
  const rows: AnnualRow[] = [];
  let row: AnnualRow | undefined;
  let storagePrev = 0;
  let wtSum = 0;
  const days = forcing.days ?? dayIndexOf(r.dates);
  const growing = windowKeys(w.growingSeason);
  const planting = windowKeys(w.plantingWindow);
  const harvest = windowKeys(w.harvestWindow);
  const close = () => {
    if (!row) return;
    row.wt_mean_depth_m = wtSum / row.days;
    row.fwmc_mg_l = flowWeightedMeanMgL(row.no3_load_kg_ha, row.drainflow_mm);
    rows.push(row);
  };
  for (let i = start; i < end; i++) {
    const year = days.year[i];
    if (!row || row.year !== year) {
      close();
      // Storage at the start of the year: soil + ponded water + snow at the end of the day before.
      storagePrev =
        i > 0
          ? r.soilStorageMm[i - 1] + r.pondedMm[i - 1] + forcing.sweMm[i - 1]
          : r.soilStorageMm[0] +
            r.pondedMm[0] +
            forcing.sweMm[0] -
            forcing.precipMm[0] +
            r.etMm[0] +
            r.runoffMm[0] +
            r.drainflowMm[0] +
            r.seepageMm[0] +
            r.balanceErrorMm[0];
      wtSum = 0;
      row = {
        scenario,
        year,
        days: 0,
        precip_mm: 0,
        snowmelt_mm: 0,
        ref_et_mm: 0,
        et_mm: 0,
        runoff_mm: 0,
        drainflow_mm: 0,
        seepage_mm: 0,
        storage_change_mm: 0,
        balance_error_mm: 0,
        wt_mean_depth_m: 0,
        wt_shallowest_depth_m: Infinity,
        wet_days: 0,
        excess_wetness_cm_days: 0,
        planting_ready_days: 0,
        harvest_ready_days: 0,
        stress_days: 0,
        no3_load_kg_ha: 0,
        fwmc_mg_l: 0,
        runoff_n_kg_ha: 0,
        seepage_n_kg_ha: 0,
        n_balance_error_kg_ha: 0,
      };
    }
    const md = days.monthDay[i];
    const wtd = r.waterTableDepthM[i];
    row.days++;
    row.precip_mm += forcing.precipMm[i];
    row.snowmelt_mm += forcing.snowmeltMm[i];
    row.ref_et_mm += forcing.refEtMm[i];
    row.et_mm += r.etMm[i];
    row.runoff_mm += r.runoffMm[i];
    row.drainflow_mm += r.drainflowMm[i];
    row.seepage_mm += r.seepageMm[i];
    row.balance_error_mm += r.balanceErrorMm[i];
    const storage = r.soilStorageMm[i] + r.pondedMm[i] + forcing.sweMm[i];
    row.storage_change_mm = storage - storagePrev;
    wtSum += wtd;
    if (wtd < row.wt_shallowest_depth_m) row.wt_shallowest_depth_m = wtd;
    if (inWindowKeys(md, growing)) {
      if (wtd < w.threshold) {
        row.wet_days++;
        row.excess_wetness_cm_days += (w.threshold - wtd) * 100;
      }
      if (r.ks[i] < 1 - 1e-9) row.stress_days++;
    }
    const ready = wtd >= w.readyDepth && r.pondedMm[i] <= 0 && forcing.precipMm[i] < w.readyRain;
    if (ready && inWindowKeys(md, planting)) row.planting_ready_days++;
    if (ready && inWindowKeys(md, harvest)) row.harvest_ready_days++;
    row.no3_load_kg_ha += no3.loadKgHa[i];
    row.runoff_n_kg_ha += no3.runoffLoadKgHa[i];
    row.seepage_n_kg_ha += no3.seepageLoadKgHa[i];
    if (no3.pool) row.n_balance_error_kg_ha += no3.pool.balanceErrorKgHa[i];
  }
  close();
  return rows;
}
