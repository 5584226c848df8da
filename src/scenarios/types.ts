/**
 * Shapes shared by the run, comparison, report and nitrate stages. Tables are arrays of plain
 * records whose numeric keys end with their unit.
 */

/**
 * One row of annual.csv: one scenario, one calendar year. Columns are grouped by the question
 * they answer: water leaving the field, nitrate-N leaving it, the crop's conditions, then the
 * year's weather and the balance terms (README "Measures" defines the crop measures).
 */
export interface AnnualRow {
  scenario: string;
  year: number;
  days: number;
  /** Water leaving the field, mm. */
  drainflow_mm: number;
  runoff_mm: number;
  seepage_mm: number;
  et_mm: number;
  /** Nitrate-N leaving with drain flow, kg N/ha, and its flow-weighted mean concentration. */
  no3n_load_kg_ha: number;
  fwmc_mg_l: number;
  runoff_n_kg_ha: number;
  seepage_n_kg_ha: number;
  /** Growing-season days with too little air in the upper root zone (below the threshold). */
  aeration_stress_days: number;
  /** Sum over those days of (threshold - air-filled porosity) / threshold: days of a layer with no air. */
  aeration_deficit_days: number;
  /** Growing-season days with water stress (FAO-56 Ks < 1). */
  stress_days: number;
  /** Growing-season days with the water table shallower than the wet threshold. */
  wet_days: number;
  /** Days suitable for fieldwork in the spring / fall window, and the window's length that year. */
  spring_fieldwork_days: number;
  spring_window_days: number;
  fall_fieldwork_days: number;
  fall_window_days: number;
  /** Mean and shallowest midpoint water-table depth, m below the surface. */
  wt_mean_depth_m: number;
  wt_shallowest_depth_m: number;
  /** The year's weather and the balance terms. */
  precip_mm: number;
  snowmelt_mm: number;
  ref_et_mm: number;
  storage_change_mm: number;
  balance_error_mm: number;
  /** Nitrogen balance residual of the pool model (0 for concentration models), kg N/ha. */
  n_balance_error_kg_ha: number;
}

/** Numeric keys of an annual row (everything but the scenario name). */
export type AnnualMeasure = Exclude<keyof AnnualRow, 'scenario'>;

/** Column order of annual.csv: the keys of an AnnualRow in the order `annualRows` makes them. */
export const ANNUAL_COLUMNS: ReadonlyArray<keyof AnnualRow> = [
  'scenario',
  'year',
  'days',
  'drainflow_mm',
  'runoff_mm',
  'seepage_mm',
  'et_mm',
  'no3n_load_kg_ha',
  'fwmc_mg_l',
  'runoff_n_kg_ha',
  'seepage_n_kg_ha',
  'aeration_stress_days',
  'aeration_deficit_days',
  'stress_days',
  'wet_days',
  'spring_fieldwork_days',
  'spring_window_days',
  'fall_fieldwork_days',
  'fall_window_days',
  'wt_mean_depth_m',
  'wt_shallowest_depth_m',
  'precip_mm',
  'snowmelt_mm',
  'ref_et_mm',
  'storage_change_mm',
  'balance_error_mm',
  'n_balance_error_kg_ha',
];
