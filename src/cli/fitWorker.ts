/**
 * Worker thread of `tileflux fit`: receives the fit problem once (workerData), prepares the
 * scenario, and then evaluates batches of candidate points or runs whole local searches.
 */
import { workerData } from 'node:worker_threads';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import { calibrationLoss, type FitProblem } from '../scenarios/fit.js';
import { preparePeriod } from '../scenarios/run.js';
import { nelderMead, type NelderMeadOptions, type Point } from '../scenarios/optimise.js';
import { guarded } from '../io/workerErrors.js';

export type FitTask =
  | { kind: 'evaluate'; points: Point[] }
  | { kind: 'search'; start: Point; options: NelderMeadOptions };

const data = workerData as {
  problem: FitProblem;
  weather: WeatherSeries;
  period: { from: string; to: string; warmupYears: number };
};
const loss = calibrationLoss({
  ...data.problem,
  period: preparePeriod(data.weather, data.problem.base.site, data.period),
});

/** Run one task: losses of a batch, or one bounded Nelder-Mead search. */
export default guarded((task: FitTask) =>
  task.kind === 'evaluate' ? task.points.map(loss) : nelderMead(loss, task.start, task.options),
);
