/**
 * Entry point of the nitrate stage: turn a run's daily flows into nitrate-N concentrations and
 * loads with the configured model (README, Nitrate models): `fixed`, `seasonal`, `rating` or `pool`.
 * Load (kg N/ha) = flow (mm) x concentration (mg/L) / 100 every day.
 */
import { loadsFromConcentration } from './concentrationLoads.js';
import { DEFAULT_RUNOFF_EXTRACTION_RATIO } from './defaults.js';
import { simulatePool, type PoolForcing } from './pool.js';
import { ratingConcentration } from './rating.js';
import { seasonalConcentration } from './seasonal.js';
import type { NitrateConfig, NitrateInput, NitrateResult } from './types.js';

/**
 * Weather and calendar series already found finite. They are shared read-only by every run over
 * a prepared field (a sweep runs thousands), so each is checked once; the flows of every run are
 * checked each time.
 */
const checkedShared = new WeakSet<ArrayLike<number>>();

/** Every daily series must have one finite value per date (the engine's contract). */
function checkInput(input: NitrateInput): void {
  const n = input.dates.length;
  const series: Array<[string, ArrayLike<number>, boolean]> = [
    ['drainflowMm', input.drainflowMm, false],
    ['runoffMm', input.runoffMm, false],
    ['seepageMm', input.seepageMm, false],
    ['tmeanC', input.tmeanC, true],
    ['saturatedFraction', input.saturatedFraction, false],
    ['waterTableDepthM', input.waterTableDepthM, false],
    ['calendar.crop', input.calendar.crop, true],
    ['calendar.seasonFraction', input.calendar.seasonFraction, true],
  ];
  for (const [name, s, shared] of series) {
    if (s.length !== n)
      throw new RangeError(`nitrate input ${name} has ${s.length} days, dates ${n}`);
    if (shared && checkedShared.has(s)) continue;
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(s[i])) {
        throw new RangeError(`nitrate input ${name} is not finite on ${input.dates[i]}: ${s[i]}`);
      }
    }
    if (shared) checkedShared.add(s);
  }
}

/**
 * Daily nitrate-N concentrations and loads of one run. `poolForcing` (pool model only) are the
 * weather- and calendar-only terms from `poolForcingOf`, when the caller keeps them across runs;
 * `reuse` (pool model only) an earlier result over as many days whose columns this run
 * overwrites.
 *
 * @example
 * const r = simulateNitrate(input, { model: 'fixed', concentrationMgL: 12 });
 * r.loadKgHa[i] === (input.drainflowMm[i] * 12) / 100
 */
export function simulateNitrate(
  input: NitrateInput,
  config: NitrateConfig,
  poolForcing?: PoolForcing,
  reuse?: NitrateResult,
): NitrateResult {
  checkInput(input);
  const n = input.dates.length;
  switch (config.model) {
    case 'pool':
      return simulatePool(input, config, poolForcing, reuse);
    case 'fixed':
      return loadsFromConcentration(
        input,
        new Float64Array(n).fill(config.concentrationMgL),
        config.runoffExtractionRatio ?? DEFAULT_RUNOFF_EXTRACTION_RATIO,
        0,
      );
    case 'seasonal':
      return loadsFromConcentration(
        input,
        seasonalConcentration(input.dates, config.monthlyMgL),
        config.runoffExtractionRatio ?? DEFAULT_RUNOFF_EXTRACTION_RATIO,
        0,
      );
    case 'rating': {
      const r = ratingConcentration(input.drainflowMm, config.a, config.b, config.fitFlowRangeMm);
      return loadsFromConcentration(
        input,
        r.concMgL,
        config.runoffExtractionRatio ?? DEFAULT_RUNOFF_EXTRACTION_RATIO,
        r.outOfRangeDays,
      );
    }
  }
}
