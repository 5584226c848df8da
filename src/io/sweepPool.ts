/**
 * A sweep spread over worker threads (piscina). The main thread plans the sweep, starts the
 * workers (they load their modules meanwhile) and prepares the field once; plan and prepared
 * field are serialized once into shared memory, which every task carries for free, and each
 * worker reads them on its first task. The jobs (one per design and soil sample) are cut into
 * ranges, largest first, and the results are put back in job order, so the outcome is the same,
 * byte for byte, for any number of workers and any split. A study under several climates runs
 * all its sweeps on one pool.
 */
import { availableParallelism } from 'node:os';
import { serialize } from 'node:v8';
import { Piscina } from 'piscina';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import type { Field } from '../scenarios/fieldSchema.js';
import { preparedDataOf, preparedFieldOf, type PreparedData } from '../scenarios/prepared.js';
import {
  jobCount,
  planSweep,
  summariseSweep,
  yearsOf,
  type JobResults,
  type SweepOptions,
  type SweepPlan,
  type SweepResult,
} from '../scenarios/sweep.js';
import {
  checkClimateNames,
  climateFigures,
  climateSweepOf,
  studyOf,
  type ClimateInput,
  type ClimateStudy,
} from '../scenarios/sweepClimates.js';
import { unguarded } from './workerErrors.js';

/** What a worker needs to run any job of a sweep. */
export interface SweepSetup {
  plan: SweepPlan;
  prepared: PreparedData;
}

/** One range of jobs as a worker receives it. */
export interface SweepTask {
  /** Names the sweep, so a worker reads each setup once. */
  id: number;
  /** The `SweepSetup`, serialized by `node:v8` into shared memory (cloned to workers for free). */
  setup: Uint8Array;
  start: number;
  end: number;
}

export interface ParallelOptions extends SweepOptions {
  /** Worker threads (default: the cores available, at most 8). */
  workers?: number | undefined;
  /** Called after each range of jobs with the jobs done so far. */
  onProgress?: (done: number, total: number) => void;
  /** Stops the sweep: running and queued ranges are abandoned and the promise rejects. */
  signal?: AbortSignal;
}

/** Setups serialized by this thread so far (the id of the next one). */
let setups = 0;

/**
 * Ranges [start, end) covering `total` jobs, largest first: each takes a share of what is left,
 * so the workers start on long ranges (few messages) and finish on short ones together (little
 * waiting at the end). From 50 jobs a range (for a lively progress bar) down to 5.
 */
export function jobRanges(total: number, workers: number): Array<{ start: number; end: number }> {
  const ranges: Array<{ start: number; end: number }> = [];
  const least = Math.min(5, Math.ceil(total / (workers * 100)));
  for (let start = 0; start < total;) {
    const size = Math.max(least, Math.min(50, Math.ceil((total - start) / (workers * 4))));
    const end = Math.min(total, start + size);
    ranges.push({ start, end });
    start = end;
  }
  return ranges;
}

/** The sweep's options without the pool's own. */
function sweepOptionsOf(o: SweepOptions): SweepOptions {
  return { samples: o.samples, seed: o.seed, from: o.from, to: o.to, warmupYears: o.warmupYears };
}

/** A pool of `workers` sweep workers; they start loading their modules at once. */
function sweepPool(workers: number): Piscina {
  return new Piscina({
    filename: new URL('./sweepWorker.js', import.meta.url).href,
    minThreads: workers,
    maxThreads: workers,
    idleTimeout: 60_000,
  });
}

function workerCount(o: ParallelOptions, total: number): number {
  return Math.max(1, Math.min(o.workers ?? Math.min(availableParallelism(), 8), total));
}

/** Aborting `signal` destroys the pool; the returned function stops listening. */
function stopOn(pool: Piscina, signal: AbortSignal | undefined): () => void {
  const stop = () => void pool.destroy();
  signal?.addEventListener('abort', stop);
  return () => signal?.removeEventListener('abort', stop);
}

/** Run one sweep on a started pool; `onJobs` is told of each range done. */
async function sweepOnPool(
  pool: Piscina,
  plan: SweepPlan,
  prepared: PreparedData,
  workers: number,
  onJobs: (jobs: number) => void,
  signal: AbortSignal | undefined,
): Promise<JobResults> {
  const bytes = serialize({ plan, prepared } satisfies SweepSetup);
  const setup = new Uint8Array(new SharedArrayBuffer(bytes.length));
  setup.set(bytes);
  const id = ++setups;
  const total = jobCount(plan);
  const ranges = jobRanges(total, workers);
  if (signal?.aborted) throw new Error('stopped');
  const parts = await Promise.all(
    ranges.map((r) =>
      unguarded<JobResults>(pool.run({ id, setup, ...r } satisfies SweepTask)).then((res) => {
        onJobs(r.end - r.start);
        return res;
      }),
    ),
  );
  const M = parts[0].measures.length;
  const values = new Float64Array(total * M);
  parts.forEach((p, k) => values.set(p.values, ranges[k].start * M));
  return { measures: parts[0].measures, values };
}

/** The summary of a sweep's job results over the prepared period. */
function summaryOf(plan: SweepPlan, prepared: PreparedData, jobs: JobResults): SweepResult {
  const { from, to } = prepared;
  return summariseSweep(plan, { from, to, years: yearsOf(from, to) }, jobs);
}

/**
 * Plan a field's sweep, start a pool and run the sweep over each weather record in turn, with
 * `each` of each record's prepared data and job results (called for one record while the
 * workers run the next). `onProgress` counts the jobs of every record together.
 */
async function sweepsOnPool<T>(
  field: Field,
  records: readonly WeatherSeries[],
  o: ParallelOptions,
  each: (plan: SweepPlan, prepared: PreparedData, jobs: JobResults) => T,
): Promise<T[]> {
  const options = sweepOptionsOf(o);
  const plan = planSweep(field, options);
  const total = jobCount(plan) * records.length;
  const workers = workerCount(o, jobCount(plan));
  const pool = sweepPool(workers);
  const unlisten = stopOn(pool, o.signal);
  let closed: Promise<void> | undefined;
  try {
    let done = 0;
    const start = (weather: WeatherSeries) => {
      const prepared = preparedDataOf(field, weather, options);
      const onJobs = (n: number) => o.onProgress?.((done += n), total);
      const jobs = sweepOnPool(pool, plan, prepared, workers, onJobs, o.signal);
      // Awaited below; this only keeps a failure from being unhandled should `each` throw first.
      jobs.catch(() => {});
      return { prepared, jobs };
    };
    const out: T[] = [];
    let next = start(records[0]);
    for (let k = 0; k < records.length; k++) {
      const { prepared, jobs } = next;
      const results = await jobs;
      if (k + 1 < records.length) next = start(records[k + 1]);
      // After the last record the threads end while this one summarises.
      else closed = pool.destroy();
      out.push(each(plan, prepared, results));
    }
    return out;
  } finally {
    unlisten();
    await (closed ?? pool.destroy());
  }
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
  const [result] = await sweepsOnPool(field, [weather], o, summaryOf);
  return result;
}

/**
 * Run a field's sweep under each climate on worker threads, one climate after the other on one
 * pool of `o.workers`; `onProgress` counts the jobs of every climate together.
 *
 * @example await sweepClimatesParallel(field.base, [{ name: 'today', weather }], { workers: 2 })
 */
export async function sweepClimatesParallel(
  field: Field,
  climates: readonly ClimateInput[],
  o: ParallelOptions = {},
): Promise<ClimateStudy> {
  checkClimateNames(climates.map((c) => c.name));
  const sweeps = await sweepsOnPool(
    field,
    climates.map((c) => c.weather),
    o,
    (plan, prepared, jobs) => ({
      result: summaryOf(plan, prepared, jobs),
      figures: climateFigures(preparedFieldOf(prepared)),
    }),
  );
  return studyOf(climates.map((c, k) => climateSweepOf(c, sweeps[k].result, sweeps[k].figures)));
}
