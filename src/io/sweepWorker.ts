/**
 * Worker thread of a parallel sweep (piscina): prepares the field once from the worker data,
 * then runs the ranges of sweep jobs it is given. See `sweepParallel` in sweepPool.ts.
 */
import { workerData } from 'piscina';
import { prepareField, type PreparedField } from '../scenarios/prepared.js';
import { planSweep, runSweepJobs, type JobResults, type SweepPlan } from '../scenarios/sweep.js';
import type { SweepWorkerData } from './sweepPool.js';
import { guarded } from './workerErrors.js';

let state: { prepared: PreparedField; plan: SweepPlan } | undefined;

/** Run jobs [start, end) of the sweep described by the worker data. */
export default guarded((task: { start: number; end: number }): JobResults => {
  if (!state) {
    const { field, weather, options } = workerData as SweepWorkerData;
    state = { prepared: prepareField(field, weather, options), plan: planSweep(field, options) };
  }
  return runSweepJobs(state.prepared, state.plan, task.start, task.end);
});
