/**
 * Shapes shared by the run, comparison, report and nitrate stages. Tables are arrays of plain
 * records whose numeric keys end with their unit (DESIGN.md section 5).
 */

/** One row of annual.csv: one scenario, one calendar year. */
export interface AnnualRow {
  scenario: string;
  year: number;
  days: number;
  precip_mm: number;
  snowmelt_mm: number;
  ref_et_mm: number;
  et_mm: number;
  runoff_mm: number;
  drainflow_mm: number;
  seepage_mm: number;
  storage_change_mm: number;
  balance_error_mm: number;
  /** Mean and shallowest midpoint water-table depth, m below the surface. */
  wt_mean_depth_m: number;
  wt_shallowest_depth_m: number;
  /** Growing-season days with the water table shallower than the wet threshold. */
  wet_days: number;
  /** Sum over days of (threshold - depth) in cm when shallower than the threshold. */
  excess_wetness_cm_days: number;
  /** Days in the planting / harvest window on which the field can be worked. */
  planting_ready_days: number;
  harvest_ready_days: number;
  /** Growing-season days with water stress (FAO-56 Ks < 1). */
  stress_days: number;
  /** Nitrate-N leaving with drain flow, kg N/ha, and its flow-weighted mean concentration. */
  no3_load_kg_ha: number;
  fwmc_mg_l: number;
  runoff_n_kg_ha: number;
  seepage_n_kg_ha: number;
  /** Nitrogen balance residual of the pool model (0 for concentration models), kg N/ha. */
  n_balance_error_kg_ha: number;
}

/** Numeric keys of an annual row (everything but the scenario name). */
export type AnnualMeasure = Exclude<keyof AnnualRow, 'scenario'>;
