import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { formatWeatherCsv, parseWeatherCsv, WeatherInputError } from '../../src/io/weather.js';
import { dayNumber, isoDate } from '../../src/climate/calendar.js';
import { TilefluxError } from '../../src/errors.js';
import type { WeatherSeries } from '../../src/climate/weatherSeries.js';

// Property tests of the weather CSV reader (fast-check): every valid file reads back exactly, and
// every single corruption of a valid file is reported at the line and column where it was made.

const int = (min: number, max: number) => fc.integer({ min, max });
const day = fc.record({
  precip: int(0, 50_000), // hundredths of mm: 0 to 500 mm
  tmin: int(-500, 300), // tenths of degC
  range: int(0, 300),
  pet: int(0, 2_000),
  solar: int(0, 4_000),
  rh: int(0, 1_000),
  wind: int(0, 3_000),
});
const seriesArb = fc
  .record({
    start: int(dayNumber('1900-01-01')!, dayNumber('2099-12-31')!),
    days: fc.array(day, { minLength: 1, maxLength: 40 }),
    optional: fc.record({
      pet: fc.boolean(),
      solar: fc.boolean(),
      rh: fc.boolean(),
      wind: fc.boolean(),
    }),
  })
  .map(({ start, days, optional }) => {
    const f = (g: (d: (typeof days)[number]) => number) => Float64Array.from(days.map(g));
    const w: WeatherSeries = {
      dates: days.map((_, i) => isoDate(start + i)),
      precipMm: f((d) => d.precip / 100),
      tmaxC: f((d) => (d.tmin + d.range) / 10),
      tminC: f((d) => d.tmin / 10),
    };
    if (optional.pet) w.refEtMm = f((d) => d.pet / 100);
    if (optional.solar) w.solarMJm2 = f((d) => d.solar / 100);
    if (optional.rh) w.rhMeanPct = f((d) => d.rh / 10);
    if (optional.wind) w.wind2mMs = f((d) => d.wind / 100);
    return w;
  });
const layout = fc.record({ crlf: fc.boolean(), bom: fc.boolean(), trailing: int(0, 3) });

function dress(text: string, l: { crlf: boolean; bom: boolean; trailing: number }): string {
  let t = text + '\n'.repeat(l.trailing);
  if (l.crlf) t = t.replace(/\n/g, '\r\n');
  return (l.bom ? '\uFEFF' : '') + t;
}

describe('weather CSV properties', () => {
  it('any valid file round-trips through formatWeatherCsv and parseWeatherCsv', () => {
    fc.assert(
      fc.property(seriesArb, layout, (w, l) => {
        const text = formatWeatherCsv(w);
        const r = parseWeatherCsv(dress(text, l), { file: 'p.csv' });
        expect(r.filledDays).toBe(0);
        expect(r.series.dates).toEqual(w.dates);
        for (const key of [
          'precipMm',
          'tmaxC',
          'tminC',
          'refEtMm',
          'solarMJm2',
          'rhMeanPct',
          'wind2mMs',
        ] as const) {
          expect(r.series[key] === undefined).toBe(w[key] === undefined);
          if (w[key]) expect([...r.series[key]!]).toEqual([...w[key]!]);
        }
        expect(formatWeatherCsv(r.series)).toBe(text); // byte-identical the second time
      }),
      { numRuns: 300 },
    );
  });

  type Corruption = { kind: string; row: number; col: number; pick: number };
  const corruptionArb = fc.record({
    kind: fc.constantFrom(
      'bad date',
      'duplicate date',
      'swapped order',
      'non-numeric',
      'negative precipitation',
      'tmin above tmax',
      'deleted row',
      'out of bounds',
    ),
    row: fc.nat(),
    col: fc.nat(),
    pick: fc.nat(),
  });

  /** Apply one corruption to the lines of a formatted file; return the expected location. */
  function corrupt(lines: string[], c: Corruption): { line: number; column: string } | undefined {
    const header = lines[0].split(',');
    const n = lines.length - 1; // data rows are lines[1..n]
    const cells = (i: number) => lines[i].split(',');
    const set = (i: number, col: number, v: string) => {
      const x = cells(i);
      x[col] = v;
      lines[i] = x.join(',');
    };
    const r = 1 + (c.row % n); // a data line index
    const valueCol = 1 + (c.col % (header.length - 1));
    switch (c.kind) {
      case 'bad date': {
        const bad = ['2023-02-29', '2024-13-01', 'yesterday', '2024/01/01', '1-1-2024', ''];
        set(r, 0, bad[c.pick % bad.length]);
        return { line: r + 1, column: 'date' };
      }
      case 'duplicate date':
        if (n < 2) return undefined;
        set(Math.max(2, r), 0, cells(Math.max(2, r) - 1)[0]);
        return { line: Math.max(2, r) + 1, column: 'date' };
      case 'swapped order': {
        if (n < 2) return undefined;
        const i = Math.min(r, n - 1);
        [lines[i], lines[i + 1]] = [lines[i + 1], lines[i]];
        return { line: i + 2, column: 'date' };
      }
      case 'non-numeric': {
        const bad = ['abc', '1.2.3', '12mm', '--1', '0x10', 'Infinity'];
        set(r, valueCol, bad[c.pick % bad.length]);
        return { line: r + 1, column: header[valueCol] };
      }
      case 'negative precipitation':
        set(r, 1, `-${(1 + (c.pick % 500)) / 10}`);
        return { line: r + 1, column: 'precip_mm' };
      case 'tmin above tmax': {
        const tmin = Number(cells(r)[3]);
        set(r, 2, (tmin - (1 + (c.pick % 30)) / 10).toFixed(1));
        return { line: r + 1, column: 'tmin_c' };
      }
      case 'deleted row':
        if (n < 3) return undefined;
        lines.splice(Math.min(Math.max(2, r), n - 1), 1);
        return { line: Math.min(Math.max(2, r), n - 1) + 1, column: 'date' };
      case 'out of bounds': {
        const outside: Record<string, string> = {
          precip_mm: '2500',
          tmax_c: '75',
          tmin_c: '-95',
          ref_et_mm: '45',
          solar_mj_m2: '60',
          rh_pct: '101',
          wind_m_s: '80',
        };
        set(r, valueCol, outside[header[valueCol]]);
        return { line: r + 1, column: header[valueCol] };
      }
    }
    return undefined;
  }

  it('any single corruption yields one error at the corrupted line and column', () => {
    fc.assert(
      fc.property(seriesArb, corruptionArb, fc.boolean(), (w, c, crlf) => {
        const lines = formatWeatherCsv(w).trimEnd().split('\n');
        const expected = corrupt(lines, c);
        fc.pre(expected !== undefined);
        const text = lines.join(crlf ? '\r\n' : '\n') + '\n';
        let caught: unknown;
        try {
          parseWeatherCsv(text, { file: 'p.csv' });
        } catch (err) {
          caught = err;
        }
        expect(caught, `${c.kind} was accepted`).toBeInstanceOf(WeatherInputError);
        const e = caught as WeatherInputError;
        expect(e.problems).toHaveLength(1);
        expect({ line: e.problems[0].line, column: e.problems[0].column }).toEqual(expected);
        expect(e.message).toContain(`p.csv line ${expected!.line}, column ${expected!.column}: `);
      }),
      { numRuns: 1000 },
    );
  });

  it('any text at all gives a series or a TilefluxError, never a crash', () => {
    const noisy = fc.oneof(
      fc.string({ maxLength: 200 }),
      fc.tuple(seriesArb, fc.nat(), fc.string({ maxLength: 5 })).map(([w, at, junk]) => {
        const t = formatWeatherCsv(w);
        const i = at % (t.length + 1);
        return t.slice(0, i) + junk + t.slice(i);
      }),
    );
    fc.assert(
      fc.property(noisy, fc.boolean(), (text, fill) => {
        try {
          const r = parseWeatherCsv(text, { file: 'n.csv', fill });
          expect(r.series.dates.length).toBeGreaterThan(0);
          for (let i = 0; i < r.series.dates.length; i++) {
            expect(Number.isFinite(r.series.precipMm[i])).toBe(true);
            expect(r.series.tminC[i]).toBeLessThanOrEqual(r.series.tmaxC[i]);
          }
        } catch (err) {
          expect(err).toBeInstanceOf(TilefluxError);
          expect((err as Error).message).toMatch(/^n\.csv line \d+/);
        }
      }),
      { numRuns: 1000 },
    );
  });
});
