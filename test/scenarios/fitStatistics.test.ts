import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  fitStatistics,
  kge,
  logNse,
  nse,
  pairsOf,
  pbias,
  rmse,
} from '../../src/scenarios/fitStatistics.js';
import { KGE_MEAN_BENCHMARK, kgeVerdict, rate } from '../../src/scenarios/fitRatings.js';

// A small series worked by hand. o = 1..5 (mean 3, sum of squared deviations 10, population
// variance 2); s = 1.5, 2, 2.5, 4.5, 5.5 (mean 3.2, sum 16, squared deviations from 3.2 sum to
// 11.8, population variance 2.36); s - o = 0.5, 0, -0.5, 0.5, 0.5 (squares sum to 1.0);
// sum (o - 3)(s - 3.2) = 3.4 + 1.2 + 0 + 1.3 + 4.6 = 10.5.
const o = [1, 2, 3, 4, 5];
const s = [1.5, 2, 2.5, 4.5, 5.5];
const p = { observed: o, simulated: s };

describe('statistics on a hand-worked series', () => {
  it('NSE = 1 - 1.0 / 10 = 0.9 (Nash and Sutcliffe 1970)', () => {
    expect(nse(p)).toBeCloseTo(0.9, 12);
  });

  it('KGE and its components (Gupta et al. 2009, Eq. 9)', () => {
    // r = 10.5 / sqrt(10 x 11.8); alpha = sqrt(2.36 / 2); beta = 3.2 / 3.
    const r = 10.5 / Math.sqrt(118);
    const alpha = Math.sqrt(1.18);
    const beta = 3.2 / 3;
    const k = kge(p);
    expect(k.r).toBeCloseTo(r, 12);
    expect(k.alpha).toBeCloseTo(alpha, 12);
    expect(k.beta).toBeCloseTo(beta, 12);
    // 1 - sqrt((r-1)^2 + (alpha-1)^2 + (beta-1)^2), worked: 1 - sqrt(0.0011153 + 0.0074439 +
    // 0.0044444) = 0.885966.
    expect(k.kge).toBeCloseTo(0.885966, 6);
  });

  it('log-NSE on ln(x + mean o / 100) (offset of Pushpalatha et al. 2012, from memory)', () => {
    const eps = 0.03;
    const lo = o.map((x) => Math.log(x + eps));
    const ls = s.map((x) => Math.log(x + eps));
    const m = lo.reduce((a, b) => a + b, 0) / lo.length;
    let num = 0;
    let den = 0;
    lo.forEach((x, i) => {
      num += (x - ls[i]) ** 2;
      den += (x - m) ** 2;
    });
    expect(logNse(p)).toBeCloseTo(1 - num / den, 12);
    expect(logNse(p)).toBeCloseTo(0.864977, 6);
  });

  it('PBIAS = 100 (15 - 16) / 15 = -6.667 %: negative when the model overestimates (Moriasi et al. 2007)', () => {
    expect(pbias(p)).toBeCloseTo(-100 / 15, 12);
  });

  it('RMSE = sqrt(1.0 / 5), R^2 = r^2, peak +10 %, volume +1 (+6.667 %)', () => {
    expect(rmse(p)).toBeCloseTo(Math.sqrt(0.2), 12);
    const f = fitStatistics(p);
    expect(f.n).toBe(5);
    expect(f.r2).toBeCloseTo(10.5 ** 2 / 118, 12);
    expect(f.peakErrorPercent).toBeCloseTo(10, 12); // (5.5 - 5) / 5
    expect(f.volumeError).toBeCloseTo(1, 12);
    expect(f.volumeErrorPercent).toBeCloseTo(100 / 15, 12);
    expect(f.meanObserved).toBe(3);
    expect(f.meanSimulated).toBeCloseTo(3.2, 12);
  });
});

describe('edge cases', () => {
  it('constant observations: NSE, KGE, r, alpha and R^2 do not exist (null); bias and RMSE do', () => {
    const f = fitStatistics({ observed: [2, 2, 2], simulated: [1, 2, 3] });
    expect(f.nse).toBeNull();
    expect(f.kge).toBeNull();
    expect(f.kgeR).toBeNull();
    expect(f.kgeAlpha).toBeNull();
    expect(f.r2).toBeNull();
    expect(f.kgeBeta).toBe(1);
    expect(f.pbiasPercent).toBe(0);
    expect(f.rmse).toBeCloseTo(Math.sqrt(2 / 3), 12);
  });

  it('observations all zero: bias, log-NSE and peak error are null rather than infinite', () => {
    const f = fitStatistics({ observed: [0, 0, 0], simulated: [0, 1, 0] });
    expect(f.pbiasPercent).toBeNull();
    expect(f.logNse).toBeNull();
    expect(f.peakErrorPercent).toBeNull();
    expect(f.volumeErrorPercent).toBeNull();
    expect(f.volumeError).toBe(1);
  });

  it('missing days (NaN) are left out pair by pair', () => {
    const pairs = pairsOf([1, NaN, 3, NaN, 5], [1.2, 99, 2.8, 99, 5]);
    expect(pairs).toEqual({ observed: [1, 3, 5], simulated: [1.2, 2.8, 5] });
    // 1 - (0.04 + 0.04 + 0) / (4 + 0 + 4)
    expect(nse(pairs)).toBeCloseTo(0.99, 12);
    // only the days of a period (mask)
    expect(pairsOf([1, NaN, 3, 4], [1, 2, 3, 4], [0, 1, 1, 0])).toEqual({
      observed: [3],
      simulated: [3],
    });
  });

  it('no pairs or one pair: nothing but n', () => {
    const none = fitStatistics({ observed: [], simulated: [] });
    expect(none.n).toBe(0);
    expect(Object.entries(none).filter(([k, v]) => k !== 'n' && v !== null)).toEqual([]);
    expect(nse({ observed: [1], simulated: [1] })).toBeNull();
  });

  it('a perfect simulation scores NSE = KGE = log-NSE = 1 and zero errors (fixed seed)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.integer({ min: 0, max: 5000 }).map((x) => x / 100),
          { minLength: 3, maxLength: 40 },
        ),
        (xs) => {
          fc.pre(new Set(xs).size > 1);
          const f = fitStatistics({ observed: xs, simulated: [...xs] });
          expect(f.nse).toBeCloseTo(1, 9);
          expect(f.kge).toBeCloseTo(1, 9);
          expect(f.logNse).toBeCloseTo(1, 9);
          expect(f.rmse).toBe(0);
          expect(Math.abs(f.pbiasPercent ?? 0)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('the mean of the observations as a simulation gives NSE = 0 (definition)', () => {
    expect(nse({ observed: o, simulated: o.map(() => 3) })).toBeCloseTo(0, 12);
  });
});

describe('ratings of daily field-scale flow (Moriasi et al. 2015 bands, from memory)', () => {
  it('NSE, R^2 and PBIAS bands, edges included where the paper puts them', () => {
    expect(rate('nse', 0.71)).toBe('very good');
    expect(rate('nse', 0.7)).toBe('good');
    expect(rate('nse', 0.55)).toBe('satisfactory');
    expect(rate('nse', 0.5)).toBe('not satisfactory');
    expect(rate('r2', 0.9)).toBe('very good');
    expect(rate('r2', 0.8)).toBe('good');
    expect(rate('r2', 0.61)).toBe('satisfactory');
    expect(rate('r2', 0.6)).toBe('not satisfactory');
    expect(rate('pbiasPercent', -9.9)).toBe('very good');
    expect(rate('pbiasPercent', 12)).toBe('good');
    expect(rate('pbiasPercent', -20)).toBe('satisfactory');
    expect(rate('pbiasPercent', 25)).toBe('not satisfactory');
    expect(rate('rmse', 1)).toBeNull();
    expect(rate('nse', null)).toBeNull();
  });

  it('KGE against the mean-flow benchmark 1 - sqrt(2) (Knoben et al. 2019)', () => {
    expect(KGE_MEAN_BENCHMARK).toBeCloseTo(-0.41421, 5);
    expect(kgeVerdict(-0.3)).toBe('better than the mean-flow benchmark');
    expect(kgeVerdict(-0.5)).toBe('no better than the mean-flow benchmark');
    expect(kgeVerdict(null)).toBeNull();
  });
});
