// The public API as a reviewed file: test/api/api-report.md must be what test/api/apiReport.mjs
// makes of the sources now, so a change of an export's name, kind or type shows in review.
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { collectApi, formatReport, missingFromNode, REPORT_PATH } from './apiReport.mjs';

/** The folder barrels whose every export is part of the core's public API. */
const BARRELS = ['src/climate/index.ts', 'src/drainage/index.ts', 'src/nitrate/index.ts'];

/** The first line where two texts differ, both versions, or undefined when they are equal. */
function firstDifference(committed: string, generated: string): string | undefined {
  const a = committed.split('\n');
  const b = generated.split('\n');
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    if (a[i] !== b[i]) {
      return `line ${i + 1}: committed ${JSON.stringify(a[i] ?? '(end of file)')}, now ${JSON.stringify(b[i] ?? '(end of file)')}`;
    }
  }
  return undefined;
}

let api: ReturnType<typeof collectApi>;
beforeAll(() => {
  api = collectApi({ barrels: BARRELS });
}, 120_000);

describe('public API', () => {
  it('is the committed API report', () => {
    const committed = readFileSync(REPORT_PATH, 'utf8');
    expect(
      firstDifference(committed, formatReport(api.entries)),
      'the public API changed: run `npm run api` and commit test/api/api-report.md',
    ).toBeUndefined();
  });

  it('tileflux re-exports everything of tileflux/core', () => {
    expect(missingFromNode(api.entries), 'add these to src/index.ts').toEqual([]);
  });

  it('tileflux/core exports everything of the climate, drainage and nitrate barrels', () => {
    const core = new Set(
      api.entries.find((e) => e.source === 'src/core.ts')!.exports.map((e) => e.name),
    );
    for (const barrel of api.barrels) {
      const left = barrel.names.filter((n) => !core.has(n));
      expect(left, `add these of ${barrel.source} to src/core.ts`).toEqual([]);
    }
  });

  it('lists the exports of both entries with kind and declaration', () => {
    // Spot checks against the sources: a function, a class, a const, a type-only export.
    const core = api.entries.find((e) => e.entry === 'tileflux/core')!.exports;
    const node = api.entries.find((e) => e.entry === 'tileflux')!.exports;
    const find = (list: typeof core, name: string) => list.find((e) => e.name === name);
    expect(find(core, 'hooghoudtSpacing')).toMatchObject({ kind: 'function' });
    expect(find(core, 'hooghoudtSpacing')!.text).toMatch(
      /^export declare function hooghoudtSpacing\(/,
    );
    expect(find(core, 'TilefluxError')).toMatchObject({ kind: 'class' });
    expect(find(core, 'PALETTE')).toMatchObject({ kind: 'const' });
    expect(find(core, 'Field')).toMatchObject({ kind: 'type' });
    expect(find(node, 'readWeatherFile')).toMatchObject({ kind: 'function' });
    expect(find(core, 'readWeatherFile')).toBeUndefined();
    // Internals stay private.
    expect(find(core, 'KINDS')).toBeUndefined();
    expect(find(node, 'OVERRIDABLE')).toBeUndefined();
  });
});
