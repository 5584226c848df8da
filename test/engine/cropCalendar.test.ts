import { describe, expect, it } from 'vitest';
import {
  BARE_SOIL_DEPLETION,
  BARE_SOIL_KC,
  CROPS,
  MIN_ROOT_DEPTH_M,
} from '../../src/engine/crops.js';
import {
  cropCalendar,
  kcOnDay,
  monthDayOfYear,
  rootDepthOnDay,
  rotationCrop,
} from '../../src/engine/cropCalendar.js';
import { dates } from './fixtures.js';

describe('rotation anchored to calendar years', () => {
  it('corn in even years by default; firstYear moves the phase', () => {
    const r = ['corn', 'soybean'];
    expect([2012, 2013, 2014, 1999].map((y) => rotationCrop(r, 2000, y))).toEqual([
      'corn',
      'soybean',
      'corn',
      'soybean',
    ]);
    expect(rotationCrop(r, 2013, 2013)).toBe('corn');
    const three = ['corn', 'soybean', 'small grains'];
    expect([2000, 2001, 2002, 2003, 1997, 1998].map((y) => rotationCrop(three, 2000, y))).toEqual([
      'corn',
      'soybean',
      'small grains',
      'corn',
      'corn',
      'soybean',
    ]);
  });

  it('two calendars that start in different years agree on every shared day', () => {
    const early = dates(6 * 365 + 1, '2010-01-01'); // 2010-2015
    const late = dates(4 * 365 + 1, '2012-01-01'); // 2012-2015
    const rotation = ['corn', 'soybean'];
    const a = cropCalendar(early, rotation, { ...CROPS });
    const b = cropCalendar(late, rotation, { ...CROPS });
    const offset = early.indexOf(late[0]);
    expect(offset).toBeGreaterThan(0);
    const name = (c: typeof a, i: number) => (c.crop[i] === 0 ? '' : c.crops[c.crop[i] - 1]);
    for (let i = 0; i < late.length; i++) {
      expect(name(b, i)).toBe(name(a, i + offset));
      expect(b.kc[i]).toBe(a.kc[i + offset]);
    }
    // 2013 (odd) is a soybean year in both.
    const mid = late.indexOf('2013-07-15');
    expect(name(b, mid)).toBe('soybean');
  });
});

describe('rooting depth grows with the crop (FAO-56 Table 22 and chapter 8)', () => {
  it('0.15 m at planting, linear to the crop maximum at mid-season, bare soil between', () => {
    // Corn: 30 + 40 days to mid-season, maximum 1.35 m (middle of FAO-56's 1.0-1.7 m, from memory).
    expect(rootDepthOnDay(CROPS.corn, 0)).toBeCloseTo(0.15, 12);
    expect(rootDepthOnDay(CROPS.corn, 35)).toBeCloseTo(0.15 + 0.5 * (1.35 - 0.15), 12);
    expect(rootDepthOnDay(CROPS.corn, 70)).toBeCloseTo(1.35, 12);
    expect(rootDepthOnDay(CROPS.corn, 140)).toBeCloseTo(1.35, 12);
    for (const [name, lo, hi] of [
      ['corn', 1.0, 1.7],
      ['soybean', 0.6, 1.3],
      ['small grains', 1.0, 1.5],
    ] as const) {
      expect(CROPS[name].maxRootDepth).toBeGreaterThanOrEqual(lo);
      expect(CROPS[name].maxRootDepth).toBeLessThanOrEqual(hi);
    }
    const d = dates(366, '2000-01-01');
    const c = cropCalendar(d, ['corn'], { ...CROPS }, undefined, 2000, { capM: 1.0 });
    expect(c.rootDepthM![d.indexOf('2000-02-01')]).toBeCloseTo(0.15, 12);
    // Capped by a restrictive layer at 1.0 m.
    expect(c.rootDepthM![d.indexOf('2000-08-01')]).toBeCloseTo(1.0, 12);
    const fixed = cropCalendar(d, ['corn'], { ...CROPS }, undefined, 2000, { fixedM: 0.6 });
    expect(new Set(fixed.rootDepthM)).toEqual(new Set([0.6]));
  });
});

describe('FAO-56 crop coefficient curve (Allen et al. 1998, ch. 6, Fig. 25 and Eq. 66)', () => {
  it('the built-in crops carry the FAO-56 Table 12 Kc and Table 11 stage lengths (from memory)', () => {
    // Maize (grain) 0.30 / 1.20 / 0.60, 30/40/50/30 d; soybeans 0.40 / 1.15 / 0.50,
    // 20/30/60/25 d; spring wheat 0.30 / 1.15 / 0.25, 20/25/60/30 d; depletion fractions p of
    // Table 22 (maize 0.55, soybean 0.50, wheat 0.55).
    const table: [string, number, number, number, number[], number][] = [
      ['corn', 0.3, 1.2, 0.6, [30, 40, 50, 30], 0.55],
      ['soybean', 0.4, 1.15, 0.5, [20, 30, 60, 25], 0.5],
      ['small grains', 0.3, 1.15, 0.25, [20, 25, 60, 30], 0.55],
    ];
    for (const [name, ini, mid, end, stages, p] of table) {
      const c = CROPS[name];
      expect([c.kcIni, c.kcMid, c.kcEnd, c.depletionFraction]).toEqual([ini, mid, end, p]);
      expect(c.stagesDays).toEqual(stages);
      // Planting and harvest in the humid continental season (common practice): planted in
      // April-May, harvested August-October.
      expect(c.planting).toMatch(/^0[45]-\d\d$/);
      expect(c.harvest).toMatch(/^(08|09|10)-\d\d$/);
    }
    // Bare soil between seasons: FAO-56 gives Kc ini 0.3-0.5 for bare soil wetted every few
    // days at moderate ET0 (from memory).
    expect(BARE_SOIL_KC).toBeGreaterThanOrEqual(0.3);
    expect(BARE_SOIL_KC).toBeLessThanOrEqual(0.5);
    expect(MIN_ROOT_DEPTH_M).toBe(0.15); // FAO-56 ch. 8 Zr,min 0.15-0.20 m (from memory)
  });

  it('Kc by stage for corn: flat, linear rise, flat, linear fall, flat (Eq. 66 by hand)', () => {
    const corn = CROPS.corn;
    const cases: [number, number][] = [
      [0, 0.3],
      [29, 0.3],
      [30, 0.3],
      [50, 0.3 + (20 / 40) * (1.2 - 0.3)],
      [69, 0.3 + (39 / 40) * (1.2 - 0.3)],
      [70, 1.2],
      [119, 1.2],
      [120, 1.2],
      [135, 1.2 + (15 / 30) * (0.6 - 1.2)],
      [150, 0.6],
      [200, 0.6],
    ];
    for (const [t, kc] of cases) expect(kcOnDay(corn, t)).toBeCloseTo(kc, 12);
  });

  it('day of year with Gregorian leap years (every 4th year, not centuries, but every 400th)', () => {
    expect(monthDayOfYear(2019, '01-01')).toBe(1);
    expect(monthDayOfYear(2019, '03-01')).toBe(60);
    expect(monthDayOfYear(2020, '02-29')).toBe(60);
    expect(monthDayOfYear(2020, '03-01')).toBe(61);
    expect(monthDayOfYear(2020, '12-31')).toBe(366);
    expect(monthDayOfYear(2100, '03-01')).toBe(60);
    expect(monthDayOfYear(2000, '03-01')).toBe(61);
    expect(monthDayOfYear(2019, '10-15')).toBe(288);
  });

  it('a season day by day: stage Kc, p, crop code, season share; bare soil outside', () => {
    // Corn planted 1 May (day 122 of 2020), harvested 15 October (day 289).
    const d = dates(366, '2020-01-01');
    const c = cropCalendar(d, ['corn'], { ...CROPS });
    const i = (date: string) => d.indexOf(date);
    expect(c.crops).toEqual(['corn']);
    const before = i('2020-04-30');
    expect([c.kc[before], c.depletionFraction[before], c.crop[before]]).toEqual([
      BARE_SOIL_KC,
      BARE_SOIL_DEPLETION,
      0,
    ]);
    expect(c.seasonFraction[before]).toBe(-1);
    expect(c.rootDepthM![before]).toBe(MIN_ROOT_DEPTH_M);
    const plant = i('2020-05-01');
    expect([c.kc[plant], c.depletionFraction[plant], c.crop[plant]]).toEqual([0.3, 0.55, 1]);
    expect(c.seasonFraction[plant]).toBe(0);
    // 20 June is day 50 after planting: half-way up the development stage.
    expect(c.kc[i('2020-06-20')]).toBeCloseTo(0.75, 12);
    expect(c.seasonFraction[i('2020-10-14')]).toBeCloseTo(166 / 167, 12);
    expect(c.crop[i('2020-10-14')]).toBe(1);
    expect(c.crop[i('2020-10-15')]).toBe(0);
    expect(c.kc[i('2020-10-15')]).toBe(BARE_SOIL_KC);
  });

  it('planting day in a century year that is not a leap year (2100) and in 2000, which is', () => {
    for (const year of [2100, 2000, 2021]) {
      const d = dates(366, `${year}-01-01`);
      const c = cropCalendar(d, ['corn'], { ...CROPS });
      expect(c.crop[d.indexOf(`${year}-04-30`)]).toBe(0);
      expect(c.crop[d.indexOf(`${year}-05-01`)]).toBe(1);
      expect(c.kc[d.indexOf(`${year}-05-01`)]).toBe(0.3);
      expect(c.crop[d.indexOf(`${year}-10-14`)]).toBe(1);
      expect(c.crop[d.indexOf(`${year}-10-15`)]).toBe(0);
    }
  });

  it('a rotation codes each crop by its place in the list and an empty run is empty', () => {
    const d = dates(2 * 365 + 1, '2020-01-01');
    const c = cropCalendar(d, ['corn', 'soybean'], { ...CROPS });
    expect(c.crops).toEqual(['corn', 'soybean']);
    expect(c.crop[d.indexOf('2020-07-01')]).toBe(1);
    expect(c.crop[d.indexOf('2021-07-01')]).toBe(2);
    expect(c.depletionFraction[d.indexOf('2021-07-01')]).toBe(0.5);
    // Soybean planted 15 May 2021 (day 135): 1 July is day 47 after planting, 27 days into the
    // 30-day development stage; 10 July (day 56) is in mid-season.
    expect(c.kc[d.indexOf('2021-07-01')]).toBeCloseTo(0.4 + (27 / 30) * (1.15 - 0.4), 12);
    expect(c.kc[d.indexOf('2021-07-10')]).toBeCloseTo(1.15, 12);
    const empty = cropCalendar([], ['corn'], { ...CROPS });
    expect(empty.kc.length).toBe(0);
    expect(empty.crops).toEqual(['corn']);
  });
});

describe('calendar edges', () => {
  it('a winter crop planted in January and harvested in February of a leap year', () => {
    // Planted 10 January, harvested 20 February 2020: the days of year 10 and 51 by hand.
    const winter = { ...CROPS.corn, planting: '01-10', harvest: '02-20' };
    const d = dates(366, '2020-01-01');
    const c = cropCalendar(d, ['winter'], { winter });
    const code = (iso: string) => c.crop[d.indexOf(iso)];
    expect([code('2020-01-09'), code('2020-01-10')]).toEqual([0, 1]);
    expect([code('2020-02-19'), code('2020-02-20')]).toEqual([1, 0]);
  });

  it('roots grow linearly to mid-season on the calendar too; before planting 0.15 m', () => {
    const d = dates(366, '2000-01-01');
    const c = cropCalendar(d, ['corn'], { ...CROPS });
    // 5 June 2000 is day 35 after planting on 1 May: 0.15 + 35 / 70 x (1.35 - 0.15) = 0.75 m.
    expect(c.rootDepthM![d.indexOf('2000-06-05')]).toBeCloseTo(0.75, 12);
    expect(rootDepthOnDay(CROPS.corn, -5)).toBe(0.15);
  });
});
