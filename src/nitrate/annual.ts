/**
 * Nitrate-N by calendar year, with the annual.csv keys of AnnualRow: drain load, flow-weighted
 * mean concentration, runoff and seepage N, and the N balance residual of the pool model.
 *
 * The flow-weighted mean concentration of a year is the concentration that would carry the
 * year's load in the year's drain flow: fwmc = 100 x load / flow (from load = flow x C / 100,
 * README, Nitrate models). A year without drain flow has no drain water to weigh, and gets 0, the
 * convention of the annual table (src/scenarios/annual.ts).
 */
import { dayIndexOf } from '../climate/calendar.js';
import type { NitrateResult } from './types.js';

/** Nitrate columns of one year of annual.csv (kg N/ha, mg N/L), with the year's drain flow (mm). */
export interface AnnualNitrate {
  year: number;
  drainflow_mm: number;
  no3n_load_kg_ha: number;
  fwmc_mg_l: number;
  runoff_n_kg_ha: number;
  seepage_n_kg_ha: number;
  n_balance_error_kg_ha: number;
}

/**
 * Flow-weighted mean concentration (mg N/L) of a load (kg N/ha) carried by a flow (mm); 0 when
 * there is no flow.
 *
 * @example flowWeightedMeanMgL(30, 250) // 12
 */
export function flowWeightedMeanMgL(loadKgHa: number, flowMm: number): number {
  return flowMm > 0 ? (100 * loadKgHa) / flowMm : 0;
}

/**
 * Sum a run's daily nitrate results by calendar year over days [start, end). The annual table of
 * a scenario (`scenarios/annual.ts`) takes its nitrate columns from here.
 *
 * @param days        ISO dates of the run, or the calendar year of each day (integers, faster)
 * @param drainflowMm daily drain flow, mm (the flow the loads came from)
 * @param r           the nitrate results of the run
 * @example annualNitrate(dates, engine.drainflowMm, simulateNitrate(input, config))[0].fwmc_mg_l
 */
export function annualNitrate(
  days: readonly string[] | ArrayLike<number>,
  drainflowMm: Float64Array,
  r: NitrateResult,
  start = 0,
  end = days.length,
): AnnualNitrate[] {
  const rows: AnnualNitrate[] = [];
  let row: AnnualNitrate | undefined;
  const years =
    days.length > 0 && typeof days[0] === 'string'
      ? dayIndexOf(days as readonly string[]).year
      : (days as ArrayLike<number>);
  for (let i = start; i < end; i++) {
    const year = years[i];
    if (!row || row.year !== year) {
      row = {
        year,
        drainflow_mm: 0,
        no3n_load_kg_ha: 0,
        fwmc_mg_l: 0,
        runoff_n_kg_ha: 0,
        seepage_n_kg_ha: 0,
        n_balance_error_kg_ha: 0,
      };
      rows.push(row);
    }
    row.drainflow_mm += drainflowMm[i];
    row.no3n_load_kg_ha += r.loadKgHa[i];
    row.runoff_n_kg_ha += r.runoffLoadKgHa[i];
    row.seepage_n_kg_ha += r.seepageLoadKgHa[i];
    if (r.pool) row.n_balance_error_kg_ha += r.pool.balanceErrorKgHa[i];
  }
  for (const y of rows) y.fwmc_mg_l = flowWeightedMeanMgL(y.no3n_load_kg_ha, y.drainflow_mm);
  return rows;
}
