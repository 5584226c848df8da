/**
 * The comparison of a run's scenarios: comparison.csv's rows and columns, with the changes under
 * the low and high seepage settings (the seepage band) when the run computed them.
 */
import { SEEPAGE_BAND, SEEPAGE_SETTINGS, type SeepageBand } from '../engine/seepage.js';
import {
  BAND_COLUMNS,
  COMPARISON_COLUMNS,
  compareScenarios,
  withSeepageBand,
  type ComparisonRow,
} from './compare.js';
import type { RunResult } from './run.js';
import type { AnnualRow } from './types.js';

/**
 * The comparison rows of a run (one per scenario, baseline first as in the run), with the
 * changes under the low and high seepage settings beside each change column when the run
 * computed the seepage band.
 */
export function comparisonOf(run: RunResult): ComparisonRow[] {
  const rows = compareAnnual(
    run,
    run.scenarios.flatMap((s) => s.annual),
  );
  const band = run.seepageBand;
  return band
    ? withSeepageBand(rows, compareAnnual(run, band.low), compareAnnual(run, band.high))
    : rows;
}

function compareAnnual(run: RunResult, annual: AnnualRow[]): ComparisonRow[] {
  return compareScenarios(annual, {
    baseline: run.baseline,
    scenarios: run.scenarios.map((s) => ({
      name: s.spec.name,
      spacingM: s.spec.params.spacingM,
    })),
  });
}

/**
 * The seepage band for summary.json: the three documented settings and, per scenario, the
 * change in drain flow, load and concentration against the baseline under each.
 */
export function seepageBandOf(run: RunResult) {
  const band = run.seepageBand;
  if (!band) return null;
  const rows = Object.fromEntries(
    SEEPAGE_BAND.map((b) => [b, compareAnnual(run, band[b])]),
  ) as Record<SeepageBand, ComparisonRow[]>;
  const keys = [
    'drainflow_change_percent',
    'no3n_load_change_percent',
    'fwmc_change_percent',
    'seepage_change_mm',
  ] as const;
  return {
    settings: Object.fromEntries(SEEPAGE_BAND.map((b) => [b, SEEPAGE_SETTINGS[b]])),
    field_setting: run.scenarios[0]?.spec.seepage.name ?? '',
    changes: run.scenarios
      .filter((s) => s.spec.name !== run.baseline)
      .map((s) => ({
        scenario: s.spec.name,
        ...Object.fromEntries(
          keys.map((k) => [
            k,
            Object.fromEntries(
              SEEPAGE_BAND.map((b) => [b, rows[b].find((r) => r.scenario === s.spec.name)![k]]),
            ),
          ]),
        ),
      })),
  };
}

/** comparison.csv's columns for a run: with the seepage band when the run computed it. */
export function comparisonColumnsOf(run: RunResult): readonly string[] {
  return run.seepageBand ? [...COMPARISON_COLUMNS, ...BAND_COLUMNS] : COMPARISON_COLUMNS;
}
