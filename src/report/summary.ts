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
 * " (-6.1 % to -31.2 % across seepage assumptions, low to high)" from a row's band columns: the
 * change under the low and under the high seepage setting; "" without a band.
 */
function bandText(r: ComparisonRow, column: string, decimals: number): string {
  const row = r as unknown as Record<string, number | null | undefined>;
  const lo = row[`${column}_low`];
  const hi = row[`${column}_high`];
  if (lo === null || lo === undefined || hi === null || hi === undefined) return '';
  return ` (${signed(lo, decimals)} % to ${signed(hi, decimals)} % across seepage assumptions, low to high)`;
}

/**
 * One line per non-baseline scenario with the change in mean annual drain flow and nitrate-N
 * load against the baseline, in percent, with the seepage band when the run has one, and the
 * load change split into its flow and concentration parts.
 *
 * @example headlineLines(rows)
 * // ['controlled: drain flow -17.0 % (-6.1 % to -31.2 % across seepage assumptions), nitrate-N
 * //   load -24.0 % (...) against conventional; of the load change, -15.1 % from less flow and
 * //   -8.9 % from a change in concentration']
 */
export function headlineLines(rows: readonly ComparisonRow[]): string[] {
  const base = baselineOf(rows);
  return rows
    .filter((r) => !r.is_baseline)
    .map((r) => {
      const parts =
        r.no3n_load_change_flow_part_percent !== null &&
        r.no3n_load_change_conc_part_percent !== null
          ? `; of the load change, ${signed(r.no3n_load_change_flow_part_percent, 1)} % from the change in flow and ` +
            `${signed(r.no3n_load_change_conc_part_percent, 1)} % from the change in concentration`
          : '';
      return (
        `${r.scenario}: drain flow ${signed(r.drainflow_change_percent, 1)} %${bandText(r, 'drainflow_change_percent', 1)}, ` +
        `nitrate-N load ${signed(r.no3n_load_change_percent, 1)} %${bandText(r, 'no3n_load_change_percent', 1)} against ${base}${parts}`
      );
    });
}
