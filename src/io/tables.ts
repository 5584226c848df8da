/**
 * Tables out: unit systems for written figures and deterministic CSV text.
 *
 * Column names carry their unit as a suffix (`drainflow_mm`, `water_table_depth_m`,
 * `no3_load_kg_ha`). With `--units us` the same tables are written in US customary units and the
 * suffixes change with them (`drainflow_in`, `water_table_depth_ft`, `no3_load_lb_ac`).
 */
import { stringify } from 'csv-stringify/sync';
import { US, type UnitSystem } from '../units/quantity.js';

/** Suffix conversions from SI to US customary (exact factors, NIST Handbook 44 App. C). */
const US_SUFFIXES: ReadonlyArray<[string, string, number]> = [
  ['_mm_d', '_in_d', 1 / US.mmPerIn],
  ['_mm_yr', '_in_yr', 1 / US.mmPerIn],
  ['_mm', '_in', 1 / US.mmPerIn],
  ['_cm_days', '_in_days', 10 / US.mmPerIn],
  ['_m_ha', '_ft_ac', (1 / US.mPerFt) * US.haPerAc],
  ['_kg_ha', '_lb_ac', US.lbAcPerKgHa],
  ['_m', '_ft', 1 / US.mPerFt],
];

/** Column name and factor for a column in the chosen unit system. */
export function columnIn(name: string, units: UnitSystem): { name: string; factor: number } {
  if (units === 'si') return { name, factor: 1 };
  for (const [si, us, f] of US_SUFFIXES) {
    if (name.endsWith(si)) return { name: name.slice(0, -si.length) + us, factor: f };
  }
  return { name, factor: 1 };
}

/** Decimals written for a column, by its unit suffix, so files are compact and stable. */
function decimalsFor(name: string): number {
  if (/_(m|ft)$/.test(name)) return 4;
  if (/_(mm|in|mm_d|in_d)$/.test(name))
    return name.endsWith('_in') || name.endsWith('_in_d') ? 4 : 3;
  if (/_(kg_ha|lb_ac)$/.test(name)) return 4;
  if (/(_days|_percent|_mg_l)$/.test(name)) return 3;
  return 6;
}

/** A number as text: fixed decimals, no "-0", empty for NaN. */
export function numberText(x: number, decimals: number): string {
  if (Number.isNaN(x)) return '';
  if (!Number.isFinite(x)) return x > 0 ? 'inf' : '-inf';
  if (Number.isInteger(x) && Math.abs(x) < 1e15) return String(x);
  const s = x.toFixed(decimals);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
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
          : String(v ?? '');
      }),
    );
  }
  return stringify(out);
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
