/**
 * Daily weather CSV in and out.
 *
 * Reading: a header row, then one row per day. Columns are found by name with the unit in the
 * suffix (`precip_mm`, `precip_in`, `tmax_c`, `tmax_f`, `tmin_c`, `tmin_f`, `pet_mm`, `pet_in`,
 * `solar_mj_m2`, `solar_w_m2`, `rh_pct`, `wind_m_s`, `wind_km_h`, `wind_mph`), or mapped from
 * other names with `columns`. Every problem names the file, the line and the column, and what
 * would be accepted. The result is a gap-free WeatherSeries in core units (mm/d, degC,
 * MJ m-2 d-1, %, m/s).
 *
 * Writing: tileflux's own form, `date,precip_mm,tmax_c,tmin_c` plus any optional columns, with
 * fixed decimals so the same series always gives the same bytes.
 */
import { readFileSync } from 'node:fs';
import { CsvError, parse } from 'csv-parse/sync';
import { TilefluxError } from '../errors.js';
import { dayNumber, isoDate } from '../climate/calendar.js';
import type { WeatherSeries } from '../climate/weatherSeries.js';

/** The variables a weather file can hold, by their short names (used by `columns`). */
export const WEATHER_VARIABLES = [
  'date',
  'precip',
  'tmax',
  'tmin',
  'pet',
  'solar',
  'rh',
  'wind',
] as const;
export type WeatherVariable = (typeof WEATHER_VARIABLES)[number];
type ValueVariable = Exclude<WeatherVariable, 'date'>;
const VALUE_VARIABLES = WEATHER_VARIABLES.filter((v) => v !== 'date') as ValueVariable[];
const REQUIRED: readonly ValueVariable[] = ['precip', 'tmax', 'tmin'];

/** One unit a column may be in: header suffix, label for messages, conversion to core units. */
interface UnitSpec {
  suffix: string;
  label: string;
  toCore: (x: number) => number;
}
const same = (x: number) => x;
const MM: UnitSpec = { suffix: 'mm', label: 'mm', toCore: same };
const INCH: UnitSpec = { suffix: 'in', label: 'in', toCore: (x) => x * 25.4 };
const CELSIUS: UnitSpec = { suffix: 'c', label: 'degC', toCore: same };
const FAHRENHEIT: UnitSpec = { suffix: 'f', label: 'degF', toCore: (x) => ((x - 32) * 5) / 9 };

/**
 * Units accepted per variable; the first is the core unit and the default for a mapped header
 * without a suffix (precipitation and temperature defaults can be changed with precipUnit and
 * tempUnit). Conversions are exact definitions: 1 in = 25.4 mm; degC = (degF - 32) * 5/9;
 * 1 W m-2 over a day = 0.0864 MJ m-2 d-1; 1 km/h = 1/3.6 m/s; 1 mph = 0.44704 m/s.
 */
const UNITS: Readonly<Record<ValueVariable, readonly UnitSpec[]>> = {
  precip: [MM, INCH],
  tmax: [CELSIUS, FAHRENHEIT],
  tmin: [CELSIUS, FAHRENHEIT],
  pet: [MM, INCH],
  solar: [
    { suffix: 'mj_m2', label: 'MJ/m2/d', toCore: same },
    { suffix: 'w_m2', label: 'W/m2 (daily mean)', toCore: (x) => x * 0.0864 },
  ],
  rh: [{ suffix: 'pct', label: '%', toCore: same }],
  wind: [
    { suffix: 'm_s', label: 'm/s', toCore: same },
    { suffix: 'km_h', label: 'km/h', toCore: (x) => x / 3.6 },
    { suffix: 'mph', label: 'mph', toCore: (x) => x * 0.44704 },
  ],
};

/**
 * Physical bounds in core units. Values outside are almost surely unit mix-ups or missing-value
 * codes (-9999), so they are errors, not data:
 * - precipitation 0 to 2000 mm/d: above the largest 24-hour rainfall on record, about 1825 mm
 *   (from memory);
 * - temperature -90 to 60 degC: around the lowest (-89.2 degC) and highest (56.7 degC) air
 *   temperatures on record (from memory);
 * - reference ET 0 to 30 mm/d: about twice the highest daily ET0 of hot, dry, windy sites
 *   (from memory);
 * - solar radiation 0 to 50 MJ m-2 d-1: extraterrestrial radiation never exceeds about 49
 *   (FAO-56 Eq. 21 at the pole at the December solstice);
 * - relative humidity 0 to 100 %; wind at 2 m 0 to 50 m/s (hurricane force as a daily mean).
 */
export const WEATHER_BOUNDS: Readonly<Record<ValueVariable, readonly [number, number, string]>> = {
  precip: [0, 2000, 'mm/d'],
  tmax: [-90, 60, 'degC'],
  tmin: [-90, 60, 'degC'],
  pet: [0, 30, 'mm/d'],
  solar: [0, 50, 'MJ m-2 d-1'],
  rh: [0, 100, '%'],
  wind: [0, 50, 'm/s'],
};

const NOUN: Readonly<Record<WeatherVariable, string>> = {
  date: 'date',
  precip: 'precipitation',
  tmax: 'maximum temperature',
  tmin: 'minimum temperature',
  pet: 'reference ET',
  solar: 'solar radiation',
  rh: 'relative humidity',
  wind: 'wind speed',
};

/** Longest run of missing days `fill` fills. */
export const MAX_FILL_DAYS = 7;

/** Cell texts that mean "no value" (compared without case). */
const MISSING = new Set(['', 'na', 'n/a', 'nan', 'null']);

/** Options for reading a weather CSV. */
export interface WeatherReadOptions {
  /** Name of the file, used in messages. */
  file?: string;
  /** Map variables to headers: keys date, precip, tmax, tmin, pet, solar, rh, wind. */
  columns?: Record<string, string>;
  /** Unit of a precipitation (and pet) column whose header has no unit suffix (default mm). */
  precipUnit?: 'mm' | 'in';
  /** Unit of temperature columns whose header has no unit suffix (default c). */
  tempUnit?: 'c' | 'f';
  /** Keep only the rows whose `column` holds `value` (one station of a multi-station file). */
  where?: { column: string; value: string };
  /** Fill missing days and empty cells, up to 7 days in a row. */
  fill?: boolean;
}

/** What was read and how. */
export interface WeatherReadResult {
  series: WeatherSeries;
  /** Days that were missing or had an empty cell and were filled. */
  filledDays: number;
  /** Variable -> header it was read from. */
  columnsUsed: Record<string, string>;
  /** Variable -> unit it was read in. */
  unitsUsed: Record<string, string>;
}

/** One located problem in a weather file. */
export interface WeatherProblem {
  /** Line in the file, 1 for the first line. */
  line: number;
  /** Header of the column, when the problem lies in one. */
  column?: string;
  message: string;
}

/**
 * A weather file the reader cannot accept. The message (one line) lists the first problems;
 * `problems` holds them all, each with its line and column.
 */
export class WeatherInputError extends TilefluxError {
  readonly problems: WeatherProblem[];
  readonly file: string;
  constructor(file: string, problems: WeatherProblem[]) {
    const shown = problems.slice(0, 3).map(locate);
    const more = problems.length > 3 ? ` (and ${problems.length - 3} more problems)` : '';
    super(`${file} ${shown.join('; ')}${more}`);
    this.name = 'WeatherInputError';
    this.problems = problems;
    this.file = file;
  }
}

function locate(p: WeatherProblem): string {
  return `line ${p.line}${p.column !== undefined ? `, column ${p.column}` : ''}: ${p.message}`;
}

/** Collects problems; stops collecting (but keeps counting) after a cap. */
class Problems {
  readonly list: WeatherProblem[] = [];
  constructor(private readonly file: string) {}
  add(line: number, column: string | undefined, message: string): void {
    if (this.list.length < 100) this.list.push({ line, column, message });
  }
  throwIfAny(): void {
    if (this.list.length > 0) throw new WeatherInputError(this.file, this.list);
  }
  fail(line: number, column: string | undefined, message: string): never {
    this.add(line, column, message);
    throw new WeatherInputError(this.file, this.list);
  }
}

interface ColumnUse {
  index: number;
  header: string;
  unit: UnitSpec;
}

/**
 * Parse the text of a daily weather CSV into a gap-free series in core units.
 *
 * Handles a byte-order mark, CRLF line ends, blank lines and surrounding spaces. Errors, each with
 * file, line and column: an empty file or a header without rows; missing or unknown columns;
 * unparseable dates or numbers; empty cells; duplicated, unordered or missing dates (the first
 * missing dates are listed); negative precipitation; Tmin above Tmax; values outside
 * WEATHER_BOUNDS. With `fill`, runs of up to 7 missing days or empty cells are filled:
 * precipitation with 0, every other variable by linear interpolation between the neighbouring
 * days (the nearest value at the ends of the record).
 *
 * @example parseWeatherCsv('date,precip_in,tmax_f,tmin_f\n2024-05-01,0.5,68,50\n').series.precipMm
 *   // Float64Array [12.7]
 */
export function parseWeatherCsv(text: string, o: WeatherReadOptions = {}): WeatherReadResult {
  const file = o.file ?? 'weather CSV';
  const problems = new Problems(file);
  const records = readRecords(text, problems);
  if (records.length === 0) {
    problems.fail(
      1,
      undefined,
      'the file is empty; expected a header row such as date,precip_mm,tmax_c,tmin_c and one row per day',
    );
  }
  const header = records[0].record;
  const headerLine = records[0].info.lines;
  const cols = resolveColumns(header, headerLine, o, problems);

  let rows = records.slice(1);
  if (o.where) rows = filterRows(rows, header, headerLine, o.where, problems);
  if (rows.length === 0) {
    problems.fail(
      headerLine,
      undefined,
      'the file has a header but no data rows; expected one row per day after the header',
    );
  }

  // Stage 1: every cell on its own.
  const n = rows.length;
  const days = new Float64Array(n);
  const lines = new Int32Array(n);
  const values = {} as Record<ValueVariable, Float64Array>;
  for (const v of VALUE_VARIABLES) if (cols[v]) values[v] = new Float64Array(n);
  const dateCol = cols.date!;
  let missingCells = 0;
  for (let r = 0; r < n; r++) {
    const { record, info } = rows[r];
    const line = info.lines;
    lines[r] = line;
    if (record.length !== header.length) {
      const at = record.length < header.length ? header[record.length] : undefined;
      problems.add(
        line,
        at,
        `the row has ${record.length} fields but the header has ${header.length}; ` +
          'every row needs one value per header column',
      );
      days[r] = NaN;
      continue;
    }
    const dateText = record[dateCol.index];
    const day = dayNumber(dateText);
    if (day === undefined) {
      problems.add(
        line,
        dateCol.header,
        `"${dateText}" is not a date; expected a calendar date as YYYY-MM-DD, such as 2024-05-01`,
      );
      days[r] = NaN;
    } else {
      days[r] = day;
    }
    for (const v of VALUE_VARIABLES) {
      const c = cols[v];
      if (!c) continue;
      const cell = record[c.index];
      const x = readCell(cell, v, c, line, o.fill === true, problems);
      if (Number.isNaN(x)) missingCells++;
      values[v][r] = x;
    }
    const tmax = values.tmax[r];
    const tmin = values.tmin[r];
    if (tmin > tmax) {
      problems.add(
        line,
        cols.tmin!.header,
        `minimum temperature ${fmtValue(tmin)} degC is above the maximum ${fmtValue(tmax)} degC ` +
          `(column ${cols.tmax!.header}); check for swapped columns`,
      );
    }
  }
  problems.throwIfAny();

  // Stage 2: dates in strict ascending order.
  for (let r = 1; r < n; r++) {
    if (days[r] === days[r - 1]) {
      problems.add(
        lines[r],
        dateCol.header,
        `date ${isoDate(days[r])} repeats line ${lines[r - 1]}; each day may appear once`,
      );
    } else if (days[r] < days[r - 1]) {
      problems.add(
        lines[r],
        dateCol.header,
        `date ${isoDate(days[r])} comes after ${isoDate(days[r - 1])} (line ${lines[r - 1]}); ` +
          'dates must ascend one day at a time',
      );
    }
  }
  problems.throwIfAny();

  // Stage 3: missing days.
  for (let r = 1; r < n; r++) {
    const missing = days[r] - days[r - 1] - 1;
    if (missing <= 0) continue;
    const first = isoDate(days[r - 1] + 1);
    const last = isoDate(days[r] - 1);
    if (!o.fill) {
      const listed: string[] = [];
      for (let k = 1; k <= Math.min(missing, 3); k++) listed.push(isoDate(days[r - 1] + k));
      problems.add(
        lines[r],
        dateCol.header,
        `dates jump from ${isoDate(days[r - 1])} to ${isoDate(days[r])}: ${missing} missing ` +
          `day${missing > 1 ? 's' : ''} (${listed.join(', ')}${missing > 3 ? ', ...' : ''}); ` +
          `add the rows, or use --fill for gaps of up to ${MAX_FILL_DAYS} days`,
      );
    } else if (missing > MAX_FILL_DAYS) {
      problems.add(
        lines[r],
        dateCol.header,
        `${missing} days are missing (${first} to ${last}); --fill fills at most ` +
          `${MAX_FILL_DAYS} days in a row`,
      );
    }
  }
  problems.throwIfAny();

  // Lay rows out on the full calendar; missing days are NaN, then filled.
  const first = days[0];
  const total = days[n - 1] - first + 1;
  const lineOfDay = new Int32Array(total);
  // A missing day is reported at the line of the next row in the file.
  for (let d = total - 1, r = n - 1, next = lines[n - 1]; d >= 0; d--) {
    if (r >= 0 && days[r] - first === d) next = lines[r--];
    lineOfDay[d] = next;
  }
  const full = {} as Record<ValueVariable, Float64Array>;
  for (const v of VALUE_VARIABLES) {
    if (!values[v]) continue;
    const a = new Float64Array(total).fill(NaN);
    for (let r = 0; r < n; r++) a[days[r] - first] = values[v][r];
    full[v] = a;
  }
  let filledDays = 0;
  if (total > n || missingCells > 0) {
    const filled = new Uint8Array(total);
    for (const v of VALUE_VARIABLES) {
      if (!full[v]) continue;
      fillRuns(
        full[v],
        v === 'precip',
        (start, length) => {
          problems.add(
            lineOfDay[start],
            cols[v]!.header,
            `${length} days in a row have no ${NOUN[v]} (${isoDate(first + start)} to ` +
              `${isoDate(first + start + length - 1)}); --fill fills at most ${MAX_FILL_DAYS}`,
          );
        },
        filled,
      );
    }
    problems.throwIfAny();
    for (let d = 0; d < total; d++) {
      if (!filled[d]) continue;
      filledDays++;
      if (full.tmin[d] > full.tmax[d]) {
        problems.add(
          lineOfDay[d],
          cols.tmin!.header,
          `after filling ${isoDate(first + d)}, the minimum temperature ` +
            `${fmtValue(full.tmin[d])} degC lies above the maximum ${fmtValue(full.tmax[d])} degC; ` +
            'give the missing value',
        );
      }
    }
    problems.throwIfAny();
  }

  const dates = new Array<string>(total);
  for (let d = 0; d < total; d++) dates[d] = isoDate(first + d);
  const series: WeatherSeries = {
    dates,
    precipMm: full.precip,
    tmaxC: full.tmax,
    tminC: full.tmin,
  };
  if (full.pet) series.petMm = full.pet;
  if (full.solar) series.solarMJm2 = full.solar;
  if (full.rh) series.rhMeanPct = full.rh;
  if (full.wind) series.wind2mMs = full.wind;
  const columnsUsed: Record<string, string> = {};
  const unitsUsed: Record<string, string> = {};
  for (const v of WEATHER_VARIABLES) {
    const c = cols[v];
    if (!c) continue;
    columnsUsed[v] = c.header;
    if (v !== 'date') unitsUsed[v] = c.unit.label;
  }
  return { series, filledDays, columnsUsed, unitsUsed };
}

/**
 * Fill runs of NaN in place: with 0 (precipitation) or linearly between the neighbours (the
 * nearest value at an end). Runs longer than MAX_FILL_DAYS are reported through `tooLong`.
 * Marks filled days in `filled`.
 */
function fillRuns(
  a: Float64Array,
  zero: boolean,
  tooLong: (start: number, length: number) => void,
  filled: Uint8Array,
): void {
  const n = a.length;
  let i = 0;
  while (i < n) {
    if (!Number.isNaN(a[i])) {
      i++;
      continue;
    }
    let j = i;
    while (j < n && Number.isNaN(a[j])) j++;
    const length = j - i;
    if (length > MAX_FILL_DAYS) tooLong(i, length);
    const before = i > 0 ? a[i - 1] : a[j];
    const after = j < n ? a[j] : before;
    for (let k = i; k < j; k++) {
      a[k] = zero ? 0 : before + ((after - before) * (k - i + 1)) / (length + 1);
      filled[k] = 1;
    }
    i = j;
  }
}

type CsvRecord = { record: string[]; info: { lines: number } };

function readRecords(text: string, problems: Problems): CsvRecord[] {
  try {
    return parse(text, {
      bom: true,
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      skip_records_with_empty_values: true,
      trim: true,
    }) as unknown as CsvRecord[];
  } catch (err) {
    if (err instanceof CsvError) {
      const line = (err as CsvError & { lines?: number }).lines ?? 1;
      problems.fail(
        line,
        undefined,
        `the file is not valid CSV: ${err.message.replace(/\s+/g, ' ')}`,
      );
    }
    throw err;
  }
}

/** Read one numeric cell in core units, recording a problem (and returning NaN) if it is bad. */
function readCell(
  cell: string,
  v: ValueVariable,
  c: ColumnUse,
  line: number,
  fill: boolean,
  problems: Problems,
): number {
  if (MISSING.has(cell.toLowerCase())) {
    if (!fill) {
      problems.add(
        line,
        c.header,
        `no ${NOUN[v]} value ("${cell}"); give a number, or use --fill for up to ` +
          `${MAX_FILL_DAYS} missing days in a row`,
      );
    }
    return NaN;
  }
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(cell)) {
    problems.add(
      line,
      c.header,
      `"${cell}" is not a number; expected ${NOUN[v]} in ${c.unit.label}`,
    );
    return NaN;
  }
  const x = c.unit.toCore(Number(cell));
  const [lo, hi, unit] = WEATHER_BOUNDS[v];
  if (v === 'precip' && x < 0) {
    problems.add(line, c.header, `precipitation ${cell} is negative; it must be 0 or more`);
  } else if (!(x >= lo && x <= hi)) {
    problems.add(
      line,
      c.header,
      `${NOUN[v]} ${cell} ${c.unit.label} is outside the physical range ${lo} to ${hi} ${unit}` +
        (c.unit.label === unit ? '' : ' (after conversion)') +
        '; check the unit or a missing-value code',
    );
  }
  return x;
}

function fmtValue(x: number): string {
  return String(Math.round(x * 100) / 100);
}

function findHeader(header: string[], name: string): number {
  const exact = header.indexOf(name);
  if (exact >= 0) return exact;
  const lower = name.toLowerCase();
  return header.findIndex((h) => h.toLowerCase() === lower);
}

/** Work out which header holds each variable, and in which unit. */
function resolveColumns(
  header: string[],
  line: number,
  o: WeatherReadOptions,
  problems: Problems,
): Partial<Record<WeatherVariable, ColumnUse>> {
  const cols: Partial<Record<WeatherVariable, ColumnUse>> = {};
  const list = header.map((h) => JSON.stringify(h)).join(', ');
  const mapping = o.columns ?? {};
  const flagUnit = (v: ValueVariable): string | undefined =>
    v === 'precip' || v === 'pet'
      ? o.precipUnit
      : v === 'tmax' || v === 'tmin'
        ? o.tempUnit
        : undefined;
  const byHeader = new Map<number, WeatherVariable>();

  const use = (v: WeatherVariable, index: number, unit: UnitSpec) => {
    const other = byHeader.get(index);
    if (other !== undefined) {
      problems.fail(line, header[index], `the column is used for both ${other} and ${v}`);
    }
    byHeader.set(index, v);
    cols[v] = { index, header: header[index], unit };
  };
  /** The unit of a header: its suffix if it has one for `v`, else the flag, else the default. */
  const unitOf = (v: ValueVariable, h: string, flagAllowed: boolean): UnitSpec => {
    const lower = h.toLowerCase();
    const fromSuffix = UNITS[v].find((u) => lower.endsWith(`_${u.suffix}`));
    const flag = flagUnit(v);
    if (fromSuffix) {
      if (flag !== undefined && flag !== fromSuffix.suffix) {
        problems.fail(
          line,
          h,
          `the header says ${fromSuffix.label} but --${v === 'precip' || v === 'pet' ? 'precip' : 'temp'}-unit says ${flag}; ` +
            'drop the option or rename the column',
        );
      }
      return fromSuffix;
    }
    if (flagAllowed && flag !== undefined) {
      const u = UNITS[v].find((x) => x.suffix === flag);
      if (u) return u;
    }
    return UNITS[v][0];
  };

  // Explicit mapping first.
  for (const [key, name] of Object.entries(mapping)) {
    if (!(WEATHER_VARIABLES as readonly string[]).includes(key)) {
      problems.fail(
        line,
        undefined,
        `--columns names an unknown variable "${key}"; accepted: ${WEATHER_VARIABLES.join(', ')}`,
      );
    }
    const index = findHeader(header, name);
    if (index < 0) {
      problems.fail(
        line,
        undefined,
        `--columns ${key}=${name}: the file has no column "${name}"; its columns are ${list}`,
      );
    }
    const v = key as WeatherVariable;
    use(v, index, v === 'date' ? MM : unitOf(v, header[index], true));
  }

  // Then the standard names, for variables not mapped.
  const nearMisses: string[] = [];
  if (!cols.date && !('date' in mapping)) {
    const index = findHeader(header, 'date');
    if (index >= 0 && !byHeader.has(index)) use('date', index, MM);
  }
  for (const v of VALUE_VARIABLES) {
    if (cols[v]) continue;
    const matches: number[] = [];
    header.forEach((h, index) => {
      if (byHeader.has(index)) return;
      const lower = h.toLowerCase();
      const required = REQUIRED.includes(v);
      if ((required && lower === v) || UNITS[v].some((u) => lower === `${v}_${u.suffix}`)) {
        matches.push(index);
      } else if (lower.startsWith(`${v}_`)) {
        nearMisses.push(h);
      }
    });
    if (matches.length > 1) {
      problems.fail(
        line,
        header[matches[1]],
        `two ${NOUN[v]} columns (${matches.map((i) => header[i]).join(' and ')}); ` +
          `keep one or choose with --columns ${v}=NAME`,
      );
    }
    if (matches.length === 1) use(v, matches[0], unitOf(v, header[matches[0]], true));
  }

  const absent = (['date', ...REQUIRED] as WeatherVariable[]).filter((v) => !cols[v]);
  if (absent.length > 0) {
    const expect = absent.map((v) =>
      v === 'date' ? 'date' : UNITS[v as ValueVariable].map((u) => `${v}_${u.suffix}`).join(' or '),
    );
    const hint = nearMisses.length
      ? ` (${nearMisses.join(', ')} ha${nearMisses.length > 1 ? 've' : 's'} an unknown unit suffix)`
      : '';
    problems.fail(
      line,
      undefined,
      `no ${absent.map((v) => NOUN[v]).join(', ')} column${absent.length > 1 ? 's' : ''}; ` +
        `expected headers ${expect.join(', ')}, or map yours with --columns ` +
        `${absent.map((v) => `${v}=NAME`).join(',')}; the file has ${list}${hint}`,
    );
  }
  return cols;
}

function filterRows(
  rows: CsvRecord[],
  header: string[],
  line: number,
  where: { column: string; value: string },
  problems: Problems,
): CsvRecord[] {
  const index = findHeader(header, where.column);
  if (index < 0) {
    problems.fail(
      line,
      undefined,
      `--where ${where.column}=${where.value}: the file has no column "${where.column}"; ` +
        `its columns are ${header.map((h) => JSON.stringify(h)).join(', ')}`,
    );
  }
  const kept = rows.filter((r) => r.record[index] === where.value);
  if (kept.length === 0 && rows.length > 0) {
    const seen = [...new Set(rows.map((r) => r.record[index]))];
    problems.fail(
      line,
      header[index],
      `no rows where ${header[index]} is "${where.value}"; values found: ` +
        `${seen
          .slice(0, 10)
          .map((s) => JSON.stringify(s))
          .join(', ')}${seen.length > 10 ? ', ...' : ''}`,
    );
  }
  return kept;
}

/**
 * Read a weather CSV file; like parseWeatherCsv, with the file's name in every message.
 *
 * @example readWeatherFile('data-demo/weather.csv').series.dates.length // 10958
 */
export function readWeatherFile(path: string, o: WeatherReadOptions = {}): WeatherReadResult {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'it is a folder'
          : String(code ?? err);
    throw new TilefluxError(`cannot read weather file ${path}: ${why}`);
  }
  return parseWeatherCsv(text, { ...o, file: o.file ?? path });
}

/** Columns of tileflux's own weather CSV: header, series field, decimals. */
const OWN_COLUMNS: ReadonlyArray<[string, keyof Omit<WeatherSeries, 'dates'>, number]> = [
  ['precip_mm', 'precipMm', 2],
  ['tmax_c', 'tmaxC', 1],
  ['tmin_c', 'tminC', 1],
  ['pet_mm', 'petMm', 2],
  ['solar_mj_m2', 'solarMJm2', 2],
  ['rh_pct', 'rhMeanPct', 1],
  ['wind_m_s', 'wind2mMs', 2],
];

/**
 * Write a series as tileflux's own CSV: `date,precip_mm,tmax_c,tmin_c` then whichever of
 * `pet_mm,solar_mj_m2,rh_pct,wind_m_s` the series has; LF line ends; fixed decimals (2 for
 * depths, speed and radiation, 1 for temperature and humidity), so output is byte-identical for
 * the same series and reads back with parseWeatherCsv.
 *
 * @example formatWeatherCsv(series) // 'date,precip_mm,tmax_c,tmin_c\n2024-05-01,12.70,20.0,10.0\n'
 */
export function formatWeatherCsv(w: WeatherSeries): string {
  const used = OWN_COLUMNS.filter(([, key]) => w[key] !== undefined);
  const arrays = used.map(([, key]) => w[key] as Float64Array);
  const decimals = used.map(([, , d]) => d);
  const out: string[] = ['date,' + used.map(([h]) => h).join(',')];
  for (let i = 0; i < w.dates.length; i++) {
    let row = w.dates[i];
    for (let k = 0; k < arrays.length; k++) {
      let s = arrays[k][i].toFixed(decimals[k]);
      if (s.charCodeAt(0) === 45 && /^-0\.0*$/.test(s)) s = s.slice(1);
      row += ',' + s;
    }
    out.push(row);
  }
  return out.join('\n') + '\n';
}
