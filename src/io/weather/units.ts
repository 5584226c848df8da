/**
 * Weather variables, the units a column may be in, and the physical bounds of each variable:
 * the vocabulary every weather reader and message shares.
 */
import { US } from '../../units/usCustomary.js';
import { roundTo } from '../../units/decimal.js';

/** The variables a weather file can hold, by their short names (used by `columns`). */
export const WEATHER_VARIABLES = [
  'date',
  'precip',
  'tmax',
  'tmin',
  'ref_et',
  'solar',
  'rh',
  'wind',
] as const;
export type WeatherVariable = (typeof WEATHER_VARIABLES)[number];
export type ValueVariable = Exclude<WeatherVariable, 'date'>;
export const VALUE_VARIABLES = WEATHER_VARIABLES.filter((v) => v !== 'date') as ValueVariable[];
export const REQUIRED: readonly ValueVariable[] = ['precip', 'tmax', 'tmin'];

/** One unit a column may be in: header suffix, label for messages, conversion to core units. */
export interface UnitSpec {
  suffix: string;
  label: string;
  toCore: (x: number) => number;
}
const same = (x: number) => x;
export const MM: UnitSpec = { suffix: 'mm', label: 'mm', toCore: same };
export const INCH: UnitSpec = { suffix: 'in', label: 'in', toCore: (x) => x * US.mmPerIn };
export const CELSIUS: UnitSpec = { suffix: 'c', label: 'degC', toCore: same };
export const FAHRENHEIT: UnitSpec = {
  suffix: 'f',
  label: 'degF',
  toCore: (x) => ((x - 32) * 5) / 9,
};

/**
 * Units accepted per variable; the first is the core unit and the default for a mapped header
 * without a suffix (precipitation and temperature defaults can be changed with precipUnit and
 * tempUnit). Conversions are exact definitions: 1 in = 25.4 mm; degC = (degF - 32) * 5/9;
 * 1 W m-2 over a day = 0.0864 MJ m-2 d-1; 1 km/h = 1/3.6 m/s; 1 mph = 0.44704 m/s.
 */
export const UNITS: Readonly<Record<ValueVariable, readonly UnitSpec[]>> = {
  precip: [MM, INCH],
  tmax: [CELSIUS, FAHRENHEIT],
  tmin: [CELSIUS, FAHRENHEIT],
  ref_et: [MM, INCH],
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
  ref_et: [0, 30, 'mm/d'],
  solar: [0, 50, 'MJ m-2 d-1'],
  rh: [0, 100, '%'],
  wind: [0, 50, 'm/s'],
};

/** What each variable is called in messages. */
export const NOUN: Readonly<Record<WeatherVariable, string>> = {
  date: 'date',
  precip: 'precipitation',
  tmax: 'maximum temperature',
  tmin: 'minimum temperature',
  ref_et: 'reference ET',
  solar: 'solar radiation',
  rh: 'relative humidity',
  wind: 'wind speed',
};

/** Longest run of missing days `fill` fills. */
export const MAX_FILL_DAYS = 7;

/** Cell texts that mean "no value" (compared without case). */
const MISSING = new Set(['', 'na', 'n/a', 'nan', 'null']);

/** True when a (trimmed) cell text means "no value". */
export function isMissingText(cell: string): boolean {
  return MISSING.has(cell.toLowerCase());
}

/**
 * A value for messages: at most two decimals, trailing zeros dropped ("12.5 degC", not
 * "12.50"), as the cell was likely written; String prints a rounded -0 as "0".
 */
export function fmtValue(x: number): string {
  return String(roundTo(x, 2));
}
