/**
 * Scenario comparison: the annual table of every scenario reduced to one row per scenario, with
 * the change against a baseline and the spread across years. This is the table a planner reads
 * first (comparison.csv); charts and the report are drawn from it.
 */
import { max, mean, median, min } from 'simple-statistics';
import { TilefluxError } from '../errors.js';
import type { AnnualMeasure, AnnualRow } from './types.js';

/**
 * Annual measures averaged per scenario and compared against the baseline, in column order:
 * [annual.csv key, stem of the change columns, unit suffix]. The change columns are
 * `<stem>_change_<unit>` (scenario minus baseline) and `<stem>_change_percent`.
 */
const COMPARED = [
  ['drainflow_mm', 'drainflow', 'mm'],
  ['no3n_load_kg_ha', 'no3n_load', 'kg_ha'],
  ['fwmc_mg_l', 'fwmc', 'mg_l'],
  ['runoff_mm', 'runoff', 'mm'],
  ['et_mm', 'et', 'mm'],
  ['seepage_mm', 'seepage', 'mm'],
  ['aeration_stress_days', 'aeration_stress', 'days'],
  ['aeration_deficit_days', 'aeration_deficit', 'days'],
  ['stress_days', 'stress', 'days'],
  ['wet_days', 'wet', 'days'],
  ['spring_fieldwork_days', 'spring_fieldwork', 'days'],
  ['fall_fieldwork_days', 'fall_fieldwork', 'days'],
  ['wt_mean_depth_m', 'wt_mean_depth', 'm'],
] as const satisfies ReadonlyArray<readonly [AnnualMeasure, string, string]>;

/**
 * Annual measures averaged for context only (the same weather and calendar drive every
 * scenario): the fieldwork window lengths let a count read as "31 of 45 days".
 */
const CONTEXT = [
  'precip_mm',
  'runoff_n_kg_ha',
  'seepage_n_kg_ha',
  'spring_window_days',
  'fall_window_days',
] as const satisfies ReadonlyArray<AnnualMeasure>;

/** Measures whose spread across years is reported: [annual key, stem, unit]. */
const SPREAD = [
  ['drainflow_mm', 'drainflow', 'mm'],
  ['no3n_load_kg_ha', 'no3n_load', 'kg_ha'],
] as const satisfies ReadonlyArray<readonly [AnnualMeasure, string, string]>;

type Compared = (typeof COMPARED)[number];
type Spread = (typeof SPREAD)[number];
/** Flow-weighted concentration is undefined (null) when no drain flow left over the period. */
type MeanOf<K extends string> = K extends 'fwmc_mg_l' ? number | null : number;

/**
 * One row of comparison.csv: one scenario over the whole period. Means are per year over the
 * years in the annual table; `fwmc_mg_l` is flow-weighted over the whole period
 * (100 x total load / total flow). Percent changes are null where the baseline value is 0.
 */
export type ComparisonRow = {
  scenario: string;
  /** True on the baseline's own row (its changes are 0). */
  is_baseline: boolean;
  years: number;
  spacing_m: number;
  /** Lateral pipe per hectare for parallel laterals at the spacing (mains excluded), m/ha. */
  pipe_length_m_ha: number;
  pipe_length_change_m_ha: number;
  pipe_length_change_percent: number | null;
} & { [K in (typeof CONTEXT)[number]]: number } & {
  [C in Compared as C[0]]: MeanOf<C[0]>;
} & { [C in Compared as `${C[1]}_change_${C[2]}`]: MeanOf<C[0]> } & {
  [C in Compared as `${C[1]}_change_percent`]: number | null;
} & { [S in Spread as `${S[1]}_min_${S[2]}`]: number } & {
  [S in Spread as `${S[1]}_median_${S[2]}`]: number;
} & { [S in Spread as `${S[1]}_max_${S[2]}`]: number } & LoadParts;

/**
 * The nitrate-N load change split into a flow part and a concentration part. Mean annual load is
 * L = Q C / 100 (Q mean annual drain flow, mm; C period flow-weighted concentration, mg/L), so
 * with the symmetric (midpoint) decomposition
 *   L1 - L0 = (Q1 - Q0) (C0 + C1) / 200  +  (C1 - C0) (Q0 + Q1) / 200
 * the two parts add up to the change exactly and neither scenario is favoured (README, Assumptions and defaults).
 */
export const LOAD_PART_COLUMNS = [
  'no3n_load_change_flow_part_kg_ha',
  'no3n_load_change_conc_part_kg_ha',
  'no3n_load_change_flow_part_percent',
  'no3n_load_change_conc_part_percent',
] as const;
export type LoadParts = { [K in (typeof LOAD_PART_COLUMNS)[number]]: number | null };

/** Column order of comparison.csv (the keys of a ComparisonRow, always in this order). */
export const COMPARISON_COLUMNS: ReadonlyArray<keyof ComparisonRow> = [
  'scenario',
  'is_baseline',
  'years',
  'spacing_m',
  'pipe_length_m_ha',
  ...CONTEXT,
  ...COMPARED.map((c) => c[0]),
  ...SPREAD.flatMap((s) => [
    `${s[1]}_min_${s[2]}`,
    `${s[1]}_median_${s[2]}`,
    `${s[1]}_max_${s[2]}`,
  ]),
  'pipe_length_change_m_ha',
  'pipe_length_change_percent',
  ...COMPARED.flatMap((c) => [`${c[1]}_change_${c[2]}`, `${c[1]}_change_percent`]),
  ...LOAD_PART_COLUMNS,
] as ReadonlyArray<keyof ComparisonRow>;

/** The change columns that carry a seepage band (pipe length does not depend on seepage). */
export const BANDED_COLUMNS: ReadonlyArray<keyof ComparisonRow> = COMPARISON_COLUMNS.filter(
  (c) => /_change_|_part_/.test(c) && !c.startsWith('pipe_length'),
);

/** comparison.csv's columns with the seepage band: every banded column with _low and _high. */
export const BAND_COLUMNS: readonly string[] = BANDED_COLUMNS.flatMap((c) => [
  `${c}_low`,
  `${c}_high`,
]);

/** A comparison row with its seepage band: `<change column>_low` and `_high`. */
export type BandedComparisonRow = ComparisonRow & Record<string, number | string | boolean | null>;

/**
 * Put the changes under the low and high seepage settings beside each change column
 * (`drainflow_change_percent_low`, `..._high`); rows are matched by scenario name.
 *
 * @example withSeepageBand(rows, lowRows, highRows)[2].drainflow_change_percent_low // e.g. -6.1
 */
export function withSeepageBand(
  rows: readonly ComparisonRow[],
  low: readonly ComparisonRow[],
  high: readonly ComparisonRow[],
): BandedComparisonRow[] {
  return rows.map((r) => {
    const l = low.find((x) => x.scenario === r.scenario);
    const h = high.find((x) => x.scenario === r.scenario);
    const out: Record<string, unknown> = { ...r };
    for (const c of BANDED_COLUMNS) {
      out[`${c}_low`] = l ? l[c] : null;
      out[`${c}_high`] = h ? h[c] : null;
    }
    return out as BandedComparisonRow;
  });
}

/** A scenario as the comparison needs it: its name and its lateral spacing. */
export interface ComparedScenario {
  name: string;
  spacingM: number;
}

/**
 * Lateral pipe length per hectare for parallel laterals at spacing S: each lateral drains a
 * strip S wide, so the length per unit area is 1/S (m/m2), i.e. 10 000/S m/ha. Mains,
 * submains and headland laterals are not counted (plain geometry of a parallel layout).
 *
 * @example pipeLengthPerHectare(20) // 500 (m/ha)
 */
export function pipeLengthPerHectare(spacingM: number): number {
  return 10_000 / spacingM;
}

/** 100 x (value - base) / base, or null when the base is 0 (no meaningful percentage). */
function percentChange(value: number, base: number): number | null {
  return base === 0 ? null : (100 * (value - base)) / base;
}

/**
 * Reduce the annual table to one comparison row per scenario, in the order of
 * `opts.scenarios`: the mean annual value of each measure, the period flow-weighted nitrate-N
 * concentration (load (kg/ha) = flow (mm) x C (mg/L) / 100, so C = 100 x sum(load) / sum(flow)),
 * lateral pipe length per hectare, the change against the baseline (absolute and percent) and
 * the minimum, median and maximum annual drain flow and load (simple-statistics).
 *
 * Every scenario must cover the same years (same weather). Pass whole years only: a partial
 * first or last year would pull the means down. Rows of scenarios not listed are ignored.
 *
 * @example
 * compareScenarios(annual, {
 *   baseline: 'conventional',
 *   scenarios: [{ name: 'conventional', spacingM: 20 }, { name: 'controlled', spacingM: 20 }],
 * })[1].drainflow_change_percent // e.g. -28.4
 */
export function compareScenarios(
  annual: readonly AnnualRow[],
  opts: { baseline: string; scenarios: readonly ComparedScenario[] },
): ComparisonRow[] {
  const names = opts.scenarios.map((s) => s.name);
  if (names.length === 0) throw new TilefluxError('no scenarios to compare', 'comparison');
  if (new Set(names).size !== names.length) {
    throw new TilefluxError(
      `scenario names must be unique (got ${names.join(', ')})`,
      'comparison',
    );
  }
  if (!names.includes(opts.baseline)) {
    throw new TilefluxError(
      `baseline "${opts.baseline}" is not one of the scenarios (${names.join(', ')})`,
      'comparison',
    );
  }
  for (const s of opts.scenarios) {
    if (!(Number.isFinite(s.spacingM) && s.spacingM > 0)) {
      throw new TilefluxError(
        `spacing of scenario "${s.name}" must be a positive length in m (got ${s.spacingM})`,
        'comparison',
      );
    }
  }

  const rowsOf = new Map<string, AnnualRow[]>(names.map((n) => [n, []]));
  for (const r of annual) rowsOf.get(r.scenario)?.push(r);
  let refYears: string | undefined;
  for (const n of names) {
    const rows = rowsOf
      .get(n)!
      .slice()
      .sort((a, b) => a.year - b.year);
    rowsOf.set(n, rows);
    const years = rows.map((r) => r.year);
    if (rows.length === 0) {
      throw new TilefluxError(`scenario "${n}" has no rows in the annual table`, 'comparison');
    }
    if (new Set(years).size !== years.length) {
      throw new TilefluxError(`scenario "${n}" has a year twice in the annual table`, 'comparison');
    }
    const key = years.join(',');
    if (refYears === undefined) refYears = key;
    else if (key !== refYears) {
      throw new TilefluxError(
        `scenario "${n}" covers years ${years[0]}-${years[years.length - 1]} (${years.length}), ` +
          `unlike "${names[0]}"; every scenario must run over the same weather`,
        'comparison',
      );
    }
  }

  const means = new Map<string, Record<string, number | null>>();
  for (const s of opts.scenarios) {
    const rows = rowsOf.get(s.name)!;
    const m: Record<string, number | null> = {};
    for (const k of CONTEXT) m[k] = mean(rows.map((r) => r[k]));
    for (const [k] of COMPARED) if (k !== 'fwmc_mg_l') m[k] = mean(rows.map((r) => r[k]));
    // The period concentration weights each year by its flow, unlike a mean of annual values.
    let flow = 0;
    let load = 0;
    for (const r of rows) {
      flow += r.drainflow_mm;
      load += r.no3n_load_kg_ha;
    }
    m.fwmc_mg_l = flow > 0 ? (100 * load) / flow : null;
    m.pipe_length_m_ha = pipeLengthPerHectare(s.spacingM);
    means.set(s.name, m);
  }

  const base = means.get(opts.baseline)!;
  return opts.scenarios.map((s) => {
    const rows = rowsOf.get(s.name)!;
    const m = means.get(s.name)!;
    const out: Record<string, unknown> = {
      scenario: s.name,
      is_baseline: s.name === opts.baseline,
      years: rows.length,
      spacing_m: s.spacingM,
      pipe_length_m_ha: m.pipe_length_m_ha,
    };
    for (const k of CONTEXT) out[k] = m[k];
    for (const [k] of COMPARED) out[k] = m[k];
    for (const [k, stem, unit] of SPREAD) {
      const values = rows.map((r) => r[k]);
      out[`${stem}_min_${unit}`] = min(values);
      out[`${stem}_median_${unit}`] = median(values);
      out[`${stem}_max_${unit}`] = max(values);
    }
    const changes: Array<readonly [string, string, string]> = [
      ['pipe_length_m_ha', 'pipe_length', 'm_ha'],
      ...COMPARED,
    ];
    for (const [k, stem, unit] of changes) {
      const v = m[k];
      const b = base[k];
      const both = v !== null && b !== null;
      out[`${stem}_change_${unit}`] = both ? v - b : null;
      out[`${stem}_change_percent`] = both ? percentChange(v, b) : null;
    }
    // Load change = flow part + concentration part (symmetric decomposition, LOAD_PART_COLUMNS).
    const q0 = base.drainflow_mm;
    const q1 = m.drainflow_mm;
    const c0 = base.fwmc_mg_l;
    const c1 = m.fwmc_mg_l;
    const l0 = base.no3n_load_kg_ha;
    if (q0 !== null && q1 !== null && c0 !== null && c1 !== null) {
      const flowPart = ((q1 - q0) * (c0 + c1)) / 200;
      const concPart = ((c1 - c0) * (q0 + q1)) / 200;
      out.no3n_load_change_flow_part_kg_ha = flowPart;
      out.no3n_load_change_conc_part_kg_ha = concPart;
      out.no3n_load_change_flow_part_percent = l0 ? (100 * flowPart) / l0 : null;
      out.no3n_load_change_conc_part_percent = l0 ? (100 * concPart) / l0 : null;
    } else for (const c of LOAD_PART_COLUMNS) out[c] = null;
    const ordered: Record<string, unknown> = {};
    for (const c of COMPARISON_COLUMNS) ordered[c] = out[c];
    return ordered as ComparisonRow;
  });
}
