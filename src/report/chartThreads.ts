/**
 * Charts drawn on worker threads (piscina). vega and resvg take about a third of a second to
 * load and the first charts are drawn cold; a command that will write charts starts the threads
 * before it parses and simulates, so loading and warming up overlap that work, and the charts
 * are then drawn side by side while the report is written. The files are the same as drawing in
 * this thread gives, byte for byte.
 */
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import type { ChartDrawer, DrawnChart } from './chartFiles.js';
import type { ChartTask } from './chartThread.js';

/** Started chart threads: their drawer (for writeCharts' `draw`) and their end. */
export interface ChartThreads {
  draw: ChartDrawer;
  /** Ends the threads; a drawing under way is abandoned (its promise rejects). */
  close: () => Promise<void>;
}

/**
 * Start `threads` chart threads (default: two, or one on a one-core machine). Every chart of a
 * drawing has settled before its promise resolves or rejects.
 *
 * @example const charts = startChartThreads(); await writeCharts(dir, specs, { draw: charts.draw }); await charts.close();
 */
export function startChartThreads(threads = Math.min(2, availableParallelism())): ChartThreads {
  const pool = new Piscina({
    filename: new URL('./chartThread.js', import.meta.url).href,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 60_000,
  });
  return {
    draw: async (specs, pngScale) => {
      const settled = await Promise.allSettled(
        Object.entries(specs).map(
          ([name, spec]) =>
            pool.run({ name, spec, pngScale } satisfies ChartTask) as Promise<DrawnChart>,
        ),
      );
      return settled.map((r) => {
        if (r.status === 'rejected') throw r.reason;
        return r.value;
      });
    },
    close: () => pool.destroy(),
  };
}
