/**
 * The outputs of `tileflux run`: daily.csv, annual.csv and summary.json,
 * built from a RunOutput. Text builders are separate from the writing so that they can be tested
 * and so that the same input always gives byte-identical files.
 */
import { closeSync, openSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { flowWeightedMeanMgL } from '../nitrate/annual.js';
import { isPartialYear, withPartialYear } from '../scenarios/annual.js';
import type { RatingFit } from '../nitrate/types.js';
import type { ComparisonRow } from '../scenarios/compare.js';
import type { EngineForcing } from '../engine/types.js';
import {
  capacityLimitedDaysOf,
  lateralSeepageMmOf,
  type RunOutput,
  type RunResult,
  type ScenarioOutput,
} from '../scenarios/run.js';
import type { ScenarioSpec } from '../scenarios/resolve.js';
import type { AnnualRow } from '../scenarios/types.js';
import type { UnitSystem } from '../units/quantity.js';
import { VERSION } from '../version.js';
import { HARGREAVES_BIAS } from '../climate/referenceEt.js';
import { capacityText, rootText, seepageText } from '../scenarios/assumptions.js';
import { seepageBandOf } from '../scenarios/runComparison.js';
import { columnsToCsvChunks, recordIn, toCsv, type Column } from './tables.js';

/** What the summary records about the inputs. */
export interface RunMeta {
  fieldFile: string;
  fieldSha256: string;
  weatherFile: string;
  weatherSha256: string;
  fieldName: string;
  /** How the weather file was read, in words (format, station, fills; not in the summary). */
  weatherSource?: string;
  /** Nitrate ratings fitted to observation files named in the field file, by file name. */
  ratingFits?: Record<string, RatingFit>;
  /** Paths of the input files, which an output folder must never hold (not in the summary). */
  inputPaths?: string[];
}

/** Daily columns of one scenario, SI, in the column order of daily.csv. */
export function dailyColumns(run: Pick<RunOutput, 'forcing'>, s: ScenarioOutput): Column[] {
  const { base, pool } = scenarioColumns(run.forcing, s);
  return [...base, ...pool];
}

/** A scenario's daily columns: those every scenario has, and the pool model's (or none). */
function scenarioColumns(f: EngineForcing, s: ScenarioOutput): { base: Column[]; pool: Column[] } {
  const e = s.engine;
  const n = s.nitrate;
  const base: Column[] = [
    { name: 'scenario', values: new Array<string>(f.dates.length).fill(s.spec.name) },
    { name: 'date', values: f.dates },
    { name: 'precip_mm', values: f.precipMm },
    { name: 'snowmelt_mm', values: f.snowmeltMm },
    { name: 'swe_mm', values: f.sweMm },
    { name: 'ref_et_mm', values: f.refEtMm },
    { name: 'crop_et_mm', values: e.cropEtMm },
    { name: 'et_mm', values: e.etMm },
    { name: 'runoff_mm', values: e.runoffMm },
    { name: 'infiltration_mm', values: e.infiltrationMm },
    { name: 'drainflow_mm', values: e.drainflowMm },
    { name: 'seepage_mm', values: e.seepageMm },
    { name: 'lateral_seepage_mm', values: e.lateralSeepageMm },
    { name: 'water_table_depth_m', values: e.waterTableDepthM },
    { name: 'outlet_depth_m', values: e.outletDepthM },
    { name: 'ponded_mm', values: e.pondedMm },
    { name: 'root_zone_depletion_mm', values: e.rootZoneDepletionMm },
    { name: 'ks', values: e.ks },
    { name: 'kc', values: s.calendar.kc },
    { name: 'balance_error_mm', values: e.balanceErrorMm },
    { name: 'no3n_conc_mg_l', values: n.concMgL },
    { name: 'no3n_load_kg_ha', values: n.loadKgHa },
    { name: 'runoff_n_kg_ha', values: n.runoffLoadKgHa },
    { name: 'seepage_n_kg_ha', values: n.seepageLoadKgHa },
  ];
  const pool: Column[] = n.pool
    ? [
        { name: 'no3n_pool_kg_ha', values: n.pool.poolKgHa },
        { name: 'fertilizer_n_kg_ha', values: n.pool.fertilizerKgHa },
        { name: 'mineralization_n_kg_ha', values: n.pool.mineralizationKgHa },
        { name: 'uptake_n_kg_ha', values: n.pool.uptakeKgHa },
        { name: 'denitrification_n_kg_ha', values: n.pool.denitrificationKgHa },
      ]
    : [];
  return { base, pool };
}

/**
 * daily.csv: every scenario's daily columns, one scenario after another. Pool columns exist only
 * for the pool model, so the columns every scenario has are kept, in the first one's order.
 * Yields the text in pieces, so that a study of many scenarios and years is written to disk
 * without ever being one string (memory does not grow with scenarios x days).
 */
export function* dailyCsvChunks(run: RunOutput, units: UnitSystem): Generator<string> {
  const pool = dailyPoolColumns(run.scenarios.map((s) => s.spec));
  for (let k = 0; k < run.scenarios.length; k++) {
    yield* scenarioDailyCsvChunks(run.forcing, run.scenarios[k], units, { header: k === 0, pool });
  }
}

/** Whether daily.csv has the pool model's columns: only when every scenario runs that model. */
export function dailyPoolColumns(specs: ReadonlyArray<Pick<ScenarioSpec, 'nitrate'>>): boolean {
  return specs.length > 0 && specs.every((s) => s.nitrate.model === 'pool');
}

/**
 * One scenario's rows of daily.csv (with the header line for the first scenario), in pieces;
 * `pool` says whether the file has the pool model's columns (`dailyPoolColumns`).
 */
export function* scenarioDailyCsvChunks(
  forcing: EngineForcing,
  s: ScenarioOutput,
  units: UnitSystem,
  o: { header: boolean; pool: boolean },
): Generator<string> {
  const { base, pool } = scenarioColumns(forcing, s);
  if (o.pool && pool.length === 0) {
    throw new Error(`scenario "${s.spec.name}" runs the pool model without its pool columns`);
  }
  yield* columnsToCsvChunks(o.pool ? [...base, ...pool] : base, units, o.header);
}

/** daily.csv as one string (small runs and tests; files are written by `writeDailyCsv`). */
export function dailyCsv(run: RunOutput, units: UnitSystem): string {
  return [...dailyCsvChunks(run, units)].join('');
}

/** Write daily.csv to `path` piece by piece, yielding to the event loop between pieces. */
export async function writeDailyCsv(
  path: string,
  run: RunOutput,
  units: UnitSystem,
): Promise<void> {
  const fd = openSync(path, 'w');
  try {
    for (const chunk of dailyCsvChunks(run, units)) {
      writeSync(fd, chunk);
      // Let a SIGINT or SIGTERM be handled (and the temporary folder removed) on long writes.
      await new Promise((r) => setImmediate(r));
    }
  } finally {
    closeSync(fd);
  }
}

/** Mean of every numeric measure over the annual rows of one scenario. */
export function annualMean(rows: AnnualRow[]): Record<string, number> {
  const out: Record<string, number> = {};
  if (rows.length === 0) return out;
  for (const key of Object.keys(rows[0]) as Array<keyof AnnualRow>) {
    if (key === 'scenario' || key === 'year') continue;
    let sum = 0;
    for (const r of rows) sum += r[key] as number;
    out[key] = sum / rows.length;
  }
  // Flow-weighted over the whole period, not the mean of yearly ratios.
  const flow = rows.reduce((s, r) => s + r.drainflow_mm, 0);
  const load = rows.reduce((s, r) => s + r.no3n_load_kg_ha, 0);
  out.fwmc_mg_l = flowWeightedMeanMgL(load, flow);
  return out;
}

/** The summary document: inputs, period, resolved parameters and annual means per scenario. */
export function buildSummary(
  run: RunResult,
  meta: RunMeta,
  units: UnitSystem,
  comparison: readonly ComparisonRow[],
) {
  return {
    tool: { name: 'tileflux', version: VERSION },
    units: units === 'si' ? 'SI (m, mm, kg/ha, mg/L)' : 'US customary (ft, in, lb/ac, mg/L)',
    inputs: {
      field: { file: meta.fieldFile, sha256: meta.fieldSha256, name: meta.fieldName },
      weather: { file: meta.weatherFile, sha256: meta.weatherSha256 },
    },
    period: {
      from: run.from,
      to: run.to,
      years: run.scenarios[0]?.annual.length ?? 0,
      warmup_years: run.warmupYears,
      warmup_years_requested: run.warmupYearsRequested,
      partial_years: (run.scenarios[0]?.annual ?? [])
        .filter((r) => isPartialYear(r.year, r.days))
        .map((r) => r.year),
      simulated_from: run.simulatedFrom,
    },
    reference_et_method: run.refEtMethod,
    nitrate_rating_fits: Object.entries(meta.ratingFits ?? {}).map(([file, f]) => ({
      observations: file,
      a_mg_l: f.a,
      b: f.b,
      r_squared: f.rSquared,
      n: f.n,
      skipped: f.skipped,
      flow_range_mm_d: f.flowRangeMm,
    })),
    // What decides the answer and is uncertain, stated every time (README, Assumptions and defaults).
    assumptions: {
      seepage: { ...run.scenarios[0]?.spec.seepage, text: seepageText(run) },
      roots: rootText(run),
      pipe_capacity: capacityText(run),
      reference_et: {
        method: run.refEtMethod,
        et_factor: run.etFactor,
        bias: run.refEtMethod === 'Hargreaves' ? HARGREAVES_BIAS : null,
      },
    },
    seepage_band: seepageBandOf(run),
    baseline: run.baseline,
    scenarios: run.scenarios.map((s) => {
      const mean = annualMean(s.annual);
      // The part of the seepage that left laterally to the field edge.
      mean.lateral_seepage_mm = lateralSeepageMmOf(s) / Math.max(1, s.annual.length);
      // Percent changes against the baseline, as in comparison.csv.
      const row = comparison.find((r) => r.scenario === s.spec.name);
      const change = Object.fromEntries(
        Object.entries(row ?? {}).filter(([k]) => k.endsWith('_change_percent')),
      );
      return {
        name: s.spec.name,
        description: s.spec.description,
        outlet: s.spec.outletLabel,
        parameters: {
          ...s.spec.params,
          capacityMmPerDay: Number.isFinite(s.spec.params.capacityMmPerDay)
            ? s.spec.params.capacityMmPerDay
            : null,
          equivalentDepthM: s.engine.equivalentDepthM,
          substepsPerDayUsed: s.engine.substepsPerDay,
          rotation: s.spec.rotation,
          rotation_first_year: s.spec.rotationFirstYear,
          // In the field file's word: a schedule without steps is "free".
          outlet: s.spec.outlet.steps.length === 0 ? ('free' as const) : s.spec.outlet,
          nitrate: s.spec.nitrate,
        },
        annual_mean: recordIn(mean, units),
        change_vs_baseline: change,
        no3n_rating_out_of_range_days: s.nitrate.outOfRangeDays,
        capacity_limited_days: capacityLimitedDaysOf(s),
        max_annual_balance_error_mm: Math.max(
          0,
          ...s.annual.map((r) => Math.abs(r.balance_error_mm)),
        ),
        max_annual_n_balance_error_kg_ha: Math.max(
          0,
          ...s.annual.map((r) => Math.abs(r.n_balance_error_kg_ha)),
        ),
      };
    }),
    comparison: comparison.map((r) => recordIn(r as unknown as Record<string, unknown>, units)),
  };
}

/**
 * Write daily.csv (unless `daily` is false), annual.csv and summary.json into `dir` (a fresh
 * temporary folder).
 */
export async function writeRunFiles(
  dir: string,
  run: RunOutput,
  summary: unknown,
  units: UnitSystem,
  daily = true,
): Promise<void> {
  if (daily) await writeDailyCsv(join(dir, 'daily.csv'), run, units);
  writeAnnualAndSummary(dir, run, summary, units);
}

/** Write annual.csv and summary.json into `dir` (daily.csv is written on its own). */
export function writeAnnualAndSummary(
  dir: string,
  run: RunResult,
  summary: unknown,
  units: UnitSystem,
): void {
  // A year the reported period covers only in part is marked, so its sums are not read as
  // annual rates.
  const annual = run.scenarios.flatMap((s) => s.annual.map(withPartialYear)) as unknown as Array<
    Record<string, string | number>
  >;
  writeFileSync(join(dir, 'annual.csv'), toCsv(annual, units));
  writeFileSync(join(dir, 'summary.json'), JSON.stringify(summary, null, 2) + '\n');
}
