/**
 * GHCN-Daily station records as the public climate-data services export them, in two layouts:
 *
 * - **wide CSV** with a header: `STATION`, optional `NAME`, `LATITUDE`, ..., `DATE`
 *   (YYYY-MM-DD), then one column per element (`PRCP`, `TMAX`, `TMIN`, optional `SNOW`, `SNWD`,
 *   ...) each with an optional `<ELEMENT>_ATTRIBUTES` column holding the measurement, quality
 *   and source flags and the observation time (`M,Q,S,T`). One row per station and day; several
 *   stations in one file. Values are in metric (mm, degC) or standard (in, degF) units as chosen
 *   at export, and the file does not say which: `exportUnits` is required.
 * - **by-station CSV** without a header: `ID,YYYYMMDD,ELEMENT,VALUE,MFLAG,QFLAG,SFLAG,OBSTIME`,
 *   one row per element and day, PRCP in tenths of mm and TMAX/TMIN in tenths of degC, -9999
 *   for a missing value (GHCN-Daily documentation, readme of the by-station files; from memory).
 *
 * Only PRCP, TMAX and TMIN are read (snowfall and snow depth are left out: tileflux's snow model
 * works from precipitation and temperature). Empty or missing values and values with a quality
 * flag (a non-empty Q flag: the value failed one of the data set's quality checks) are gaps,
 * filled with the --fill rules and counted.
 */
import { isoDate } from '../../climate/calendar.js';
import { assembleSeries, checkTminTmax, stagedRows } from './assemble.js';
import { findHeader, resolveColumns, SeenValues, type ColumnUse } from './columns.js';
import { CsvRows } from './csvRows.js';
import {
  columnReport,
  EMPTY_FILE,
  nextRecord,
  NO_ROWS,
  readOwnRows,
  toCore,
  type WeatherReadOptions,
  type WeatherReadResult,
} from './parse.js';
import { Problems } from './problems.js';
import { MAX_FILL_DAYS, NOUN, type UnitSpec, type ValueVariable } from './units.js';

const ELEMENTS: Readonly<Record<string, ValueVariable>> = {
  PRCP: 'precip',
  TMAX: 'tmax',
  TMIN: 'tmin',
};
const ELEMENT_OF = { precip: 'PRCP', tmax: 'TMAX', tmin: 'TMIN' } as const;

/** The by-station layout: an 11-character station id, a compact date, an element. */
export const GHCN_BY_STATION_LINE =
  /^\s*"?[A-Z0-9]{11}"?\s*,\s*"?\d{8}"?\s*,\s*"?[A-Z0-9]{4}"?\s*,/;

/** Quality flag of a wide export's attributes cell (`M,Q,S,T`), or '' when none. */
function qualityFlag(attributes: string): string {
  const first = attributes.indexOf(',');
  if (first < 0) return '';
  const second = attributes.indexOf(',', first + 1);
  return attributes.slice(first + 1, second < 0 ? undefined : second).trim();
}

/** Distinct values of one column over all rows after the header (for the station choice). */
function distinctValues(text: string, index: number, problems: Problems): Map<string, number> {
  const rows = new CsvRows(text);
  const seen = new Map<string, number>();
  nextRecord(rows, problems);
  while (nextRecord(rows, problems)) {
    if (index >= rows.count) continue;
    const v = rows.field(index);
    if (!seen.has(v)) seen.set(v, rows.line);
  }
  return seen;
}

function stationChoiceError(
  stations: Iterable<string>,
  count: number,
  problems: Problems,
  line: number,
  column: string | undefined,
): never {
  const list = [...stations].slice(0, 10).join(', ') + (count > 10 ? ', ...' : '');
  problems.fail(
    line,
    column,
    (n) => `the file holds ${count} stations (${list}); choose one with ${n('station')} ID`,
  );
}

/** A GHCN-Daily wide export (with a header). */
export function parseGhcnWide(text: string, o: WeatherReadOptions): WeatherReadResult {
  const problems = new Problems(o.file ?? 'weather CSV');
  const rows = new CsvRows(text);
  if (!nextRecord(rows, problems)) problems.fail(1, undefined, EMPTY_FILE);
  const header = rows.fields();
  const headerLine = rows.line;
  if (o.exportUnits === undefined) {
    problems.fail(
      headerLine,
      undefined,
      (n) =>
        `a GHCN-Daily export does not record its units: give ${n('exportUnits')} metric (mm, degC) ` +
        `or ${n('exportUnits')} standard (in, degF), as chosen when the file was ordered`,
    );
  }
  const stationIndex = findHeader(header, 'STATION');
  let station = o.station;
  if (station === undefined && stationIndex >= 0) {
    const stations = distinctValues(text, stationIndex, problems);
    if (stations.size > 1) {
      stationChoiceError(
        stations.keys(),
        stations.size,
        problems,
        headerLine,
        header[stationIndex],
      );
    }
    station = stations.keys().next().value;
  }
  const standard = o.exportUnits === 'standard';
  const cols = resolveColumns(
    header,
    headerLine,
    {
      columns: { date: 'DATE', precip: 'PRCP', tmax: 'TMAX', tmin: 'TMIN' },
      precipUnit: standard ? 'in' : 'mm',
      tempUnit: standard ? 'f' : 'c',
    },
    problems,
  );
  const attributes: Partial<Record<ValueVariable, number>> = {};
  for (const v of ['precip', 'tmax', 'tmin'] as const) {
    const index = findHeader(header, `${cols[v]!.header}_ATTRIBUTES`);
    if (index >= 0) attributes[v] = index;
  }
  let flagged = 0;
  const staged = readOwnRows(
    rows,
    header,
    headerLine,
    cols,
    {
      ...(o.fill !== undefined && { fill: o.fill }),
      ...(station !== undefined && stationIndex >= 0
        ? { where: { column: header[stationIndex], value: station } }
        : o.station !== undefined && { where: { column: 'STATION', value: o.station } }),
    },
    problems,
    {
      whereSetting: 'station',
      gap: (r, v) => {
        const index = attributes[v];
        if (index === undefined || index >= r.count || r.isEmpty(index)) return undefined;
        const q = qualityFlag(r.field(index));
        if (q === '') return undefined;
        flagged++;
        return `quality-flagged (Q flag ${q} in ${header[index]})`;
      },
    },
  );
  const { series, filledDays } = assembleSeries(staged, o.fill === true, problems);
  const notes = [`GHCN-Daily export, station ${station ?? 'unnamed'}, ${o.exportUnits} units`];
  if (flagged > 0) notes.push(`${flagged} quality-flagged values treated as gaps and filled`);
  return { series, filledDays, ...columnReport(cols), format: 'ghcn', notes };
}

/** A GHCN-Daily by-station file (no header, one element per row, tenths). */
export function parseGhcnByStation(text: string, o: WeatherReadOptions): WeatherReadResult {
  const problems = new Problems(o.file ?? 'weather CSV');
  const rows = new CsvRows(text);
  const fill = o.fill === true;
  const TENTH_MM: UnitSpec = { suffix: 'mm', label: 'tenths of mm', toCore: (x) => x / 10 };
  const TENTH_C: UnitSpec = { suffix: 'c', label: 'tenths of degC', toCore: (x) => x / 10 };
  const use: Record<ValueVariable, ColumnUse | undefined> = {
    precip: { index: 3, header: 'VALUE (PRCP)', unit: TENTH_MM },
    tmax: { index: 3, header: 'VALUE (TMAX)', unit: TENTH_C },
    tmin: { index: 3, header: 'VALUE (TMIN)', unit: TENTH_C },
    ref_et: undefined,
    solar: undefined,
    rh: undefined,
    wind: undefined,
  };
  // Gather the three elements by day: day number -> row of the day in `byDay`.
  const byDay = new Map<number, number>();
  const dayList: number[] = [];
  const lineList: number[] = [];
  const vals: Record<'precip' | 'tmax' | 'tmin', number[]> = { precip: [], tmax: [], tmin: [] };
  const lineOf: Record<'precip' | 'tmax' | 'tmin', number[]> = { precip: [], tmax: [], tmin: [] };
  const stations = new SeenValues();
  let stationCount = 0;
  let station = o.station;
  const stationSet = new Set<string>();
  let flagged = 0;
  let missing = 0;
  while (nextRecord(rows, problems)) {
    const line = rows.line;
    if (rows.count < 4) {
      problems.add(
        line,
        undefined,
        `the row has ${rows.count} fields; a GHCN-Daily by-station row has ` +
          'ID,YYYYMMDD,ELEMENT,VALUE,MFLAG,QFLAG,SFLAG,OBSTIME',
      );
      continue;
    }
    const id = rows.field(0);
    if (!stationSet.has(id)) {
      stationSet.add(id);
      stationCount++;
      stations.add(id);
    }
    if (station === undefined) station = id;
    if (id !== station) {
      if (o.station === undefined) {
        stationChoiceError(stationSet, stationCount, problems, line, 'ID');
      }
      continue;
    }
    const v = ELEMENTS[rows.field(2)] as 'precip' | 'tmax' | 'tmin' | undefined;
    if (v === undefined) continue;
    const day = rows.compactDay(1);
    if (Number.isNaN(day)) {
      problems.add(
        line,
        'DATE',
        `"${rows.field(1)}" is not a date; expected a calendar date as YYYYMMDD, such as 20240501`,
      );
      continue;
    }
    let r = byDay.get(day);
    if (r === undefined) {
      r = dayList.length;
      byDay.set(day, r);
      dayList.push(day);
      lineList.push(line);
      for (const k of ['precip', 'tmax', 'tmin'] as const) {
        vals[k].push(NaN);
        lineOf[k].push(0);
      }
    }
    if (lineOf[v][r] !== 0) {
      problems.add(
        line,
        use[v]!.header,
        `${rows.field(2)} of ${rows.field(1)} repeats line ${lineOf[v][r]}; each element may appear once a day`,
      );
      continue;
    }
    lineOf[v][r] = line;
    const raw = rows.number(3);
    const q = rows.count > 5 ? rows.field(5) : '';
    if (Number.isNaN(raw)) {
      problems.add(
        line,
        use[v]!.header,
        `"${rows.field(3)}" is not a whole number of ${use[v]!.unit.label}`,
      );
    } else if (raw === -9999) {
      missing++;
      if (!fill) {
        problems.add(
          line,
          use[v]!.header,
          (n) =>
            `no ${NOUN[v]} value (-9999); use ${n('fill')} for up to ${MAX_FILL_DAYS} missing days in a row`,
        );
      }
    } else if (q !== '') {
      flagged++;
      if (!fill) {
        problems.add(
          line,
          use[v]!.header,
          (n) =>
            `${NOUN[v]} ${rows.field(3)} is quality-flagged (Q flag ${q}), so it counts as a gap; ` +
            `use ${n('fill')} for up to ${MAX_FILL_DAYS} missing days in a row`,
        );
      }
    } else {
      vals[v][r] = toCore(raw, rows, v, use[v]!, line, problems);
    }
  }
  if (o.station !== undefined && dayList.length === 0 && stationCount > 0) {
    problems.fail(1, 'ID', `no rows where ID is "${o.station}"; values found: ${stations}`);
  }
  if (dayList.length === 0) problems.fail(1, undefined, NO_ROWS);
  // Days in order (the files are sorted, but need not be).
  const order = dayList.map((_, i) => i).sort((a, b) => dayList[a] - dayList[b]);
  const staged = stagedRows(
    order.length,
    ['precip', 'tmax', 'tmin'],
    {
      precip: use.precip!.header,
      tmax: use.tmax!.header,
      tmin: use.tmin!.header,
    },
    'DATE',
  );
  staged.n = order.length;
  order.forEach((i, r) => {
    staged.days[r] = dayList[i];
    staged.lines[r] = lineList[i];
    for (const k of ['precip', 'tmax', 'tmin'] as const) {
      const x = vals[k][i];
      staged.values[k]![r] = x;
      if (Number.isNaN(x)) {
        staged.missingCells++;
        if (lineOf[k][i] === 0 && !fill) {
          problems.add(
            lineList[i],
            use[k]!.header,
            (n) =>
              `no ${ELEMENT_OF[k]} row for ${compactDate(dayList[i])}; ` +
              `use ${n('fill')} for up to ${MAX_FILL_DAYS} missing days in a row`,
          );
        }
      }
    }
    checkTminTmax(staged, r, problems);
  });
  problems.throwIfAny();
  const { series, filledDays } = assembleSeries(staged, fill, problems);
  const notes = [`GHCN-Daily by-station file, station ${station}, values in tenths`];
  if (missing + flagged > 0) {
    notes.push(
      `${missing} missing and ${flagged} quality-flagged values treated as gaps and filled`,
    );
  }
  return {
    series,
    filledDays,
    columnsUsed: { date: 'DATE', precip: 'PRCP', tmax: 'TMAX', tmin: 'TMIN' },
    unitsUsed: { precip: TENTH_MM.label, tmax: TENTH_C.label, tmin: TENTH_C.label },
    format: 'ghcn',
    notes,
  };
}

function compactDate(day: number): string {
  return isoDate(day).replaceAll('-', '');
}
