import { describe, expect, it } from 'vitest';
import { parseField } from '../../src/io/field.js';
import { capacityOf, drainageIntensityOf, standardScenarios } from '../../src/scenarios/resolve.js';
import { equivalentDepth } from '../../src/drainage/equivalentDepth.js';

const BASE = `name: Test field
soil: { conductivity: 0.8 m/d, restrictiveLayerDepth: 2.4 m }
drains: { depth: 1.2 m, spacing: 22 m, radius: 0.05 m }
`;

describe('scenario resolution', () => {
  it('pipe capacity from Manning full flow over the area a lateral drains', () => {
    const f = parseField(
      BASE.replace(
        'radius: 0.05 m }',
        'radius: 0.05 m, pipe: { diameter: 4 in, grade: 0.2 %, length: 300 m } }',
      ),
      'f.yaml',
    );
    // Manning (SI): Q = (1/n) A R^(2/3) S^(1/2), full circular pipe A = pi D^2 / 4, R = D / 4.
    const D = 0.1016;
    const n = 0.015;
    const Q = (1 / n) * ((Math.PI * D * D) / 4) * Math.pow(D / 4, 2 / 3) * Math.sqrt(0.002);
    const mmPerDay = ((Q * 86400) / (300 * 22)) * 1000;
    expect(capacityOf(f.base)).toBeCloseTo(mmPerDay, 9);
  });

  it('derived shallow alternative keeps the drainage intensity; controlled holds the outlet in winter', () => {
    const f = parseField(BASE, 'f.yaml').base;
    const [conv, shallow, controlled] = standardScenarios(f);
    expect([conv.name, shallow.name, controlled.name]).toEqual([
      'conventional',
      'shallow',
      'controlled',
    ]);
    expect(shallow.params.drainDepthM).toBe(0.75);
    // Hooghoudt with the water table at the surface midway, evaluated here: q = (8 K d h + 4 K h^2) / L^2.
    const intensity = (depth: number, L: number) => {
      const d = equivalentDepth(L, 2.4 - depth, 0.05);
      return (8 * 0.8 * d * depth + 4 * 0.8 * depth * depth) / (L * L);
    };
    const target = intensity(1.2, 22);
    expect(drainageIntensityOf(f)).toBeCloseTo(target, 12);
    // The shallow spacing is rounded to 0.1 m, so the intensity matches to about 1 %.
    expect(Math.abs(intensity(0.75, shallow.params.spacingM) - target) / target).toBeLessThan(0.01);
    expect(shallow.params.spacingM).toBeLessThan(22);
    expect(controlled.params.drainDepthM).toBe(1.2);
    expect(controlled.outlet).toEqual({
      steps: [
        { from: '11-01', depthM: 0.3 },
        { from: '04-01', depthM: null },
      ],
    });
  });

  it('the field file\'s "free" becomes a schedule without steps, a free step a null depth', () => {
    const [conv, , controlled] = standardScenarios(parseField(BASE, 'f.yaml').base);
    expect(conv.outlet).toEqual({ steps: [] });
    expect(conv.outletLabel).toBe('free outlet');
    expect(controlled.outlet.steps.map((s) => s.depthM)).toContain(null);
    const held = parseField(
      `${BASE}outlet: { schedule: [{ from: 10-15, depth: 0.4 m }, { from: 04-15, depth: free }] }\n`,
      'f.yaml',
    ).base;
    expect(standardScenarios(held)[0].outlet).toEqual({
      steps: [
        { from: '10-15', depthM: 0.4 },
        { from: '04-15', depthM: null },
      ],
    });
  });
});

describe('pipe capacity from the drainage coefficient', () => {
  it('defaults to field crops on mineral soil without inlets: 7/16 in/d (common practice, from memory)', () => {
    const f = parseField(BASE, 'f.yaml');
    expect(capacityOf(f.base)).toBeCloseTo((7 / 16) * 25.4, 12);
  });
  it('takes a preset, a rate, and lets capacity override both', () => {
    const preset = parseField(
      BASE.replace(
        'radius: 0.05 m }',
        'radius: 0.05 m, coefficient: { soil: organic, inlets: open } }',
      ),
      'f.yaml',
    );
    // Organic soil, field crops, open inlets: 1 to 1 1/2 in/d, the middle 1.25 in/d.
    expect(capacityOf(preset.base)).toBeCloseTo(1.25 * 25.4, 12);
    const rate = parseField(
      BASE.replace('radius: 0.05 m }', 'radius: 0.05 m, coefficient: 0.5 in/d }'),
      'f.yaml',
    );
    expect(capacityOf(rate.base)).toBeCloseTo(12.7, 12);
    const both = parseField(
      BASE.replace(
        'radius: 0.05 m }',
        'radius: 0.05 m, coefficient: 0.5 in/d, capacity: 20 mm/d }',
      ),
      'f.yaml',
    );
    expect(capacityOf(both.base)).toBe(20);
  });
});
