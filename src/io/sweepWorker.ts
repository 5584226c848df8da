/**
 * Worker thread of a parallel sweep (piscina): reads the sweep's setup (plan and prepared field)
 * on the first task that names it, then runs the ranges of sweep jobs it is given. See
 * `sweepParallel` in sweepPool.ts. It imports only what runs designs (`scenarios/sweepJobs.ts`),
 * not the planning with its schemas, so a worker is ready sooner.
 */
import { deserialize } from 'node:v8';
import { preparedFieldOf, type PreparedField } from '../scenarios/prepared.js';
import type { SweepPlan } from '../scenarios/sweep.js';
import { runSweepJobs, type JobResults } from '../scenarios/sweepJobs.js';
import type { SweepSetup, SweepTask } from './sweepPool.js';
import { guarded } from './workerErrors.js';

let state: { id: number; prepared: PreparedField; plan: SweepPlan } | undefined;

/** Run jobs [start, end) of the sweep the task names. */
export default guarded((task: SweepTask): JobResults => {
  if (state?.id !== task.id) {
    // A copy first: the typed arrays `deserialize` returns are views into the bytes it reads, and
    // the shared ones are every worker's.
    const { plan, prepared } = deserialize(task.setup.slice()) as SweepSetup;
    state = { id: task.id, prepared: preparedFieldOf(prepared), plan };
  }
  return runSweepJobs(state.prepared, state.plan, task.start, task.end);
});
