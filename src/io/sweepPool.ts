/**
 * A sweep spread over worker threads (piscina). The jobs (one per design and soil sample) are
 * cut into ranges and handed to the workers, each of which prepares the field once; the results
 * are put back in job order, so the outcome is the same, byte for byte, for any number of
 * workers and any split.
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import type { Field } from '../scenarios/fieldSchema.js';
import { reportPeriod } from '../scenarios/prepared.js';
import {
  jobCount,
  planSweep,
  summariseSweep,
  yearsOf,
  type JobResults,
  type SweepOptions,
  type SweepResult,
} from '../scenarios/sweep.js';
import {
  checkClimateNames,
  climateFiguresOf,
  climateSweepOf,
  studyOf,
  type ClimateInput,
  type ClimateStudy,
} from '../scenarios/sweepClimates.js';
import { unguarded } from './workerErrors.js';

/** What every worker receives once. */
export interface SweepWorkerData {
  field: Field;
  weather: WeatherSeries;
  options: SweepOptions;
}

export interface ParallelOptions extends SweepOptions {
  /** Worker threads (default: the cores available, at most 8). */
  workers?: number | undefined;
  /** Called after each range of jobs with the jobs done so far. */
  onProgress?: (done: number, total: number) => void;
  /** Stops the sweep: running and queued ranges are abandoned and the promise rejects. */
  signal?: AbortSignal;
}

/**
 * Run a field's sweep on worker threads.
 *
 * @example const result = await sweepParallel(field.base, weather, { samples: 40, workers: 2 });
 */
export async function sweepParallel(
  field: Field,
  weather: WeatherSeries,
  o: ParallelOptions = {},
): Promise<SweepResult> {
  const options: SweepOptions = {
    samples: o.samples,
    seed: o.seed,
    from: o.from,
    to: o.to,
    warmupYears: o.warmupYears,
  };
  const plan = planSweep(field, options);
  const period = reportPeriod(weather.dates, options);
  const total = jobCount(plan);
  const workers = Math.max(1, Math.min(o.workers ?? Math.min(availableParallelism(), 8), total));
  // Ranges small enough for an even spread and a lively progress bar, large enough that the
  // messages cost nothing beside the runs.
  const size = Math.max(1, Math.min(50, Math.ceil(total / (workers * 12))));
  const ranges: Array<{ start: number; end: number }> = [];
  for (let start = 0; start < total; start += size)
    ranges.push({ start, end: Math.min(total, start + size) });
  const pool = new Piscina({
    filename: new URL('./sweepWorker.js', import.meta.url).href,
    minThreads: workers,
    maxThreads: workers,
    idleTimeout: 60_000,
    workerData: { field, weather, options } satisfies SweepWorkerData,
  });
  let done = 0;
  const stop = () => void pool.destroy();
  o.signal?.addEventListener('abort', stop);
  try {
    if (o.signal?.aborted) throw new Error('stopped');
    const parts = await Promise.all(
      ranges.map((r) =>
        unguarded<JobResults>(pool.run(r)).then((res) => {
          done += r.end - r.start;
          o.onProgress?.(done, total);
          return res;
        }),
      ),
    );
    const M = parts[0].measures.length;
    const values = new Float64Array(total * M);
    parts.forEach((p, k) => values.set(p.values, ranges[k].start * M));
    return summariseSweep(
      plan,
      { ...period, years: yearsOf(period.from, period.to) },
      { measures: parts[0].measures, values },
    );
  } finally {
    o.signal?.removeEventListener('abort', stop);
    await pool.destroy();
  }
}

/**
 * Run a field's sweep under each climate on worker threads, one climate after the other (each
 * on its own pool of `o.workers`); `onProgress` counts the jobs of every climate together.
 *
 * @example await sweepClimatesParallel(field.base, [{ name: 'today', weather }], { workers: 2 })
 */
export async function sweepClimatesParallel(
  field: Field,
  climates: readonly ClimateInput[],
  o: ParallelOptions = {},
): Promise<ClimateStudy> {
  checkClimateNames(climates.map((c) => c.name));
  const sweeps = [];
  for (const [k, c] of climates.entries()) {
    const result = await sweepParallel(field, c.weather, {
      ...o,
      onProgress: (done, total) => o.onProgress?.(k * total + done, total * climates.length),
    });
    sweeps.push(climateSweepOf(c, result, climateFiguresOf(field, c.weather, o)));
  }
  return studyOf(sweeps);
}
