/**
 * Observations at a monitored site, for `tileflux fit`: a daily CSV with `date` and any of
 * - drain flow as a depth per day over the drained area: `drainflow_mm` or `drainflow_in`;
 * - drain flow as a rate at the outlet, converted to mm/d with the drained area (`--area`):
 *   `flow_l_s`, `flow_m3_s`, `flow_gpm` (US gallons per minute) or `flow_cfs`;
 * - water-table depth below the surface (observation well midway between drains):
 *   `water_table_depth_m` or `water_table_depth_ft`;
 * - nitrate-N concentration of drain water: `no3n_mg_l` (carried into fit.csv, not fitted).
 * One row per day, dates ascending without gaps; an empty cell (or NA) is a day without that
 * observation. Other columns are ignored. Every problem names the file, the line and the
 * column, and what is accepted, as the weather reader does.
 *
 * Conversions are exact definitions: 1 in = 25.4 mm; 1 ft = 0.3048 m; 1 US gal = 3.785411784 L;
 * 1 ft3 = 0.028316846592 m3; a flow Q (m3/s) over an area A (m2) is Q x 86400 / A x 1000 mm/d.
 *
 * Longer than most files: every accepted column with its unit conversion, and a located message
 * for each way a cell, a row or the dates can be wrong.
 */
import { readTextFile } from './files.js';
import { CsvError, parse } from 'csv-parse/sync';
import { dayNumber, isoDate } from '../climate/calendar.js';
import { SettingError } from '../errors.js';
import { problemsLine, type LocatedProblem, type ProblemMessage } from './weather/problems.js';
import { isDecimalNumber } from '../units/decimal.js';
import { US } from '../units/quantity.js';

/** One located problem in an observation file. */
export interface ObservationProblem {
  line: number;
  column?: string;
  message: string;
}

/**
 * An observation file the reader cannot accept; lists the first problems with line and column.
 * Settings are named as the library names them (`areaHa`); the CLI names its flags (`--area`).
 */
export class ObservationInputError extends SettingError {
  readonly problems: ObservationProblem[];
  constructor(file: string, problems: readonly LocatedProblem[]) {
    const list = [...problems];
    super((n) => problemsLine(file, list, n));
    this.name = 'ObservationInputError';
    this.problems = list.map((p) => ({
      ...p,
      message: typeof p.message === 'string' ? p.message : p.message((s) => s),
    }));
  }
}

/** Observed daily series on consecutive dates; NaN where a day has no observation. */
export interface ObservationSeries {
  file: string;
  dates: string[];
  /** Line of each day's row in the file. */
  lines: Int32Array;
  /** Drain flow, mm/d over the drained area. */
  drainflowMm?: Float64Array;
  /** Water-table depth below the surface, m. */
  waterTableDepthM?: Float64Array;
  /** Nitrate-N concentration, mg/L. */
  no3MgL?: Float64Array;
  /** Variable -> header read. */
  columnsUsed: Record<string, string>;
}

export interface ObservationReadOptions {
  /** Name used in messages. */
  file?: string;
  /** Drained area served by the monitored outlet, ha (needed for flow-rate columns). */
  areaHa?: number | undefined;
}

type Variable = 'drainflow' | 'waterTable' | 'no3';

interface ColumnSpec {
  header: string;
  variable: Variable;
  unit: string;
  /** True for a rate at the outlet that needs the drained area. */
  rate?: boolean;
  /** To core units: mm/d, m, mg/L (rates: to m3/s, then over the area). */
  toCore: (x: number) => number;
}

const COLUMNS: readonly ColumnSpec[] = [
  { header: 'drainflow_mm', variable: 'drainflow', unit: 'mm/d', toCore: (x) => x },
  { header: 'drainflow_in', variable: 'drainflow', unit: 'in/d', toCore: (x) => x * US.mmPerIn },
  { header: 'flow_l_s', variable: 'drainflow', unit: 'L/s', rate: true, toCore: (x) => x / 1000 },
  { header: 'flow_m3_s', variable: 'drainflow', unit: 'm3/s', rate: true, toCore: (x) => x },
  {
    header: 'flow_gpm',
    variable: 'drainflow',
    unit: 'US gal/min',
    rate: true,
    toCore: (x) => (x * US.lPerGal) / 1000 / 60,
  },
  {
    header: 'flow_cfs',
    variable: 'drainflow',
    unit: 'ft3/s',
    rate: true,
    toCore: (x) => x / US.cfsPerM3s,
  },
  { header: 'water_table_depth_m', variable: 'waterTable', unit: 'm', toCore: (x) => x },
  {
    header: 'water_table_depth_ft',
    variable: 'waterTable',
    unit: 'ft',
    toCore: (x) => x * US.mPerFt,
  },
  { header: 'no3n_mg_l', variable: 'no3', unit: 'mg/L', toCore: (x) => x },
];

/** Stems whose unknown suffixes are errors (a unit we do not read), not ignored columns. */
const STEMS: ReadonlyArray<[string, Variable]> = [
  ['drainflow_', 'drainflow'],
  ['flow_', 'drainflow'],
  ['water_table_depth_', 'waterTable'],
  ['no3n_', 'no3'],
];

/**
 * Largest plausible values in core units; above them a value is a unit mix-up or a code:
 * drain flow 300 mm/d (well above the largest drainage coefficients, 25-50 mm/d, common
 * practice); water-table depth 30 m; nitrate-N 200 mg/L.
 */
const UPPER: Readonly<Record<Variable, number>> = { drainflow: 300, waterTable: 30, no3: 200 };
const NOUN: Readonly<Record<Variable, string>> = {
  drainflow: 'drain flow',
  waterTable: 'water-table depth',
  no3: 'nitrate-N concentration',
};
const CORE_UNIT: Readonly<Record<Variable, string>> = {
  drainflow: 'mm/d',
  waterTable: 'm',
  no3: 'mg/L',
};
const MISSING = new Set(['', 'na', 'n/a', 'nan', 'null']);

/**
 * Parse an observation CSV into daily series in core units.
 * @example parseObservationsCsv('date,drainflow_mm\n2024-04-01,2.5\n2024-04-02,\n').drainflowMm
 *   // Float64Array [2.5, NaN]
 */
export function parseObservationsCsv(
  text: string,
  o: ObservationReadOptions = {},
): ObservationSeries {
  const file = o.file ?? 'observation file';
  const problems: LocatedProblem[] = [];
  const fail = (line: number, column: string | undefined, message: ProblemMessage): never => {
    problems.push({ line, ...(column !== undefined && { column }), message });
    throw new ObservationInputError(file, problems);
  };
  let rows: Array<{ record: string[]; info: { lines: number } }>;
  try {
    rows = parse(text, {
      bom: true,
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      trim: true,
    }) as unknown as typeof rows;
  } catch (err) {
    if (err instanceof CsvError) {
      const line = (err as CsvError & { lines?: number }).lines ?? 1;
      fail(line, undefined, `the file is not valid CSV: ${err.message.replace(/\s+/g, ' ')}`);
    }
    throw err;
  }
  if (rows.length === 0) {
    fail(1, undefined, 'the file is empty; expected a header row such as date,drainflow_mm');
  }
  const header = rows[0].record;
  const headerLine = rows[0].info.lines;
  const lower = header.map((h) => h.toLowerCase());
  const iDate = lower.indexOf('date');
  const accepted = COLUMNS.map((c) => c.header).join(', ');
  if (iDate < 0) fail(headerLine, undefined, `no date column; the file has ${header.join(', ')}`);

  const used = new Map<Variable, { index: number; spec: ColumnSpec }>();
  lower.forEach((h, index) => {
    const spec = COLUMNS.find((c) => c.header === h);
    if (!spec) {
      const stem = STEMS.find(([s]) => h.startsWith(s));
      if (stem) {
        const choices = COLUMNS.filter((c) => c.variable === stem[1])
          .map((c) => c.header)
          .join(', ');
        fail(
          headerLine,
          header[index],
          `unknown unit in "${header[index]}"; ${NOUN[stem[1]]} is read from ${choices}`,
        );
      }
      return;
    }
    const before = used.get(spec.variable);
    if (before) {
      fail(
        headerLine,
        header[index],
        `two ${NOUN[spec.variable]} columns (${header[before.index]} and ${header[index]}); keep one`,
      );
    }
    if (spec.rate && o.areaHa === undefined) {
      fail(
        headerLine,
        header[index],
        (n) =>
          `${header[index]} is a flow rate (${spec.unit}); give the drained area it comes from with ` +
          `${n('areaHa')} (such as 16 ha or 40 ac) to turn it into mm/d, or give drainflow_mm`,
      );
    }
    used.set(spec.variable, { index, spec });
  });
  if (!used.has('drainflow') && !used.has('waterTable')) {
    fail(
      headerLine,
      undefined,
      `no drain-flow or water-table column; expected date and any of ${accepted}; the file has ` +
        header.join(', '),
    );
  }
  if (rows.length < 2) fail(headerLine, undefined, 'the file has a header but no data rows');

  const n = rows.length - 1;
  const areaM2 = (o.areaHa ?? 0) * 10_000;
  const columns = new Map<Variable, Float64Array>();
  for (const v of used.keys()) columns.set(v, new Float64Array(n).fill(NaN));
  const days = new Float64Array(n);
  const lines = new Int32Array(n);
  const add = (line: number, column: string | undefined, message: ProblemMessage) => {
    if (problems.length < 100)
      problems.push({ line, ...(column !== undefined && { column }), message });
  };
  for (let r = 0; r < n; r++) {
    const { record, info } = rows[r + 1];
    const line = info.lines;
    lines[r] = line;
    if (record.length !== header.length) {
      add(
        line,
        undefined,
        `the row has ${record.length} fields but the header has ${header.length}; every row ` +
          'needs one value per column (leave a cell empty for no observation)',
      );
      continue;
    }
    const day = dayNumber(record[iDate]);
    if (day === undefined) {
      add(
        line,
        header[iDate],
        `"${record[iDate]}" is not a date; expected YYYY-MM-DD, such as 2024-05-01`,
      );
    } else days[r] = day;
    for (const [v, { index, spec }] of used) {
      const cell = record[index];
      if (MISSING.has(cell.toLowerCase())) continue;
      const where = header[index];
      if (!isDecimalNumber(cell)) {
        add(
          line,
          where,
          `"${cell}" is not a number; expected ${NOUN[v]} in ${spec.unit}, or an empty cell`,
        );
        continue;
      }
      const raw = Number(cell);
      if (raw < 0) {
        add(
          line,
          where,
          v === 'waterTable'
            ? `water-table depth ${cell} ${spec.unit} is above the surface; give 0 for a water ` +
                'table at the surface (depths are measured downward)'
            : `${NOUN[v]} ${cell} ${spec.unit} is negative; it must be 0 or more`,
        );
        continue;
      }
      let x = spec.toCore(raw);
      if (spec.rate) x = ((x * 86400) / areaM2) * 1000;
      if (x > UPPER[v]) {
        add(
          line,
          where,
          (n) =>
            `${NOUN[v]} ${cell} ${spec.unit}` +
            (spec.unit !== CORE_UNIT[v] ? ` (${x.toPrecision(4)} ${CORE_UNIT[v]})` : '') +
            ` is above the plausible ${UPPER[v]}; check the unit` +
            (spec.rate ? ` and ${n('areaHa')}` : ''),
        );
        continue;
      }
      columns.get(v)![r] = x;
    }
  }
  if (problems.length) throw new ObservationInputError(file, problems);

  for (let r = 1; r < n; r++) {
    const gap = days[r] - days[r - 1];
    if (gap === 1) continue;
    const at = header[iDate];
    if (gap === 0) add(lines[r], at, `date ${isoDate(days[r])} repeats line ${lines[r - 1]}`);
    else if (gap < 0) {
      add(
        lines[r],
        at,
        `date ${isoDate(days[r])} comes after ${isoDate(days[r - 1])} (line ${lines[r - 1]}); ` +
          'dates must ascend one day at a time',
      );
    } else {
      add(
        lines[r],
        at,
        `dates jump from ${isoDate(days[r - 1])} to ${isoDate(days[r])} (${gap - 1} missing ` +
          `day${gap > 2 ? 's' : ''}); add a row for every day, with empty cells for days ` +
          'without an observation',
      );
    }
  }
  if (problems.length) throw new ObservationInputError(file, problems);

  const out: ObservationSeries = {
    file,
    dates: Array.from(days, (d) => isoDate(d)),
    lines,
    columnsUsed: { date: header[iDate] },
  };
  const keys: Record<Variable, 'drainflowMm' | 'waterTableDepthM' | 'no3MgL'> = {
    drainflow: 'drainflowMm',
    waterTable: 'waterTableDepthM',
    no3: 'no3MgL',
  };
  for (const [v, { index }] of used) {
    out[keys[v]] = columns.get(v)!; // every used variable has its column
    out.columnsUsed[v] = header[index];
  }
  return out;
}

/**
 * Refuse observations outside the weather record, at the line of the first day outside it.
 * @example checkInsideWeather(obs, weather.dates)
 */
export function checkInsideWeather(obs: ObservationSeries, weatherDates: readonly string[]): void {
  const first = weatherDates[0];
  const last = weatherDates[weatherDates.length - 1];
  const i = obs.dates.findIndex((d) => d < first || d > last);
  if (i < 0) return;
  throw new ObservationInputError(obs.file, [
    {
      line: obs.lines[i],
      column: obs.columnsUsed.date,
      message:
        `date ${obs.dates[i]} lies outside the weather record (${first} to ${last}); the model ` +
        'can only be compared on days it simulates: drop those rows or give a longer weather file',
    },
  ]);
}

/** Read an observation CSV file; like parseObservationsCsv with the file's name in messages. */
export function readObservationsFile(
  path: string,
  o: ObservationReadOptions = {},
): ObservationSeries {
  const text = readTextFile(path, 'observation file');
  return parseObservationsCsv(text, { ...o, file: o.file ?? path });
}
