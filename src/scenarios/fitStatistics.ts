/**
 * Goodness of fit of a simulated daily series against observations: the statistics hydrologists
 * report when they show that a model represents a monitored site. Pure; days without an
 * observation (NaN) are left out pair by pair, and a statistic that does not exist for the data
 * (for example NSE of constant observations, whose variance is zero) is null, never a number
 * made up to fill the gap.
 *
 * Definitions, with o the observed and s the simulated values on the n paired days:
 * - NSE = 1 - sum (o - s)^2 / sum (o - mean o)^2 (Nash and Sutcliffe 1970).
 * - KGE = 1 - sqrt((r - 1)^2 + (alpha - 1)^2 + (beta - 1)^2), with r the Pearson correlation,
 *   alpha = sd s / sd o and beta = mean s / mean o (Gupta et al. 2009, Eq. 9).
 * - log-NSE: NSE of ln(x + eps) with eps = mean o / 100, so that days without flow count
 *   (the offset recommended by Pushpalatha et al. 2012; from memory).
 * - PBIAS = 100 sum (o - s) / sum o, percent; positive when the model underestimates
 *   (Gupta, Sorooshian and Yapo 1999; the sign convention of Moriasi et al. 2007).
 * - RMSE = sqrt(mean (s - o)^2), in the series' unit.
 * - R^2 = r^2, the square of the Pearson correlation.
 * - Peak error = 100 (max s - max o) / max o, percent, both maxima over the paired days.
 * - Volume error = sum s - sum o over the paired days (in the series' unit summed, e.g. mm), and
 *   as a percent of sum o.
 * Means, standard deviations (population) and the correlation come from simple-statistics.
 */
import { max, mean, sampleCorrelation, standardDeviation, sum } from 'simple-statistics';

/** Observed and simulated values on the days that have an observation. */
export interface Pairs {
  observed: number[];
  simulated: number[];
}

/**
 * Keep the days with a finite observation (and a finite simulation), optionally only the days
 * whose `mask` entry is non-zero (a calibration or validation period).
 * @example pairsOf([1, NaN, 3], [1.5, 2, 2.5]) // { observed: [1, 3], simulated: [1.5, 2.5] }
 */
export function pairsOf(
  observed: ArrayLike<number>,
  simulated: ArrayLike<number>,
  mask?: ArrayLike<number>,
): Pairs {
  const o: number[] = [];
  const s: number[] = [];
  for (let i = 0; i < observed.length; i++) {
    if (mask && !mask[i]) continue;
    if (Number.isFinite(observed[i]) && Number.isFinite(simulated[i])) {
      o.push(observed[i]);
      s.push(simulated[i]);
    }
  }
  return { observed: o, simulated: s };
}

/** A finite number, or null. */
function finite(x: number): number | null {
  return Number.isFinite(x) ? x : null;
}

/**
 * Nash-Sutcliffe efficiency (Nash and Sutcliffe 1970); null with fewer than 2 pairs or constant
 * observations.
 * @example nse({ observed: [1, 2, 3], simulated: [1, 2, 4] }) // 0.5
 */
export function nse(p: Pairs): number | null {
  const { observed: o, simulated: s } = p;
  if (o.length < 2) return null;
  const m = mean(o);
  let num = 0;
  let den = 0;
  for (let i = 0; i < o.length; i++) {
    num += (o[i] - s[i]) ** 2;
    den += (o[i] - m) ** 2;
  }
  return den > 0 ? finite(1 - num / den) : null;
}

/** Kling-Gupta efficiency and its three components. */
export interface Kge {
  kge: number | null;
  /** Pearson correlation of simulated with observed. */
  r: number | null;
  /** Variability ratio, sd simulated / sd observed. */
  alpha: number | null;
  /** Bias ratio, mean simulated / mean observed. */
  beta: number | null;
}

/**
 * KGE with r, alpha and beta (Gupta et al. 2009, Eq. 9); a component that does not exist
 * (constant observations: sd o = 0; mean o = 0) is null and so is KGE.
 * @example kge({ observed: [1, 2, 3], simulated: [2, 4, 6] }) // { kge: -0.414, r: 1, alpha: 2, beta: 2 }
 */
export function kge(p: Pairs): Kge {
  const { observed: o, simulated: s } = p;
  if (o.length < 2) return { kge: null, r: null, alpha: null, beta: null };
  const mo = mean(o);
  const sdo = standardDeviation(o);
  const sds = standardDeviation(s);
  const r = sdo > 0 && sds > 0 ? finite(sampleCorrelation(o, s)) : null;
  const alpha = sdo > 0 ? finite(sds / sdo) : null;
  const beta = mo !== 0 ? finite(mean(s) / mo) : null;
  const value =
    r === null || alpha === null || beta === null
      ? null
      : 1 - Math.sqrt((r - 1) ** 2 + (alpha - 1) ** 2 + (beta - 1) ** 2);
  return { kge: value, r, alpha, beta };
}

/**
 * NSE of log-transformed values with the offset eps = mean observed / 100 (Pushpalatha et al.
 * 2012, from memory); null when the offset is not positive or NSE does not exist.
 * @example logNse({ observed: [1, 10, 100], simulated: [1, 10, 100] }) // 1
 */
export function logNse(p: Pairs): number | null {
  if (p.observed.length < 2) return null;
  const eps = mean(p.observed) / 100;
  if (!(eps > 0)) return null;
  const ln = (x: number) => Math.log(Math.max(x, 0) + eps);
  return nse({ observed: p.observed.map(ln), simulated: p.simulated.map(ln) });
}

/**
 * Percent bias, 100 sum (o - s) / sum o: positive when the model underestimates (Moriasi et al.
 * 2007 convention); null when the observations sum to 0.
 * @example pbias({ observed: [2, 2], simulated: [1, 1] }) // 50
 */
export function pbias(p: Pairs): number | null {
  if (p.observed.length === 0) return null;
  const so = sum(p.observed);
  return so !== 0 ? finite((100 * (so - sum(p.simulated))) / so) : null;
}

/**
 * Root-mean-square error in the unit of the series; null without pairs.
 * @example rmse({ observed: [0, 0], simulated: [3, 4] }) // 3.5355
 */
export function rmse(p: Pairs): number | null {
  const n = p.observed.length;
  if (n === 0) return null;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (p.simulated[i] - p.observed[i]) ** 2;
  return Math.sqrt(ss / n);
}

/** Everything reported for one series over one period. */
export interface FitStatistics {
  /** Paired days (days with an observation). */
  n: number;
  nse: number | null;
  kge: number | null;
  kgeR: number | null;
  kgeAlpha: number | null;
  kgeBeta: number | null;
  logNse: number | null;
  pbiasPercent: number | null;
  rmse: number | null;
  r2: number | null;
  meanObserved: number | null;
  meanSimulated: number | null;
  /** 100 (max s - max o) / max o; null when max o is 0 or there are no pairs. */
  peakErrorPercent: number | null;
  /** Sum s - sum o over the paired days. */
  volumeError: number | null;
  volumeErrorPercent: number | null;
}

/**
 * Every statistic of one series on its paired days.
 * @example fitStatistics(pairsOf(observedFlowMm, simulatedFlowMm)).nse
 */
export function fitStatistics(p: Pairs): FitStatistics {
  const n = p.observed.length;
  const k = kge(p);
  const so = n ? sum(p.observed) : 0;
  const ss = n ? sum(p.simulated) : 0;
  const maxO = n ? max(p.observed) : 0;
  return {
    n,
    nse: nse(p),
    kge: k.kge,
    kgeR: k.r,
    kgeAlpha: k.alpha,
    kgeBeta: k.beta,
    logNse: logNse(p),
    pbiasPercent: pbias(p),
    rmse: rmse(p),
    r2: k.r === null ? null : k.r * k.r,
    meanObserved: n ? mean(p.observed) : null,
    meanSimulated: n ? mean(p.simulated) : null,
    peakErrorPercent: n && maxO !== 0 ? (100 * (max(p.simulated) - maxO)) / maxO : null,
    volumeError: n ? ss - so : null,
    volumeErrorPercent: n && so !== 0 ? (100 * (ss - so)) / so : null,
  };
}
