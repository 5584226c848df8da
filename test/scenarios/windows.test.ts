// Water table in the fieldwork windows against a hand-built water-table series: every expected
// figure is worked out by hand from the definitions (median and 80th percentile by linear
// interpolation between ranks, R/numpy type 7, as simple-statistics documents).
import { describe, expect, it } from 'vitest';
import { windowWaterTable } from '../../src/scenarios/windows.js';
import type { AnnualRow } from '../../src/scenarios/types.js';
import { dates } from '../nitrate/synthetic.js';

describe('water table in the fieldwork windows', () => {
  // Two years; spring window 1-5 Apr (5 days), fall window 1-4 Oct (4 days).
  const w = {
    springWindow: { from: '04-01', to: '04-05' },
    fallWindow: { from: '10-01', to: '10-04' },
  };
  const ds = [...dates('2001-01-01', 365), ...dates('2002-01-01', 365)];
  const depth = new Float64Array(ds.length).fill(2); // outside the windows: 2 m (must not count)
  const set = (iso: string, d: number) => (depth[ds.indexOf(iso)] = d);
  // Spring depths: 2001 0.1, 0.2, 0.3, 0.4, 0.5; 2002 0.6, 0.7, 0.8, 0.9, 1.0 (10 days).
  for (let k = 0; k < 5; k++) {
    set(`2001-04-0${k + 1}`, 0.1 * (k + 1));
    set(`2002-04-0${k + 1}`, 0.1 * (k + 6));
  }
  // Fall depths: 2001 0.2 x 4 days; 2002 1.0 x 4 days (8 days).
  for (let k = 1; k <= 4; k++) {
    set(`2001-10-0${k}`, 0.2);
    set(`2002-10-0${k}`, 1.0);
  }
  const row = (year: number, spring: number, fall: number) =>
    ({
      scenario: 'a',
      year,
      spring_fieldwork_days: spring,
      spring_window_days: 5,
      fall_fieldwork_days: fall,
      fall_window_days: 4,
    }) as AnnualRow;
  // 2001: 2 of 5 spring days workable (fewer than half: too wet), 2 of 4 fall days (exactly
  // half: not too wet); 2002: 5 of 5 and 0 of 4 (too wet).
  const annual = [row(2001, 2, 2), row(2002, 5, 0), { ...row(2001, 0, 0), scenario: 'b' }];
  const [spring, fall] = windowWaterTable('a', ds, depth, annual, w);

  it('median and 80th percentile over every window day of the period', () => {
    // Spring, sorted 0.1..1.0 (n = 10): median at rank 4.5 -> (0.5 + 0.6) / 2 = 0.55;
    // 80th percentile at rank 0.8 x 9 = 7.2 -> 0.8 + 0.2 x (0.9 - 0.8) = 0.82.
    expect(spring.medianDepthM).toBeCloseTo(0.55, 12);
    expect(spring.p80DepthM).toBeCloseTo(0.82, 12);
    // Fall, sorted 0.2 x 4, 1.0 x 4 (n = 8): median at rank 3.5 -> (0.2 + 1.0) / 2 = 0.6;
    // 80th percentile at rank 5.6 -> 1.0.
    expect(fall.medianDepthM).toBeCloseTo(0.6, 12);
    expect(fall.p80DepthM).toBeCloseTo(1.0, 12);
  });

  it('counts the years too wet for more than half of the window', () => {
    expect(spring.tooWetYears).toBe(1); // 2001
    expect(fall.tooWetYears).toBe(1); // 2002 (2001 had exactly half)
    expect(spring.years).toBe(2); // rows of scenario b are not counted
    expect([spring.window, spring.from, spring.to]).toEqual(['spring', '04-01', '04-05']);
  });
});
