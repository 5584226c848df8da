import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { dayIndexOf, monthDayKey } from '../../src/climate/calendar.js';
import { generateWeather } from '../../src/climate/weatherGenerator.js';
import { parseField } from '../../src/io/field.js';
import { scenarioOf } from '../../src/scenarios/resolve.js';
import { prepareField, runDesign } from '../../src/scenarios/prepared.js';
import { runField, scenariosOf } from '../../src/scenarios/run.js';

const demo = parseField(readFileSync('data-demo/field.yaml', 'utf8'), 'field.yaml');

describe('calendar fields of a day index', () => {
  it('agree with the calendar of JavaScript Date (UTC) on every day of 1896-2104', () => {
    // Independent source: ECMAScript Date arithmetic (proleptic Gregorian, UTC), across the
    // non-leap century years 1900 and 2100 and the leap year 2000.
    const t0 = Date.UTC(1896, 0, 1);
    const dates: string[] = [];
    for (let t = t0; t <= Date.UTC(2104, 11, 31); t += 86_400_000)
      dates.push(new Date(t).toISOString().slice(0, 10));
    const d = dayIndexOf(dates);
    let bad = 0;
    for (let i = 0; i < dates.length; i++) {
      const t = new Date(t0 + i * 86_400_000);
      if (
        d.year[i] !== t.getUTCFullYear() ||
        d.month[i] !== t.getUTCMonth() + 1 ||
        d.dayOfMonth[i] !== t.getUTCDate() ||
        d.monthDay[i] !== (t.getUTCMonth() + 1) * 100 + t.getUTCDate()
      )
        bad++;
    }
    expect(bad).toBe(0);
    expect(monthDayKey('10-25')).toBe(1025);
  });
});

describe('a prepared field', () => {
  const weather = generateWeather({ years: 6, seed: 5, startYear: 2000 });
  it('gives every scenario the same annual table as runField', () => {
    const run = runField(demo, weather);
    const prepared = prepareField(demo.base, weather);
    for (const s of scenariosOf(demo)) {
      const own = runDesign(prepared, s).annual;
      expect(own).toEqual(run.scenarios.find((x) => x.spec.name === s.name)!.annual);
    }
  });

  it('computes forcing, calendar, outlet series and pool terms once for many designs', () => {
    const prepared = prepareField(demo.base, weather);
    const a = scenarioOf('a', '', demo.base);
    const b = scenarioOf('b', '', { ...demo.base, drains: { ...demo.base.drains, depth: 0.9 } });
    const ra = runDesign(prepared, a);
    const rb = runDesign(prepared, b);
    expect(rb.calendar).toBe(ra.calendar);
    expect(prepared.outletOf(a.outlet)).toBe(prepared.outletOf(b.outlet));
    expect(prepared.poolForcingOf(ra.calendar, a.nitrate)).toBe(
      prepared.poolForcingOf(rb.calendar, b.nitrate),
    );
    // Reported period: whole years after one warm-up year.
    expect(ra.annual.map((r) => r.year)).toEqual([1, 2, 3, 4, 5].map((k) => 2000 + k));
    expect(prepared.forcing.dates[prepared.reportStart]).toBe('2001-01-01');
  });

  it('gives the same numbers when a run writes over an earlier run’s columns', () => {
    // A sweep passes each design the previous design's run to write into; every daily column
    // must then hold this design's values, as a fresh run gives them (a column written only on
    // some days would keep the earlier design's numbers on the others).
    const prepared = prepareField(demo.base, weather);
    const specs = scenariosOf(demo);
    const fresh = specs.map((s) => runDesign(prepared, s));
    let last = runDesign(
      prepared,
      scenarioOf('x', '', { ...demo.base, drains: { ...demo.base.drains, spacing: 9 } }),
    );
    for (const [k, s] of specs.entries()) {
      const reused = runDesign(prepared, s, last);
      expect(reused.engine.drainflowMm).toBe(last.engine.drainflowMm);
      expect(reused.nitrate.loadKgHa).toBe(last.nitrate.loadKgHa);
      expect(reused.annual).toEqual(fresh[k].annual);
      for (const [key, col] of Object.entries(fresh[k].engine))
        if (ArrayBuffer.isView(col)) expect(reused.engine[key as 'etMm'], key).toEqual(col);
      expect(reused.nitrate.pool).toEqual(fresh[k].nitrate.pool);
      last = reused;
    }
  });
});
