/**
 * Number formatting for people (report tables and summary lines): fixed decimals, no "-0",
 * explicit sign for changes, and "n/a" where a figure does not exist (null).
 */
import { fixedText } from '../units/decimal.js';

/**
 * A number with a fixed number of decimals (`fixedText`); "n/a" for null or a non-finite value,
 * since a report table shows a figure that does not exist as words, not as "NaN".
 *
 * @example fixed(-0.04, 1) // '0.0'
 */
export function fixed(x: number | null, decimals = 1): string {
  if (x === null || !Number.isFinite(x)) return 'n/a';
  return fixedText(x, decimals);
}

/**
 * A count with its noun, singular for exactly one: "1 year", "29 years", "0 scenarios".
 *
 * @example counted(1, 'scenario') // '1 scenario'
 */
export function counted(n: number, noun: string, plural = `${noun}s`): string {
  return `${n} ${n === 1 ? noun : plural}`;
}

/**
 * A change with its sign: "+4.1", "-30.0", "0.0".
 *
 * @example signed(4.08, 1) // '+4.1'
 */
export function signed(x: number | null, decimals = 1): string {
  const s = fixed(x, decimals);
  return s === 'n/a' || s.startsWith('-') || Number(s) === 0 ? s : `+${s}`;
}
