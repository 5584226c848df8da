/**
 * How a parallel sweep cuts its jobs into ranges. The results do not depend on the cut (the
 * CLI tests compare 1, 2 and more workers byte for byte); these checks hold the cut to its
 * definition: the ranges tile the jobs 0..total-1 in order with no gap or overlap (a partition,
 * by definition), are never longer than 50 jobs and never grow, so the workers end on short ones.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { jobRanges } from '../../src/io/sweepPool.js';

describe('ranges of sweep jobs', () => {
  it('tile the jobs in order, at most 50 each, largest first', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 20_000 }), fc.integer({ min: 1, max: 8 }), (n, w) => {
        const ranges = jobRanges(n, w);
        expect(ranges[0].start).toBe(0);
        expect(ranges[ranges.length - 1].end).toBe(n);
        ranges.forEach((r, k) => {
          expect(r.end).toBeGreaterThan(r.start);
          expect(r.end - r.start).toBeLessThanOrEqual(50);
          if (k > 0) {
            expect(r.start).toBe(ranges[k - 1].end);
            expect(r.end - r.start).toBeLessThanOrEqual(ranges[k - 1].end - ranges[k - 1].start);
          }
        });
      }),
    );
  });

  it('end on short ranges: 1,000 jobs on 2 workers start with 50 and end with 5 or fewer', () => {
    const sizes = jobRanges(1000, 2).map((r) => r.end - r.start);
    expect(sizes[0]).toBe(50);
    expect(Math.max(...sizes.slice(-4))).toBeLessThanOrEqual(5);
  });
});
