/**
 * The jobs of a batch shard on worker threads (piscina). The main thread reads each weather file
 * once (cached by resolved path) into shared memory, so a record used by many jobs is neither
 * read nor copied again; each task carries its field and the shared weather, and the worker
 * returns the job's rows.
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import type { FieldWithScenarios } from '../scenarios/run.js';
import { runJob, type JobRows } from '../scenarios/batch.js';
import { unguarded } from './workerErrors.js';

/** One job as a worker receives it. */
export interface BatchTask {
  id: string;
  field: FieldWithScenarios;
  weather: WeatherSeries;
  only?: string[];
}

/** Runs jobs: in this thread (`workers` 0) or on a pool of worker threads. */
export interface BatchRunner {
  workers: number;
  run(task: BatchTask): Promise<JobRows>;
  /** Stop: running and queued jobs are abandoned (their promises reject). */
  close(): Promise<void>;
}

/** The default number of workers: the cores available, at most 8. */
export function defaultWorkers(): number {
  return Math.min(availableParallelism(), 8);
}

/** A copy of a weather record whose columns lie in shared memory (cloned to workers for free). */
export function sharedWeather(w: WeatherSeries): WeatherSeries {
  const share = (a: Float64Array) => {
    const b = new Float64Array(new SharedArrayBuffer(a.byteLength));
    b.set(a);
    return b;
  };
  return {
    ...w,
    precipMm: share(w.precipMm),
    tmaxC: share(w.tmaxC),
    tminC: share(w.tminC),
    ...(w.refEtMm && { refEtMm: share(w.refEtMm) }),
    ...(w.solarMJm2 && { solarMJm2: share(w.solarMJm2) }),
    ...(w.rhMeanPct && { rhMeanPct: share(w.rhMeanPct) }),
    ...(w.wind2mMs && { wind2mMs: share(w.wind2mMs) }),
  };
}

/**
 * A runner with `workers` threads, or running in this thread when `workers` is 0.
 * @example const runner = batchRunner(2); await runner.run({ id, field, weather }); await runner.close();
 */
export function batchRunner(workers: number): BatchRunner {
  if (workers === 0) {
    return {
      workers,
      run: async (t) => {
        // Let signals and progress through between jobs.
        await new Promise((r) => setImmediate(r));
        return runJob(t.id, t.field, t.weather, { only: t.only });
      },
      close: async () => {},
    };
  }
  const pool = new Piscina({
    filename: new URL('./batchWorker.js', import.meta.url).href,
    minThreads: workers,
    maxThreads: workers,
    idleTimeout: 60_000,
  });
  return {
    workers,
    run: (t) => unguarded<JobRows>(pool.run(t)),
    close: () => pool.destroy(),
  };
}
