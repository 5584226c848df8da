/**
 * tileflux's own weather CSV: a header row, then one row per day. Columns are found by name with
 * the unit in the suffix (`precip_mm`, `precip_in`, `tmax_c`, `tmax_f`, `tmin_c`, `tmin_f`,
 * `ref_et_mm`, `ref_et_in`, `solar_mj_m2`, `solar_w_m2`, `rh_pct`, `wind_m_s`, `wind_km_h`,
 * `wind_mph`), or mapped from other names with `columns`. Every problem names the file, the line
 * and the column, and what would be accepted. The result is a gap-free WeatherSeries in core
 * units (mm/d, degC, MJ m-2 d-1, %, m/s).
 */
import type { WeatherSeries } from '../../climate/weatherSeries.js';
import type { WeatherFormat } from './formats.js';
import {
  assembleSeries,
  checkTminTmax,
  lineCount,
  stagedRows,
  type StagedRows,
} from './assemble.js';
import {
  resolveColumns,
  SeenValues,
  whereColumn,
  type ColumnMap,
  type ColumnOptions,
  type ColumnUse,
} from './columns.js';
import { CsvRows, CsvSyntaxError } from './csvRows.js';
import { Problems } from './problems.js';
import {
  isMissingText,
  MAX_FILL_DAYS,
  NOUN,
  VALUE_VARIABLES,
  WEATHER_BOUNDS,
  WEATHER_VARIABLES,
  type ValueVariable,
} from './units.js';

/** Options for reading a weather CSV. */
export interface WeatherReadOptions extends ColumnOptions {
  /** Name of the file, used in messages. */
  file?: string;
  /** Map variables to headers: keys date, precip, tmax, tmin, ref_et, solar, rh, wind. */
  columns?: Record<string, string>;
  /** Unit of a precipitation (and ref_et) column whose header has no unit suffix (default mm). */
  precipUnit?: 'mm' | 'in';
  /** Unit of temperature columns whose header has no unit suffix (default c). */
  tempUnit?: 'c' | 'f';
  /** Keep only the rows whose `column` holds `value` (one station of a multi-station file). */
  where?: { column: string; value: string };
  /** Fill missing days and empty cells, up to 7 days in a row. */
  fill?: boolean;
  /** Format of the file (default auto: detected from the header). */
  format?: WeatherFormat;
  /** GHCN-Daily: the station to read (required when the file holds several). */
  station?: string;
  /** GHCN-Daily wide export: the units it was ordered in (the file does not say). */
  exportUnits?: 'metric' | 'standard';
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
  /** The format the file was read in. */
  format: Exclude<WeatherFormat, 'auto'>;
  /** What was done beyond reading (station, filled leap days, flagged values). */
  notes: string[];
  /** Daymet: left-out 31 Decembers of leap years that were filled (not in filledDays). */
  leapDaysFilled?: number;
}

/** Move a reader to its next record, turning CSV syntax errors into located problems. */
export function nextRecord(rows: CsvRows, problems: Problems): boolean {
  try {
    return rows.next();
  } catch (err) {
    if (err instanceof CsvSyntaxError) {
      problems.fail(err.line, undefined, `the file is not valid CSV: ${err.message}`);
    }
    throw err;
  }
}

/** The message for a file without a header. */
export const EMPTY_FILE =
  'the file is empty; expected a header row such as date,precip_mm,tmax_c,tmin_c and one row per day';
/** The message for a header without rows. */
export const NO_ROWS =
  'the file has a header but no data rows; expected one row per day after the header';

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
  const problems = new Problems(o.file ?? 'weather CSV');
  const rows = new CsvRows(text);
  if (!nextRecord(rows, problems)) problems.fail(1, undefined, EMPTY_FILE);
  const header = rows.fields();
  const headerLine = rows.line;
  const cols = resolveColumns(header, headerLine, o, problems);
  const staged = readOwnRows(rows, header, headerLine, cols, o, problems);
  const { series, filledDays } = assembleSeries(staged, o.fill === true, problems);
  return { series, filledDays, ...columnReport(cols), format: 'tileflux', notes: [] };
}

/** Variable -> header and variable -> unit label, as reported to the user. */
export function columnReport(
  cols: ColumnMap,
): Pick<WeatherReadResult, 'columnsUsed' | 'unitsUsed'> {
  const columnsUsed: Record<string, string> = {};
  const unitsUsed: Record<string, string> = {};
  for (const v of WEATHER_VARIABLES) {
    const c = cols[v];
    if (!c) continue;
    columnsUsed[v] = c.header;
    if (v !== 'date') unitsUsed[v] = c.unit.label;
  }
  return { columnsUsed, unitsUsed };
}

/**
 * How a format marks a value as unusable beyond an empty cell (a quality flag): returns the
 * reason, or undefined when the value may be used.
 */
export type CellGap = (rows: CsvRows, v: ValueVariable) => string | undefined;

/** Extra rules of a format built on the own reader (GHCN-Daily exports). */
export interface RowRules {
  /** A cell's reason to be a gap (quality flags). */
  gap?: CellGap;
  /** Setting that selects rows, for messages (default `where`). */
  whereSetting?: 'where' | 'station';
  /** Date forms accepted besides YYYY-MM-DD. */
  compactDates?: boolean;
}

/** Stage 1 of the own format: every row on its own, into typed arrays. */
export function readOwnRows(
  rows: CsvRows,
  header: string[],
  headerLine: number,
  cols: ColumnMap,
  o: WeatherReadOptions,
  problems: Problems,
  rules: RowRules = {},
): StagedRows {
  const used = VALUE_VARIABLES.filter((v) => cols[v]);
  const uses = used.map((v) => cols[v]!);
  const headers: Partial<Record<ValueVariable, string>> = {};
  for (const v of used) headers[v] = cols[v]!.header;
  const dateCol = cols.date!;
  const staged = stagedRows(lineCount(rows.text), used, headers, dateCol.header);
  const { days, lines, values } = staged;
  const arrays = used.map((v) => values[v]!);
  const width = header.length;
  const fill = o.fill === true;
  const whereIndex = o.where
    ? whereColumn(header, headerLine, o.where, problems, rules.whereSetting)
    : -1;
  const seen = new SeenValues();
  let offered = 0;
  let n = 0;
  while (nextRecord(rows, problems)) {
    if (whereIndex >= 0) {
      offered++;
      const value = whereIndex < rows.count ? rows.field(whereIndex) : undefined;
      if (value !== o.where!.value) {
        if (n === 0 && value !== undefined) seen.add(value);
        continue;
      }
    }
    const r = n++;
    const line = rows.line;
    lines[r] = line;
    if (rows.count !== width) {
      const at = rows.count < width ? header[rows.count] : undefined;
      problems.add(
        line,
        at,
        `the row has ${rows.count} fields but the header has ${width}; ` +
          'every row needs one value per header column',
      );
      days[r] = NaN;
      continue;
    }
    let day = rows.isoDay(dateCol.index);
    if (Number.isNaN(day) && rules.compactDates) day = rows.compactDay(dateCol.index);
    if (Number.isNaN(day)) {
      problems.add(
        line,
        dateCol.header,
        `"${rows.field(dateCol.index)}" is not a date; expected a calendar date as YYYY-MM-DD, such as 2024-05-01`,
      );
    }
    days[r] = day;
    for (let k = 0; k < used.length; k++) {
      const v = used[k];
      const c = uses[k];
      let x = rows.number(c.index);
      if (Number.isNaN(x)) {
        x = badCell(rows.field(c.index), v, c, line, fill, problems);
      } else {
        const gap = rules.gap?.(rows, v);
        if (gap !== undefined) {
          if (!fill) {
            problems.add(
              line,
              c.header,
              (n) =>
                `${NOUN[v]} ${rows.field(c.index)} is ${gap}, so it counts as a gap; ` +
                `use ${n('fill')} for up to ${MAX_FILL_DAYS} missing days in a row`,
            );
          }
          x = NaN;
        } else {
          x = toCore(x, rows, v, c, line, problems);
        }
      }
      if (Number.isNaN(x)) staged.missingCells++;
      arrays[k][r] = x;
    }
    checkTminTmax(staged, r, problems);
  }
  if (n === 0) {
    if (whereIndex >= 0 && offered > 0) {
      problems.fail(
        headerLine,
        header[whereIndex],
        `no rows where ${header[whereIndex]} is "${o.where!.value}"; values found: ${seen}`,
      );
    }
    problems.fail(headerLine, undefined, NO_ROWS);
  }
  problems.throwIfAny();
  staged.n = n;
  return staged;
}

/** A cell that is not a plain number: empty (a gap) or an error. Returns NaN. */
function badCell(
  cell: string,
  v: ValueVariable,
  c: ColumnUse,
  line: number,
  fill: boolean,
  problems: Problems,
): number {
  if (isMissingText(cell)) {
    if (!fill) {
      problems.add(
        line,
        c.header,
        (n) =>
          `no ${NOUN[v]} value ("${cell}"); give a number, or use ${n('fill')} for up to ` +
          `${MAX_FILL_DAYS} missing days in a row`,
      );
    }
  } else {
    problems.add(
      line,
      c.header,
      `"${cell}" is not a number; expected ${NOUN[v]} in ${c.unit.label}`,
    );
  }
  return NaN;
}

/** A number in the column's unit to core units, checked against WEATHER_BOUNDS. */
export function toCore(
  raw: number,
  rows: CsvRows,
  v: ValueVariable,
  c: ColumnUse,
  line: number,
  problems: Problems,
): number {
  const x = c.unit.toCore(raw);
  const [lo, hi, unit] = WEATHER_BOUNDS[v];
  if (v === 'precip' && x < 0) {
    problems.add(
      line,
      c.header,
      `precipitation ${rows.field(c.index)} is negative; it must be 0 or more`,
    );
  } else if (!(x >= lo && x <= hi)) {
    problems.add(
      line,
      c.header,
      `${NOUN[v]} ${rows.field(c.index)} ${c.unit.label} is outside the physical range ${lo} to ${hi} ${unit}` +
        (c.unit.label === unit ? '' : ' (after conversion)') +
        '; check the unit or a missing-value code',
    );
  }
  return x;
}
