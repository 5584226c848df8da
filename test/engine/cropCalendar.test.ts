import { describe, expect, it } from 'vitest';
import { CROPS } from '../../src/engine/crops.js';
import { cropCalendar, rootDepthOnDay, rotationCrop } from '../../src/engine/cropCalendar.js';
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
