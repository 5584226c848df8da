/**
 * A chart thread of the pool that chartThreads.ts starts (piscina): loads vega, vega-lite and
 * resvg at once and draws a small chart to warm them up, then draws each spec it is given and
 * returns its SVG and PNG. It writes no file: the main thread does (chartFiles.ts says why).
 */
import { drawCharts, type DrawnChart } from './chartFiles.js';

/** One chart to draw, named, at a PNG scale (PNG pixels per SVG pixel). */
export interface ChartTask {
  name: string;
  spec: object;
  pngScale: number;
}

// A line and a bar layer of a few points: the JIT warms the paths the run charts take, so the
// first real chart is drawn at near warm speed. The result is dropped, and so is a failure (the
// real charts report their own).
const WARM_UP = {
  width: 200,
  height: 100,
  data: { values: [0, 1, 2, 3, 4, 5].map((x) => ({ x, y: (x * 7) % 5, s: x % 2 ? 'a' : 'b' })) },
  layer: [
    {
      mark: 'line',
      encoding: {
        x: { field: 'x', type: 'quantitative' },
        y: { field: 'y', type: 'quantitative' },
        color: { field: 's' },
      },
    },
    {
      mark: 'bar',
      encoding: { x: { field: 'x', type: 'ordinal' }, y: { field: 'y', type: 'quantitative' } },
    },
  ],
};
await drawCharts({ warm: WARM_UP }, 1).catch(() => undefined);

/** Draw one chart. */
export default async function drawChart(task: ChartTask): Promise<DrawnChart> {
  const [chart] = await drawCharts({ [task.name]: task.spec }, task.pngScale);
  return chart;
}
