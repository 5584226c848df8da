import { describe, expect, it } from 'vitest';
import {
  groundAt,
  layReach,
  reachStations,
  type GroundProfile,
  type LayReachInput,
} from '../../src/drainage/gradeLaying.js';
import { TilefluxError } from '../../src/errors.js';

// Every expected value below is worked by hand from the rules the module documents (linear
// interpolation between surveyed stations; grade = fall / length; the aim, cover, machine and
// flushing bounds of the header comment), written out beside each check.

const profileOf = (stations: number[], elevations: number[]): GroundProfile => ({
  stationsM: Float64Array.from(stations),
  elevationsM: Float64Array.from(elevations),
});

/** |a - b| within 1e-12 m (or m/m): rounding only. */
const near = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThan(1e-12);

describe('groundAt: linear interpolation between surveyed stations', () => {
  it('interpolates inside each segment of an uneven survey (hand interpolation)', () => {
    const p = profileOf([0, 50, 120, 200], [100, 101, 100.3, 102]);
    // 0-50: 100 + 25/50 x 1 = 100.5
    near(groundAt(p, 25, 'trunk'), 100.5);
    // 50-120: 101 + 35/70 x (100.3 - 101) = 100.65
    near(groundAt(p, 85, 'trunk'), 100.65);
    // 120-200: 100.3 + 40/80 x (102 - 100.3) = 101.15
    near(groundAt(p, 160, 'trunk'), 101.15);
    // 120-200 near its top: 100.3 + 79/80 x 1.7 = 101.97875
    near(groundAt(p, 199, 'trunk'), 101.97875);
    // on surveyed stations: the surveyed elevation
    expect(groundAt(p, 0, 'trunk')).toBe(100);
    expect(groundAt(p, 50, 'trunk')).toBe(101);
    expect(groundAt(p, 120, 'trunk')).toBe(100.3);
    expect(groundAt(p, 200, 'trunk')).toBe(102);
  });

  it('holds the end elevations a hair (under 1e-6 m) outside the survey, no extrapolation', () => {
    const p = profileOf([0, 50, 120, 200], [100, 101, 100.3, 102]);
    // Extrapolating would move the ground by 1e-7 x 1/50 = 2e-9 m and 1e-7 x 1.7/80 = 2e-9 m.
    expect(groundAt(p, -1e-7, 'trunk')).toBe(100);
    expect(groundAt(p, 200 + 1e-7, 'trunk')).toBe(102);
  });

  it('refuses a station outside the survey, naming the main, the surveyed range and the station', () => {
    const p = profileOf([0, 50, 120, 200], [100, 101, 100.3, 102]);
    const msg = (station: number) =>
      `the profile of main "trunk" covers stations 0 to 200 m; the main needs station ` +
      `${station} m: survey the whole length of each main`;
    expect(() => groundAt(p, 200.01, 'trunk')).toThrow(TilefluxError);
    expect(() => groundAt(p, 200.01, 'trunk')).toThrow(msg(200.01));
    expect(() => groundAt(p, -0.5, 'trunk')).toThrow(msg(-0.5));
    expect(() => groundAt(profileOf([], []), 0, 'b')).toThrow(
      'the profile of main "b" covers stations none m; the main needs station 0 m: ' +
        'survey the whole length of each main',
    );
  });
});

describe('reachStations: the stations a reach is checked at', () => {
  it('takes the surveyed stations strictly inside the reach, then its upper end', () => {
    const p = profileOf([0, 50, 120, 200], [100, 101, 100.3, 102]);
    // 50-200: 120 is inside; 50 (the lower end) and 200 (the upper end, added once) are not.
    expect(reachStations(p, 50, 200)).toEqual([120, 200]);
    // 0-160: 50 and 120 inside, then the end 160 (not surveyed).
    expect(reachStations(p, 0, 160)).toEqual([50, 120, 160]);
    // 60-100: no surveyed station inside, only the end.
    expect(reachStations(p, 60, 100)).toEqual([100]);
  });
});

/** A reach 100-200 m on stations 100, 150, 200 with a 0.15 m pipe, 0.6 m cover, 2.5 m deepest. */
function reach(ground: [number, number, number], over: Partial<LayReachInput>): LayReachInput {
  return {
    invertStartM: 99,
    fromStationM: 100,
    toStationM: 200,
    profile: profileOf([100, 150, 200], ground),
    main: 'trunk',
    minimumGrade: 0.002,
    diameterM: 0.15,
    depthM: 1,
    minimumCoverM: 0.6,
    maximumDepthM: 2.5,
    ...over,
  };
}

describe('layReach: one uniform grade per reach, inside the trench bounds', () => {
  it("follows the ground at the design depth (the module's @example)", () => {
    const p = profileOf([0, 100], [100, 100.5]);
    const got = layReach({
      invertStartM: 99,
      fromStationM: 0,
      toStationM: 100,
      profile: p,
      main: 'trunk',
      minimumGrade: 0.002,
      diameterM: 0.1524,
      depthM: 1,
      minimumCoverM: 0.6,
      maximumDepthM: 2.5,
    });
    // aim = (100.5 - 1 - 99) / 100 = 0.005
    expect(got.limit).toBe('design depth');
    near(got.grade, 0.005);
  });

  it('design depth on a reach that does not start at station 0 (length = to - from)', () => {
    // Ground 100, 100.25, 100.5; invert 99 at station 100.
    // aim = (100.5 - 1 - 99) / (200 - 100) = 0.005
    // cover: (100.25 - 99 - 0.75) / 50 = 0.01, (100.5 - 99 - 0.75) / 100 = 0.0075 -> 0.0075
    // machine: (1.25 - 2.5) / 50 = -0.025, (1.5 - 2.5) / 100 = -0.01; flushing 0.002 -> 0.002
    const got = layReach(reach([100, 100.25, 100.5], {}));
    expect(got.limit).toBe('design depth');
    near(got.grade, 0.005);
  });

  it('flat ground: the minimum (flushing) grade', () => {
    // aim = (100 - 1 - 99) / 100 = 0; cover min(0.25/50, 0.25/100) = 0.0025 >= 0.002
    const got = layReach(reach([100, 100, 100], {}));
    expect(got).toEqual({ grade: 0.002, limit: 'minimum grade' });
  });

  it('a high middle station: steepened so the cut there stays within the machine depth', () => {
    // Ground 100, 102.1, 101; invert 99: aim = (101 - 1 - 99) / 100 = 0.01.
    // machine at 150: (3.1 - 2.5) / 50 = 0.012; at 200: (2 - 2.5) / 100 = -0.005 -> 0.012
    // cover: (3.1 - 0.75) / 50 = 0.047, (2 - 0.75) / 100 = 0.0125 -> 0.0125 >= 0.012
    const got = layReach(reach([100, 102.1, 101], {}));
    expect(got.limit).toBe('maximum depth');
    near(got.grade, 0.012);
    // depth of cut at 150 = ground - invert = 102.1 - (99 + 50 x 0.012) = 2.5, the deepest
    near(102.1 - (99 + 50 * got.grade), 2.5);
  });

  it('a low middle station: flattened so the pipe keeps its cover there', () => {
    // Ground 100, 99.9, 101; invert 98.5: aim = (101 - 1 - 98.5) / 100 = 0.015.
    // cover at 150: (1.4 - 0.75) / 50 = 0.013; at 200: (2.5 - 0.75) / 100 = 0.0175 -> 0.013
    // machine: (1.4 - 2.5) / 50 < 0, (2.5 - 2.5) / 100 = 0 -> flushing 0.002
    const got = layReach(reach([100, 99.9, 101], { invertStartM: 98.5 }));
    expect(got.limit).toBe('minimum cover');
    near(got.grade, 0.013);
    // cover over the pipe top at 150 = 99.9 - (98.5 + 50 x 0.013) - 0.15 = 0.6, the minimum
    near(99.9 - (98.5 + 50 * got.grade) - 0.15, 0.6);
  });

  describe('bounds in conflict: flushing grade first, then cover, the rest flagged', () => {
    it('cover below the flushing grade: the flushing grade is kept', () => {
      // Ground 100, 99.3, 101; invert 98.5: aim 0.015; cover at 150: (0.8 - 0.75) / 50 = 0.001
      // machine at 200: 0, so lo = 0.002 > 0.001: conflict, and 0.001 <= 0.002
      const got = layReach(reach([100, 99.3, 101], { invertStartM: 98.5 }));
      expect(got).toEqual({ grade: 0.002, limit: 'minimum grade' });
    });

    it('a knoll too deep for the machine: the design depth where the cover allows it', () => {
      // Ground 100, 102.5, 100.75; invert 99: machine at 150: (3.5 - 2.5) / 50 = 0.02;
      // cover: (3.5 - 0.75) / 50 = 0.055, (1.75 - 0.75) / 100 = 0.01 -> 0.01 < 0.02: conflict.
      // aim = (100.75 - 1 - 99) / 100 = 0.0075, between 0.002 and 0.01
      const got = layReach(reach([100, 102.5, 100.75], {}));
      expect(got.limit).toBe('design depth');
      near(got.grade, 0.0075);
    });

    it('the same knoll, aiming shallower than the cover allows: held at the cover', () => {
      // depth 0.5: aim = (100.75 - 0.5 - 99) / 100 = 0.0125 > 0.01
      const got = layReach(reach([100, 102.5, 100.75], { depthM: 0.5 }));
      expect(got.limit).toBe('minimum cover');
      near(got.grade, 0.01);
    });

    it('the same knoll, aiming flatter than the flushing grade: the flushing grade', () => {
      // depth 1.74: aim = (100.75 - 1.74 - 99) / 100 = 0.0001 < 0.002
      const got = layReach(reach([100, 102.5, 100.75], { depthM: 1.74 }));
      expect(got).toEqual({ grade: 0.002, limit: 'minimum grade' });
    });
  });
});
