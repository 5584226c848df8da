/**
 * The README's output-file reference against what `tileflux run` writes: every column of
 * daily.csv, annual.csv and comparison.csv is listed (directly or by one of the reference's
 * patterns) and nothing listed is missing from the files; the US-unit run renames the columns by
 * the suffix rule the reference states; every key of summary.json is named.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { columnIn } from '../../src/io/tables.js';
import { ensureBuilt, FIELD, tileflux, WEATHER } from './cli.js';

const README = readFileSync(join(process.cwd(), 'README.md'), 'utf8');

/** The text of README section `### title` (up to the next heading). */
function section(title: string): string {
  const start = README.indexOf(`\n### ${title}\n`);
  expect(start, `README has a section "### ${title}"`).toBeGreaterThanOrEqual(0);
  const rest = README.slice(start + title.length + 6);
  const end = rest.search(/\n#{2,3} /);
  return end < 0 ? rest : rest.slice(0, end);
}

/** The SI unit suffixes of the reference's column names. */
const UNIT_SUFFIXES = ['mm', 'm', 'm_ha', 'kg_ha', 'mg_l', 'days'];

/** Backticked words of a text. */
const ticked = (text: string): string[] => [...text.matchAll(/`([^`]+)`/g)].map((m) => m[1]);

/**
 * The columns a reference table documents. A row names columns in its first cell; the patterns
 * `{measure}_change_{unit}` and `{measure}_change_percent` expand over the measures listed in the
 * first pattern's meaning (the unit taken from the measure's own column in the table), and
 * `{change column}_low` / `_high` over every change column but those of the measures its meaning
 * names.
 */
function documentedColumns(text: string): Set<string> {
  const rows = text
    .split('\n')
    .filter((l) => l.startsWith('| ') && !l.startsWith('| column') && !l.startsWith('|---'))
    .map((l) => l.split(' | ').map((c) => c.replace(/^\| |\s*\|$/g, '')));
  const plain = new Set<string>();
  const patterns: Array<{ names: string[]; measures: string[] }> = [];
  for (const [first, , meaning] of rows) {
    const names = ticked(first);
    if (names.some((n) => n.includes('{'))) patterns.push({ names, measures: ticked(meaning) });
    else names.forEach((n) => plain.add(n));
  }
  const out = new Set(plain);
  const unitOf = (m: string): string => {
    const own = UNIT_SUFFIXES.map((u) => `${m}_${u}`).filter((c) => plain.has(c));
    expect(own, `one column of its own for measure ${m}`).toHaveLength(1);
    return own[0].slice(m.length + 1);
  };
  const changed = patterns.find((p) => p.names.includes('{measure}_change_{unit}'))?.measures ?? [];
  for (const m of changed) out.add(`${m}_change_${unitOf(m)}`);
  if (patterns.some((p) => p.names.includes('{measure}_change_percent')))
    for (const m of changed) out.add(`${m}_change_percent`);
  const band = patterns.find((p) => p.names.includes('{change column}_low'));
  if (band) {
    // The row's meaning names the measures whose changes have no band.
    const without = band.measures.filter((m) => m !== 'measure');
    for (const c of [...out].filter((x) => x.includes('_change_'))) {
      if (without.some((m) => c.startsWith(`${m}_change_`))) continue;
      out.add(`${c}_low`);
      out.add(`${c}_high`);
    }
  }
  return out;
}

let dir: string;
const header = (run: string, file: string) =>
  readFileSync(join(dir, run, file), 'utf8')
    .split('\n')[0]
    .split(',');

beforeAll(() => {
  ensureBuilt();
  dir = mkdtempSync(join(tmpdir(), 'tileflux-outref-'));
  for (const units of ['si', 'us']) {
    const r = tileflux([
      'run',
      FIELD,
      '-w',
      WEATHER,
      '--from',
      '2001-01-01',
      '--to',
      '2002-12-31',
      '--no-charts',
      '--no-report',
      '--no-explorer',
      '--units',
      units,
      '--out',
      join(dir, units),
    ]);
    expect(r.code, r.stderr).toBe(0);
  }
}, 120_000);

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('README output-file reference', () => {
  for (const file of ['daily.csv', 'annual.csv', 'comparison.csv']) {
    it(`${file}: the columns written are the columns documented`, () => {
      const written = header('si', file);
      const documented = documentedColumns(section(file));
      expect(
        written.filter((c) => !documented.has(c)),
        'written, not documented',
      ).toEqual([]);
      expect(
        [...documented].filter((c) => !written.includes(c)),
        'documented, not written',
      ).toEqual([]);
    });

    it(`${file}: --units us renames every column by the stated suffix rule`, () => {
      expect(header('us', file)).toEqual(header('si', file).map((c) => columnIn(c, 'us').name));
    });
  }

  it('summary.json: every key of the top level and of a scenario is named', () => {
    const named = new Set(ticked(section('summary.json')));
    const summary = JSON.parse(readFileSync(join(dir, 'si', 'summary.json'), 'utf8'));
    const keys = [...Object.keys(summary), ...Object.keys(summary.scenarios[0])];
    expect(keys.filter((k) => !named.has(k))).toEqual([]);
  });

  it('a deliberately undocumented column is caught (the check can fail)', () => {
    const documented = documentedColumns(section('annual.csv'));
    expect(documented.has('drainflow_mm')).toBe(true);
    expect(documented.has('drainflow_peak_mm')).toBe(false);
  });
});
