import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { createHash } from 'node:crypto';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { CsvRows, civilDay, isoDateRun } from '../../src/io/weather/csvRows.js';
import { readWeatherFile, type WeatherReadResult } from '../../src/io/weather.js';
import { dayNumber, isoDate } from '../../src/climate/calendar.js';
import { OPTIONAL_WEATHER_FIELDS } from '../../src/climate/weatherSeries.js';

// The record reader is checked against csv-parse (the library the weather reader used before,
// with the options it used), numbers against Number() and dates against the Date-based calendar.

function viaCsvParse(text: string) {
  return (
    parse(text, {
      bom: true,
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      skip_records_with_empty_values: true,
      trim: true,
    }) as unknown as { record: string[]; info: { lines: number } }[]
  ).map((r) => ({ fields: r.record, line: r.info.lines }));
}

function viaCsvRows(text: string) {
  const rows = new CsvRows(text);
  const out: { fields: string[]; line: number }[] = [];
  while (rows.next()) out.push({ fields: rows.fields(), line: rows.line });
  return out;
}

const plainField = fc.stringMatching(/^[-a-z0-9 .]{0,6}$/);
const quotedField = fc
  .stringMatching(/^[-a-z0-9 ,"]{0,6}$/)
  .map((s) => `"${s.replaceAll('"', '""')}"`);
const field = fc.oneof(plainField, quotedField, fc.constant(''));
const record = fc.array(field, { minLength: 1, maxLength: 5 }).map((f) => f.join(','));
const csvText = fc
  .record({
    records: fc.array(record, { minLength: 0, maxLength: 12 }),
    eol: fc.constantFrom('\n', '\r\n'),
    bom: fc.boolean(),
    final: fc.boolean(),
  })
  .map(
    ({ records, eol, bom, final }) =>
      (bom ? '\uFEFF' : '') + records.join(eol) + (final && records.length ? eol : ''),
  );

describe('CsvRows', () => {
  it('reads every record, field and line as csv-parse does (quotes, CRLF, blanks, BOM)', () => {
    fc.assert(
      fc.property(csvText, (text) => {
        expect(viaCsvRows(text)).toEqual(viaCsvParse(text));
      }),
      { numRuns: 500 },
    );
  });

  it('gives the first line of a record whose quoted field spans lines', () => {
    const rows = new CsvRows('a,b\n"x\ny",2\nz,3\n');
    expect(rows.next() && rows.line).toBe(1);
    expect(rows.next() && [rows.line, rows.field(0)]).toEqual([2, 'x\ny']);
    expect(rows.next() && [rows.line, rows.field(0)]).toEqual([4, 'z']);
  });

  it('rejects an unclosed quote and a stray quote with the line', () => {
    expect(() => viaCsvRows('a\n"b\n')).toThrow(/never closed/);
    try {
      viaCsvRows('a,b\n1,2\n3,x"y\n');
    } catch (err) {
      expect((err as { line: number }).line).toBe(3);
    }
    expect(() => viaCsvRows('a\n"b"c\n')).toThrow(/after the closing quote/);
  });

  it('reads a number exactly as Number() does, and only the decimal forms', () => {
    const decimal = fc
      .tuple(
        fc.constantFrom('', '-', '+'),
        fc.stringMatching(/^[0-9]{0,12}$/),
        fc.constantFrom('', '.'),
        fc.stringMatching(/^[0-9]{0,10}$/),
        fc.constantFrom('', 'e3', 'E-2', 'e', 'x'),
      )
      .map((p) => p.join(''));
    const fromDouble = fc.double({ noNaN: true, noDefaultInfinity: true }).map(String);
    const plain = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
    fc.assert(
      fc.property(fc.oneof(decimal, fromDouble), (s) => {
        const rows = new CsvRows(`${s}\n`);
        if (!rows.next()) return; // an empty field: no record
        const x = rows.number(0);
        if (plain.test(s)) expect(Object.is(x, Number(s))).toBe(true);
        else expect(x).toBeNaN();
      }),
      { numRuns: 3000 },
    );
  });

  it('reads dates as the Date-based calendar does, and rejects impossible ones', () => {
    fc.assert(
      fc.property(fc.integer({ min: -700_000, max: 2_900_000 }), (day) => {
        const iso = isoDate(day);
        const rows = new CsvRows(`${iso},${iso.replaceAll('-', '')}\n`);
        rows.next();
        expect(rows.isoDay(0)).toBe(day);
        expect(rows.compactDay(1)).toBe(day);
        expect(civilDay(Number(iso.slice(0, 4)), Number(iso.slice(5, 7)), 1)).toBe(
          dayNumber(`${iso.slice(0, 8)}01`),
        );
      }),
      { numRuns: 2000 },
    );
    // Bad dates between good ones of one month: the month remembered stays right.
    const rows = new CsvRows(
      '2023-01-30\n2023-02-29\n2024-13-01\n2024-00-10\n2024-04-31\n2024-4-01\n2023-01-31\n',
    );
    const read: number[] = [];
    while (rows.next()) read.push(rows.isoDay(0));
    expect(read.slice(1, -1).every(Number.isNaN)).toBe(true);
    expect([read[0], read.at(-1)]).toEqual([dayNumber('2023-01-30'), dayNumber('2023-01-31')]);
  });

  it('writes runs of dates as isoDate does, across month, year and leap-day ends', () => {
    const first = dayNumber('1899-12-25')!;
    const run = isoDateRun(first, 365 * 130);
    for (let i = 0; i < run.length; i += 1) {
      if (run[i] !== isoDate(first + i)) expect(run[i]).toBe(isoDate(first + i));
    }
    expect(isoDateRun(dayNumber('2024-02-28')!, 3)).toEqual([
      '2024-02-28',
      '2024-02-29',
      '2024-03-01',
    ]);
  });
});

/** SHA-256 of everything a read returns: dates, the bytes of every array, filled days, columns. */
function digest(r: WeatherReadResult): string {
  const h = createHash('sha256');
  h.update(r.series.dates.join(','));
  for (const k of ['precipMm', 'tmaxC', 'tminC', ...OPTIONAL_WEATHER_FIELDS] as const) {
    const a = r.series[k];
    if (!a) continue;
    h.update(k);
    h.update(new Uint8Array(a.buffer, a.byteOffset, a.byteLength));
  }
  h.update(JSON.stringify([r.filledDays, r.columnsUsed, r.unitsUsed]));
  return h.digest('hex');
}

describe('the fast reader gives what the csv-parse reader gave', () => {
  // Digests computed with the reader built on csv-parse (per-record info objects), before the
  // record reader replaced it: the same dates and the same bits in every value.
  const root = join(import.meta.dirname, '..', '..');
  const vega = join(root, 'node_modules', 'vega-datasets', 'data');
  const columns = { date: 'date', precip: 'precipitation', tmax: 'temp_max', tmin: 'temp_min' };
  it.each([
    [
      'data-demo/weather.csv',
      () => readWeatherFile(join(root, 'data-demo', 'weather.csv')),
      '56e3e0d80bcd5957f2a91c3684566c2d595083b260d579f292657c35e434e998',
    ],
    [
      'vega-datasets weather.csv, Seattle',
      () =>
        readWeatherFile(join(vega, 'weather.csv'), {
          columns,
          where: { column: 'location', value: 'Seattle' },
        }),
      '44244e4e3bae4b3eeac88dafd6d9b686ddd4ce55380ad08e392d27631f4daad5',
    ],
    [
      'vega-datasets weather.csv, New York',
      () =>
        readWeatherFile(join(vega, 'weather.csv'), {
          columns,
          where: { column: 'location', value: 'New York' },
        }),
      '38015f128974a1cd1c835f85e91969d12dd60bab951bc0968646b85b7e3a2a47',
    ],
    [
      'vega-datasets seattle-weather.csv',
      () => readWeatherFile(join(vega, 'seattle-weather.csv'), { columns }),
      '44244e4e3bae4b3eeac88dafd6d9b686ddd4ce55380ad08e392d27631f4daad5',
    ],
  ])('%s', (_name, read, expected) => {
    expect(digest(read())).toBe(expected);
  });
});
