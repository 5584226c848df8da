import { describe, it, expect } from 'vitest';
import { join } from 'node:path';
import { readFileSync } from 'node:fs';
import {
  detectWeatherFormat,
  readWeather,
  readWeatherFile,
  WeatherInputError,
  type WeatherReadOptions,
} from '../../src/io/weather.js';
import { TilefluxError } from '../../src/errors.js';

// Small invented files in the public formats (test/io/fixtures, never real station data); every
// expected value is computed by hand from the file, with the unit definitions 1 in = 25.4 mm and
// degC = (degF - 32) 5/9 (exact), tenths as the GHCN-Daily by-station files use them, and
// 31 December left out of Daymet's leap years.
const fixture = (name: string) => join(import.meta.dirname, 'fixtures', name);

function problemOf(name: string, o: WeatherReadOptions) {
  try {
    readWeatherFile(fixture(name), o);
  } catch (err) {
    expect(err).toBeInstanceOf(TilefluxError);
    return err as WeatherInputError;
  }
  throw new Error('accepted');
}

describe('format detection from the header', () => {
  it.each([
    ['ghcn-wide-metric.csv', 'ghcn'],
    ['ghcn-wide-standard.csv', 'ghcn'],
    ['ghcn-by-station.csv', 'ghcn'],
    ['daymet.csv', 'daymet'],
  ])('%s is %s', (name, format) => {
    expect(detectWeatherFormat(readFileSync(fixture(name), 'utf8'))).toBe(format);
  });
  it('the own format and other CSVs stay tileflux', () => {
    expect(detectWeatherFormat('date,precip_mm,tmax_c,tmin_c\n')).toBe('tileflux');
    expect(detectWeatherFormat('location,date,precipitation,temp_max,temp_min\n')).toBe('tileflux');
  });
});

describe('GHCN-Daily wide export', () => {
  it('metric units, one station of two, a flagged and an empty value filled', () => {
    const r = readWeatherFile(fixture('ghcn-wide-metric.csv'), {
      station: 'XX000000001',
      exportUnits: 'metric',
      fill: true,
    });
    expect(r.format).toBe('ghcn');
    expect(r.series.dates).toEqual([
      '2024-02-27',
      '2024-02-28',
      '2024-02-29',
      '2024-03-01',
      '2024-03-02',
    ]);
    expect([...r.series.precipMm]).toEqual([5.1, 0, 12.7, 2, 0.3]);
    // TMAX of 1 March has Q flag I: a gap, interpolated between 8.3 and 7.2 -> 7.75.
    expect(r.series.tmaxC[3]).toBeCloseTo(7.75, 12);
    // TMIN of 29 February is empty: between -0.6 and 1.0 -> 0.2.
    expect(r.series.tminC[2]).toBeCloseTo(0.2, 12);
    expect(r.filledDays).toBe(2);
    expect(r.notes.join(' ')).toMatch(/1 quality-flagged value/);
  });

  it('without --fill the flagged and empty values are located errors', () => {
    const e = problemOf('ghcn-wide-metric.csv', { station: 'XX000000001', exportUnits: 'metric' });
    expect(e.problems.map((p) => [p.line, p.column])).toEqual([
      [4, 'TMIN'],
      [5, 'TMAX'],
    ]);
    expect(e.problems[1].message).toMatch(/quality-flagged \(Q flag I in TMAX_ATTRIBUTES\)/);
  });

  it('asks for the station when the file holds several, and for the export units', () => {
    expect(problemOf('ghcn-wide-metric.csv', { exportUnits: 'metric' }).message).toMatch(
      /2 stations \(XX000000001, XX000000002\); choose one with station ID/,
    );
    expect(problemOf('ghcn-wide-metric.csv', { station: 'XX000000002' }).message).toMatch(
      /give exportUnits metric .* or exportUnits standard/,
    );
    expect(
      problemOf('ghcn-wide-metric.csv', { station: 'XX9', exportUnits: 'metric' }).message,
    ).toMatch(/no rows where STATION is "XX9"; values found: "XX000000001", "XX000000002"/);
  });

  it('standard units: inches and degrees Fahrenheit', () => {
    const r = readWeatherFile(fixture('ghcn-wide-standard.csv'), { exportUnits: 'standard' });
    expect(r.series.precipMm[0]).toBeCloseTo(0.2 * 25.4, 12); // 5.08 mm
    expect(r.series.precipMm[1]).toBeCloseTo(1.05 * 25.4, 12); // 26.67 mm
    expect(r.series.tmaxC[0]).toBeCloseTo(((39 - 32) * 5) / 9, 12); // 3.89 degC
    expect(r.series.tminC[2]).toBeCloseTo(-20, 12); // -4 degF
    expect(r.unitsUsed).toEqual({ precip: 'in', tmax: 'degF', tmin: 'degF' });
  });
});

describe('GHCN-Daily by-station file (tenths)', () => {
  it('tenths of mm and degC, -9999 and a Q flag as gaps', () => {
    const r = readWeatherFile(fixture('ghcn-by-station.csv'), { fill: true });
    expect(r.series.dates).toEqual(['2024-02-28', '2024-02-29', '2024-03-01', '2024-03-02']);
    expect([...r.series.precipMm]).toEqual([0, 12.7, 2, 0.3]);
    expect(r.series.tmaxC[0]).toBe(6.1);
    expect(r.series.tmaxC[2]).toBeCloseTo((8.3 + 7.2) / 2, 12); // Q flag I: interpolated
    expect(r.series.tminC[1]).toBeCloseTo((-0.6 + 1.0) / 2, 12); // -9999: interpolated
    expect(r.unitsUsed.precip).toBe('tenths of mm');
  });
  it('without --fill, each gap at its line', () => {
    const e = problemOf('ghcn-by-station.csv', {});
    expect(e.problems.map((p) => p.line)).toEqual([6, 8]);
  });
});

describe('Daymet single-pixel table', () => {
  const r = readWeatherFile(fixture('daymet.csv'));
  it('dates from year and yday: yday 365 of 2024 (a leap year) is 30 December', () => {
    expect(r.format).toBe('daymet');
    expect(r.series.dates).toEqual([
      '2024-12-28',
      '2024-12-29',
      '2024-12-30',
      '2024-12-31',
      '2025-01-01',
      '2025-01-02',
    ]);
  });
  it('fills the left-out 31 December and says so', () => {
    expect(r.series.precipMm[3]).toBe(0);
    expect(r.series.tmaxC[3]).toBeCloseTo((3 + 5) / 2, 12);
    expect(r.series.tminC[3]).toBeCloseTo((-5 + -3) / 2, 12);
    expect(r.leapDaysFilled).toBe(1);
    expect(r.filledDays).toBe(0);
    expect(r.notes.join(' ')).toMatch(/31 December filled in 1 leap year/);
  });
  it('daily solar radiation = srad x dayl / 10^6 (MJ m-2 d-1)', () => {
    expect(r.series.solarMJm2![0]).toBeCloseTo((100 * 32000) / 1e6, 12); // 3.2
    expect(r.series.solarMJm2![3]).toBeCloseTo((3.852 + 2.898) / 2, 12);
  });
  it('located errors carry the line in the original file (header lines counted)', () => {
    const text = readFileSync(fixture('daymet.csv'), 'utf8').replace(
      '2025,1,32200.00,1.20',
      '2025,1,32200.00,-1.20',
    );
    try {
      readWeather(text, { file: 'd.csv' });
      throw new Error('accepted');
    } catch (err) {
      expect((err as WeatherInputError).problems[0]).toMatchObject({
        line: 12,
        column: 'prcp (mm/day)',
      });
    }
  });
});
