/**
 * Loads of the concentration models (`fixed`, `seasonal`, `rating`), which describe the drain
 * water only. Deep seepage leaves the same profile water as the drains, so it carries the same
 * concentration (assumption). Surface runoff meets only a thin surface layer of the soil, so it
 * carries a fixed fraction of the drain-water concentration, the runoff extraction ratio
 * (assumption; the "effective depth of interaction" idea of runoff-chemistry models, e.g.
 * Ahuja, Sharpley, Yamamoto & Menzel 1981, Water Resources Research 17: 969-974 (from memory)).
 */
import type { NitrateInput, NitrateResult } from './types.js';

/**
 * Drain, seepage and runoff loads (kg N/ha) of each day from the day's concentration.
 *
 * @param input           flows of the run (mm)
 * @param concMgL         drain-water concentration of each day, mg N/L
 * @param runoffRatio     runoff concentration / drain-water concentration (0..1)
 * @param outOfRangeDays  passed through (rating days outside the fitted range)
 * @example loadsFromConcentration(input, new Float64Array(input.dates.length).fill(12), 0.1, 0).loadKgHa
 */
export function loadsFromConcentration(
  input: NitrateInput,
  concMgL: Float64Array,
  runoffRatio: number,
  outOfRangeDays: number,
): NitrateResult {
  const n = concMgL.length;
  const loadKgHa = new Float64Array(n);
  const runoffLoadKgHa = new Float64Array(n);
  const seepageLoadKgHa = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const c = concMgL[i];
    loadKgHa[i] = (input.drainflowMm[i] * c) / 100;
    seepageLoadKgHa[i] = (input.seepageMm[i] * c) / 100;
    runoffLoadKgHa[i] = (input.runoffMm[i] * runoffRatio * c) / 100;
  }
  return { concMgL, loadKgHa, runoffLoadKgHa, seepageLoadKgHa, outOfRangeDays };
}
