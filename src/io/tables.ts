/**
 * Tables out: unit systems for written figures and deterministic CSV text.
 *
 * Column names carry their unit as a suffix (`drainflow_mm`, `water_table_depth_m`,
 * `no3n_load_kg_ha`). With `--units us` the same tables are written in US customary units and the
 * suffixes change with them (`drainflow_in`, `water_table_depth_ft`, `no3n_load_lb_ac`).
 */
import { stringify } from 'csv-stringify/sync';
import { US, type UnitSystem } from '../units/quantity.js';
import { roundTo } from '../units/decimal.js';

/** Suffix conversions from SI to US customary (exact factors, NIST Handbook 44 App. C). */
const US_SUFFIXES: ReadonlyArray<[string, string, number]> = [
  ['_mm_d', '_in_d', 1 / US.mmPerIn],
  ['_mm_yr', '_in_yr', 1 / US.mmPerIn],
  ['_mm', '_in', 1 / US.mmPerIn],
  ['_m_ha', '_ft_ac', (1 / US.mPerFt) * US.haPerAc],
  ['_kg_ha', '_lb_ac', US.lbAcPerKgHa],
  ['_m', '_ft', 1 / US.mPerFt],
  ['_ha', '_ac', 1 / US.haPerAc],
  ['_l_s', '_cfs', US.cfsPerM3s / 1000],
  ['_m_s', '_ft_s', 1 / US.mPerFt],
];

/** Column name and factor for a column in the chosen unit system. */
export function columnIn(name: string, units: UnitSystem): { name: string; factor: number } {
  if (units === 'si') return { name, factor: 1 };
  // A seepage-band column (`drainflow_change_mm_low`) converts like the column it bands.
  const band = /_(low|high)$/.exec(name);
  if (band) {
    const c = columnIn(name.slice(0, -band[0].length), units);
    return { name: c.name + band[0], factor: c.factor };
  }
  for (const [si, us, f] of US_SUFFIXES) {
    if (name.endsWith(si)) return { name: name.slice(0, -si.length) + us, factor: f };
  }
  return { name, factor: 1 };
}

/** Decimals written for a column, by its unit suffix, so files are compact and stable. */
function decimalsFor(name: string): number {
  if (/_(low|high)$/.test(name)) return decimalsFor(name.replace(/_(low|high)$/, ''));
  if (/_(m|ft)$/.test(name)) return 4;
  if (/_(mm|in|mm_d|in_d)$/.test(name))
    return name.endsWith('_in') || name.endsWith('_in_d') ? 4 : 3;
  if (/_(kg_ha|lb_ac)$/.test(name)) return 4;
  if (/(_days|_percent|_mg_l)$/.test(name)) return 3;
  return 6;
}

/** Powers of ten up to 10^6, the most decimals a column has. */
const POW10 = [1, 10, 100, 1e3, 1e4, 1e5, 1e6];

/** A number as text: fixed decimals, no "-0", empty for NaN. */
export function numberText(x: number, decimals: number): string {
  if (Number.isNaN(x)) return '';
  if (!Number.isFinite(x)) return x > 0 ? 'inf' : '-inf';
  // Unlike fixedText (units/decimal.ts), a cell drops trailing zeros: round to the decimals,
  // then print the shortest text that reads back to that double (ECMAScript Number::toString),
  // so files stay short and a value reads back as written; + 0 turns -0 into 0.
  const p = POW10[decimals];
  const k = p === undefined ? NaN : Math.round(x * p) + 0;
  if (!(Math.abs(k) < 1e15)) {
    const r = roundTo(x, decimals) + 0;
    return Math.abs(r) < 1e15 ? String(r) : r.toFixed(0);
  }
  // The same text built from the integer k = round(x * 10^decimals): the double k / 10^decimals
  // is the one nearest the decimal k * 10^-decimals, which has at most 15 significant digits, so
  // that decimal (trailing zeros dropped) is the shortest text reading back to it, which is what
  // String prints. Integers print much faster than fractions; this runs for every daily cell.
  const a = k < 0 ? -k : k;
  const frac = a % p;
  const whole = (a - frac) / p;
  const sign = k < 0 ? '-' : '';
  if (frac === 0) return sign + whole;
  const digits = String(frac + p);
  let end = digits.length;
  while (digits.charCodeAt(end - 1) === 48) end--;
  return sign + whole + '.' + digits.slice(1, end);
}

/**
 * CSV text for records, converting columns to the unit system and renaming their suffixes.
 * @example toCsv([{ scenario: 'a', drainflow_mm: 25.4 }], 'us') // "scenario,drainflow_in\na,1\n"
 */
export function toCsv(
  rows: ReadonlyArray<Record<string, string | number>>,
  units: UnitSystem,
): string {
  if (rows.length === 0) return '';
  const keys = Object.keys(rows[0]);
  const cols = keys.map((k) => ({ key: k, ...columnIn(k, units) }));
  const out: string[][] = [cols.map((c) => c.name)];
  for (const r of rows) {
    out.push(
      cols.map((c) => {
        const v = r[c.key];
        return typeof v === 'number'
          ? numberText(v * c.factor, decimalsFor(c.name))
          : safeCell(String(v ?? ''));
      }),
    );
  }
  return stringify(out);
}

/** One column of a columnar table: a name ending with its unit, and its values. */
export interface Column {
  name: string;
  values: ArrayLike<number> | ReadonlyArray<string>;
}

/**
 * A text cell that a spreadsheet would run as a formula (it starts with =, +, -, @, a tab or a
 * carriage return) gets a leading apostrophe, the OWASP "CSV injection" rule; other text and
 * numbers are written unchanged.
 * @example safeCell('=HYPERLINK("x")') // "'=HYPERLINK(\"x\")"
 */
export function safeCell(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** A CSV field, quoted by csv-stringify when it needs quoting. */
function field(text: string): string {
  return /[",\r\n]/.test(text) ? stringify([[text]]).replace(/\r?\n$/, '') : text;
}

/**
 * CSV text for a columnar table (all columns the same length), converted to the unit system,
 * with or without the header line (to append tables with the same columns).
 * Built line by line from typed arrays: the daily table of a 30-year, three-scenario run has
 * about a million cells, and one object per row would cost more in garbage than in formatting.
 */
export function columnsToCsv(
  columns: ReadonlyArray<Column>,
  units: UnitSystem,
  header = true,
): string {
  return [...columnsToCsvChunks(columns, units, header, Infinity)].join('');
}

/**
 * The same text as `columnsToCsv`, in pieces of at most `rowsPerChunk` lines, so that a large
 * table can be written to a file without ever being one string.
 */
export function* columnsToCsvChunks(
  columns: ReadonlyArray<Column>,
  units: UnitSystem,
  header = true,
  rowsPerChunk = 4096,
): Generator<string> {
  if (columns.length === 0) return;
  const conv = columns.map((c) => {
    const u = columnIn(c.name, units);
    return {
      ...u,
      values: c.values,
      decimals: decimalsFor(u.name),
      numeric: typeof c.values[0] === 'number',
    };
  });
  const n = columns[0].values.length;
  let lines: string[] = header ? [stringify([conv.map((c) => c.name)]).replace(/\r?\n$/, '')] : [];
  const cache = new Map<string, string>();
  const cell = new Array<string>(conv.length);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < conv.length; j++) {
      const c = conv[j];
      if (c.numeric) cell[j] = numberText((c.values[i] as number) * c.factor, c.decimals);
      else {
        const t = String(c.values[i]);
        let q = cache.get(t);
        if (q === undefined) {
          q = field(safeCell(t));
          cache.set(t, q);
        }
        cell[j] = q;
      }
    }
    lines.push(cell.join(','));
    if (lines.length >= rowsPerChunk) {
      yield lines.join('\n') + '\n';
      lines = [];
    }
  }
  if (lines.length > 0) yield lines.join('\n') + '\n';
}

/** Convert a record's numeric values and keys to the unit system (for JSON outputs). */
export function recordIn(r: Record<string, unknown>, units: UnitSystem): Record<string, unknown> {
  if (units === 'si') return r;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(r)) {
    const c = columnIn(k, units);
    out[c.name] = typeof v === 'number' ? v * c.factor : v;
  }
  return out;
}
