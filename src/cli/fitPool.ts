/**
 * The worker pool of `tileflux fit` (piscina): each worker gets the fit problem once and then
 * runs candidate evaluations in batches and local searches whole. Results come back in the order
 * they were asked for, so the fit is the same with any number of workers.
 */
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import type { FitProblem } from '../scenarios/fit.js';
import type { nelderMead, SearchRunner } from '../scenarios/optimise.js';
import type { FitTask } from './fitWorker.js';
import { unguarded } from '../io/workerErrors.js';

/** A search runner on `workers` threads, and the function that stops them. */
export function poolRunner(
  problem: FitProblem,
  weather: WeatherSeries,
  workers: number,
  onProgress: () => void = () => {},
): { runner: SearchRunner; close: () => Promise<void> } {
  const pool = new Piscina({
    filename: fileURLToPath(new URL('./fitWorker.js', import.meta.url)),
    // The prepared period holds caches and functions, which cannot be sent to a thread: each
    // worker prepares the same period again from the weather (same code, same numbers).
    workerData: {
      problem: { ...problem, period: undefined },
      weather,
      period: {
        from: problem.period.from,
        to: problem.period.to,
        warmupYears: problem.period.warmupYears,
      },
    },
    minThreads: workers,
    maxThreads: workers,
    idleTimeout: 1000,
  });
  const run = async <T>(task: FitTask): Promise<T> => {
    const out = await unguarded<T>(pool.run(task));
    onProgress();
    return out;
  };
  const runner: SearchRunner = {
    async evaluate(points) {
      const size = Math.ceil(points.length / workers);
      const batches: Array<Promise<number[]>> = [];
      for (let i = 0; i < points.length; i += size) {
        batches.push(run({ kind: 'evaluate', points: points.slice(i, i + size) }));
      }
      return (await Promise.all(batches)).flat();
    },
    localSearches: (starts, options) =>
      Promise.all(
        starts.map((start) =>
          run<ReturnType<typeof nelderMead>>({ kind: 'search', start, options }),
        ),
      ),
  };
  return { runner, close: () => pool.destroy() };
}
