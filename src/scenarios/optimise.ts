/**
 * A small seeded optimiser for bounded parameter searches: multi-start local search in the unit
 * cube. Stage 1 evaluates a Latin hypercube sample (McKay, Beckman and Conover 1979) plus the
 * given start; stage 2 runs a bounded Nelder-Mead simplex search (Nelder and Mead 1965, with the
 * standard coefficients: reflection 1, expansion 2, contraction 1/2, shrink 1/2) from the start
 * and from the best distinct sample points. Points are kept inside [0, 1]^d by clamping.
 *
 * Everything is deterministic for a seed: the sample comes from the seeded sfc32 generator and
 * Nelder-Mead uses no random numbers, so each local search can run on its own worker thread and
 * the combined result does not depend on which finishes first. Pure: no Node imports.
 */
import { sfc32 } from '../climate/random.js';

export type Point = number[];
/** A point and its loss (lower is better). */
export interface Evaluated {
  u: Point;
  loss: number;
}

/**
 * A Latin hypercube sample of `n` points in [0, 1]^d: each coordinate's range is cut into n
 * equal strata, one point per stratum, strata paired at random (seeded), position inside a
 * stratum uniform.
 * @example latinHypercube(10, 3, 7).length // 10
 */
export function latinHypercube(n: number, d: number, seed: number): Point[] {
  const u = sfc32(seed);
  const points: Point[] = Array.from({ length: n }, () => new Array<number>(d).fill(0));
  for (let j = 0; j < d; j++) {
    const perm = Array.from({ length: n }, (_, i) => i);
    for (let i = n - 1; i > 0; i--) {
      const k = Math.floor(u() * (i + 1));
      [perm[i], perm[k]] = [perm[k], perm[i]];
    }
    for (let i = 0; i < n; i++) points[i][j] = (perm[i] + u()) / n;
  }
  return points;
}

export interface NelderMeadOptions {
  /** Edge of the starting simplex in unit-cube coordinates. */
  step?: number;
  /** Largest number of loss evaluations. */
  maxEvaluations?: number | undefined;
  /** Stop when the losses of the simplex differ by less than this ... */
  lossTolerance?: number;
  /** ... and its vertices lie within this of the best (unit-cube coordinates). */
  pointTolerance?: number;
}

const clamp01 = (x: number) => (x < 0 ? 0 : x > 1 ? 1 : x);

/**
 * Bounded Nelder-Mead from `start`. Returns the best point and every point evaluated (for the
 * behavioural range).
 * @example nelderMead(([x, y]) => (x - 0.3) ** 2 + (y - 0.6) ** 2, [0.5, 0.5]).best.u // ~[0.3, 0.6]
 */
export function nelderMead(
  loss: (u: Point) => number,
  start: Point,
  o: NelderMeadOptions = {},
): { best: Evaluated; trace: Evaluated[] } {
  const d = start.length;
  const step = o.step ?? 0.1;
  const maxEval = o.maxEvaluations ?? 200 * d;
  const fTol = o.lossTolerance ?? 1e-7;
  const xTol = o.pointTolerance ?? 1e-4;
  const trace: Evaluated[] = [];
  const f = (u: Point): Evaluated => {
    const p = u.map(clamp01);
    const e = { u: p, loss: loss(p) };
    trace.push(e);
    return e;
  };
  // Starting simplex: the start and one step along each axis (back when the step leaves the cube).
  const simplex: Evaluated[] = [f(start)];
  for (let j = 0; j < d; j++) {
    const v = [...start];
    v[j] = v[j] + step <= 1 ? v[j] + step : v[j] - step;
    simplex.push(f(v));
  }
  const along = (c: Point, w: Point, t: number) => c.map((x, j) => x + t * (w[j] - x));
  while (trace.length < maxEval) {
    simplex.sort((a, b) => a.loss - b.loss);
    const best = simplex[0];
    const worst = simplex[d];
    const spreadF = worst.loss - best.loss;
    const spreadX = Math.max(
      ...simplex.slice(1).map((s) => Math.max(...s.u.map((x, j) => Math.abs(x - best.u[j])))),
    );
    if (spreadF < fTol && spreadX < xTol) break;
    const centroid = new Array<number>(d).fill(0);
    for (let i = 0; i < d; i++) for (let j = 0; j < d; j++) centroid[j] += simplex[i].u[j] / d;
    const reflected = f(along(centroid, worst.u, -1));
    if (reflected.loss < best.loss) {
      const expanded = f(along(centroid, worst.u, -2));
      simplex[d] = expanded.loss < reflected.loss ? expanded : reflected;
    } else if (reflected.loss < simplex[d - 1].loss) {
      simplex[d] = reflected;
    } else {
      const outside = reflected.loss < worst.loss;
      const contracted = f(along(centroid, worst.u, outside ? -0.5 : 0.5));
      if (contracted.loss < (outside ? reflected.loss : worst.loss)) simplex[d] = contracted;
      else {
        for (let i = 1; i <= d; i++) simplex[i] = f(along(best.u, simplex[i].u, 0.5));
      }
    }
  }
  simplex.sort((a, b) => a.loss - b.loss);
  return { best: simplex[0], trace };
}

/** What the search needs to evaluate losses: one batch, and one local search per start. */
export interface SearchRunner {
  evaluate(points: Point[]): Promise<number[]>;
  localSearches(
    starts: Point[],
    o: NelderMeadOptions,
  ): Promise<Array<{ best: Evaluated; trace: Evaluated[] }>>;
}

export interface MultiStartOptions extends NelderMeadOptions {
  dimensions: number;
  seed: number;
  /** Latin hypercube sample size (default 10 per dimension, at least 20). */
  samples?: number | undefined;
  /** Local searches: from `start` and from the best distinct sample points (default 3). */
  starts?: number | undefined;
  /** Where the first local search begins (e.g. the field's own values). */
  start?: Point;
}

export interface MultiStartResult {
  best: Evaluated;
  /** Every evaluated point, sample first, then each local search in order of its start. */
  evaluated: Evaluated[];
  /** Best point of each local search, in order of its start. */
  searchBests: Evaluated[];
}

/** A runner that evaluates in this thread. */
export function localRunner(loss: (u: Point) => number): SearchRunner {
  return {
    evaluate: async (points) => points.map(loss),
    localSearches: async (starts, o) => starts.map((s) => nelderMead(loss, s, o)),
  };
}

/**
 * Multi-start bounded search (seeded): sample, then local searches from the start and from the
 * best sample points at least 0.1 apart (unit-cube max-norm).
 * @example await multiStart(localRunner(loss), { dimensions: 3, seed: 1 })
 */
export async function multiStart(
  runner: SearchRunner,
  o: MultiStartOptions,
): Promise<MultiStartResult> {
  const d = o.dimensions;
  const n = o.samples ?? Math.max(20, 10 * d);
  const sample = latinHypercube(n, d, o.seed);
  const points = o.start ? [o.start.map(clamp01), ...sample] : sample;
  const losses = await runner.evaluate(points);
  const evaluated: Evaluated[] = points.map((u, i) => ({ u, loss: losses[i] }));
  const order = [...evaluated].sort((a, b) => a.loss - b.loss);
  const starts: Point[] = o.start ? [points[0]] : [];
  const wanted = o.starts ?? 3;
  const far = (u: Point) =>
    starts.every((s) => Math.max(...s.map((x, j) => Math.abs(x - u[j]))) >= 0.1);
  for (const e of order) {
    if (starts.length >= wanted) break;
    if (far(e.u)) starts.push(e.u);
  }
  const searches = await runner.localSearches(starts, o);
  for (const s of searches) evaluated.push(...s.trace);
  const searchBests = searches.map((s) => s.best);
  let best = order[0];
  for (const b of searchBests) if (b.loss < best.loss) best = b;
  return { best, evaluated, searchBests };
}
