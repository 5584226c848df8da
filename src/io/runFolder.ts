/**
 * The outputs of `tileflux run`: daily.csv, annual.csv and summary.json (DESIGN.md section 5),
 * built from a RunOutput. Text builders are separate from the writing so that they can be tested
 * and so that the same input always gives byte-identical files.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { RunOutput, ScenarioOutput } from '../scenarios/run.js';
import type { AnnualRow } from '../scenarios/types.js';
import type { UnitSystem } from '../units/quantity.js';
import { VERSION } from '../version.js';
import { recordIn, toCsv } from './tables.js';

/** What the summary records about the inputs. */
export interface RunMeta {
  fieldFile: string;
  fieldSha256: string;
  weatherFile: string;
  weatherSha256: string;
  fieldName: string;
}

/** Daily rows of one scenario, SI, in the column order of daily.csv. */
export function dailyRows(
  run: RunOutput,
  s: ScenarioOutput,
): Array<Record<string, string | number>> {
  const f = run.forcing;
  const e = s.engine;
  const n = s.nitrate;
  const rows: Array<Record<string, string | number>> = [];
  for (let i = 0; i < f.dates.length; i++) {
    const r: Record<string, string | number> = {
      scenario: s.spec.name,
      date: f.dates[i],
      precip_mm: f.precipMm[i],
      snowmelt_mm: f.snowmeltMm[i],
      swe_mm: f.sweMm[i],
      ref_et_mm: f.refEtMm[i],
      potential_et_mm: e.potentialEtMm[i],
      et_mm: e.etMm[i],
      runoff_mm: e.runoffMm[i],
      infiltration_mm: e.infiltrationMm[i],
      drainflow_mm: e.drainflowMm[i],
      seepage_mm: e.seepageMm[i],
      water_table_depth_m: e.waterTableDepthM[i],
      outlet_depth_m: e.outletDepthM[i],
      ponded_mm: e.pondedMm[i],
      root_zone_depletion_mm: e.rootZoneDepletionMm[i],
      ks: e.ks[i],
      kc: s.calendar.kc[i],
      balance_error_mm: e.balanceErrorMm[i],
      no3_conc_mg_l: n.concMgL[i],
      no3_load_kg_ha: n.loadKgHa[i],
      runoff_n_kg_ha: n.runoffLoadKgHa[i],
      seepage_n_kg_ha: n.seepageLoadKgHa[i],
    };
    if (n.pool) {
      r.no3_pool_kg_ha = n.pool.poolKgHa[i];
      r.fertilizer_n_kg_ha = n.pool.fertilizerKgHa[i];
      r.mineralization_n_kg_ha = n.pool.mineralizationKgHa[i];
      r.uptake_n_kg_ha = n.pool.uptakeKgHa[i];
      r.denitrification_n_kg_ha = n.pool.denitrificationKgHa[i];
    }
    rows.push(r);
  }
  return rows;
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
  const load = rows.reduce((s, r) => s + r.no3_load_kg_ha, 0);
  out.fwmc_mg_l = flow > 0 ? (100 * load) / flow : 0;
  return out;
}

/** Percent change of b against a (null when a is zero). */
export function percentChange(a: number, b: number): number | null {
  return a === 0 ? null : (100 * (b - a)) / Math.abs(a);
}

/** The summary document: inputs, period, resolved parameters and annual means per scenario. */
export function buildSummary(
  run: RunOutput,
  meta: RunMeta,
  units: UnitSystem,
  extra: Record<string, unknown> = {},
) {
  const base = run.scenarios.find((s) => s.spec.name === run.baseline);
  const baseMean = base ? annualMean(base.annual) : {};
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
      simulated_from: run.simulatedFrom,
    },
    reference_et_method: run.refEtMethod,
    baseline: run.baseline,
    scenarios: run.scenarios.map((s) => {
      const mean = annualMean(s.annual);
      const change: Record<string, number | null> = {};
      for (const k of [
        'drainflow_mm',
        'runoff_mm',
        'et_mm',
        'seepage_mm',
        'no3_load_kg_ha',
        'fwmc_mg_l',
        'wet_days',
      ]) {
        change[`${k.replace(/_(mm|kg_ha|mg_l)$/, '')}_change_percent`] = percentChange(
          baseMean[k] ?? 0,
          mean[k] ?? 0,
        );
      }
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
          outlet: s.spec.outlet,
          nitrate: s.spec.nitrate,
        },
        annual_mean: recordIn(mean, units),
        change_vs_baseline: change,
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
    ...extra,
  };
}

/** Write daily.csv, annual.csv and summary.json into `dir` (a fresh temporary folder). */
export function writeRunFiles(
  dir: string,
  run: RunOutput,
  summary: unknown,
  units: UnitSystem,
): void {
  const daily = run.scenarios.flatMap((s) => dailyRows(run, s));
  writeFileSync(join(dir, 'daily.csv'), toCsv(daily, units));
  const annual = run.scenarios.flatMap((s) => s.annual) as unknown as Array<
    Record<string, string | number>
  >;
  writeFileSync(join(dir, 'annual.csv'), toCsv(annual, units));
  writeFileSync(join(dir, 'summary.json'), JSON.stringify(summary, null, 2) + '\n');
}
