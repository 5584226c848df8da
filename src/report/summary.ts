/**
 * Short sentences that say what changed against the baseline: the headline (drain flow and
 * nitrate-N load) and the price in field wetness. Used by the report and by the CLI.
 */
import type { ComparisonRow } from '../scenarios/compare.js';
import { signed } from './format.js';
import { displayUnits } from './units.js';

function baselineOf(rows: readonly ComparisonRow[]): string {
  return rows.find((r) => r.is_baseline)?.scenario ?? '';
}

/**
 * One line per non-baseline scenario on how wetness changed against the baseline, per year on
 * average: growing-season wet days, excess wetness, planting- and harvest-ready days.
 *
 * @example wetnessChangeLines(rows)
 * // ['controlled: +4.1 wet days per year, +12.0 cm-days of excess wetness, -1.3 planting-ready
 * //   days and -0.7 harvest-ready days against conventional']
 */
export function wetnessChangeLines(
  rows: readonly ComparisonRow[],
  units: 'si' | 'us' = 'si',
): string[] {
  const w = displayUnits(units).wetness;
  const base = baselineOf(rows);
  return rows
    .filter((r) => !r.is_baseline)
    .map(
      (r) =>
        `${r.scenario}: ${signed(r.wet_change_days, 1)} wet days per year, ` +
        `${signed(r.excess_wetness_change_cm_days * w.factor, 1)} ${w.label} of excess wetness, ` +
        `${signed(r.planting_ready_change_days, 1)} planting-ready days and ` +
        `${signed(r.harvest_ready_change_days, 1)} harvest-ready days against ${base}`,
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
