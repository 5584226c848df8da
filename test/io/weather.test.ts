import { describe, it, expect } from 'vitest';
import {
  formatWeatherCsv,
  parseWeatherCsv,
  WeatherInputError,
  type WeatherReadOptions,
} from '../../src/io/weather.js';
import { TilefluxError } from '../../src/errors.js';

const F = { file: 'w.csv' };

/** The located problem a bad file produces (fails the test if the file is accepted). */
function problem(text: string, o: WeatherReadOptions = {}) {
  try {
    parseWeatherCsv(text, { ...F, ...o });
  } catch (err) {
    expect(err).toBeInstanceOf(WeatherInputError);
    expect(err).toBeInstanceOf(TilefluxError);
    const e = err as WeatherInputError;
    expect(e.message).not.toContain('\n'); // one line on stderr
    expect(e.message.startsWith('w.csv line ')).toBe(true);
    return { ...e.problems[0], text: e.message, count: e.problems.length };
  }
  throw new Error('the file was accepted');
}

const GOOD =
  'date,precip_mm,tmax_c,tmin_c\n2024-05-01,1.5,20,10\n2024-05-02,0,22,11\n2024-05-03,7.25,18,9\n';

describe('parseWeatherCsv: accepted forms', () => {
  it('reads the canonical form into core units', () => {
    const r = parseWeatherCsv(GOOD, F);
    expect(r.series.dates).toEqual(['2024-05-01', '2024-05-02', '2024-05-03']);
    expect([...r.series.precipMm]).toEqual([1.5, 0, 7.25]);
    expect([...r.series.tmaxC]).toEqual([20, 22, 18]);
    expect([...r.series.tminC]).toEqual([10, 11, 9]);
    expect(r.filledDays).toBe(0);
    expect(r.columnsUsed).toEqual({
      date: 'date',
      precip: 'precip_mm',
      tmax: 'tmax_c',
      tmin: 'tmin_c',
    });
    expect(r.unitsUsed).toEqual({ precip: 'mm', tmax: 'degC', tmin: 'degC' });
    expect(r.series.refEtMm).toBeUndefined();
  });

  it('converts inches and Fahrenheit from the header suffix (1 in = 25.4 mm, degC = (degF - 32) 5/9)', () => {
    const r = parseWeatherCsv('Date,PRECIP_IN,Tmax_F,tmin_f\n2024-01-01,0.5,68,-4\n', F);
    expect(r.series.precipMm[0]).toBeCloseTo(12.7, 12);
    expect(r.series.tmaxC[0]).toBeCloseTo(20, 12);
    expect(r.series.tminC[0]).toBeCloseTo(-20, 12);
    expect(r.unitsUsed).toEqual({ precip: 'in', tmax: 'degF', tmin: 'degF' });
  });

  it('handles a byte-order mark, CRLF, spaces, blank and trailing blank lines', () => {
    const text =
      '\uFEFF' +
      GOOD.replace(/\n/g, '\r\n').replace('2024-05-02,0', '\r\n 2024-05-02 , 0 ') +
      '\r\n\r\n,,,\r\n';
    const r = parseWeatherCsv(text, F);
    expect(r.series.dates.length).toBe(3);
    expect(r.series.precipMm[1]).toBe(0);
  });

  it('reads optional columns with their units', () => {
    const text =
      'date,precip_mm,tmax_c,tmin_c,ref_et_in,solar_w_m2,rh_pct,wind_mph,station_note\n' +
      '2024-07-01,0,30,18,0.2,250,55,10,ok\n';
    const r = parseWeatherCsv(text, F);
    expect(r.series.refEtMm![0]).toBeCloseTo(5.08, 12); // 0.2 in
    expect(r.series.solarMJm2![0]).toBeCloseTo(21.6, 12); // 250 W/m2 * 86400 s = 21.6 MJ/m2
    expect(r.series.rhMeanPct![0]).toBe(55);
    expect(r.series.wind2mMs![0]).toBeCloseTo(4.4704, 12); // 10 mph, 1 mph = 0.44704 m/s exactly
  });

  it('maps other headers with columns, units from flags, and keeps one station with where', () => {
    const text =
      'STATION,DATE,PRCP,TMAX,TMIN,AWND\n' +
      'B,2024-05-01,9,99,98,1\n' +
      'A,2024-05-01,0.1,50,41,3\n' +
      'A,2024-05-02,0,59,32,4\n';
    const r = parseWeatherCsv(text, {
      ...F,
      columns: { date: 'DATE', precip: 'PRCP', tmax: 'TMAX', tmin: 'TMIN' },
      precipUnit: 'in',
      tempUnit: 'f',
      where: { column: 'STATION', value: 'A' },
    });
    expect(r.series.dates).toEqual(['2024-05-01', '2024-05-02']);
    expect(r.series.precipMm[0]).toBeCloseTo(2.54, 12);
    expect(r.series.tmaxC[0]).toBeCloseTo(10, 12);
    expect(r.series.tminC[1]).toBeCloseTo(0, 12);
    expect(r.series.wind2mMs).toBeUndefined(); // unmapped, unsuffixed: not taken as wind at 2 m
    expect(r.columnsUsed.precip).toBe('PRCP');
  });

  it('fills short gaps: precipitation 0, temperatures interpolated linearly', () => {
    const text =
      'date,precip_mm,tmax_c,tmin_c,rh_pct\n' +
      '2024-05-01,5,20,8,60\n' +
      '2024-05-05,3,24,12,80\n' + // 3 missing days between
      '2024-05-06,,25,NA,70\n'; // empty cells
    const r = parseWeatherCsv(text, { ...F, fill: true });
    expect(r.series.dates.length).toBe(6);
    expect(r.filledDays).toBe(4);
    expect([...r.series.precipMm]).toEqual([5, 0, 0, 0, 3, 0]);
    // Linear interpolation 20 -> 24 over 4 steps: 21, 22, 23 (hand calculation).
    expect([...r.series.tmaxC]).toEqual([20, 21, 22, 23, 24, 25]);
    expect([...r.series.rhMeanPct!]).toEqual([60, 65, 70, 75, 80, 70]);
    expect(r.series.tminC[5]).toBe(12); // last day: the nearest value
  });
});

describe('parseWeatherCsv: every bad input names file, line and column', () => {
  it('empty file and header without rows', () => {
    expect(problem('').message).toMatch(/file is empty/);
    expect(problem('\uFEFF\r\n\r\n').line).toBe(1);
    const h = problem('date,precip_mm,tmax_c,tmin_c\r\n\r\n');
    expect(h.line).toBe(1);
    expect(h.message).toMatch(/header but no data rows/);
  });

  it('missing and unknown columns', () => {
    const m = problem('date,precip_cm,tmax_c,tmin_c\n2024-01-01,1,2,1\n');
    expect(m.message).toMatch(/no precipitation column/);
    expect(m.message).toMatch(/precip_mm or precip_in/);
    expect(m.message).toMatch(/precip_cm has an unknown unit suffix/);
    expect(problem(GOOD, { columns: { rain: 'x' } }).message).toMatch(/unknown variable "rain"/);
    expect(problem(GOOD, { columns: { precip: 'PRCP' } }).message).toMatch(/no column "PRCP"/);
    expect(problem(GOOD, { where: { column: 'site', value: 'A' } }).message).toMatch(
      /no column "site"/,
    );
    expect(problem('date,precip_mm,precip_in,tmax_c,tmin_c\n').column).toBe('precip_in');
    const conflict = problem(GOOD, { precipUnit: 'in' });
    expect(conflict.column).toBe('precip_mm');
    expect(conflict.message).toMatch(/but precipUnit says in/);
  });

  it('no rows for the where value lists the values present', () => {
    const p = problem('site,date,precip_mm,tmax_c,tmin_c\nA,2024-01-01,0,1,0\n', {
      where: { column: 'site', value: 'B' },
    });
    expect(p.message).toMatch(/no rows where site is "B"; values found: "A"/);
  });

  it.each([
    [
      'bad date',
      '2024-05-02',
      '2024-02-30',
      3,
      'date',
      /not a date; expected a calendar date as YYYY-MM-DD/,
    ],
    ['non-numeric', '2024-05-02,0,22', '2024-05-02,0,hot', 3, 'tmax_c', /"hot" is not a number/],
    [
      'empty cell',
      '2024-05-02,0,22',
      '2024-05-02,,22',
      3,
      'precip_mm',
      /no precipitation value.*use fill for up to 7/,
    ],
    ['negative precipitation', '7.25,18', '-1,18', 4, 'precip_mm', /precipitation -1 is negative/],
    [
      'tmin above tmax',
      '22,11',
      '22,23',
      3,
      'tmin_c',
      /minimum temperature 23 degC is above the maximum 22/,
    ],
    ['out of bounds', '18,9', '18,-9999', 4, 'tmin_c', /outside the physical range -90 to 60/],
    [
      'missing field',
      '2024-05-02,0,22,11',
      '2024-05-02,0,22',
      3,
      'tmin_c',
      /3 fields but the header has 4/,
    ],
  ])('%s', (_name, from, to, line, column, re) => {
    const p = problem(GOOD.replace(from, to));
    expect(p.line).toBe(line);
    expect(p.column).toBe(column);
    expect(p.message).toMatch(re);
    expect(p.text).toContain(`w.csv line ${line}, column ${column}: `);
  });

  it('duplicated, unordered and missing dates', () => {
    const dup = problem(GOOD.replace('2024-05-03', '2024-05-02'));
    expect([dup.line, dup.column]).toEqual([4, 'date']);
    expect(dup.message).toMatch(/2024-05-02 repeats line 3/);
    const order = problem(
      GOOD.replace('2024-05-02', '2024-05-09').replace('2024-05-03', '2024-05-02'),
    );
    expect(order.line).toBe(4);
    expect(order.message).toMatch(/comes after 2024-05-09 \(line 3\)/);
    const gap = problem(GOOD.replace('2024-05-03', '2024-05-08'));
    expect([gap.line, gap.column]).toEqual([4, 'date']);
    expect(gap.message).toMatch(/5 missing days \(2024-05-03, 2024-05-04, 2024-05-05, \.\.\.\)/);
    const long = problem(GOOD.replace('2024-05-03', '2024-05-11'), { fill: true });
    expect(long.message).toMatch(
      /8 days are missing \(2024-05-03 to 2024-05-10\); fill fills at most 7/,
    );
  });

  it('lists several problems on one line and counts the rest', () => {
    const rows = ['date,precip_mm,tmax_c,tmin_c'];
    for (let d = 1; d <= 9; d++) rows.push(`2024-05-0${d},-1,20,10`);
    const p = problem(rows.join('\n'));
    expect(p.count).toBe(9);
    expect(p.text).toMatch(/line 2, .*; line 3, .*; line 4, .* \(and 6 more problems\)$/);
  });

  it('a run of more than 7 empty cells cannot be filled', () => {
    const rows = ['date,precip_mm,tmax_c,tmin_c'];
    for (let d = 1; d <= 12; d++)
      rows.push(`2024-05-${String(d).padStart(2, '0')},0,${d > 2 && d < 11 ? '' : 20},10`);
    const p = problem(rows.join('\n'), { fill: true });
    expect([p.line, p.column]).toEqual([4, 'tmax_c']);
    expect(p.message).toMatch(/8 days in a row have no maximum temperature/);
  });

  it('unclosed quotes are reported as invalid CSV with a line', () => {
    const p = problem('date,precip_mm,tmax_c,tmin_c\n2024-05-01,"1,20,10\n');
    expect(p.message).toMatch(/not valid CSV/);
  });
});

describe('formatWeatherCsv', () => {
  it('writes fixed decimals, optional columns in order, no negative zero', () => {
    const text = formatWeatherCsv({
      dates: ['2024-05-01', '2024-05-02'],
      precipMm: Float64Array.of(12.7, 0),
      tmaxC: Float64Array.of(20, -0.04),
      tminC: Float64Array.of(10.05, -3.26),
      wind2mMs: Float64Array.of(2, 3.456),
      refEtMm: Float64Array.of(4, 5),
    });
    expect(text).toBe(
      'date,precip_mm,tmax_c,tmin_c,ref_et_mm,wind_m_s\n' +
        '2024-05-01,12.70,20.0,10.1,4.00,2.00\n' +
        '2024-05-02,0.00,0.0,-3.3,5.00,3.46\n',
    );
    expect(parseWeatherCsv(text).series.wind2mMs![1]).toBe(3.46);
  });
});

describe('reference ET column', () => {
  it('is read from ref_et_mm, and an old pet_mm header is an error, not ignored', () => {
    const text = 'date,precip_mm,tmax_c,tmin_c,ref_et_mm\n2024-05-01,0,20,10,3.5\n';
    expect(parseWeatherCsv(text, F).series.refEtMm![0]).toBe(3.5);
    const p = problem('date,precip_mm,tmax_c,tmin_c,pet_mm\n2024-05-01,0,20,10,3.5\n');
    expect(p.text).toContain('column pet_mm: reference ET');
    expect(p.text).toContain('ref_et_mm');
    // Mapped on purpose, the same column is read.
    const mapped = parseWeatherCsv(
      'date,precip_mm,tmax_c,tmin_c,pet_mm\n2024-05-01,0,20,10,3.5\n',
      {
        ...F,
        columns: { ref_et: 'pet_mm' },
      },
    );
    expect(mapped.series.refEtMm![0]).toBe(3.5);
  });
});
