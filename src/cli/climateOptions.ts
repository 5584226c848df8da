/**
 * Climate-change options of `weather make`: --precip-change and --temp-change, each one change
 * for the whole year (`+10%`, `+2C`) or changes per month or season (`djf:+20%,jja:-10%`,
 * `jan:+1.5C,jul:+3C`; months and seasons not named keep 0). Seasons are the meteorological
 * three-month groups djf, mam, jja, son.
 */
import { TilefluxError } from '../errors.js';
import { roundTo } from '../units/decimal.js';

const MONTHS = ['jan', 'feb', 'mar', 'apr', 'may', 'jun', 'jul', 'aug', 'sep', 'oct', 'nov', 'dec'];
const SEASONS: Readonly<Record<string, number[]>> = {
  djf: [11, 0, 1],
  mam: [2, 3, 4],
  jja: [5, 6, 7],
  son: [8, 9, 10],
};

/** One change value: a signed number with its unit (the unit may be left out). */
function changeValue(text: string, option: string, kind: 'precip' | 'temp'): number {
  const t = text.trim().replace(/\s+/g, '');
  const m =
    kind === 'precip'
      ? /^([-+]?\d+(?:\.\d+)?)%?$/.exec(t)
      : /^([-+]?\d+(?:\.\d+)?)(c|degc|k|f|degf)?$/i.exec(t);
  if (!m) {
    throw new TilefluxError(
      `${option} expects ${kind === 'precip' ? 'a percentage such as +10% or -5%' : 'a temperature change such as +2C or +3.6F'}` +
        `, or MONTH:VALUE / SEASON:VALUE pairs (jan..dec, djf, mam, jja, son); got "${text}"`,
    );
  }
  const x = Number(m[1]);
  const unit = (m[2] ?? 'c').toLowerCase();
  // A change of 1 degF is 5/9 degC (the 32 offset cancels in a difference).
  return kind === 'temp' && unit.endsWith('f') ? (x * 5) / 9 : x;
}

/**
 * Twelve monthly changes (January first) from an option's text; all 0 when not given.
 * Precipitation changes are in percent and must stay above -100; temperature changes in degC.
 *
 * @example monthlyChange('djf:+20%,jja:-10%', '--precip-change', 'precip')[0] // 20
 */
export function monthlyChange(
  text: string | undefined,
  option: string,
  kind: 'precip' | 'temp',
): number[] {
  const out = new Array<number>(12).fill(0);
  if (text === undefined) return out;
  if (!text.includes(':')) {
    out.fill(changeValue(text, option, kind));
  } else {
    for (const part of text.split(',')) {
      const [name, value, extra] = part.split(':');
      const key = (name ?? '').trim().toLowerCase();
      const months = SEASONS[key] ?? (MONTHS.includes(key) ? [MONTHS.indexOf(key)] : undefined);
      if (months === undefined || value === undefined || extra !== undefined) {
        throw new TilefluxError(
          `${option}: "${part}" is not MONTH:VALUE or SEASON:VALUE; months jan..dec, seasons djf, mam, jja, son`,
        );
      }
      const x = changeValue(value, option, kind);
      for (const m of months) out[m] = x;
    }
  }
  if (kind === 'precip' && out.some((x) => x <= -100 || x > 1000)) {
    throw new TilefluxError(`${option} must stay above -100% and at most +1000%; got "${text}"`);
  }
  if (kind === 'temp' && out.some((x) => Math.abs(x) > 20)) {
    throw new TilefluxError(`${option} must lie within -20 to +20 degC; got "${text}"`);
  }
  return out;
}

/** A short description of monthly changes: `+10%` or `Dec-Feb +20%, Jun-Aug -10%`. */
export function describeChange(values: readonly number[], unit: string): string {
  const sign = (x: number) => `${x > 0 ? '+' : ''}${roundTo(x, 2)}${unit}`;
  if (values.every((x) => x === values[0])) return sign(values[0]);
  const names = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ');
  return values
    .map((x, m) => (x === 0 ? '' : `${names[m]} ${sign(x)}`))
    .filter((s) => s !== '')
    .join(', ');
}
