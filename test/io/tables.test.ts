import { describe, expect, it } from 'vitest';
import { columnsToCsv, columnsToCsvChunks, safeCell, toCsv } from '../../src/io/tables.js';

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
