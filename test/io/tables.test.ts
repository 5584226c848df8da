import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  columnsToCsv,
  columnsToCsvChunks,
  numberText,
  safeCell,
  toCsv,
} from '../../src/io/tables.js';

describe('CSV cells', () => {
  it('neutralises formula-looking text cells (OWASP CSV injection: prefix an apostrophe)', () => {
    for (const t of ['=1+1', '+1', '-1', '@A1', '\tx', '\rx']) expect(safeCell(t)).toBe(`'${t}`);
    for (const t of ['conventional', '2015-01-01', "'=already", '']) expect(safeCell(t)).toBe(t);
    expect(toCsv([{ scenario: '=cmd', drainflow_mm: -1.5 }], 'si')).toBe(
      "scenario,drainflow_mm\n'=cmd,-1.5\n",
    );
    expect(
      columnsToCsv(
        [
          { name: 'scenario', values: ['@x', 'ok'] },
          { name: 'a_mm', values: new Float64Array([-2, 3]) },
        ],
        'si',
      ),
    ).toBe("scenario,a_mm\n'@x,-2\nok,3\n");
  });

  it('the chunked writer gives the same text in pieces of bounded size', () => {
    const n = 10_001;
    const cols = [
      { name: 'date', values: Array.from({ length: n }, (_, i) => `d${i}`) },
      { name: 'x_mm', values: Float64Array.from({ length: n }, (_, i) => i / 7) },
    ];
    const chunks = [...columnsToCsvChunks(cols, 'si', true, 1000)];
    expect(chunks.length).toBe(11);
    expect(Math.max(...chunks.map((c) => c.split('\n').length - 1))).toBe(1000);
    expect(chunks.join('')).toBe(columnsToCsv(cols, 'si'));
  });
});

describe('numberText', () => {
  // The reference is the definition the cell format states: round to the decimals as
  // Math.round(x * 10^d) / 10^d does, then ECMAScript's Number::toString (the shortest text that
  // reads back to that double), with -0 printed as 0. The fast integer path must give the same
  // text for every double; the fallback covers values of 10^15 units and more.
  const reference = (x: number, d: number) => {
    const r = Math.round(x * 10 ** d) / 10 ** d + 0;
    return Math.abs(r) < 1e15 ? String(r) : r.toFixed(0);
  };

  it('prints what the rounding and Number::toString print, for any double', () => {
    const decimals = fc.constantFrom(0, 1, 2, 3, 4, 6);
    const magnitudes = fc.oneof(
      fc.double({ noNaN: true, noDefaultInfinity: true }),
      fc.double({ min: -1e4, max: 1e4, noNaN: true }),
      fc.double({ min: -1, max: 1, noNaN: true }),
      fc.integer({ min: -1e9, max: 1e9 }).map((k) => k / 1000),
    );
    fc.assert(
      fc.property(magnitudes, decimals, (x, d) => {
        expect(numberText(x, d)).toBe(reference(x, d));
      }),
      { numRuns: 20_000 },
    );
  });

  it('hand-checked cells: halves, trailing zeros, negative zero, large values, NaN', () => {
    expect(numberText(2.5, 0)).toBe('3');
    expect(numberText(-2.5, 0)).toBe('-2');
    expect(numberText(1.23456789, 4)).toBe('1.2346');
    expect(numberText(0.1 + 0.2, 3)).toBe('0.3');
    expect(numberText(-0.0004, 3)).toBe('0');
    // -12.05 * 10 is -120.5 in doubles, and Math.round takes a half up (toward +inf): -120.
    expect(numberText(-12.05, 1)).toBe('-12');
    expect(numberText(0.000001, 6)).toBe('0.000001');
    expect(numberText(1234567890123456, 0)).toBe('1234567890123456');
    expect(numberText(NaN, 3)).toBe('');
    expect(numberText(-Infinity, 3)).toBe('-inf');
  });
});
