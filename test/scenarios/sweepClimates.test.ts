import { describe, expect, it } from 'vitest';
import { changeClimate } from '../../src/climate/generatorFit.js';
import { DEFAULT_GENERATOR, generateWeather } from '../../src/climate/weatherGenerator.js';
import { parseField } from '../../src/io/field.js';
import { sweepField } from '../../src/scenarios/sweep.js';
import {
  checkClimateNames,
  frontierUnion,
  robustnessLines,
  studyRows,
  sweepClimates,
} from '../../src/scenarios/sweepClimates.js';

const FIELD = `name: Climate sweep test field
soil:
  conductivity: 0.9 m/d
  restrictiveLayerDepth: 2.2 m
  drainablePorosity: 0.05
drains: { depth: 1.1 m, spacing: 18 m, capacity: 12 mm/d }
sweep:
  depth: [0.8 m, 1.1 m]
  spacing: [12 m, 24 m]
  outlet:
    free: free
    winter hold: { schedule: [ { from: '11-01', depth: 0.3 m }, { from: '04-01', depth: free } ] }
  uncertain:
    soil.conductivity: { low: 0.4 m/d, high: 1.6 m/d, scale: log }
  samples: 3
`;
const field = parseField(FIELD).base;
const twelve = (x: number) => new Array<number>(12).fill(x);
// Same seed, same generator: the wetter record has the same wet and dry days, every wet-day
// amount 20 % larger (the delta change of intensity, README "Bringing your own weather").
const today = generateWeather({ years: 5, seed: 21, startYear: 2001 });
const wetter = generateWeather({
  years: 5,
  seed: 21,
  startYear: 2001,
  params: changeClimate(DEFAULT_GENERATOR, { precipChangePct: twelve(20), tempChangeC: twelve(0) }),
});

describe('a sweep under several climates', () => {
  const study = sweepClimates(field, [
    { name: 'today', weather: today },
    { name: 'wetter', weather: wetter, source: 'generated, +20 % intensity' },
  ]);

  it('equals one one-climate sweep per climate, climate by climate', () => {
    expect(study.climates.map((c) => c.name)).toEqual(['today', 'wetter']);
    expect(study.climates[0].result).toEqual(sweepField(field, today));
    expect(study.climates[1].result).toEqual(sweepField(field, wetter));
    const rows = studyRows(study, 'designs');
    expect(rows).toHaveLength(2 * study.climates[0].result.designs.length);
    expect(rows.filter((r) => r.climate === 'wetter').map(({ climate: _, ...r }) => r)).toEqual(
      study.climates[1].result.designs,
    );
    expect(Object.keys(studyRows(study, 'samples')[0])[0]).toBe('climate');
  });

  it('gives more drain flow for every design and soil sample under 20 % more intense rain', () => {
    // Physical sense: more water on the same wet days, the same soil and drains, drains more.
    const [a, b] = study.climates.map((c) => c.result.samples);
    expect(a.length).toBe(9 * 3);
    a.forEach((row, k) => {
      expect(b[k].design).toBe(row.design);
      expect(Number(b[k].drainflow_mm)).toBeGreaterThan(Number(row.drainflow_mm));
    });
    // The reported precipitation is the record's, 20 % up: the figure is checked against a sum
    // over the record's reported days taken here (2002-2005 after the warm-up year).
    const start = today.dates.indexOf('2002-01-01');
    const sum = (p: Float64Array) => p.slice(start).reduce((x, y) => x + y, 0);
    const days = today.dates.length - start;
    expect(study.climates[0].figures.precipMmYr).toBeCloseTo(
      (sum(today.precipMm) * 365.25) / days,
      9,
    );
    const ratio = study.climates[1].figures.precipMmYr / study.climates[0].figures.precipMmYr;
    // Rounding of daily amounts to 0.1 mm moves the ratio by far less than 0.5 %.
    expect(Math.abs(ratio - 1.2)).toBeLessThan(0.005);
    expect(study.climates[1].source).toBe('generated, +20 % intensity');
    expect(study.climates[0].source).toBe('weather given');
  });

  it('ranks designs on each frontier and marks those on every frontier robust', () => {
    study.climates.forEach((c, k) => {
      c.result.designs.forEach((d, i) => {
        expect(study.ranks[k][i] > 0).toBe(d.on_frontier);
      });
      expect(c.result.frontier.map((i) => study.ranks[k][i])).toEqual(
        c.result.frontier.map((_, r) => r + 1),
      );
    });
    study.robust.forEach((r, i) =>
      expect(r).toBe(study.climates.every((c) => c.result.designs[i].on_frontier)),
    );
    const union = frontierUnion(study);
    expect(new Set(union).size).toBe(union.length);
    expect(union.length).toBeGreaterThanOrEqual(study.climates[0].result.frontier.length);
    const lines = robustnessLines(study);
    expect(lines[0]).toMatch(/^design +today +wetter$/);
    expect(lines.filter((l) => l.endsWith('robust across climates'))).toHaveLength(
      study.robust.filter(Boolean).length,
    );
  });

  it('refuses missing, malformed and repeated climate names in one line', () => {
    expect(() => checkClimateNames([])).toThrow(/at least one climate/);
    expect(() => checkClimateNames(['to day'])).toThrow(/"to day" is not accepted/);
    expect(() => checkClimateNames(['-x'])).toThrow(/not accepted/);
    expect(() => checkClimateNames(['today', 'Today'])).toThrow(/given twice/);
    expect(() => checkClimateNames(Array.from({ length: 13 }, (_, k) => `c${k}`))).toThrow(
      /at most 12/,
    );
    expect(() =>
      sweepClimates(field, [
        { name: 'a', weather: today },
        { name: 'a', weather: wetter },
      ]),
    ).toThrow(/"a" is given twice/);
  });
});
