/**
 * The planner's study: every design of a field's `sweep:` section (drain depth x lateral spacing
 * x outlet management) over the same weather, for each of a Latin-hypercube sample of the
 * uncertain soil values, with installed and annualised costs, summarised per design (10th,
 * 50th and 90th percentiles across the soil samples, changes against the field's own design)
 * and ranked by the trade-off frontier of nitrate-N load, wetness and cost.
 *
 * The work is split into jobs, one per design and soil sample (job j = design floor(j / S),
 * sample j mod S); `runSweepJobs` (in `sweepJobs.ts`, re-exported here) runs any range of them
 * on a prepared field, so worker threads can share a sweep and the result does not depend on how
 * it was split. Measures are taken generically from the annual table (every numeric column but
 * the bookkeeping ones).
 *
 * Longer than most files: planning and summarising a sweep share the job order and the measure
 * names; running the jobs, the sampling, the frontier, the costs, the climates and the worker
 * pool are in their own modules.
 *
 * @example
 * const result = sweepField(field.base, weather, { samples: 20, seed: 1 });
 * result.designs.filter((d) => d.on_frontier);
 */
import { quantileSorted } from 'simple-statistics';
import type { z } from 'zod';
import { SettingError, TilefluxError } from '../errors.js';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import { designCost, type DesignCost } from './economics.js';
import { soilSchema, type Field } from './fieldSchema.js';
import { nonDominated } from './frontier.js';
import { prepareField, type PeriodOptions } from './prepared.js';
import { latinHypercube, scaledValue } from './sampling.js';
import { costsSchema, type CostsSection } from './sweepSchema.js';
import { roundTo } from '../units/decimal.js';
import { LOAD_MEASURE, runSweepJobs, type JobResults } from './sweepJobs.js';

export { LOAD_MEASURE, runSweepJobs, sampledField, type JobResults } from './sweepJobs.js';

/**
 * The annual measure the frontier takes as wetness: growing-season days with too little air in
 * the upper root zone (README "Measures").
 */
export const WETNESS_MEASURE = 'aeration_stress_days';
/** Unit suffixes of measure names, longest first. */
const UNITS = ['cm_days', 'kg_ha', 'mg_l', 'days', 'mm', 'm'];

/** Stem and unit of a measure column, e.g. no3n_load_kg_ha -> [no3n_load, kg_ha]. */
export function splitUnit(name: string): [string, string] {
  for (const u of UNITS) if (name.endsWith(`_${u}`)) return [name.slice(0, -u.length - 1), u];
  return [name, ''];
}

/** `<stem>_<what>_<unit>`, e.g. column('no3n_load_kg_ha', 'p10') = no3n_load_p10_kg_ha. */
export function measureColumn(name: string, what: string): string {
  const [stem, unit] = splitUnit(name);
  return unit ? `${stem}_${what}_${unit}` : `${stem}_${what}`;
}

/** One design of a sweep. */
export interface SweepDesign {
  name: string;
  depthM: number;
  spacingM: number;
  management: string;
  /** The outlet as in the field file (`outlet:`). */
  outlet: Field['outlet'];
  managed: boolean;
  isBaseline: boolean;
  /** False for the field's own design when it is not one of the swept combinations. */
  inGrid: boolean;
  cost: DesignCost;
}

/** An uncertain soil value and its sampled range (in the soil key's own unit). */
export interface UncertainParam {
  key: string;
  soilKey: string;
  low: number;
  high: number;
  scale: 'linear' | 'log';
  /** Column name in samples.csv, e.g. soil_conductivity_m_d. */
  column: string;
}

/** Everything a sweep runs, resolved from the field file (deterministic for a seed). */
export interface SweepPlan {
  field: Field;
  designs: SweepDesign[];
  baselineIndex: number;
  params: UncertainParam[];
  /** Sampled values, [sample][param]. */
  samples: number[][];
  seed: number;
  costs: CostsSection;
  /** Whether the field file gave a costs section (else the illustrative defaults apply). */
  costsGiven: boolean;
}

export interface SweepOptions extends PeriodOptions {
  /** Soil samples per design (default: the sweep section's `samples`). */
  samples?: number | undefined;
  /** Seed of the Latin hypercube (default 1). */
  seed?: number | undefined;
}

function lengthText(x: number): string {
  return String(roundTo(x, 3));
}

/** The unit of a soil key from its schema description ("... [m/d; e.g. ...]"), as a suffix. */
function unitSuffix(description: string | undefined): string {
  const m = /\[([^;\]]+)/.exec(description ?? '');
  if (!m || m[1].startsWith('(')) return '';
  return '_' + m[1].trim().replace(/\//g, '_').replace(/\s+/g, '_');
}

/**
 * Resolve a field's sweep section: the designs (the field's own design first when the grid does
 * not hold it), the Latin-hypercube soil samples and the costs.
 */
export function planSweep(field: Field, o: SweepOptions = {}): SweepPlan {
  const sw = field.sweep;
  if (!sw) {
    throw new TilefluxError(
      'has no sweep: section; add one with the drain depths, spacings and outlet managements to ' +
        'compare (tileflux init shows an example)',
      'field file',
    );
  }
  const costsGiven = field.costs !== undefined;
  const costs = field.costs ?? costsSchema.parse({});
  const seed = o.seed ?? 1;
  const nSamples = o.samples ?? sw.samples;
  if (!(Number.isInteger(nSamples) && nSamples >= 1 && nSamples <= 10000)) {
    throw new SettingError(
      (n) => `${n('samples')} expects a whole number from 1 to 10000; got ${nSamples}`,
    );
  }
  const managements = Object.entries(sw.outlet) as Array<[string, Field['outlet']]>;
  const key = (x: unknown) => JSON.stringify(x);
  const make = (depthM: number, spacingM: number, management: string, outlet: Field['outlet']) => {
    const managed = outlet !== 'free';
    return {
      name: `${lengthText(depthM)} m x ${lengthText(spacingM)} m, ${management}`,
      depthM,
      spacingM,
      management,
      outlet,
      managed,
      isBaseline: false,
      inGrid: true,
      cost: designCost(spacingM, managed, costs),
    };
  };
  const designs: SweepDesign[] = [];
  for (const [management, outlet] of managements)
    for (const depthM of sw.depth)
      for (const spacingM of sw.spacing) designs.push(make(depthM, spacingM, management, outlet));
  const own = field.drains;
  let baselineIndex = designs.findIndex(
    (d) =>
      d.depthM === own.depth && d.spacingM === own.spacing && key(d.outlet) === key(field.outlet),
  );
  if (baselineIndex < 0) {
    const named = managements.find(([, outlet]) => key(outlet) === key(field.outlet));
    designs.unshift(make(own.depth, own.spacing, named?.[0] ?? 'as given', field.outlet));
    designs[0].name += ' (field as given)';
    designs[0].inGrid = false;
    baselineIndex = 0;
  }
  designs[baselineIndex].isBaseline = true;

  const params: UncertainParam[] = Object.entries(sw.uncertain).map(([k, u]) => {
    const soilKey = k.slice('soil.'.length);
    const schema = (soilSchema.shape as Record<string, z.ZodType>)[soilKey];
    // The values passed the soil key's schema when the file was read (checkSweep); here they
    // are parsed the same way to get numbers in the key's unit.
    const num = (v: unknown) => schema.parse(v) as number;
    return {
      key: k,
      soilKey,
      low: num(u.low),
      high: num(u.high),
      scale: u.scale,
      column: `${k.replace('.', '_').replace(/[A-Z]/g, (c) => '_' + c.toLowerCase())}${unitSuffix(schema.description)}`,
    };
  });
  const unit = latinHypercube(nSamples, params.length, seed);
  const samples = unit.map((row) =>
    params.map((p, d) => (params.length ? scaledValue(row[d], p.low, p.high, p.scale) : 0)),
  );
  return { field, designs, baselineIndex, params, samples, seed, costs, costsGiven };
}

/** A row of designs.csv (column names end with their unit). */
export type DesignRow = Record<string, string | number | boolean>;

/** The summary of a sweep. */
export interface SweepResult {
  plan: SweepPlan;
  from: string;
  to: string;
  years: number;
  measures: string[];
  /** One row per design, in plan order. */
  designs: DesignRow[];
  /** One row per design and soil sample. */
  samples: DesignRow[];
  /** Indices of the frontier designs, lowest median load first. */
  frontier: number[];
  /** Column names of the cost figures (with the currency label). */
  costColumns: { capital: string; annual: string; annualChange: string; perKg: string };
}

function percentile(sorted: number[], p: number): number {
  const ok = sorted.filter((v) => !Number.isNaN(v));
  return ok.length ? quantileSorted(ok, p) : NaN;
}

/**
 * Summarise the job results of a whole sweep (`values`: jobs in order, `measures` per job).
 */
export function summariseSweep(
  plan: SweepPlan,
  period: { from: string; to: string; years: number },
  jobs: JobResults,
): SweepResult {
  const { measures, values } = jobs;
  const S = plan.samples.length;
  const M = measures.length;
  const at = (d: number, s: number, m: number) => values[(d * S + s) * M + m];
  const loadM = measures.indexOf(LOAD_MEASURE);
  const wetM = measures.indexOf(WETNESS_MEASURE);
  if (loadM < 0 || wetM < 0) throw new Error('annual table lacks the load or wetness measure');
  const cur = plan.costs.currency.toLowerCase();
  const costColumns = {
    capital: `capital_cost_${cur}_ha`,
    annual: `annual_cost_${cur}_ha`,
    annualChange: `annual_cost_change_${cur}_ha`,
    perKg: `cost_per_kg_n_avoided_${cur}_kg`,
  };
  const b = plan.baselineIndex;
  const baseCost = plan.designs[b].cost.annualPerHa;
  const median = (xs: number[]) =>
    percentile(
      [...xs].sort((x, y) => x - y),
      0.5,
    );

  // Frontier at the medians, and in each soil sample.
  const medianOf = (d: number, m: number) =>
    median(Array.from({ length: S }, (_, s) => at(d, s, m)));
  const aims = plan.designs.map((x, d) => [
    medianOf(d, loadM),
    medianOf(d, wetM),
    x.cost.annualPerHa,
  ]);
  const onFrontier = nonDominated(aims);
  const share = new Array<number>(plan.designs.length).fill(0);
  for (let s = 0; s < S; s++) {
    const nd = nonDominated(
      plan.designs.map((x, d) => [at(d, s, loadM), at(d, s, wetM), x.cost.annualPerHa]),
    );
    nd.forEach((v, d) => (share[d] += v ? 1 / S : 0));
  }

  // Column names once per measure, not once per design.
  const spreadColumns = measures.map((n) => [measureColumn(n, 'p10'), measureColumn(n, 'p90')]);
  const changeColumns = measures.map((n) => measureColumn(n, 'change'));
  const designs: DesignRow[] = plan.designs.map((x, d) => {
    const row: DesignRow = {
      design: x.name,
      depth_m: x.depthM,
      spacing_m: x.spacingM,
      management: x.management,
      is_baseline: x.isBaseline,
      lateral_length_m_ha: x.cost.lateralMPerHa,
      [costColumns.capital]: x.cost.capitalPerHa,
      [costColumns.annual]: x.cost.annualPerHa,
      [costColumns.annualChange]: x.cost.annualPerHa - baseCost,
    };
    measures.forEach((name, m) => {
      const own = Array.from({ length: S }, (_, s) => at(d, s, m)).sort((p, q) => p - q);
      const ok = own.filter((v) => !Number.isNaN(v));
      const [p10, p90] = spreadColumns[m];
      row[name] = ok.length ? quantileSorted(ok, 0.5) : NaN;
      row[p10] = ok.length ? quantileSorted(ok, 0.1) : NaN;
      row[p90] = ok.length ? quantileSorted(ok, 0.9) : NaN;
    });
    measures.forEach((_, m) => {
      row[changeColumns[m]] = median(
        Array.from({ length: S }, (_, s) => at(d, s, m) - at(b, s, m)),
      );
    });
    const avoided = median(Array.from({ length: S }, (_, s) => at(b, s, loadM) - at(d, s, loadM)));
    row.no3n_load_avoided_kg_ha = avoided;
    row[costColumns.perKg] = avoided > 1e-9 ? (x.cost.annualPerHa - baseCost) / avoided : NaN;
    row.on_frontier = onFrontier[d];
    row.frontier_share = share[d];
    return row;
  });

  const samples: DesignRow[] = [];
  plan.designs.forEach((x, d) => {
    for (let s = 0; s < S; s++) {
      const row: DesignRow = { design: x.name, sample: s + 1 };
      plan.params.forEach((p, k) => (row[p.column] = plan.samples[s][k]));
      measures.forEach((name, m) => (row[name] = at(d, s, m)));
      samples.push(row);
    }
  });
  const frontier = plan.designs
    .map((_, d) => d)
    .filter((d) => onFrontier[d])
    .sort((p, q) => aims[p][0] - aims[q][0] || aims[p][2] - aims[q][2] || p - q);
  return { plan, ...period, measures, designs, samples, frontier, costColumns };
}

/** Number of jobs of a plan: designs x soil samples. */
export function jobCount(plan: SweepPlan): number {
  return plan.designs.length * plan.samples.length;
}

/**
 * Run a whole sweep in this thread (notebooks, the in-browser page; the CLI spreads the same
 * jobs over worker threads).
 *
 * @example sweepField(field.base, weather, { samples: 10 }).frontier
 */
export function sweepField(
  field: Field,
  weather: WeatherSeries,
  o: SweepOptions & { onProgress?: (done: number, total: number) => void } = {},
): SweepResult {
  const plan = planSweep(field, o);
  const prepared = prepareField(field, weather, o);
  const total = jobCount(plan);
  let done = 0;
  const jobs = runSweepJobs(prepared, plan, 0, total, () => o.onProgress?.(++done, total));
  const { from, to } = prepared;
  return summariseSweep(plan, { from, to, years: yearsOf(from, to) }, jobs);
}

/** Calendar years touched by a period from ISO `from` to `to`. */
export function yearsOf(from: string, to: string): number {
  return Number(to.slice(0, 4)) - Number(from.slice(0, 4)) + 1;
}

/** Signed figure with a fixed number of decimals ("+1.2", "-0.5"). */
function signedText(x: number, d: number): string {
  const t = x.toFixed(d);
  return x > 0 && Number(t) !== 0 ? `+${t}` : Number(t) === 0 ? (0).toFixed(d) : t;
}

/**
 * The recommended candidates in words: the frontier designs, lowest median load first (at most
 * `max`), each with what it trades against the field as given.
 *
 * @example recommendationLines(result, 5)[0] // "1. 0.9 m x 30 m, winter hold: nitrate-N 36.8 kg/ha/yr (-28 %), ..."
 */
export function recommendationLines(r: SweepResult, max = 8): string[] {
  const base = r.designs[r.plan.baselineIndex];
  const cur = r.plan.costs.currency;
  const lines = r.frontier.slice(0, max).map((i, k) => {
    const d = r.designs[i];
    const load = Number(d[LOAD_MEASURE]);
    const baseLoad = Number(base[LOAD_MEASURE]);
    const pct = baseLoad > 0 ? ` (${signedText((100 * (load - baseLoad)) / baseLoad, 0)} %)` : '';
    const perKg = Number(d[r.costColumns.perKg]);
    return (
      `${k + 1}. ${d.design}: nitrate-N ${load.toFixed(1)} kg/ha/yr${pct}, ` +
      `aeration-stress days ${Number(d[WETNESS_MEASURE]).toFixed(1)}/yr (${signedText(Number(d[measureColumn(WETNESS_MEASURE, 'change')]), 1)}), ` +
      `cost ${Number(d[r.costColumns.annual]).toFixed(0)} ${cur}/ha/yr (${signedText(Number(d[r.costColumns.annualChange]), 0)})` +
      (Number.isFinite(perKg) ? `, ${perKg.toFixed(2)} ${cur} per kg N avoided` : '') +
      `; on the frontier in ${Math.round(100 * Number(d.frontier_share))} % of soil samples`
    );
  });
  if (r.frontier.length > max)
    lines.push(`... and ${r.frontier.length - max} more on the frontier (designs.csv).`);
  return lines;
}
