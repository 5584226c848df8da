/**
 * Which header holds each weather variable, and in which unit: standard names with a unit
 * suffix (`precip_mm`, `tmax_f`, ...), or headers mapped with `columns`.
 */
import type { Problems } from './problems.js';
import {
  MM,
  NOUN,
  REQUIRED,
  UNITS,
  VALUE_VARIABLES,
  WEATHER_VARIABLES,
  type UnitSpec,
  type ValueVariable,
  type WeatherVariable,
} from './units.js';

/** Where a variable is read from. */
export interface ColumnUse {
  index: number;
  header: string;
  unit: UnitSpec;
}

/** Variable -> the column it is read from. */
export type ColumnMap = Partial<Record<WeatherVariable, ColumnUse>>;

/** The reading options column resolution depends on. */
export interface ColumnOptions {
  columns?: Record<string, string>;
  precipUnit?: 'mm' | 'in';
  tempUnit?: 'c' | 'f';
}

/** Index of a header: exact match first, then without case; -1 when absent. */
export function findHeader(header: readonly string[], name: string): number {
  const exact = header.indexOf(name);
  if (exact >= 0) return exact;
  const lower = name.toLowerCase();
  return header.findIndex((h) => h.toLowerCase() === lower);
}

/** The headers of a file as a list for messages. */
export function headerList(header: readonly string[]): string {
  return header.map((h) => JSON.stringify(h)).join(', ');
}

/** Work out which header holds each variable, and in which unit. */
export function resolveColumns(
  header: string[],
  line: number,
  o: ColumnOptions,
  problems: Problems,
): ColumnMap {
  const cols: ColumnMap = {};
  const list = headerList(header);
  const mapping = o.columns ?? {};
  const flagUnit = (v: ValueVariable): string | undefined =>
    v === 'precip' || v === 'ref_et'
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
          (n) =>
            `the header says ${fromSuffix.label} but ${n(v === 'precip' || v === 'ref_et' ? 'precipUnit' : 'tempUnit')} says ${flag}; ` +
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
        (n) =>
          `${n('columns')} names an unknown variable "${key}"; accepted: ${WEATHER_VARIABLES.join(', ')}`,
      );
    }
    const index = findHeader(header, name);
    if (index < 0) {
      problems.fail(
        line,
        undefined,
        (n) =>
          `${n('columns')} ${key}=${name}: the file has no column "${name}"; its columns are ${list}`,
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
        (n) =>
          `two ${NOUN[v]} columns (${matches.map((i) => header[i]).join(' and ')}); ` +
          `keep one or choose with ${n('columns')} ${v}=NAME`,
      );
    }
    if (matches.length === 1) use(v, matches[0], unitOf(v, header[matches[0]], true));
  }

  // Reference ET was once read from `pet_mm`/`pet_in`: say so rather than ignore the column
  // and compute ET0 by another method without a word.
  if (!cols.ref_et) {
    const old = header.find((h) => /^pet_(mm|in)$/i.test(h));
    if (old !== undefined) {
      problems.fail(
        line,
        old,
        (n) =>
          `reference ET is read from a column named ref_et_${old.slice(4).toLowerCase()}; ` +
          `rename the header or map it with ${n('columns')} ref_et=${old}`,
      );
    }
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
      (n) =>
        `no ${absent.map((v) => NOUN[v]).join(', ')} column${absent.length > 1 ? 's' : ''}; ` +
        `expected headers ${expect.join(', ')}, or map yours with ${n('columns')} ` +
        `${absent.map((v) => `${v}=NAME`).join(',')}; the file has ${list}${hint}`,
    );
  }
  return cols;
}

/** The column of a `where` filter (one station of several), or a located error. */
export function whereColumn(
  header: readonly string[],
  line: number,
  where: { column: string; value: string },
  problems: Problems,
  setting: 'where' | 'station' = 'where',
): number {
  const index = findHeader(header, where.column);
  if (index < 0) {
    problems.fail(
      line,
      undefined,
      (n) =>
        `${n(setting)} ${where.column}=${where.value}: the file has no column "${where.column}"; ` +
        `its columns are ${headerList(header)}`,
    );
  }
  return index;
}

/** Collects up to 11 distinct values of a filter column, for the "no rows where" message. */
export class SeenValues {
  private readonly seen = new Set<string>();
  add(value: string): void {
    if (this.seen.size <= 10) this.seen.add(value);
  }
  /** `"A", "B", ...` (at most ten, then an ellipsis). */
  toString(): string {
    const list = [...this.seen];
    return (
      list
        .slice(0, 10)
        .map((s) => JSON.stringify(s))
        .join(', ') + (list.length > 10 ? ', ...' : '')
    );
  }
}
