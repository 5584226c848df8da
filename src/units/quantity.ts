/**
 * Quantity strings ("1.2 m", "48 in", "0.5 in/d", "0.2 %", "40 ac") parsed into the numbers
 * tileflux computes with. Units are converted once, here at the edge; the core sees plain
 * numbers in its own units (m, mm, days, m/d, mm/d, ha, mg/L, m3/s).
 *
 * Parsing and conversion are done by js-quantities; this module adds the trade's short
 * spellings (ha, ac, cfs, gpm) and the rule that a bare number means the documented unit.
 */
import Qty from 'js-quantities';
import { clip, TilefluxError } from '../errors.js';
import { DECIMAL_NUMBER, isDecimalNumber } from './decimal.js';

/** What a quantity measures, and therefore which unit the core receives it in. */
export type QuantityKind =
  | 'length'
  | 'depthMm'
  | 'rate'
  | 'conductivity'
  | 'area'
  | 'fraction'
  | 'slope'
  | 'concentration'
  | 'flow'
  | 'duration'
  | 'latitude'
  | 'diameter'
  | 'velocity';

interface KindSpec {
  /** js-quantities unit the result is expressed in. */
  target: string;
  /** The unit a bare number is taken to be in (same as the result). */
  unit: string;
  /** Examples shown in error messages. */
  examples: string;
  /** Word used in messages ("a length", "a rate"). */
  noun: string;
}

/** One source of truth for each kind's unit, bare-number meaning and examples. */
export const KINDS: Readonly<Record<QuantityKind, KindSpec>> = {
  length: { target: 'm', unit: 'm', examples: '1.2 m, 48 in or 4 ft', noun: 'a length' },
  depthMm: {
    target: 'mm',
    unit: 'mm',
    examples: '10 mm, 1 cm or 0.5 in',
    noun: 'a depth of water',
  },
  diameter: { target: 'mm', unit: 'mm', examples: '100 mm, 4 in or 0.1 m', noun: 'a diameter' },
  rate: { target: 'mm/d', unit: 'mm/d', examples: '12 mm/d or 0.5 in/d', noun: 'a rate' },
  conductivity: {
    target: 'm/d',
    unit: 'm/d',
    examples: '1.2 m/d, 2 in/h or 5 cm/h',
    noun: 'a hydraulic conductivity',
  },
  area: { target: 'hectare', unit: 'ha', examples: '16 ha or 40 ac', noun: 'an area' },
  fraction: { target: '', unit: '(fraction)', examples: '0.05 or 5 %', noun: 'a fraction' },
  slope: { target: '', unit: 'm/m', examples: '0.002, 0.2 % or 0.2 ft/100ft', noun: 'a slope' },
  concentration: {
    target: 'mg/L',
    unit: 'mg/L',
    examples: '10 mg/L or 10 ppm',
    noun: 'a concentration',
  },
  flow: { target: 'm^3/s', unit: 'm3/s', examples: '0.05 m3/s, 1.5 cfs or 50 L/s', noun: 'a flow' },
  duration: { target: 'day', unit: 'd', examples: '5 d, 48 h or 2 days', noun: 'a duration' },
  latitude: { target: 'deg', unit: 'degrees', examples: '42.1 or 42.1 deg', noun: 'a latitude' },
  velocity: { target: 'm/s', unit: 'm/s', examples: '0.45 m/s or 1.4 ft/s', noun: 'a velocity' },
};

/** Trade spellings js-quantities does not know, rewritten before parsing. */
const ALIASES: ReadonlyArray<[RegExp, string]> = [
  [/\bha\b/g, 'hectare'],
  [/\bac\b/g, 'acre'],
  [/\bcfs\b/g, 'ft^3/s'],
  [/\bgpm\b/g, 'gal/min'],
  [/\bm3\b/g, 'm^3'],
  [/\bft3\b/g, 'ft^3'],
  [/\bppm\b/g, 'mg/L'],
  [/(\d)\s*%/g, '$1 percent'],
  [/ft\/100\s*ft/g, 'percent'],
];

/** A leading number written against its unit ("12ha"), the whole number in group 1. */
const NUMBER_AGAINST_UNIT = new RegExp(
  String.raw`^(${DECIMAL_NUMBER})(?![\d.]|[eE][-+]?\d)(?=[A-Za-z%])`,
);

function normalise(text: string): string {
  // "12ha", "10mm/d", "1.2m": a unit written against its number reads as if spaced.
  let s = text.trim().replace(NUMBER_AGAINST_UNIT, '$1 ');
  for (const [re, to] of ALIASES) s = s.replace(re, to);
  return s;
}

/**
 * Parse a quantity string (or a bare number) into the core unit of `kind`, or say why not.
 * The reason reads after a key or option name: "expects a rate such as 12 mm/d ...; got 12 m".
 */
export function tryParseQuantity(
  value: unknown,
  kind: QuantityKind,
): { ok: true; value: number } | { ok: false; reason: string } {
  const spec = KINDS[kind];
  const expects = `expects ${spec.noun} such as ${spec.examples}`;
  const fail = (got: string) => ({ ok: false as const, reason: `${expects}; got ${got}` });
  if (typeof value === 'number') {
    if (Number.isFinite(value)) return { ok: true, value };
    return fail(Number.isNaN(value) ? 'not a number' : 'an infinite value');
  }
  if (typeof value !== 'string')
    return fail(value === null ? 'nothing' : `${typeof value} ${clip(JSON.stringify(value))}`);
  const text = value.trim();
  if (text === '') return fail('an empty value');
  // A bare number is in the documented unit.
  if (isDecimalNumber(text)) return { ok: true, value: Number(text) };
  let q: Qty;
  try {
    q = Qty(normalise(text));
  } catch {
    return fail(`"${clip(text)}", which is not a number with a known unit`);
  }
  let out: number;
  if (kind === 'latitude' && q.kind() === 'unitless') out = q.scalar;
  else if (spec.target === '') {
    if (q.kind() !== 'unitless') return fail(clip(text));
    out = q.toBase().scalar;
  } else {
    if (!q.isCompatible(spec.target)) return fail(clip(text));
    out = q.to(spec.target).scalar;
  }
  return Number.isFinite(out) ? { ok: true, value: out } : fail(clip(text));
}

/**
 * Parse a quantity string (or a bare number) into the core unit of `kind`.
 *
 * @param value  "1.2 m", "0.5 in/d", "5 %", or a number already in the core unit
 * @param kind   what the quantity measures
 * @param name   the option or key it came from, used in error messages
 * @example parseQuantity('48 in', 'length', '--drain-depth') // 1.2192
 * @example parseQuantity('0.5 in/d', 'rate', '--rate') // 12.7
 */
export function parseQuantity(value: string | number, kind: QuantityKind, name: string): number {
  const r = tryParseQuantity(value, kind);
  if (!r.ok) throw new TilefluxError(`${name} ${r.reason}`);
  return r.value;
}

export { US, type UnitSystem } from './usCustomary.js';
