/**
 * Running the jobs of a sweep (job j = design floor(j / S), soil sample j mod S; see
 * `scenarios/sweep.ts` for the plan and the summary): any range of jobs on a prepared field, one
 * row of measures per job. Kept apart from the planning and the summary so that a sweep's worker
 * threads load only what runs designs (no zod schemas, no unit parser, no statistics).
 */
import type { Field } from './fieldSchema.js';
import { runDesign, type PreparedField } from './prepared.js';
import { scenarioOf } from './resolve.js';
import type { SweepPlan } from './sweep.js';
import type { AnnualRow } from './types.js';

/** Annual columns that are bookkeeping or weather, not results of a design. */
const NOT_MEASURES = new Set([
  'year',
  'days',
  'precip_mm',
  'snowmelt_mm',
  'ref_et_mm',
  'storage_change_mm',
  'balance_error_mm',
  'n_balance_error_kg_ha',
  'spring_window_days',
  'fall_window_days',
]);

/** The nitrate-N load measure of the frontier. */
export const LOAD_MEASURE = 'no3n_load_kg_ha';

/** The field with the soil values of sample `s`. */
export function sampledField(plan: SweepPlan, s: number): Field {
  if (plan.params.length === 0) return plan.field;
  const soil: Record<string, unknown> = { ...plan.field.soil };
  plan.params.forEach((p, d) => (soil[p.soilKey] = plan.samples[s][d]));
  return { ...plan.field, soil: soil as Field['soil'] };
}

/** Mean annual value of every measure (flow-weighted concentration over the whole period). */
function measuresOf(rows: AnnualRow[]): { names: string[]; values: number[] } {
  const first = rows[0] as unknown as Record<string, unknown>;
  const names = Object.keys(first).filter(
    (k) => typeof first[k] === 'number' && !NOT_MEASURES.has(k),
  );
  const values = names.map((k) => {
    let sum = 0;
    for (const r of rows) sum += (r as unknown as Record<string, number>)[k];
    return sum / rows.length;
  });
  const flow = values[names.indexOf('drainflow_mm')];
  const fw = names.indexOf('fwmc_mg_l');
  if (fw >= 0) values[fw] = flow > 0 ? (100 * values[names.indexOf(LOAD_MEASURE)]) / flow : NaN;
  return { names, values };
}

/** Results of jobs [start, end): for each job, one value per measure, in `measures` order. */
export interface JobResults {
  measures: string[];
  values: Float64Array;
}

/**
 * Run jobs [start, end) of a sweep on a prepared field (see the module comment for the job
 * order). Pure and deterministic: the same jobs give the same numbers in any thread.
 */
export function runSweepJobs(
  prepared: PreparedField,
  plan: SweepPlan,
  start: number,
  end: number,
  onJob?: () => void,
): JobResults {
  const S = plan.samples.length;
  let measures: string[] = [];
  let values = new Float64Array(0);
  const fields = new Map<number, Field>();
  // Each design's daily columns are written over the previous design's: only its measures stay.
  let last: ReturnType<typeof runDesign> | undefined;
  for (let j = start; j < end; j++) {
    const d = plan.designs[Math.floor(j / S)];
    const s = j % S;
    let sf = fields.get(s);
    if (!sf) fields.set(s, (sf = sampledField(plan, s)));
    const f: Field = {
      ...sf,
      drains: { ...sf.drains, depth: d.depthM, spacing: d.spacingM },
      outlet: d.outlet,
    };
    last = runDesign(prepared, scenarioOf(d.name, '', f), last);
    const { annual } = last;
    const m = measuresOf(annual);
    if (j === start) {
      measures = m.names;
      values = new Float64Array((end - start) * measures.length);
    }
    values.set(m.values, (j - start) * measures.length);
    onJob?.();
  }
  return { measures, values };
}
