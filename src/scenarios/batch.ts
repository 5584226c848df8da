/**
 * Batches of fields (`tileflux batch`): which manifest rows a shard runs, the columns of the
 * annual and summary tables, and one job's rows. Pure: the manifest, the weather files and the
 * Parquet files are read and written in `io/`.
 */
import type { WeatherSeries } from '../climate/weatherSeries.js';
import { BAND_COLUMNS, COMPARISON_COLUMNS } from './compare.js';
import { comparisonOf } from './runComparison.js';
import { runField, type FieldWithScenarios, type PeriodOptions, type RunOptions } from './run.js';
import { ANNUAL_COLUMNS } from './types.js';
import { withPartialYear } from './annual.js';

/** One shard of a manifest: rows whose 0-based index i has i mod `count` = `index`. */
export interface Shard {
  index: number;
  count: number;
}

/** The file-name tag of a shard: `0of4`. */
export function shardTag(s: Shard): string {
  return `${s.index}of${s.count}`;
}

/**
 * The 0-based manifest row indices of a shard.
 * @example shardRows(10, { index: 1, count: 4 }) // [1, 5, 9]
 */
export function shardRows(rows: number, s: Shard): number[] {
  const out: number[] = [];
  for (let i = s.index; i < rows; i += s.count) out.push(i);
  return out;
}

/** Column types of the batch tables, as written to Parquet. */
export type BatchColumnType = 'text' | 'integer' | 'number' | 'boolean';
export interface BatchColumn {
  name: string;
  type: BatchColumnType;
}

const INTEGERS = new Set(['year', 'days', 'years']);
const typed = (name: string): BatchColumn => ({
  name,
  type:
    name === 'scenario'
      ? 'text'
      : name === 'is_baseline'
        ? 'boolean'
        : INTEGERS.has(name)
          ? 'integer'
          : 'number',
});

/** Columns of the annual table: job_id, then annual.csv's (SI units in the names). */
export const BATCH_ANNUAL_COLUMNS: readonly BatchColumn[] = [
  { name: 'job_id', type: 'text' },
  ...ANNUAL_COLUMNS.flatMap((c) =>
    c === 'days' ? [typed(c), { name: 'partial_year', type: 'text' as const }] : [typed(c)],
  ),
];

/** Columns of the summary table: job_id, then comparison.csv's with the seepage band. */
export const BATCH_SUMMARY_COLUMNS: readonly BatchColumn[] = [
  { name: 'job_id', type: 'text' },
  ...[...COMPARISON_COLUMNS, ...BAND_COLUMNS].map(typed),
];

/** A table row: values by column name (null where comparison.csv has an empty cell). */
export type BatchRow = Record<string, string | number | boolean | null>;

/** One job's rows: per scenario and year, and per scenario. */
export interface JobRows {
  annual: BatchRow[];
  summary: BatchRow[];
}

/**
 * Run one job: every scenario of the field (or the named ones, in the field's order) over the
 * weather, with the seepage band, as `tileflux run` does; rows as in annual.csv and
 * comparison.csv with the job's id in front.
 *
 * @example runJob('north-18m', field, weather.series).summary[0].drainflow_mm
 */
export function runJob(
  id: string,
  field: FieldWithScenarios,
  weather: WeatherSeries,
  o: PeriodOptions & Pick<RunOptions, 'only'> = {},
): JobRows {
  const run = runField(field, weather, { ...o, seepageBand: true });
  const pick = (r: object, columns: readonly BatchColumn[]): BatchRow => {
    const out: BatchRow = { job_id: id };
    const rec = r as Record<string, unknown>;
    for (const c of columns) if (c.name !== 'job_id') out[c.name] = rec[c.name] as BatchRow[string];
    return out;
  };
  return {
    annual: run.scenarios.flatMap((s) =>
      s.annual.map((r) => pick(withPartialYear(r), BATCH_ANNUAL_COLUMNS)),
    ),
    summary: comparisonOf(run).map((r) => pick(r, BATCH_SUMMARY_COLUMNS)),
  };
}
