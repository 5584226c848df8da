/**
 * Decimal numbers as text, both ways: the one pattern every reader of a bare number accepts
 * (settings, CSV cells, size lists, command options), and the formatting of numbers for people
 * with fixed decimals and no "-0".
 */

/**
 * A decimal number: optional sign, digits with an optional point (or a point and digits), and
 * an optional exponent: "12", "-0.5", "+.25", "3.", "1e-4", "2.5E3". Not hexadecimal,
 * "Infinity", "NaN", digit separators or spaces. Every group inside is non-capturing, so a
 * pattern that embeds it keeps its own group numbers. A source string, to be embedded with the
 * caller's own anchors and context.
 */
export const DECIMAL_NUMBER = String.raw`[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?`;

const WHOLE_DECIMAL = new RegExp(`^${DECIMAL_NUMBER}$`);

/**
 * True when the whole text (no surrounding spaces) is a decimal number (`DECIMAL_NUMBER`).
 *
 * @example isDecimalNumber('2.5e3') // true
 * @example isDecimalNumber('2.5 mm') // false
 */
export function isDecimalNumber(text: string): boolean {
  return WHOLE_DECIMAL.test(text);
}

/**
 * A number with a fixed number of decimals, without a negative zero: what toFixed prints,
 * except that a value that rounds to zero is "0.0", never "-0.0". Non-finite values print as
 * toFixed does ("NaN", "Infinity").
 *
 * @example fixedText(-0.04, 1) // '0.0'
 * @example fixedText(2.345, 2) // '2.35'
 */
export function fixedText(x: number, decimals: number): string {
  const s = x.toFixed(decimals);
  // The sign test first: this runs for every cell of a written weather file.
  return s.charCodeAt(0) === 45 && /^-0(\.0+)?$/.test(s) ? s.slice(1) : s;
}

/** Powers of ten as their decimal literals (exact up to 1e22). */
const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

/**
 * A number rounded to `decimals` places as a number (halves rounded up, as
 * Math.round does): `Math.round(x * 10^decimals) / 10^decimals`. A negative value that rounds to
 * zero gives -0, which JSON and String print as 0.
 *
 * @example roundTo(2.3456, 2) // 2.35
 */
export function roundTo(x: number, decimals: number): number {
  const p = POW10[decimals] ?? 10 ** decimals;
  return Math.round(x * p) / p;
}
