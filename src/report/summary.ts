/**
 * Short sentences that say what changed against the baseline: the headline (drain flow and
 * nitrate-N load) and the price in the crop's conditions. Used by the report and by the CLI.
 */
import type { ComparisonRow } from '../scenarios/compare.js';
import { fixed, signed } from './format.js';

function baselineOf(rows: readonly ComparisonRow[]): string {
  return rows.find((r) => r.is_baseline)?.scenario ?? '';
}

/**
 * One line per non-baseline scenario on how the crop's conditions changed against the
 * baseline, per year on average: aeration-stress days, wet days, and days suitable for
 * fieldwork in the spring and fall windows, each count beside its window's length.
 *
 * @example cropConditionLines(rows)
 * // ['controlled: +1.9 aeration-stress days, +4.1 wet days, -0.4 spring fieldwork days of 47
 * //   and -1.5 fall fieldwork days of 57 a year against conventional']
 */
export function cropConditionLines(rows: readonly ComparisonRow[]): string[] {
  const base = baselineOf(rows);
  return rows
    .filter((r) => !r.is_baseline)
    .map(
      (r) =>
        `${r.scenario}: ${signed(r.aeration_stress_change_days, 1)} aeration-stress days, ` +
        `${signed(r.wet_change_days, 1)} wet days, ` +
        `${signed(r.spring_fieldwork_change_days, 1)} spring fieldwork days of ${fixed(r.spring_window_days, 0)} and ` +
        `${signed(r.fall_fieldwork_change_days, 1)} fall fieldwork days of ${fixed(r.fall_window_days, 0)} ` +
        `a year against ${base}`,
    );
}

/**
 * One line per non-baseline scenario with the change in mean annual drain flow and nitrate-N
 * load against the baseline, in percent.
 *
 * @example headlineLines(rows) // ['controlled: drain flow -29.8 %, nitrate-N load -33.1 % against conventional']
 */
export function headlineLines(rows: readonly ComparisonRow[]): string[] {
  const base = baselineOf(rows);
  return rows
    .filter((r) => !r.is_baseline)
    .map(
      (r) =>
        `${r.scenario}: drain flow ${signed(r.drainflow_change_percent, 1)} %, ` +
        `nitrate-N load ${signed(r.no3_load_change_percent, 1)} % against ${base}`,
    );
}
