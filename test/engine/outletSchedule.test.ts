import { describe, expect, it } from 'vitest';
import { outletSeries, stepKey } from '../../src/engine/outletSchedule.js';
import { dates } from './fixtures.js';

const at = (days: string[], series: Float64Array, date: string) => series[days.indexOf(date)];

describe('outlet schedules to daily levels', () => {
  it('a schedule without steps leaves the outlet free (NaN) every day', () => {
    const s = outletSeries(dates(40, '2020-01-01'), { steps: [] });
    expect(s.length).toBe(40);
    expect(s.every(Number.isNaN)).toBe(true);
  });

  it('step keys sort month-day and dated steps by calendar order', () => {
    expect(stepKey('10-25')).toBe(1025);
    expect(stepKey('04-10')).toBe(410);
    expect(stepKey('2020-11-01')).toBe(20201101);
    expect(stepKey('2021-03-01')).toBeGreaterThan(stepKey('2020-11-01'));
  });

  it('a yearly schedule holds the outlet over winter and wraps across the new year', () => {
    // Held at 0.3 m from 25 October, free from 10 April (steps given out of order on purpose).
    const d = dates(2 * 366, '2020-01-01');
    const s = outletSeries(d, {
      steps: [
        { from: '10-25', depthM: 0.3 },
        { from: '04-10', depthM: null },
      ],
    });
    expect(at(d, s, '2020-01-01')).toBe(0.3); // before the first step of the year: wraps
    expect(at(d, s, '2020-04-09')).toBe(0.3);
    expect(at(d, s, '2020-04-10')).toBeNaN();
    expect(at(d, s, '2020-10-24')).toBeNaN();
    expect(at(d, s, '2020-10-25')).toBe(0.3);
    expect(at(d, s, '2020-12-31')).toBe(0.3);
    expect(at(d, s, '2021-04-09')).toBe(0.3);
    expect(at(d, s, '2021-04-10')).toBeNaN();
  });

  it('three yearly steps: each day takes the latest step at or before it', () => {
    const d = dates(366, '2020-01-01');
    const s = outletSeries(d, {
      steps: [
        { from: '03-01', depthM: 0.6 },
        { from: '06-15', depthM: 0.4 },
        { from: '11-01', depthM: 0.2 },
      ],
    });
    expect(at(d, s, '2020-02-29')).toBe(0.2);
    expect(at(d, s, '2020-03-01')).toBe(0.6);
    expect(at(d, s, '2020-06-14')).toBe(0.6);
    expect(at(d, s, '2020-06-15')).toBe(0.4);
    expect(at(d, s, '2020-10-31')).toBe(0.4);
    expect(at(d, s, '2020-11-01')).toBe(0.2);
  });

  it('dated steps are a one-off list: free before the first, the last one holds on', () => {
    const d = dates(800, '2020-06-01');
    const s = outletSeries(d, {
      steps: [
        { from: '2021-03-01', depthM: 0.5 },
        { from: '2020-11-01', depthM: 0.2 },
        { from: '2021-09-01', depthM: null },
      ],
    });
    expect(at(d, s, '2020-06-01')).toBeNaN();
    expect(at(d, s, '2020-10-31')).toBeNaN();
    expect(at(d, s, '2020-11-01')).toBe(0.2);
    expect(at(d, s, '2021-02-28')).toBe(0.2);
    expect(at(d, s, '2021-03-01')).toBe(0.5);
    expect(at(d, s, '2021-08-31')).toBe(0.5);
    expect(at(d, s, '2021-09-01')).toBeNaN();
    expect(at(d, s, '2022-06-01')).toBeNaN(); // no wrap for dated lists
    // The same month-day a year later is not the same step.
    expect(at(d, s, '2021-11-01')).toBeNaN();
  });
});
