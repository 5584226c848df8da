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
  let row: AnnualRow | undefined;
  let storagePrev = 0;
  let wtSum = 0;
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
  const close = () => {
    if (!row) return;
    row.wt_mean_depth_m = wtSum / row.days;
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
        drainflow_mm: 0,
        runoff_mm: 0,
        seepage_mm: 0,
        et_mm: 0,
        no3n_load_kg_ha: 0,
        fwmc_mg_l: 0,
        runoff_n_kg_ha: 0,
        seepage_n_kg_ha: 0,
        aeration_stress_days: 0,
        aeration_deficit_days: 0,
        stress_days: 0,
        wet_days: 0,
        spring_fieldwork_days: 0,
        spring_window_days: 0,
        fall_fieldwork_days: 0,
        fall_window_days: 0,
        wt_mean_depth_m: 0,
        wt_shallowest_depth_m: Infinity,
        precip_mm: 0,
        snowmelt_mm: 0,
        ref_et_mm: 0,
        storage_change_mm: 0,
        balance_error_mm: 0,
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
    const j = i - start;
    if (inWindowKeys(md, growing)) {
      if (wtd < w.threshold) row.wet_days++;
      const air = airFilledPorosity(table, w.aerationLayer, wtd, aerationDepletion[j]);
      if (air < w.aerationThreshold) {
        row.aeration_stress_days++;
        row.aeration_deficit_days += (w.aerationThreshold - air) / w.aerationThreshold;
      }
      if (r.ks[i] < 1 - 1e-9) row.stress_days++;
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
      const workable =
        theta <= workableAtOrBelow + 1e-12 && r.pondedMm[i] <= 0 && forcing.sweMm[i] <= 0;
      if (spring) {
        row.spring_window_days++;
        if (workable) row.spring_fieldwork_days++;
      }
      if (fall) {
        row.fall_window_days++;
        if (workable) row.fall_fieldwork_days++;
      }
    }
  }
  close();
  const nitrate = annualNitrate(days.year, r.drainflowMm, no3, start, end);
  rows.forEach((y, k) => {
    const n = nitrate[k];
    y.no3n_load_kg_ha = n.no3n_load_kg_ha;
    y.fwmc_mg_l = n.fwmc_mg_l;
    y.runoff_n_kg_ha = n.runoff_n_kg_ha;
    y.seepage_n_kg_ha = n.seepage_n_kg_ha;
    y.n_balance_error_kg_ha = n.n_balance_error_kg_ha;
  });
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
