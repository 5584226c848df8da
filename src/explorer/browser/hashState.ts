/**
 * The page's settings in the URL's fragment ("#v1=..."), so that a link or a bookmark brings
 * back the same view: soil, nitrate setting, each design's depth, spacing and outlet schedule
 * (core units) and the chart year. A fragment that does not fit the field is ignored.
 *
 * @example readHash(writeHashText(s, 2010), s) // { settings: s, year: 2010 }
 */
import { MONTH_DAY, type DesignSettings, type ExplorerSettings } from './model.js';

interface Packed {
  k: number;
  p: number[];
  n: number | null;
  a: [number, number, Array<[string, number | null]>];
  b: [number, number, Array<[string, number | null]>];
  y: number | null;
}

const PREFIX = '#v1=';

const design = (d: DesignSettings): Packed['a'] => [
  d.depthM,
  d.spacingM,
  d.outlet.map((r) => [r.from, r.depthM]),
];

/** The fragment for the settings and chart year. */
export function writeHashText(s: ExplorerSettings, year: number | null): string {
  const packed: Packed = {
    k: s.kMPerDay,
    p: s.porosity,
    n: s.nitrate,
    a: design(s.a),
    b: design(s.b),
    y: year,
  };
  return PREFIX + encodeURIComponent(JSON.stringify(packed));
}

const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

function unpackDesign(x: unknown): DesignSettings | null {
  if (!Array.isArray(x) || x.length !== 3 || !finite(x[0]) || !finite(x[1]) || !Array.isArray(x[2]))
    return null;
  const rows: DesignSettings['outlet'] = [];
  for (const r of x[2] as unknown[]) {
    if (!Array.isArray(r) || r.length !== 2 || typeof r[0] !== 'string' || !MONTH_DAY.test(r[0]))
      return null;
    if (r[1] !== null && !finite(r[1])) return null;
    rows.push({ from: r[0], depthM: r[1] as number | null });
  }
  return { depthM: x[0], spacingM: x[1], outlet: rows };
}

/**
 * The settings and chart year a fragment holds, or null when it holds none or they do not fit
 * the field (another number of porosity layers, a nitrate setting where there is none).
 */
export function readHash(
  hash: string,
  fits: ExplorerSettings,
): { settings: ExplorerSettings; year: number | null } | null {
  if (!hash.startsWith(PREFIX)) return null;
  let x: Partial<Packed>;
  try {
    x = JSON.parse(decodeURIComponent(hash.slice(PREFIX.length))) as Partial<Packed>;
  } catch {
    return null;
  }
  if (typeof x !== 'object' || x === null || !finite(x.k)) return null;
  if (!Array.isArray(x.p) || x.p.length !== fits.porosity.length || !x.p.every(finite)) return null;
  if ((fits.nitrate === null) !== (x.n === null) || (x.n !== null && !finite(x.n))) return null;
  const a = unpackDesign(x.a);
  const b = unpackDesign(x.b);
  if (!a || !b) return null;
  const year = finite(x.y) && Number.isInteger(x.y) ? x.y : null;
  return { settings: { kMPerDay: x.k, porosity: x.p, nitrate: x.n ?? null, a, b }, year };
}

/** Put the settings in the address without reloading or adding a history step. */
export function writeHash(s: ExplorerSettings, year: number | null): void {
  try {
    history.replaceState(null, '', writeHashText(s, year));
  } catch {
    // Some browsers refuse to change the address of a page opened from a file: no link then.
  }
}
