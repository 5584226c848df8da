import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DECIMAL_NUMBER, fixedText, isDecimalNumber, roundTo } from '../../src/units/decimal.js';

describe('decimal numbers in text', () => {
  it('accepts the decimal forms and nothing else', () => {
    // The forms of ECMAScript's StrDecimalLiteral (ECMA-262, ToNumber applied to the String
    // type) less "Infinity": digits with an optional point, a leading point, an exponent.
    for (const s of ['0', '12', '-0.5', '+.25', '3.', '1e-4', '2.5E3', '-7e+2', '007']) {
      expect(isDecimalNumber(s), s).toBe(true);
      expect(Number.isFinite(Number(s)), s).toBe(true);
    }
    // Number() reads several of these ("0x1A" as 26, "" and " 1" as 0 and 1, "Infinity"), which
    // is why a reader checks the text first.
    for (const s of [
      '0x1A',
      '0b11',
      '',
      ' 1',
      '1 ',
      'Infinity',
      'NaN',
      '1,5',
      '-',
      '.',
      'e3',
      '1e',
      '1_000',
      '--1',
    ]) {
      expect(isDecimalNumber(s), s).toBe(false);
    }
  });

  it('embeds with its caller’s groups unchanged', () => {
    const m = new RegExp(String.raw`^(${DECIMAL_NUMBER})\s*(mm)$`).exec('-1.5e2 mm');
    expect(m?.[1]).toBe('-1.5e2');
    expect(m?.[2]).toBe('mm');
  });

  it('prints fixed decimals as toFixed does, without a negative zero', () => {
    expect(fixedText(-0.04, 1)).toBe('0.0');
    expect(fixedText(-0.4, 0)).toBe('0');
    expect(fixedText(-0.06, 1)).toBe('-0.1');
    expect(fixedText(2.5, 3)).toBe('2.500');
    expect(fixedText(NaN, 2)).toBe('NaN');
    // Property (ECMA-262 Number.prototype.toFixed): the same text as toFixed, except that a
    // negative value printed as all zeros loses its sign.
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.integer({ min: 0, max: 6 }),
        (x, d) => {
          const t = x.toFixed(d);
          const zero = Number(t) === 0;
          expect(fixedText(x, d)).toBe(zero ? t.replace('-', '') : t);
        },
      ),
    );
  });

  it('rounds to a number of decimals as Math.round does', () => {
    expect(roundTo(1234.5678, 2)).toBe(1234.57);
    expect(roundTo(0.5, 0)).toBe(1);
    expect(Object.is(roundTo(-0.004, 2), -0)).toBe(true);
    expect(roundTo(-2.5, 0)).toBe(-2); // Math.round rounds halves up (ECMA-262 Math.round)
    expect(roundTo(123456, 0)).toBe(123456);
    expect(String(roundTo(0.1 + 0.2, 6))).toBe('0.3');
  });
});
