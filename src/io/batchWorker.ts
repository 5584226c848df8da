/**
 * Worker thread of a batch (piscina): runs one job and returns its rows. See batchPool.ts.
 */
import { runJob, type JobRows } from '../scenarios/batch.js';
import type { BatchTask } from './batchPool.js';
import { guarded } from './workerErrors.js';

export default guarded((t: BatchTask): JobRows =>
  runJob(t.id, t.field, t.weather, { only: t.only }),
);
