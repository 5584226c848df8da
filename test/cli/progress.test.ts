import { describe, expect, it } from 'vitest';
import { progressLine } from '../../src/cli/progress.js';

describe('progress lines for logs', () => {
  it('states the count, the share, the rate and the time left', () => {
    // 120 of 1000 in 60 s: 2 per s, 880 left at 2 per s = 440 s, about 7 min.
    expect(progressLine('shard 0/4 jobs', 120, 1000, 60)).toBe(
      'shard 0/4 jobs: 120/1000 done (12 %), 2.0 per s, about 7 min left',
    );
    // 990 of 1000 in 99 s: 10 per s, 1 s left.
    expect(progressLine('jobs', 990, 1000, 99)).toBe(
      'jobs: 990/1000 done (99 %), 10 per s, about 1 s left',
    );
  });

  it('says nothing about time left before the first step is done', () => {
    expect(progressLine('jobs', 0, 10, 61)).toBe('jobs: 0/10 done (0 %), 0.0 per s');
  });
});
