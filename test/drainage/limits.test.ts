import { describe, expect, it } from 'vitest';
import { equivalentDepth, equivalentDepthAndSlope } from '../../src/drainage/equivalentDepth.js';
import { gloverHeadRatio, gloverSpacing } from '../../src/drainage/glover.js';
import { hooghoudtFlux, hooghoudtSpacing } from '../../src/drainage/hooghoudt.js';
import { kirkhamFlux, kirkhamGeometryFactor } from '../../src/drainage/kirkham.js';
import {
  fullFlowVelocity,
  manningDiameter,
  manningDiameterInches,
  manningFullCapacity,
  minimumGrade,
} from '../../src/drainage/manning.js';
import {
  INCH_SIZES,
  METRIC_SIZES,
  pipeSizeList,
  selectPipeSize,
} from '../../src/drainage/pipeSizes.js';
import { roughnessFor, type PipeMaterialName } from '../../src/drainage/pipeMaterials.js';
import { TilefluxError } from '../../src/errors.js';
import { moodyDepthRaw, vdmwDepth, vdmwDepthRaw } from './reference.js';

// The edges of the drain design equations: the inputs each accepts, the one-line messages that
// name the parameter, its unit and the value received, and the limits of the equivalent-depth
// methods (4 drain radii, capped at the layer thickness). Reference values are the published
// equations evaluated in ./reference.ts or here.

const hooghoudtBase = {
  kAboveMPerDay: 0.5,
  kBelowMPerDay: 0.5,
  layerBelowDrainsM: 2,
  drainRadiusM: 0.1,
  headM: 0.7,
  rateMPerDay: 0.007,
};
const gloverBase = {
  kMPerDay: 0.5,
  drainablePorosity: 0.05,
  drainDepthM: 1.2,
  layerBelowDrainsM: 2,
  drainRadiusM: 0.1,
  fromDepthM: 0.3,
  toDepthM: 0.6,
  days: 2,
};
const kirkhamBase = { drainDepthM: 1, layerBelowDrainsM: 2, drainRadiusM: 0.1, spacingM: 20 };

/** A TilefluxError whose message is exactly `message`. */
function refuses(f: () => unknown, message: string): void {
  let error: unknown;
  try {
    f();
  } catch (e) {
    error = e;
  }
  expect(error).toBeInstanceOf(TilefluxError);
  expect((error as Error).message).toBe(message);
}

describe('messages name the parameter, its unit and the value', () => {
  it('positive quantities', () => {
    const cases: Array<[() => unknown, string]> = [
      [() => hooghoudtSpacing({ ...hooghoudtBase, kAboveMPerDay: 0 }), 'kAboveMPerDay m/d; got 0'],
      [
        () => hooghoudtSpacing({ ...hooghoudtBase, kBelowMPerDay: -1 }),
        'kBelowMPerDay m/d; got -1',
      ],
      [() => hooghoudtSpacing({ ...hooghoudtBase, rateMPerDay: 0 }), 'rateMPerDay m/d; got 0'],
      [
        () => hooghoudtSpacing({ ...hooghoudtBase, headM: 0 }),
        'headM (midpoint head above drain level) m; got 0',
      ],
      [() => hooghoudtSpacing({ ...hooghoudtBase, drainRadiusM: 0 }), 'drainRadiusM m; got 0'],
      [() => equivalentDepth(0, 2, 0.1), 'spacingM m; got 0'],
      [() => gloverSpacing({ ...gloverBase, kMPerDay: 0 }), 'kMPerDay m/d; got 0'],
      [() => gloverSpacing({ ...gloverBase, days: 0 }), 'days d; got 0'],
      [() => gloverSpacing({ ...gloverBase, drainDepthM: NaN }), 'drainDepthM m; got NaN'],
      [() => gloverHeadRatio(1, { ...gloverLayout, spacingM: 0 }), 'spacingM m; got 0'],
      [() => gloverHeadRatio(1, { ...gloverLayout, initialHeadM: 0 }), 'initialHeadM m; got 0'],
      [() => kirkhamGeometryFactor({ ...kirkhamBase, drainDepthM: 0 }), 'drainDepthM m; got 0'],
      [() => kirkhamGeometryFactor({ ...kirkhamBase, spacingM: -3 }), 'spacingM m; got -3'],
      [() => manningFullCapacity(0, 0.002, 0.015), 'diameterM m; got 0'],
      [() => manningFullCapacity(0.1, 0, 0.015), 'slope (pipe grade) m/m; got 0'],
      [() => manningDiameter(0, 0.002, 0.015), 'flowM3s m3/s; got 0'],
      [() => manningDiameterInches(0, 0.002, 0.015), 'flowCfs ft3/s; got 0'],
      [() => minimumGrade(0.1, 0, 0.015), 'velocityMs m/s; got 0'],
    ];
    for (const [f, tail] of cases) {
      const [name, rest] = tail.split(/ (?=[^ ]*; got)/);
      const unit = rest.split(';')[0];
      const value = tail.split('; got ')[1];
      refuses(f, `${name} must be a number greater than 0 ${unit}; got ${value}`);
    }
    // Manning's n has no unit: the message says so without one.
    refuses(
      () => fullFlowVelocity(0.1, 0.002, 0),
      'roughness (Manning n) must be a number greater than 0 ; got 0',
    );
  });
  it('non-negative quantities (time, equivalent depth)', () => {
    refuses(
      () => gloverHeadRatio(-1, gloverLayout),
      'tDays must be a number of at least 0 d; got -1',
    );
    refuses(
      () => gloverHeadRatio(1, { ...gloverLayout, equivalentDepthM: -0.1 }),
      'equivalentDepthM must be a number of at least 0 m; got -0.1',
    );
    refuses(
      () => gloverHeadRatio(Infinity, gloverLayout),
      'tDays must be a number of at least 0 d; got Infinity',
    );
    // 0 is accepted: no time, no fall; no layer below the drains, flow above them only.
    expect(gloverHeadRatio(0, gloverLayout)).toBe(1);
    expect(gloverHeadRatio(1, { ...gloverLayout, equivalentDepthM: 0 })).toBeGreaterThan(0);
  });
  it('drainable porosity is a fraction strictly between 0 and 1', () => {
    for (const mu of [0, 1, NaN, Infinity, -0.1]) {
      refuses(
        () => gloverSpacing({ ...gloverBase, drainablePorosity: mu }),
        `drainablePorosity must be a fraction between 0 and 1; got ${mu}`,
      );
      refuses(
        () => gloverHeadRatio(1, { ...gloverLayout, drainablePorosity: mu }),
        `drainablePorosity must be a fraction between 0 and 1; got ${mu}`,
      );
    }
  });
});

const gloverLayout = {
  kMPerDay: 0.6,
  equivalentDepthM: 1.3,
  drainablePorosity: 0.06,
  spacingM: 22,
  initialHeadM: 0.8,
};

describe('Glover-Dumm spacing: results and refusals', () => {
  it('reports the average flow depth D = d + h0 / 2 (the method convention)', () => {
    const s = gloverSpacing(gloverBase);
    expect(s.averageFlowDepthM).toBeCloseTo(s.equivalentDepthM + (1.2 - 0.3) / 2, 14);
    expect(s.headRatio).toBeCloseTo((1.2 - 0.6) / (1.2 - 0.3), 14);
  });
  it('a water table that does not fall, and one at drain level, are refused', () => {
    refuses(
      () => gloverSpacing({ ...gloverBase, toDepthM: 0.3 }),
      'toDepthM (0.3 m) must be deeper than fromDepthM (0.3 m): the water table falls',
    );
    expect(() => gloverSpacing({ ...gloverBase, toDepthM: 1.2 })).toThrowError(
      /^toDepthM \(1\.2 m\) must be shallower than the drain depth \(1\.2 m\): drains cannot lower/,
    );
    expect(() => gloverSpacing({ ...gloverBase, fromDepthM: NaN })).toThrowError(
      /^fromDepthM \(NaN m\) puts the water table above the surface; give a depth of at least 0 m/,
    );
    // The surface itself is a valid start.
    expect(gloverSpacing({ ...gloverBase, fromDepthM: 0 }).spacingM).toBeGreaterThan(0);
  });
});

describe('spacing solver: the 4-radii limit of the equivalent-depth methods', () => {
  const tooClose = /^the spacing these inputs call for is under 0\.4 m \(4 drain radii\), outside/;
  it('refuses a design whose spacing would be under 4 radii, even with d = D', () => {
    // L^2 <= (8 K2 D h + 4 K1 h^2) / q: with K = 1e-4 m/d, h = 0.1 m, q = 0.05 m/d, D = 2 m the
    // bound is sqrt(0.0032 + 0.000008) = 0.0566 m < 0.4 m.
    expect(() =>
      hooghoudtSpacing({
        ...hooghoudtBase,
        kAboveMPerDay: 1e-4,
        kBelowMPerDay: 1e-4,
        headM: 0.1,
        rateMPerDay: 0.05,
      }),
    ).toThrowError(tooClose);
  });
  it('refuses when the published d at 4 radii already carries less than the rate', () => {
    // K = 0.01 m/d, h = 0.3 m, q = 0.2 m/d, D = 2 m, r0 = 0.1 m: with d = D the bound is
    // sqrt((8*0.01*2*0.3 + 4*0.01*0.09)/0.2) = 0.51 m > 0.4 m, but at L = 0.4 m the vdMW d is
    // 0.65 m and Hooghoudt's rate there, 0.12 m/d, is below q (evaluated here):
    const d = vdmwDepth(0.4, 2, 0.1);
    const q04 = (8 * 0.01 * d * 0.3 + 4 * 0.01 * 0.09) / 0.16;
    expect(q04).toBeLessThan(0.2);
    expect(Math.sqrt((8 * 0.01 * 2 * 0.3 + 4 * 0.01 * 0.09) / 0.2)).toBeGreaterThan(0.4);
    expect(() =>
      hooghoudtSpacing({
        ...hooghoudtBase,
        kAboveMPerDay: 0.01,
        kBelowMPerDay: 0.01,
        headM: 0.3,
        rateMPerDay: 0.2,
      }),
    ).toThrowError(tooClose);
  });
  it('the equivalent depth itself refuses 4 radii and accepts just above', () => {
    refuses(
      () => equivalentDepth(0.4, 2, 0.1),
      'spacingM (0.4 m) must be more than 4 drain radii (0.4 m)',
    );
    expect(equivalentDepth(0.4000001, 2, 0.1)).toBeCloseTo(vdmwDepth(0.4000001, 2, 0.1), 12);
  });
  it('a wide bracket: the answer is the published root wherever Newton starts', () => {
    // Very thick layer, tiny rate: d grows a long way with L (vdMW, ./reference.ts).
    for (const [D, q] of [
      [50, 0.0005],
      [0.15, 0.02],
      [8, 0.001],
    ]) {
      const s = hooghoudtSpacing({ ...hooghoudtBase, layerBelowDrainsM: D, rateMPerDay: q });
      const d = vdmwDepth(s.spacingM, D, 0.1);
      const back = (8 * 0.5 * d * 0.7 + 4 * 0.5 * 0.49) / s.spacingM ** 2;
      expect(Math.abs(back / q - 1)).toBeLessThan(1e-11);
      expect(Math.abs(s.equivalentDepthM / d - 1)).toBeLessThan(1e-12);
    }
  });
});

describe('equivalent depth: slope and caps', () => {
  it('dd/dL is the derivative of the published forms (central differences of ./reference.ts)', () => {
    // Layouts on both sides of x = 2 pi D / L = pi / 2 (the two summations) and of Moody's
    // D/L = 0.3. Central differences with step 1e-4 L: error ~1e-8 relative; 1e-6 allowed.
    for (const [L, D] of [
      [3, 0.75],
      [4, 1],
      [6, 3],
      [10, 2.5],
      [20, 2],
      [40, 1.5],
      [80, 0.5],
    ]) {
      for (const method of ['vdmw', 'moody'] as const) {
        const raw = method === 'vdmw' ? vdmwDepthRaw : moodyDepthRaw;
        const d = raw(L, D, 0.05);
        if (!(d < D) || Math.abs(D / L - 0.3) < 1e-3) continue;
        const h = 1e-4 * L;
        const fd = (raw(L + h, D, 0.05) - raw(L - h, D, 0.05)) / (2 * h);
        const got = equivalentDepthAndSlope(L, D, 0.05, method).dDdL;
        expect(Math.abs(got / fd - 1), `${method} L=${L} D=${D}`).toBeLessThan(1e-6);
      }
    }
  });
  it("Moody's first form holds up to and including D/L = 0.3", () => {
    expect(equivalentDepth(10, 3, 0.1, 'moody')).toBeCloseTo(
      Math.min(moodyDepthRaw(10, 3, 0.1), 3),
      13,
    );
    const u = 0.3;
    const first = 3 / (1 + u * ((8 / Math.PI) * Math.log(3 / 0.1) - (3.55 - 1.6 * u + 2 * u * u)));
    expect(equivalentDepth(10, 3, 0.1, 'moody')).toBeCloseTo(Math.min(first, 3), 13);
  });
  it('is capped at the layer thickness with a zero slope', () => {
    // Drains 0.12 m above the barrier with r0 = 0.1 m: the radial term is negative (vdMW > D).
    expect(vdmwDepthRaw(20, 0.12, 0.1)).toBeGreaterThan(0.12);
    expect(equivalentDepthAndSlope(20, 0.12, 0.1, 'vdmw')).toEqual({ d: 0.12, dDdL: 0 });
  });
});

describe('Hooghoudt and Kirkham at their edges', () => {
  it('a head equal to the drain depth (water table at the surface) is accepted', () => {
    expect(hooghoudtSpacing({ ...hooghoudtBase, drainDepthM: 0.7 }).spacingM).toBeGreaterThan(0);
    refuses(
      () => hooghoudtSpacing({ ...hooghoudtBase, drainDepthM: 0.69 }),
      'headM (0.7 m) puts the water table above the surface: it can be at most the drain depth (0.69 m)',
    );
  });
  it('hooghoudtFlux is continuous at h = 0', () => {
    const p = { kAboveMPerDay: 1, kBelowMPerDay: 1, equivalentDepthM: 1, spacingM: 10 };
    expect(hooghoudtFlux({ ...p, headM: 1e-12 })).toBeCloseTo(8e-14, 20);
  });
  it('Kirkham refuses a radius at the drain depth and a spacing of one diameter', () => {
    refuses(
      () => kirkhamGeometryFactor({ ...kirkhamBase, drainRadiusM: 1, layerBelowDrainsM: 3 }),
      'drainRadiusM (1 m) must be less than drainDepthM (1 m)',
    );
    refuses(
      () => kirkhamGeometryFactor({ ...kirkhamBase, spacingM: 0.2 }),
      'spacingM (0.2 m) must exceed the drain diameter (0.2 m)',
    );
    expect(kirkhamGeometryFactor({ ...kirkhamBase, spacingM: 0.2001 })).toBeGreaterThan(0);
  });
  it('Kirkham flux counts no negative ponding (q = 4 pi K (t + b - r) / (g L), t >= 0)', () => {
    const g = kirkhamGeometryFactor(kirkhamBase);
    const p = { kMPerDay: 1, drainDepthM: 1, drainRadiusM: 0.1, spacingM: 20, geometryFactor: g };
    const want = (4 * Math.PI * 1 * 0.9) / (g * 20);
    expect(kirkhamFlux({ ...p, pondedDepthM: -0.2 })).toBeCloseTo(want, 14);
    expect(kirkhamFlux({ ...p, pondedDepthM: 0.1 })).toBeCloseTo(
      (4 * Math.PI * 1.0) / (g * 20),
      14,
    );
  });
});

describe('pipe size lists', () => {
  it('names the lists it was asked for, trimmed', () => {
    expect(pipeSizeList(' in ')).toBe(INCH_SIZES);
    expect(pipeSizeList('mm')).toBe(METRIC_SIZES);
    expect(INCH_SIZES.name).toBe('in');
    expect(METRIC_SIZES.name).toBe('mm');
    expect(INCH_SIZES.source).toMatch(/common practice/);
    expect(METRIC_SIZES.source).toMatch(/common practice/);
  });
  it('reads custom lists: bare mm, a trailing unit, spaces, decimals and exponents', () => {
    expect(pipeSizeList('100, 150 ,200')).toEqual({
      name: 'custom',
      unit: 'mm',
      nominal: [100, 150, 200],
      source: 'custom list',
    });
    expect(pipeSizeList('4,6, 8 in').nominal).toEqual([4, 6, 8]);
    expect(pipeSizeList('4,6,8in').unit).toBe('in');
    // A trailing unit after a number of several digits, or after a tab.
    expect(pipeSizeList('4,6,10 in')).toMatchObject({ unit: 'in', nominal: [4, 6, 10] });
    expect(pipeSizeList('4,6,8\tin')).toMatchObject({ unit: 'in', nominal: [4, 6, 8] });
    expect(pipeSizeList('.5,1e1,+1.5e2').nominal).toEqual([0.5, 10, 150]);
    expect(pipeSizeList('2.5, 1e+1, 1.2E2 mm').nominal).toEqual([2.5, 10, 120]);
    // Mixed: a unit on an entry other than the last converts that entry (0.1 m = 100 mm).
    expect(pipeSizeList('50, 0.1 m, 150').nominal).toEqual([50, 100, 150]);
  });
  it('refuses empty entries, zero, non-increasing lists and words', () => {
    const accepted =
      'sizes accepts in, mm or a comma-separated list of diameters such as "4,6,8 in" or "100,150 mm"';
    refuses(() => pipeSizeList('100,,200'), `${accepted}; got "100,,200"`);
    refuses(() => pipeSizeList('100, ,200'), `${accepted}; got "100, ,200"`);
    refuses(() => pipeSizeList('0,100'), `${accepted}; "0" is not a positive diameter`);
    refuses(() => pipeSizeList('100,100'), `${accepted}, in increasing order; got "100,100"`);
    refuses(() => pipeSizeList('100,90'), `${accepted}, in increasing order; got "100,90"`);
    refuses(() => pipeSizeList('ten'), `${accepted}; "ten" is not a positive diameter`);
    refuses(() => pipeSizeList('1-2'), `${accepted}; "1-2" is not a positive diameter`);
    expect(() => pipeSizeList('x', '--laterals')).toThrowError(/^--laterals accepts in, mm/);
  });
  it('selects an exact fit, and says how large a pipe the flow needs when none fits', () => {
    expect(selectPipeSize(0.1016)).toEqual({ nominal: 4, unit: 'in', diameterM: 0.1016 });
    refuses(
      () => selectPipeSize(0.7),
      'the flow needs a pipe of at least 700 mm (27.6 in), larger than the largest size in ' +
        'the size list (24 in); give larger sizes, a steeper grade or a smaller drained area ' +
        '(split it between outlets)',
    );
  });
});

describe('pipe materials', () => {
  it('refuses an unknown material, naming the ones it knows', () => {
    refuses(
      () => roughnessFor('steel' as PipeMaterialName, 0.1),
      'pipe material must be one of corrugated, smooth-wall, clay, concrete; got steel',
    );
  });
});
