/**
 * Daymet single-pixel CSV, as the gridded daily surface-weather service writes it for one
 * point: header lines (latitude, longitude, elevation, version, how to cite) before the table,
 * then `year,yday,dayl (s),prcp (mm/day),srad (W/m^2),swe (kg/m^2),tmax (deg c),tmin (deg c),
 * vp (Pa)`. Every year has 365 days: in leap years 31 December is left out (Daymet user guide,
 * from memory), so yday 365 of a leap year is 30 December. The reader puts each row on its date,
 * fills each left-out 31 December explicitly (precipitation 0, temperatures and radiation
 * interpolated between 30 December and 1 January, as --fill does) and says how many it filled.
 *
 * Read: prcp (mm/day), tmax and tmin (deg c), and, when present, srad (W/m^2, the mean over the
 * daylight period) with dayl (s) as daily solar radiation srad x dayl / 10^6 MJ m-2 d-1. Not
 * read: swe (snow water equivalent, the snow model computes its own) and vp (vapour pressure).
 */
import { assembleSeries, checkTminTmax, lineCount, stagedRows } from './assemble.js';
import { civilDay, CsvRows } from './csvRows.js';
import {
  EMPTY_FILE,
  nextRecord,
  NO_ROWS,
  toCore,
  type WeatherReadOptions,
  type WeatherReadResult,
} from './parse.js';
import { Problems } from './problems.js';
import { isLeapYear } from '../../climate/calendar.js';
import { CELSIUS, MM, NOUN, type UnitSpec, type ValueVariable } from './units.js';

/** A line that starts the Daymet table. */
export const DAYMET_TABLE_START = /^\s*"?year"?\s*,\s*"?yday"?\s*(,|$)/i;

/** Where the table starts: the character offset and line of its header, or undefined. */
export function daymetTable(text: string): { offset: number; line: number } | undefined {
  let offset = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  for (let line = 1; line <= 60 && offset < text.length; line++) {
    let end = text.indexOf('\n', offset);
    if (end < 0) end = text.length;
    if (DAYMET_TABLE_START.test(text.slice(offset, end))) return { offset, line };
    offset = end + 1;
  }
  return undefined;
}

const SOLAR: UnitSpec = { suffix: 'mj_m2', label: 'MJ/m2/d (srad x dayl)', toCore: (x) => x };

/** The Daymet columns read: name before the parenthesis, and the unit it must carry. */
const COLUMNS: ReadonlyArray<[string, string, ValueVariable | 'dayl', UnitSpec]> = [
  ['prcp', 'mm/day', 'precip', MM],
  ['tmax', 'deg c', 'tmax', CELSIUS],
  ['tmin', 'deg c', 'tmin', CELSIUS],
  ['srad', 'w/m^2', 'solar', SOLAR],
  ['dayl', 's', 'dayl', SOLAR],
];

/** A Daymet single-pixel CSV. */
export function parseDaymet(text: string, o: WeatherReadOptions): WeatherReadResult {
  const problems = new Problems(o.file ?? 'weather CSV');
  const at = daymetTable(text);
  if (at === undefined) {
    return problems.fail(
      1,
      undefined,
      'no Daymet table: expected a line starting year,yday within the first 60 lines',
    );
  }
  const rows = new CsvRows(text, at.offset, at.line);
  if (!nextRecord(rows, problems)) problems.fail(1, undefined, EMPTY_FILE);
  const header = rows.fields();
  const headerLine = rows.line;
  const index: Partial<Record<string, number>> = {};
  for (const [name, unit, key] of COLUMNS) {
    const k = header.findIndex((h) => h.toLowerCase().split('(')[0].trim() === name);
    if (k < 0) continue;
    const given = /\((.*)\)/.exec(header[k])?.[1]?.trim().toLowerCase();
    if (given !== unit) {
      problems.fail(
        headerLine,
        header[k],
        `expected ${name} in ${unit}, as Daymet writes it; the header says ${given ?? 'no unit'}`,
      );
    }
    index[key] = k;
  }
  const absent = ['prcp', 'tmax', 'tmin'].filter((_name, i) => index[COLUMNS[i][2]] === undefined);
  if (absent.length > 0) {
    problems.fail(
      headerLine,
      undefined,
      `no ${absent.join(', ')} column${absent.length > 1 ? 's' : ''}; a Daymet table has ` +
        'year,yday,dayl (s),prcp (mm/day),srad (W/m^2),swe (kg/m^2),tmax (deg c),tmin (deg c),vp (Pa)',
    );
  }
  const solar = index.solar !== undefined && index.dayl !== undefined;
  const variables: ValueVariable[] = solar
    ? ['precip', 'tmax', 'tmin', 'solar']
    : ['precip', 'tmax', 'tmin'];
  const headers: Partial<Record<ValueVariable, string>> = {};
  for (const v of variables) headers[v] = header[index[v]!];
  const staged = stagedRows(lineCount(text) + 64, variables, headers, header[1]);
  const fill = o.fill === true;
  let n = 0;
  let leapFilled = 0;
  const push = (day: number, line: number) => {
    const r = n++;
    staged.days[r] = day;
    staged.lines[r] = line;
    return r;
  };
  const addLeapDay = (day: number, line: number) => {
    const r = push(day, line);
    for (const v of variables) staged.values[v]![r] = NaN;
    staged.missingCells += variables.length;
    leapFilled++;
  };
  let previous = NaN;
  while (nextRecord(rows, problems)) {
    const line = rows.line;
    if (rows.count !== header.length) {
      problems.add(
        line,
        rows.count < header.length ? header[rows.count] : undefined,
        `the row has ${rows.count} fields but the header has ${header.length}`,
      );
      continue;
    }
    const year = rows.number(0);
    const yday = rows.number(1);
    const leap = Number.isInteger(year) && isLeapYear(year);
    if (!Number.isInteger(year) || year < 1 || year > 9999) {
      problems.add(
        line,
        header[0],
        `"${rows.field(0)}" is not a year; expected a whole number such as 2024`,
      );
      continue;
    }
    if (!Number.isInteger(yday) || yday < 1 || yday > (leap ? 366 : 365)) {
      problems.add(
        line,
        header[1],
        `"${rows.field(1)}" is not a day of the year; expected 1 to ${leap ? 366 : 365}`,
      );
      continue;
    }
    const day = civilDay(year, 1, 1) + yday - 1;
    // 31 December of a leap year, left out: between 30 December and the next row.
    const dec31 = (y: number) => civilDay(y, 12, 31);
    if (!Number.isNaN(previous) && day === previous + 2 && isLeapYear(year - 1)) {
      if (previous + 1 === dec31(year - 1)) addLeapDay(previous + 1, line);
    }
    const r = push(day, line);
    for (const v of variables) {
      const k = index[v]!;
      let x = rows.number(k);
      if (Number.isNaN(x)) {
        const cell = rows.field(k);
        problems.add(
          line,
          header[k],
          cell === '' || /^-9999(\.0*)?$/.test(cell)
            ? `no ${NOUN[v]} value ("${cell}"); Daymet files have every day, check the download`
            : `"${cell}" is not a number; expected ${NOUN[v]}`,
        );
      } else {
        if (v === 'solar') {
          const dayl = rows.number(index.dayl!);
          x = (x * dayl) / 1e6;
        }
        x = toCore(x, rows, v, { index: k, header: header[k], unit: unitOf(v) }, line, problems);
      }
      staged.values[v]![r] = x;
    }
    checkTminTmax(staged, r, problems);
    previous = day;
  }
  if (n === 0) problems.fail(headerLine, undefined, NO_ROWS);
  // A record ending on 30 December of a leap year: its 31 December too.
  const lastYear = new Date(previous * 86_400_000).getUTCFullYear();
  if (isLeapYear(lastYear) && previous + 1 === civilDay(lastYear, 12, 31)) {
    addLeapDay(previous + 1, staged.lines[n - 1]);
  }
  problems.throwIfAny();
  staged.n = n;
  const { series, filledDays } = assembleSeries(staged, fill, problems);
  const notes = ['Daymet single-pixel table'];
  if (leapFilled > 0) {
    notes.push(
      `31 December filled in ${leapFilled} leap year${leapFilled > 1 ? 's' : ''} (Daymet leaves it ` +
        'out): precipitation 0, the rest interpolated between 30 December and 1 January',
    );
  }
  return {
    series,
    filledDays: filledDays - leapFilled,
    columnsUsed: Object.fromEntries([
      ['date', `${header[0]}+${header[1]}`],
      ...variables.map((v) => [v, headers[v]!]),
    ]),
    unitsUsed: Object.fromEntries(
      variables.map((v) => [v, v === 'solar' ? SOLAR.label : v === 'precip' ? 'mm' : 'degC']),
    ),
    format: 'daymet',
    notes,
    leapDaysFilled: leapFilled,
  };
}

function unitOf(v: ValueVariable): UnitSpec {
  return v === 'precip' ? MM : v === 'solar' ? SOLAR : CELSIUS;
}
