import { describe, expect, it } from 'vitest';
import {
  COEFFICIENT_CROPS,
  COEFFICIENT_INLETS,
  COEFFICIENT_SOILS,
  drainageCoefficient,
  parseCoefficientPreset,
} from '../../src/drainage/drainageCoefficient.js';

// Drainage coefficients for subsurface drains in humid areas, inches per 24 hours, as the
// drainage handbooks tabulate them (common practice, from memory), written out here as fractions.
const HANDBOOK: [string, string, string, number, number][] = [
  ['mineral', 'field', 'none', 3 / 8, 1 / 2],
  ['mineral', 'field', 'blind', 1 / 2, 3 / 4],
  ['mineral', 'field', 'open', 1 / 2, 1],
  ['mineral', 'truck', 'none', 1 / 2, 3 / 4],
  ['mineral', 'truck', 'blind', 3 / 4, 1],
  ['mineral', 'truck', 'open', 1, 1.5],
  ['organic', 'field', 'none', 1 / 2, 3 / 4],
  ['organic', 'field', 'blind', 3 / 4, 1],
  ['organic', 'field', 'open', 1, 1.5],
  ['organic', 'truck', 'none', 3 / 4, 1.5],
  ['organic', 'truck', 'blind', 1, 2],
  ['organic', 'truck', 'open', 1.5, 4],
];

describe('drainageCoefficient', () => {
  it('reproduces the handbook table, in/d and mm/d (1 in = 25.4 mm exactly)', () => {
    for (const [soil, crop, inlets, lo, hi] of HANDBOOK) {
      const c = drainageCoefficient({ soil, crop, inlets } as never);
      expect(c.lowInPerDay).toBe(lo);
      expect(c.highInPerDay).toBe(hi);
      expect(c.inPerDay).toBe((lo + hi) / 2);
      expect(c.lowMmPerDay).toBeCloseTo(lo * 25.4, 12);
      expect(c.highMmPerDay).toBeCloseTo(hi * 25.4, 12);
      expect(c.mmPerDay).toBeCloseTo(((lo + hi) / 2) * 25.4, 12);
    }
    expect(HANDBOOK.length).toBe(
      COEFFICIENT_SOILS.length * COEFFICIENT_CROPS.length * COEFFICIENT_INLETS.length,
    );
  });

  it('field crops on mineral soil without inlets: 3/8-1/2 in/d, about 9.5-12.7 mm/d (common practice)', () => {
    const c = drainageCoefficient({ soil: 'mineral', crop: 'field', inlets: 'none' });
    expect(c.mmPerDay).toBeGreaterThanOrEqual(9.5);
    expect(c.mmPerDay).toBeLessThanOrEqual(12.7);
  });

  it('never lower for organic soils, truck crops or more direct surface inlets (common practice)', () => {
    for (const crop of COEFFICIENT_CROPS)
      for (const inlets of COEFFICIENT_INLETS) {
        const m = drainageCoefficient({ soil: 'mineral', crop, inlets });
        const o = drainageCoefficient({ soil: 'organic', crop, inlets });
        expect(o.lowMmPerDay).toBeGreaterThanOrEqual(m.lowMmPerDay);
        expect(o.highMmPerDay).toBeGreaterThanOrEqual(m.highMmPerDay);
      }
    for (const soil of COEFFICIENT_SOILS)
      for (const inlets of COEFFICIENT_INLETS) {
        const f = drainageCoefficient({ soil, crop: 'field', inlets });
        const t = drainageCoefficient({ soil, crop: 'truck', inlets });
        expect(t.mmPerDay).toBeGreaterThan(f.mmPerDay);
      }
    for (const soil of COEFFICIENT_SOILS)
      for (const crop of COEFFICIENT_CROPS) {
        const [n, b, o] = COEFFICIENT_INLETS.map(
          (inlets) => drainageCoefficient({ soil, crop, inlets }).mmPerDay,
        );
        expect(b).toBeGreaterThan(n);
        expect(o).toBeGreaterThanOrEqual(b);
      }
  });
});

describe('parseCoefficientPreset', () => {
  it('reads words in any order and fills the rest with mineral, field, none', () => {
    expect(parseCoefficientPreset('organic truck open', 'x')).toEqual({
      soil: 'organic',
      crop: 'truck',
      inlets: 'open',
    });
    expect(parseCoefficientPreset('Open, Organic', 'x')).toEqual({
      soil: 'organic',
      crop: 'field',
      inlets: 'open',
    });
    expect(parseCoefficientPreset('blind', 'x')).toEqual({
      soil: 'mineral',
      crop: 'field',
      inlets: 'blind',
    });
  });

  it('rejects unknown, doubled and empty words with the option named', () => {
    expect(() => parseCoefficientPreset('peat', '--coefficient')).toThrowError(
      /^--coefficient: does not know "peat"; words from soil mineral\|organic/,
    );
    expect(() => parseCoefficientPreset('mineral organic', '--coefficient')).toThrowError(
      /gives the soil twice/,
    );
    expect(() => parseCoefficientPreset('  ', '--coefficient')).toThrowError(/--coefficient/);
  });

  it('separates words by spaces, commas, slashes, plus signs and hyphens', () => {
    const want = { soil: 'organic', crop: 'truck', inlets: 'blind' };
    for (const text of ['organic/truck/blind', 'organic-truck-blind', 'organic+truck+blind'])
      expect(parseCoefficientPreset(text, 'x')).toEqual(want);
    expect(parseCoefficientPreset(' ORGANIC ,  truck,blind ', 'x')).toEqual(want);
  });

  it('says in full what is accepted (the messages users see)', () => {
    const accepted =
      'words from soil mineral|organic, crop field|truck, inlets none|blind|open (e.g. "mineral field none")';
    expect(() => parseCoefficientPreset('  ', 'drains.coefficient')).toThrowError(
      `drains.coefficient: expects ${accepted}; got "  "`,
    );
    expect(() => parseCoefficientPreset('open blind', 'drains.coefficient')).toThrowError(
      `drains.coefficient: gives the inlets twice (open, blind); ${accepted}`,
    );
    expect(() =>
      drainageCoefficient({ soil: 'peat', crop: 'field', inlets: 'none' } as never),
    ).toThrowError(
      'unknown drainage-coefficient preset {"soil":"peat","crop":"field","inlets":"none"}; ' +
        'accepted: soil mineral|organic, crop field|truck, inlets none|blind|open',
    );
    // A known soil with an unknown crop, or a known soil and crop with unknown inlets: the same
    // message, not a failed lookup.
    for (const preset of [
      { soil: 'mineral', crop: 'rice', inlets: 'none' },
      { soil: 'organic', crop: 'truck', inlets: 'tile' },
    ]) {
      expect(() => drainageCoefficient(preset as never)).toThrowError(
        `unknown drainage-coefficient preset ${JSON.stringify(preset)}; accepted: soil mineral|organic`,
      );
    }
  });

  it('returns the preset it was given, as a copy', () => {
    const preset = { soil: 'organic', crop: 'truck', inlets: 'open' } as const;
    const c = drainageCoefficient(preset);
    expect(c.preset).toEqual(preset);
    expect(c.preset).not.toBe(preset);
  });
});
