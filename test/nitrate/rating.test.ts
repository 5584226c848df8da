import { describe, expect, it } from 'vitest';
import { TilefluxError } from '../../src/errors.js';
import { fitRating } from '../../src/nitrate/fitRating.js';
import { ratingConcentration } from '../../src/nitrate/rating.js';
import { readRatingPairsCsv } from '../../src/nitrate/ratingCsv.js';
import { simulateNitrate } from '../../src/nitrate/simulate.js';
import { normal, rng, syntheticInput } from './synthetic.js';

/** Flows spread log-uniformly over 0.05..40 mm/d, the span of daily drain flows. */
function flows(n: number, u: () => number): number[] {
  return Array.from({ length: n }, () => Math.exp(Math.log(0.05) + u() * Math.log(40 / 0.05)));
}

describe('fitRating', () => {
  it('recovers a and b exactly from noise-free pairs', () => {
    // Data generated from C = 8.5 Q^0.27 (known values); a power law is a straight line in
    // log space, so least squares there must return it exactly (to rounding) with R2 = 1.
    const q = flows(200, rng(11));
    const c = q.map((x) => 8.5 * Math.pow(x, 0.27));
    const fit = fitRating({ flowMm: q, concMgL: c });
    expect(fit.a).toBeCloseTo(8.5, 9);
    expect(fit.b).toBeCloseTo(0.27, 9);
    expect(fit.rSquared).toBeCloseTo(1, 12);
    expect(fit.n).toBe(200);
    expect(fit.flowRangeMm).toEqual([Math.min(...q), Math.max(...q)]);
  });

  it('recovers a and b within 1 % from pairs with lognormal scatter', () => {
    // Known values a = 12, b = -0.18 with multiplicative lognormal scatter (sigma 0.15 in ln):
    // ln C = ln a + b ln Q + e is the classical regression model, so the estimates are unbiased
    // with standard errors of about 0.15 / sqrt(n) for ln a and 0.15 / (sd(ln Q) sqrt(n)) for b;
    // with n = 20 000 and sd(ln Q) = ln(800) / sqrt(12) = 1.93 these are 0.1 % of a and 0.3 % of
    // b, so 1 % is more than 3 standard errors.
    const u = rng(2024);
    const q = flows(20_000, u);
    const c = q.map((x) => 12 * Math.pow(x, -0.18) * Math.exp(0.15 * normal(u)));
    const fit = fitRating({ flowMm: q, concMgL: c });
    expect(Math.abs(fit.a / 12 - 1)).toBeLessThan(0.01);
    expect(Math.abs(fit.b / -0.18 - 1)).toBeLessThan(0.01);
    // Independent check of the slope: the closed-form least-squares slope
    // b = sum((x - mx)(y - my)) / sum((x - mx)^2) in log space.
    const x = q.map(Math.log);
    const y = c.map(Math.log);
    const mx = x.reduce((s, v) => s + v, 0) / x.length;
    const my = y.reduce((s, v) => s + v, 0) / y.length;
    let sxy = 0;
    let sxx = 0;
    for (let i = 0; i < x.length; i++) {
      sxy += (x[i] - mx) * (y[i] - my);
      sxx += (x[i] - mx) ** 2;
    }
    expect(fit.b).toBeCloseTo(sxy / sxx, 10);
    expect(Math.log(fit.a)).toBeCloseTo(my - (sxy / sxx) * mx, 10);
    expect(fit.rSquared).toBeGreaterThan(0.5);
    expect(fit.rSquared).toBeLessThan(1);
  });

  it('leaves out pairs without a logarithm and says how many', () => {
    const fit = fitRating({ flowMm: [0, 1, 4, 16, 2], concMgL: [5, 10, 20, 40, 0] });
    expect(fit.n).toBe(3);
    expect(fit.skipped).toBe(2);
    expect(fit.a).toBeCloseTo(10, 12); // 10 x 4^0.5 = 20, 10 x 16^0.5 = 40
    expect(fit.b).toBeCloseTo(0.5, 12);
  });

  it('refuses too few pairs or a single flow, naming where', () => {
    expect(() => fitRating({ flowMm: [1, 2], concMgL: [3, 4] }, 'obs.csv')).toThrow(TilefluxError);
    expect(() => fitRating({ flowMm: [1, 2], concMgL: [3, 4] }, 'obs.csv')).toThrow(
      /obs.csv: .*at least 3 pairs/,
    );
    expect(() => fitRating({ flowMm: [2, 2, 2], concMgL: [3, 4, 5] })).toThrow(/same flow/);
  });
});

describe('rating model', () => {
  it('evaluates C = a Q^b inside the range and clamps and flags flows outside it', () => {
    // 10 x 4^0.5 = 20; 100 mm is above the range, so C = 10 x 25^0.5 = 50 and the day counts;
    // 0.2 mm is below, C = 10 x 1^0.5 = 10, counted; a day without flow is not counted.
    const r = ratingConcentration(new Float64Array([0, 4, 100, 0.2, 25, 1]), 10, 0.5, [1, 25]);
    expect(Array.from(r.concMgL)).toEqual([10, 20, 50, 10, 50, 10]);
    expect(r.outOfRangeDays).toBe(2);
  });

  it('counts out-of-range days of a run and keeps load = flow x concentration / 100', () => {
    const input = syntheticInput(2, 5);
    const range: [number, number] = [0.5, 5];
    const r = simulateNitrate(input, { model: 'rating', a: 9, b: 0.2, fitFlowRangeMm: range });
    let outside = 0;
    for (let i = 0; i < input.dates.length; i++) {
      const q = input.drainflowMm[i];
      if (q > 0 && (q < range[0] || q > range[1])) outside++;
      const qc = Math.min(Math.max(q, range[0]), range[1]);
      expect(r.concMgL[i]).toBeCloseTo(9 * qc ** 0.2, 12);
      expect(r.loadKgHa[i]).toBe((q * r.concMgL[i]) / 100);
    }
    expect(outside).toBeGreaterThan(0);
    expect(r.outOfRangeDays).toBe(outside);
  });
});

describe('readRatingPairsCsv', () => {
  it('reads pairs in any column order, converts inches and skips unsampled rows', () => {
    const text =
      'no3n_mg_l,site,date,flow_in\n14.1,A,2024-04-01,0.1\n\n,A,2024-04-02,0.05\n9,A,2024-04-03,1\n';
    const p = readRatingPairsCsv(text, 'obs.csv');
    expect(p.dates).toEqual(['2024-04-01', '2024-04-03']);
    // 1 in = 25.4 mm exactly (international inch).
    expect(p.flowMm[0]).toBeCloseTo(2.54, 12);
    expect(p.flowMm[1]).toBeCloseTo(25.4, 12);
    expect(p.concMgL).toEqual([14.1, 9]);
    expect(p.skippedRows).toBe(1);
  });

  it('names the file, line and column of each problem and what is accepted', () => {
    const head = 'date,flow_mm,no3n_mg_l\n';
    const cases: Array<[string, RegExp]> = [
      ['date,flow,no3\n', /^obs.csv: line 1: the header lacks flow_mm \(or flow_in\), no3n_mg_l/],
      [head + '2024-04-01,2.5\n', /^obs.csv: line 2: not readable as CSV/],
      [head + '2024-04-01,2.5,abc\n', /^obs.csv: line 2, column no3n_mg_l: "abc" is not a number/],
      [
        head + '2024-04-01,-1,3\n',
        /^obs.csv: line 2, column flow_mm: "-1" is not a number of at least 0/,
      ],
      [
        head + '2024-02-30,1,3\n',
        /^obs.csv: line 2, column date: "2024-02-30" is not a date; expected YYYY-MM-DD/,
      ],
      [
        head + '2024-04-01,1,3\n\n2024-04-01,2,3\n',
        /^obs.csv: line 4, column date: 2024-04-01 repeats line 2/,
      ],
      ['', /^obs.csv: empty file/],
    ];
    for (const [text, re] of cases) {
      expect(() => readRatingPairsCsv(text, 'obs.csv')).toThrow(TilefluxError);
      expect(() => readRatingPairsCsv(text, 'obs.csv')).toThrow(re);
    }
  });
});
