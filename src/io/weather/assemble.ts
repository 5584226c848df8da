/**
 * From rows read in any format to a gap-free daily series: dates in strict ascending order,
 * missing days found and (with `fill`) filled, then the series in core units.
 */
import { isoDate } from '../../climate/calendar.js';
import type { WeatherSeries } from '../../climate/weatherSeries.js';
import { isoDateRun } from './csvRows.js';
import type { Problems } from './problems.js';
import { fmtValue, MAX_FILL_DAYS, NOUN, VALUE_VARIABLES, type ValueVariable } from './units.js';

/** Rows of a weather file after each cell was read on its own (stage 1 of every reader). */
export interface StagedRows {
  n: number;
  /** Day number of each row (days since 1970-01-01). */
  days: Float64Array;
  /** Line of each row in the file. */
  lines: Int32Array;
  /** Values in core units; NaN where a cell was empty (or a gap by the format's rules). */
  values: Partial<Record<ValueVariable, Float64Array>>;
  /** Header each variable was read from, for messages. */
  headers: Partial<Record<ValueVariable, string>>;
  /** Header of the date (the column messages about dates name). */
  dateHeader: string;
  /** Cells that were empty (NaN in `values`). */
  missingCells: number;
}

/** Room for `capacity` rows of the given variables. */
export function stagedRows(
  capacity: number,
  variables: readonly ValueVariable[],
  headers: Partial<Record<ValueVariable, string>>,
  dateHeader: string,
): StagedRows {
  const values: Partial<Record<ValueVariable, Float64Array>> = {};
  for (const v of variables) values[v] = new Float64Array(capacity);
  return {
    n: 0,
    days: new Float64Array(capacity),
    lines: new Int32Array(capacity),
    values,
    headers,
    dateHeader,
    missingCells: 0,
  };
}

/** Number of line ends of a text plus one: an upper bound of its rows. */
export function lineCount(text: string): number {
  const count = (ch: string) => {
    let c = 0;
    for (let i = text.indexOf(ch); i >= 0; i = text.indexOf(ch, i + 1)) c++;
    return c;
  };
  return Math.max(count('\n'), count('\r')) + 1;
}

/** Check that a row's Tmin is not above its Tmax. */
export function checkTminTmax(rows: StagedRows, r: number, problems: Problems): void {
  const tmax = rows.values.tmax![r];
  const tmin = rows.values.tmin![r];
  if (tmin > tmax) {
    problems.add(
      rows.lines[r],
      rows.headers.tmin,
      `minimum temperature ${fmtValue(tmin)} degC is above the maximum ${fmtValue(tmax)} degC ` +
        `(column ${rows.headers.tmax}); check for swapped columns`,
    );
  }
}

/**
 * Stages 2 and 3 and the calendar: dates must ascend one day at a time; missing days are errors
 * (listed) unless `fill`, which fills runs of up to MAX_FILL_DAYS missing days or empty cells:
 * precipitation with 0, every other variable linearly between the neighbouring days (the
 * nearest value at the ends of the record). Throws a located WeatherInputError.
 */
export function assembleSeries(
  rows: StagedRows,
  fill: boolean,
  problems: Problems,
): { series: WeatherSeries; filledDays: number } {
  const { n, days, lines, dateHeader } = rows;

  // Stage 2: dates in strict ascending order.
  for (let r = 1; r < n; r++) {
    if (days[r] === days[r - 1]) {
      problems.add(
        lines[r],
        dateHeader,
        `date ${isoDate(days[r])} repeats line ${lines[r - 1]}; each day may appear once`,
      );
    } else if (days[r] < days[r - 1]) {
      problems.add(
        lines[r],
        dateHeader,
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
    if (!fill) {
      const listed: string[] = [];
      for (let k = 1; k <= Math.min(missing, 3); k++) listed.push(isoDate(days[r - 1] + k));
      problems.add(
        lines[r],
        dateHeader,
        (n) =>
          `dates jump from ${isoDate(days[r - 1])} to ${isoDate(days[r])}: ${missing} missing ` +
          `day${missing > 1 ? 's' : ''} (${listed.join(', ')}${missing > 3 ? ', ...' : ''}); ` +
          `add the rows, or use ${n('fill')} for gaps of up to ${MAX_FILL_DAYS} days`,
      );
    } else if (missing > MAX_FILL_DAYS) {
      problems.add(
        lines[r],
        dateHeader,
        (n) =>
          `${missing} days are missing (${first} to ${last}); ${n('fill')} fills at most ` +
          `${MAX_FILL_DAYS} days in a row`,
      );
    }
  }
  problems.throwIfAny();

  // Lay rows out on the full calendar; missing days are NaN, then filled.
  const first = days[0];
  const total = days[n - 1] - first + 1;
  const full = {} as Record<ValueVariable, Float64Array>;
  for (const v of VALUE_VARIABLES) {
    const src = rows.values[v];
    if (!src) continue;
    if (total === n) {
      full[v] = src.length === n ? src : src.slice(0, n);
      continue;
    }
    const a = new Float64Array(total).fill(NaN);
    for (let r = 0; r < n; r++) a[days[r] - first] = src[r];
    full[v] = a;
  }
  let filledDays = 0;
  if (total > n || rows.missingCells > 0) {
    // A missing day is reported at the line of the next row in the file.
    const lineOfDay = new Int32Array(total);
    for (let d = total - 1, r = n - 1, next = lines[n - 1]; d >= 0; d--) {
      if (r >= 0 && days[r] - first === d) next = lines[r--];
      lineOfDay[d] = next;
    }
    const filled = new Uint8Array(total);
    for (const v of VALUE_VARIABLES) {
      if (!full[v]) continue;
      fillRuns(
        full[v],
        v === 'precip',
        (start, length) => {
          problems.add(
            lineOfDay[start],
            rows.headers[v],
            (n) =>
              `${length} days in a row have no ${NOUN[v]} (${isoDate(first + start)} to ` +
              `${isoDate(first + start + length - 1)}); ${n('fill')} fills at most ${MAX_FILL_DAYS}`,
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
          rows.headers.tmin,
          `after filling ${isoDate(first + d)}, the minimum temperature ` +
            `${fmtValue(full.tmin[d])} degC lies above the maximum ${fmtValue(full.tmax[d])} degC; ` +
            'give the missing value',
        );
      }
    }
    problems.throwIfAny();
  }

  const series: WeatherSeries = {
    dates: isoDateRun(first, total),
    precipMm: full.precip,
    tmaxC: full.tmax,
    tminC: full.tmin,
  };
  if (full.ref_et) series.refEtMm = full.ref_et;
  if (full.solar) series.solarMJm2 = full.solar;
  if (full.rh) series.rhMeanPct = full.rh;
  if (full.wind) series.wind2mMs = full.wind;
  return { series, filledDays };
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
