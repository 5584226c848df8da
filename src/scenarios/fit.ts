/**
 * Calibration of a field against observations at a monitored site (`tileflux fit`): the loss of
 * a parameter set, the seeded multi-start search over the chosen parameters, the behavioural
 * range, and the statistics of the best set on the calibration and validation periods.
 *
 * The forcing, crop calendar and outlet series are prepared once (`preparePeriod`,
 * `prepareScenario`); each candidate only reruns the engine with the changed parameters. The
 * simulated midpoint water-table depth is compared with wells midway between drains.
 *
 * Loss of one series (lower is better): 1 - KGE, 1 - NSE, 1 - log-NSE, or RMSE / sd of the
 * observations (RSR, Moriasi et al. 2007) for `rmse`, so that flow (mm/d) and water-table depth
 * (m) combine as pure numbers: loss = sum w_v loss_v / sum w_v over the observed series.
 * Pure: the worker pool and the files live outside the core.
 */
import { standardDeviation } from 'simple-statistics';
import type { EngineResult } from '../engine/types.js';
import type { Field } from './fieldSchema.js';
import { fieldValue, fitParameter, withValue, type FitParameter } from './fitParams.js';
import {
  fitStatistics,
  kge,
  logNse,
  nse,
  pairsOf,
  rmse,
  type FitStatistics,
  type Pairs,
} from './fitStatistics.js';
import { multiStart, type Point, type SearchRunner } from './optimise.js';
import { engineParamsOf, scenarioOf } from './resolve.js';
import { prepareScenario, runEngine, type PreparedPeriod, type PreparedScenario } from './run.js';

export const FIT_OBJECTIVES = ['kge', 'nse', 'lognse', 'rmse'] as const;
export type FitObjective = (typeof FIT_OBJECTIVES)[number];

/** Loss given to a set whose statistic does not exist (e.g. no simulated flow at all). */
export const NO_STATISTIC_LOSS = 1000;

/** Observed series aligned with the period's days (NaN on days without an observation). */
export interface AlignedObservations {
  drainflowMm?: Float64Array;
  waterTableDepthM?: Float64Array;
  /** Carried along for the outputs; not fitted. */
  no3MgL?: Float64Array;
}

/** Everything one candidate evaluation needs; plain data, so it can be sent to a worker. */
export interface FitProblem {
  period: PreparedPeriod;
  base: Field;
  paths: string[];
  /** Search bounds per parameter, in its unit. */
  bounds: Array<[number, number]>;
  objective: FitObjective;
  weights: { flow: number; waterTable: number };
  observed: AlignedObservations;
  /** 1 on the days of the calibration period. */
  calibration: Uint8Array;
  /** 1 on the days of the validation period (all 0 without one). */
  validation: Uint8Array;
}

function registry(path: string): FitParameter {
  const p = fitParameter(path);
  if (!p) throw new Error(`unknown fit parameter ${path}`);
  return p;
}

/** Parameter values from unit-cube coordinates (log or linear between the bounds). */
export function valuesOf(problem: FitProblem, u: Point): number[] {
  return u.map((x, j) => {
    const [lo, hi] = problem.bounds[j];
    return registry(problem.paths[j]).log && lo > 0 ? lo * (hi / lo) ** x : lo + x * (hi - lo);
  });
}

/** Unit-cube coordinates of parameter values (clamped into the bounds). */
export function unitOf(problem: FitProblem, values: number[]): Point {
  return values.map((v, j) => {
    const [lo, hi] = problem.bounds[j];
    const x = Math.min(Math.max(v, lo), hi);
    const t =
      registry(problem.paths[j]).log && lo > 0
        ? Math.log(x / lo) / Math.log(hi / lo)
        : (x - lo) / (hi - lo);
    return Number.isFinite(t) ? t : 0.5;
  });
}

/** The base field with the parameter values in place. */
export function fieldWith(base: Field, paths: string[], values: number[]): Field {
  return paths.reduce((f, path, j) => withValue(f, path, values[j]), base);
}

/** The engine run of a parameter set over the whole period. */
export function simulateWith(
  problem: FitProblem,
  prepared: PreparedScenario,
  values: number[],
): EngineResult {
  return runEngine(
    problem.period,
    prepared,
    engineParamsOf(fieldWith(problem.base, problem.paths, values)),
  );
}

/** The loss of one series (see the module comment). */
export function seriesLoss(objective: FitObjective, p: Pairs): number {
  let loss: number | null;
  switch (objective) {
    case 'kge':
      loss = nullOr(kge(p).kge, (k) => 1 - k);
      break;
    case 'nse':
      loss = nullOr(nse(p), (x) => 1 - x);
      break;
    case 'lognse':
      loss = nullOr(logNse(p), (x) => 1 - x);
      break;
    case 'rmse': {
      const sd = p.observed.length > 1 ? standardDeviation(p.observed) : 0;
      loss = sd > 0 ? nullOr(rmse(p), (x) => x / sd) : null;
      break;
    }
  }
  return loss === null || !Number.isFinite(loss) ? NO_STATISTIC_LOSS : loss;
}

function nullOr(x: number | null, f: (x: number) => number): number | null {
  return x === null ? null : f(x);
}

/** Weighted loss of an engine run on the days of `mask`. */
export function lossOfRun(problem: FitProblem, run: EngineResult, mask: Uint8Array): number {
  let num = 0;
  let den = 0;
  const { drainflowMm, waterTableDepthM } = problem.observed;
  if (drainflowMm && problem.weights.flow > 0) {
    num +=
      problem.weights.flow *
      seriesLoss(problem.objective, pairsOf(drainflowMm, run.drainflowMm, mask));
    den += problem.weights.flow;
  }
  if (waterTableDepthM && problem.weights.waterTable > 0) {
    num +=
      problem.weights.waterTable *
      seriesLoss(problem.objective, pairsOf(waterTableDepthM, run.waterTableDepthM, mask));
    den += problem.weights.waterTable;
  }
  return den > 0 ? num / den : NO_STATISTIC_LOSS;
}

/**
 * The calibration loss of unit-cube points, with the scenario prepared once.
 * @example const loss = calibrationLoss(problem); loss([0.5, 0.5, 0.5])
 */
export function calibrationLoss(problem: FitProblem): (u: Point) => number {
  const prepared = prepareScenario(problem.period, scenarioOf('fit', '', problem.base));
  return (u) =>
    lossOfRun(problem, simulateWith(problem, prepared, valuesOf(problem, u)), problem.calibration);
}

/** Statistics of flow and water table on one period. */
export interface PeriodStatistics {
  from: string | null;
  to: string | null;
  drainflow?: FitStatistics;
  waterTable?: FitStatistics;
  loss: number | null;
}

/** Statistics of an engine run on the days of `mask`. */
export function periodStatistics(
  problem: FitProblem,
  run: EngineResult,
  mask: Uint8Array,
): PeriodStatistics {
  const dates = problem.period.forcing.dates;
  const first = mask.indexOf(1);
  const last = mask.lastIndexOf(1);
  const out: PeriodStatistics = {
    from: first >= 0 ? dates[first] : null,
    to: last >= 0 ? dates[last] : null,
    loss: first >= 0 ? lossOfRun(problem, run, mask) : null,
  };
  const { drainflowMm, waterTableDepthM } = problem.observed;
  if (drainflowMm) out.drainflow = fitStatistics(pairsOf(drainflowMm, run.drainflowMm, mask));
  if (waterTableDepthM) {
    out.waterTable = fitStatistics(pairsOf(waterTableDepthM, run.waterTableDepthM, mask));
  }
  return out;
}

export interface FitParameterResult {
  path: string;
  unit: string;
  bounds: [number, number];
  /** The field's own value (where the search started). */
  start: number;
  best: number;
  /** Smallest and largest value among the behavioural sets. */
  behavioural: [number, number];
}

export interface FitResult {
  objective: FitObjective;
  parameters: FitParameterResult[];
  /** Calibration loss of the best set and of the start. */
  bestLoss: number;
  startLoss: number;
  /** Behavioural sets: loss within `tolerance` of the best. */
  behaviouralTolerance: number;
  behaviouralSets: number;
  modelRuns: number;
  seed: number;
  calibration: PeriodStatistics;
  validation: PeriodStatistics | null;
  /** The best run over the whole period. */
  bestRun: EngineResult;
  /** The base field with the best values in place. */
  fitted: Field;
}

export interface FitSearchOptions {
  seed: number;
  behaviouralTolerance: number;
  samples?: number;
  starts?: number;
  maxEvaluations?: number;
}

/**
 * Fit the problem's parameters: multi-start search from the field's own values (seeded), then
 * the statistics of the best set.
 * @example const r = await fitField(problem, localRunner(calibrationLoss(problem)), { seed: 1, behaviouralTolerance: 0.05 });
 */
export async function fitField(
  problem: FitProblem,
  runner: SearchRunner,
  o: FitSearchOptions,
): Promise<FitResult> {
  const startValues = problem.paths.map((path, j) => {
    const v = fieldValue(problem.base, path);
    if (v === undefined) throw new Error(`${path} has no single value to fit`);
    const [lo, hi] = problem.bounds[j];
    return Math.min(Math.max(v, lo), hi);
  });
  const start = unitOf(problem, startValues);
  const search = await multiStart(runner, {
    dimensions: problem.paths.length,
    seed: o.seed,
    start,
    samples: o.samples,
    starts: o.starts,
    maxEvaluations: o.maxEvaluations,
  });
  // Values as written to fitted.yaml (four significant digits, inside the bounds): the
  // statistics below are those of the written values, so `tileflux run fitted.yaml` agrees.
  const best = valuesOf(problem, search.best.u).map((v, j) => {
    const [lo, hi] = problem.bounds[j];
    return Math.min(Math.max(Number(v.toPrecision(4)), lo), hi);
  });
  const limit = search.best.loss + o.behaviouralTolerance;
  const behavioural = search.evaluated
    .filter((e) => e.loss <= limit)
    .map((e) => valuesOf(problem, e.u));
  const prepared = prepareScenario(problem.period, scenarioOf('fit', '', problem.base));
  const bestRun = simulateWith(problem, prepared, best);
  const hasValidation = problem.validation.includes(1);
  return {
    objective: problem.objective,
    parameters: problem.paths.map((path, j) => ({
      path,
      unit: registry(path).unit,
      bounds: problem.bounds[j],
      start: startValues[j],
      best: best[j],
      behavioural: [
        Math.min(...behavioural.map((b) => b[j])),
        Math.max(...behavioural.map((b) => b[j])),
      ],
    })),
    bestLoss: lossOfRun(problem, bestRun, problem.calibration),
    startLoss: search.evaluated[0].loss,
    behaviouralTolerance: o.behaviouralTolerance,
    behaviouralSets: behavioural.length,
    modelRuns: search.evaluated.length,
    seed: o.seed,
    calibration: periodStatistics(problem, bestRun, problem.calibration),
    validation: hasValidation ? periodStatistics(problem, bestRun, problem.validation) : null,
    bestRun,
    fitted: fieldWith(problem.base, problem.paths, best),
  };
}
