import { describe, expect, it } from 'vitest';
import {
  checkInsideWeather,
  ObservationInputError,
  parseObservationsCsv,
} from '../../src/io/observations.js';

const read = (text: string, areaHa?: number) =>
  parseObservationsCsv(text, { file: 'obs.csv', areaHa });

/** The message of the error thrown by `f`. */
function errorOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(ObservationInputError);
    return (e as Error).message;
  }
  throw new Error('expected an error');
}

describe('observation files', () => {
  it('reads depths per day, water-table depths and nitrate; blanks are days without data', () => {
    const o = read(
      'date,drainflow_mm,water_table_depth_m,no3n_mg_l,note\n' +
        '2024-04-01,2.5,0.62,14.1,x\n2024-04-02,,0.70,,\n2024-04-03,0,NA,,\n',
    );
    expect(o.dates).toEqual(['2024-04-01', '2024-04-02', '2024-04-03']);
    expect(Array.from(o.drainflowMm!)).toEqual([2.5, NaN, 0]);
    expect(Array.from(o.waterTableDepthM!)).toEqual([0.62, 0.7, NaN]);
    expect(Array.from(o.no3MgL!)).toEqual([14.1, NaN, NaN]);
    expect(Array.from(o.lines)).toEqual([2, 3, 4]);
  });

  it('converts inches and feet by their definitions (1 in = 25.4 mm, 1 ft = 0.3048 m)', () => {
    const o = read('date,drainflow_in,water_table_depth_ft\n2024-04-01,0.5,2\n');
    expect(o.drainflowMm![0]).toBeCloseTo(12.7, 12);
    expect(o.waterTableDepthM![0]).toBeCloseTo(0.6096, 12);
  });

  it('converts flow rates over the drained area to mm/d', () => {
    // 1 L/s over 10 ha: 0.001 m3/s x 86400 s = 86.4 m3/d over 100 000 m2 = 0.864 mm/d.
    expect(read('date,flow_l_s\n2024-04-01,1\n', 10).drainflowMm![0]).toBeCloseTo(0.864, 12);
    // 100 US gal/min (1 gal = 3.785411784 L exactly) over 40 ac (1 ac = 0.40468564224 ha).
    const areaHa = 40 * 0.40468564224;
    const mmPerDay = (((100 * 3.785411784) / 1000 / 60) * 86400 * 1000) / (areaHa * 10_000);
    expect(read('date,flow_gpm\n2024-04-01,100\n', areaHa).drainflowMm![0]).toBeCloseTo(
      mmPerDay,
      12,
    );
    expect(read('date,flow_m3_s\n2024-04-01,0.01\n', 16).drainflowMm![0]).toBeCloseTo(5.4, 12);
    // 1 ft3 = 0.028316846592 m3 exactly.
    expect(read('date,flow_cfs\n2024-04-01,0.1\n', 40).drainflowMm![0]).toBeCloseTo(
      (0.0028316846592 * 86400 * 1000) / 400_000,
      12,
    );
  });

  it('a flow rate without --area, an unknown unit, two flow columns: errors at the header', () => {
    expect(errorOf(() => read('date,flow_l_s\n2024-04-01,1\n'))).toBe(
      'obs.csv line 1, column flow_l_s: flow_l_s is a flow rate (L/s); give the drained area it ' +
        'comes from with areaHa (such as 16 ha or 40 ac) to turn it into mm/d, or give drainflow_mm',
    );
    expect(errorOf(() => read('date,flow_mgd\n2024-04-01,1\n'))).toMatch(
      /^obs.csv line 1, column flow_mgd: unknown unit in "flow_mgd"; drain flow is read from drainflow_mm, drainflow_in, flow_l_s/,
    );
    expect(errorOf(() => read('date,water_table_depth_cm\n2024-04-01,1\n'))).toMatch(
      /water_table_depth_m, water_table_depth_ft$/,
    );
    expect(errorOf(() => read('date,drainflow_mm,drainflow_in\n2024-04-01,1,1\n'))).toMatch(
      /column drainflow_in: two drain flow columns \(drainflow_mm and drainflow_in\)/,
    );
    expect(errorOf(() => read('date,rain_mm\n2024-04-01,1\n'))).toMatch(
      /line 1: no drain-flow or water-table column; expected date and any of drainflow_mm/,
    );
  });

  it('gaps, repeats and disorder in the dates name the line', () => {
    expect(errorOf(() => read('date,drainflow_mm\n2024-04-01,1\n2024-04-04,1\n'))).toBe(
      'obs.csv line 3, column date: dates jump from 2024-04-01 to 2024-04-04 (2 missing days); ' +
        'add a row for every day, with empty cells for days without an observation',
    );
    expect(errorOf(() => read('date,drainflow_mm\n2024-04-01,1\n2024-04-01,1\n'))).toMatch(
      /line 3, column date: date 2024-04-01 repeats line 2/,
    );
    expect(errorOf(() => read('date,drainflow_mm\n2024-04-02,1\n2024-04-01,1\n'))).toMatch(
      /line 3, column date: date 2024-04-01 comes after 2024-04-02/,
    );
    expect(errorOf(() => read('date,drainflow_mm\n2024-02-30,1\n'))).toMatch(
      /line 2, column date: "2024-02-30" is not a date/,
    );
  });

  it('negative flows, text, impossible values and ragged rows name line and column', () => {
    expect(errorOf(() => read('date,drainflow_mm\n2024-04-01,1\n2024-04-02,-0.3\n'))).toBe(
      'obs.csv line 3, column drainflow_mm: drain flow -0.3 mm/d is negative; it must be 0 or more',
    );
    expect(errorOf(() => read('date,water_table_depth_m\n2024-04-01,-0.1\n'))).toMatch(
      /line 2, column water_table_depth_m: water-table depth -0.1 m is above the surface/,
    );
    expect(errorOf(() => read('date,drainflow_mm\n2024-04-01,lots\n'))).toMatch(
      /line 2, column drainflow_mm: "lots" is not a number; expected drain flow in mm\/d/,
    );
    // 10 L/s from 0.1 ha is 864 mm/d: a wrong area or unit.
    expect(errorOf(() => read('date,flow_l_s\n2024-04-01,10\n', 0.1))).toMatch(
      /line 2, column flow_l_s: drain flow 10 L\/s \(864.0 mm\/d\) is above the plausible 300; check the unit and areaHa/,
    );
    expect(errorOf(() => read('date,drainflow_mm\n2024-04-01,1,2\n'))).toMatch(
      /line 2: the row has 3 fields but the header has 2/,
    );
    expect(errorOf(() => read(''))).toMatch(/line 1: the file is empty/);
  });

  it('dates outside the weather record are refused at the first such line', () => {
    const o = read('date,drainflow_mm\n2015-12-30,1\n2015-12-31,1\n2016-01-01,1\n');
    expect(() => checkInsideWeather(o, ['2012-01-01', '2015-12-31'])).toThrow(
      'obs.csv line 4, column date: date 2016-01-01 lies outside the weather record (2012-01-01 to 2015-12-31)',
    );
    expect(() => checkInsideWeather(o, ['2012-01-01', '2016-12-31'])).not.toThrow();
  });
});
